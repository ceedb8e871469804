// Garment sizing: measurements, ease, gauge and motif repeat → stitch and row counts, chart sizes, recipes.
export { GARMENT_FIELDS, sizeGarment, sizeGarmentInputSchema, type SizeGarmentInput } from "./size-garment";
export type { ChartArea, GarmentKind, Piece, SizingResult } from "./sizing-result";
export { SizingError } from "./sizing-error";
export { getCastOn, getRows } from "./cast-on";
export { resolveGauge, type GaugeInput } from "./gauge";
export { DEFAULT_EASE, EASE_CATEGORIES, getEaseCategory, resolveEase, type EaseCategory, type EaseCategoryKey } from "./ease";
export { BODY_SIZES, HEAD_SIZES, MITTEN_SIZES, STANDARD_SIZES, getSizeKeys, getStandardMeasurements } from "./standard-sizes";
export { MEASUREMENT_SPECS, checkMeasurement } from "./measurements";
export { MITTEN_PROPORTIONS } from "./mitten";
export { HAT_PROPORTIONS } from "./hat";
export { PULLOVER_PROPORTIONS } from "./pullover";
export { CM_PER_IN, MM_PER_IN, cmToIn, inToCm, formatCm, formatIn } from "./units";
