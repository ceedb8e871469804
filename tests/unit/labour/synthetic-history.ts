// Seeded synthetic finished pieces for calibration tests: known "true" rates, multiplicative
// noise, and a few mislogged pieces (timer left running) as outliers.
import type { LoggedPiece } from "@/lib/core/labour/calibrate";
import type { LabourRates } from "@/lib/core/labour/default-rates";
import { fillPieceFeatures, type PieceFeatures } from "@/lib/core/labour/piece-features";
import { getStageMinutes } from "@/lib/core/labour/stage-model";
import { STAGES, type Stage } from "@/lib/core/labour/stages";

/** mulberry32: a small, well-known 32-bit seeded generator; enough for test data. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A studio faster than our defaults at knitting and slower at embroidery. */
export const TRUE_RATES: LabourRates = {
  designBaseMinutes: 150,
  minutesPerProofRound: 40,
  plainStitchesPerMinute: 35,
  strandedStitchesPerMinute: 20,
  minutesPerShapingRound: 3,
  minutesPerThumb: 25,
  secondsPerFloatCatch: 4,
  secondsPerDuplicateStitch: 40,
  minutesPerEnd: 4,
  secondsPerCarryCm: 12,
  blockingMinutesPerPiece: 12,
  dryingHoursPerPiece: 24,
  finishingMinutesPerPiece: 25,
};

export interface SyntheticOptions {
  seed: number;
  count: number;
  /** half-width of uniform multiplicative noise, e.g. 0.1 for ±10 % */
  noise: number;
  /** every n-th piece (from piece 6) logs three times its true minutes in every stage; 0 for none */
  outlierEvery: number;
  rates?: LabourRates;
}

export function makeHistory(o: SyntheticOptions): LoggedPiece[] {
  const rnd = seededRandom(o.seed);
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const rates = o.rates ?? TRUE_RATES;
  const out: LoggedPiece[] = [];
  for (let i = 0; i < o.count; i++) {
    const features: PieceFeatures = {
      newDesign: rnd() < 0.6,
      proofRounds: int(0, 3),
      plainStitches: int(1000, 8000),
      strandedStitches: int(0, 6000),
      floatCatches: int(0, 400),
      shapingRounds: int(4, 30),
      thumbs: int(0, 1),
      duplicateStitches: int(0, 300),
      ends: int(0, 20),
      carryCm: int(0, 200),
    };
    const filled = fillPieceFeatures(features);
    const loggedMinutes: Partial<Record<Stage, number>> = {};
    for (const stage of STAGES) {
      let m = getStageMinutes(stage, filled, rates) * (1 + (rnd() * 2 - 1) * o.noise);
      if (o.outlierEvery > 0 && i % o.outlierEvery === 6 % o.outlierEvery) m *= 3;
      if (m > 0) loggedMinutes[stage] = Math.round(m);
    }
    out.push({ features, loggedMinutes });
  }
  return out;
}
