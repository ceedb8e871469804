// Lengths between metric and imperial. The inch is exactly 25.4 mm (international yard and pound
// agreement, 1959). Rounding policy, used everywhere in sizing:
//  - a length converted from inches to centimetres is kept to the whole millimetre (0.1 cm);
//  - a length converted to inches is kept to 0.01 in (0.254 mm), so cm → in → cm returns within 1 mm;
//  - recipes print centimetres to 0.5 cm and inches to the nearest ¼ in, for reading only:
//    every stitch and row count is computed from the unrounded length.

export const MM_PER_IN = 25.4;
export const CM_PER_IN = 2.54;

/** Half away from zero at `step` (0.1, 0.5, 0.01…), allowing for binary fractions (105.6 stays 105.6). */
export function roundTo(value: number, step: number): number {
  const q = value / step;
  const n = Math.sign(q) * Math.floor(Math.abs(q) + 0.5 + 1e-9);
  const decimals = (String(step).split(".")[1] ?? "").length;
  return Number((n * step).toFixed(decimals)) + 0; // + 0 turns -0 into 0
}

/** Exact conversion, kept to the whole millimetre. */
export function inToCm(inches: number): number {
  return roundTo(inches * CM_PER_IN, 0.1);
}

/** Exact conversion, kept to 0.01 in. */
export function cmToIn(cm: number): number {
  return roundTo(cm / CM_PER_IN, 0.01);
}

const QUARTERS = ["", "¼", "½", "¾"];

/** "7 cm", "6.5 cm": to the nearest 0.5 cm for a recipe line. */
export function formatCm(cm: number): string {
  const v = roundTo(cm, 0.5);
  return `${Number.isInteger(v) ? v.toFixed(0) : v.toFixed(1)} cm`;
}

/** "2¾ in", "¼ in": to the nearest ¼ in for a recipe line. */
export function formatIn(cm: number): string {
  const quarters = Math.round(roundTo((cm / CM_PER_IN) * 4, 1));
  const whole = Math.floor(quarters / 4);
  const frac = QUARTERS[quarters % 4];
  if (whole === 0 && frac !== "") return `${frac} in`;
  return `${whole}${frac} in`;
}

/** A length in both systems, as the result reports it. */
export interface Length {
  cm: number;
  in: number;
}

export function toLength(cm: number): Length {
  return { cm: roundTo(cm, 0.1), in: cmToIn(cm) };
}
