// Yarn: weights and needles, loop length, metres per colour, skeins and dye lots.
export { YARN_WEIGHTS, checkGauge, getTypicalStitchesPer10cm, getYarnWeight, type GaugeCheck, type YarnWeight } from "./yarn-weights";
export { NEEDLE_SIZES, NO_EQUIVALENT, getNeedleMmFromUs, getNeedleSize, type NeedleLookup } from "./needle-sizes";
export { MUNDEN_KC, MUNDEN_KW, getLoopLengthCm, getStitchWidthCm } from "./loop-length";
export * from "./allowances";
export { darningPlanSchema, type DarningPlanData } from "./darning-plan";
export { countAreas, estimateChartYarn, type ChartYarnEstimate, type ChartYarnOptions, type ColourYarn } from "./chart-yarn";
export { estimatePlainYarn, type PlainYarnEstimate } from "./garment-yarn";
export { METRES_PER_YARD, getSkeinNeed, type SkeinNeed, type YarnRecord } from "./skeins";
export { estimateYarn, yarnInputSchema, yarnOptionsSchema, yarnRecordSchema, type ColourEstimate, type YarnEstimate } from "./estimate-yarn";
export { estimateDesignYarn, estimateGarmentYarn, matchStudioYarn, type DesignChartYarnInput, type DesignYarnEstimate, type DesignYarnLine, type DesignYarnOptions, type StudioYarnRecord } from "./design-yarn";
