// Each stage's minutes are a linear sum: terms (from the piece's features) × coefficients (minutes
// per unit, from the rates). Estimation and calibration share this one description.
import type { LabourRates } from "./default-rates";
import type { FilledPieceFeatures } from "./piece-features";
import type { Stage } from "./stages";

export interface StageTerm {
  /** the rate this coefficient is read from and written back to */
  rate: keyof LabourRates;
  /** the feature (or per-piece constant) it multiplies */
  term: string;
  /** value of the term for one piece */
  valueOf: (piece: FilledPieceFeatures) => number;
  /** minutes per unit of the term, from the rate */
  toCoefficient: (rate: number) => number;
  /** the rate, from minutes per unit; null when the coefficient cannot give a rate (e.g. 0 min/stitch) */
  fromCoefficient: (coefficient: number) => number | null;
}

const perMinute = (rate: number) => 1 / rate;
const fromPerMinute = (c: number) => (c > 0 ? 1 / c : null);
const seconds = (rate: number) => rate / 60;
const fromSeconds = (c: number) => c * 60;
const minutes = (rate: number) => rate;
const fromMinutes = (c: number) => c;

export const STAGE_TERMS: Readonly<Record<Stage, readonly StageTerm[]>> = {
  design: [
    { rate: "designBaseMinutes", term: "new design", valueOf: (p) => (p.newDesign ? 1 : 0), toCoefficient: minutes, fromCoefficient: fromMinutes },
    { rate: "minutesPerProofRound", term: "proofRounds", valueOf: (p) => p.proofRounds, toCoefficient: minutes, fromCoefficient: fromMinutes },
  ],
  knitting: [
    { rate: "plainStitchesPerMinute", term: "plainStitches", valueOf: (p) => p.plainStitches, toCoefficient: perMinute, fromCoefficient: fromPerMinute },
    { rate: "strandedStitchesPerMinute", term: "strandedStitches", valueOf: (p) => p.strandedStitches, toCoefficient: perMinute, fromCoefficient: fromPerMinute },
    { rate: "secondsPerFloatCatch", term: "floatCatches", valueOf: (p) => p.floatCatches, toCoefficient: seconds, fromCoefficient: fromSeconds },
    { rate: "minutesPerShapingRound", term: "shapingRounds", valueOf: (p) => p.shapingRounds, toCoefficient: minutes, fromCoefficient: fromMinutes },
    { rate: "minutesPerThumb", term: "thumbs", valueOf: (p) => p.thumbs, toCoefficient: minutes, fromCoefficient: fromMinutes },
  ],
  embroidery: [
    { rate: "secondsPerDuplicateStitch", term: "duplicateStitches", valueOf: (p) => p.duplicateStitches, toCoefficient: seconds, fromCoefficient: fromSeconds },
    { rate: "minutesPerEnd", term: "ends", valueOf: (p) => p.ends, toCoefficient: minutes, fromCoefficient: fromMinutes },
    { rate: "secondsPerCarryCm", term: "carryCm", valueOf: (p) => p.carryCm, toCoefficient: seconds, fromCoefficient: fromSeconds },
  ],
  blocking: [
    { rate: "blockingMinutesPerPiece", term: "blocked piece", valueOf: (p) => (p.blocked ? 1 : 0), toCoefficient: minutes, fromCoefficient: fromMinutes },
  ],
  finishing: [
    { rate: "finishingMinutesPerPiece", term: "piece", valueOf: () => 1, toCoefficient: minutes, fromCoefficient: fromMinutes },
  ],
};

export function getStageTermValues(stage: Stage, piece: FilledPieceFeatures): number[] {
  return STAGE_TERMS[stage].map((t) => t.valueOf(piece));
}

export function getStageCoefficients(stage: Stage, rates: LabourRates): number[] {
  return STAGE_TERMS[stage].map((t) => t.toCoefficient(rates[t.rate]));
}

/** Unrounded minutes one piece needs for one stage. */
export function getStageMinutes(stage: Stage, piece: FilledPieceFeatures, rates: LabourRates): number {
  const values = getStageTermValues(stage, piece);
  const coefficients = getStageCoefficients(stage, rates);
  let sum = 0;
  for (let i = 0; i < values.length; i++) sum += values[i] * coefficients[i];
  return sum;
}
