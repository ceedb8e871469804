// Labour: stage estimates from piece features, and calibration of rates from logged minutes.
export { STAGES, isStage, type Stage } from "./stages";
export { fillPieceFeatures, assertPieceFeatures, COUNT_FEATURES, type PieceFeatures, type CountFeature } from "./piece-features";
export { defaultRates, rateSources, resolveRates, RATE_KEYS, type LabourRates, type RateSource } from "./default-rates";
export { estimateLabour, resolveP80Factors, DEFAULT_P80_FACTOR, type LabourEstimate, type LabourEstimateInput, type P80Factors, type StageEstimate } from "./estimate-labour";
export { calibrateRates, type CalibrationResult, type CalibrationOptions, type LoggedPiece } from "./calibrate";
export { solveNnls } from "./nnls";
export { fitRobustNnls } from "./robust-fit";
