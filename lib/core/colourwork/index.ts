// Colourwork planning: the knitted pair, underlay, floats and catches, and darning routes.
export { planColours, type ColourPlan, type FloatMark, type PairCandidate, type RowFloatReport, type UnderlayReport } from "./colour-plan";
export { planDarning, type DarningPlan, type DarningTotals } from "./darning-plan";
export type { ColourDarning, DarningStep, DarningStrand } from "./darn-colour";
export {
  colourPlanOptionsSchema,
  darningOptionsSchema,
  DEFAULT_CARRY_LIMIT_CM,
  DEFAULT_FLOAT_LIMIT_CM,
  DEFAULT_FLOAT_LIMIT_STITCHES,
  type ColourPlanOptions,
  type DarningOptions,
} from "./colourwork-options";
export { ColourworkError } from "./colourwork-error";
export {
  darningRateSources,
  defaultDarningRates,
  defaultDarningYarn,
  getDarningMinutes,
  getOverheadMinutes,
  type DarningRates,
  type DarningWork,
} from "./darning-rates";
export { getCiede2000, getColourDifference, hexToLab, type Lab } from "./ciede2000";
export {
  getCatchCount,
  getCatchStitches,
  getFloatLimitStitches,
  getRowFloats,
  getStaggeredOffsets,
  type CatchAvoid,
  type RowFloat,
  type RowFloatSummary,
} from "./row-floats";
export {
  planRoundPairs,
  type DarnedStitch,
  type RoundColour,
  type RoundDarning,
  type RoundPairRound,
  type RoundPairsInput,
  type RoundPairsOptions,
  type RoundPairsPlan,
  type RoundPairsTotals,
  type RoundPin,
} from "./round-pairs";
