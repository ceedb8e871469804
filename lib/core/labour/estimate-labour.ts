// Labour estimate per stage with a P50 (typical) and P80 (four jobs in five finish within) figure.
import { resolveRates, type LabourRates } from "./default-rates";
import { assertPieceFeatures, fillPieceFeatures, type PieceFeatures } from "./piece-features";
import { getStageMinutes } from "./stage-model";
import { STAGES, type Stage } from "./stages";

/**
 * P80 = P50 × 1.25 until a studio has its own history. This factor is our assumption (not a
 * published figure): hand work overruns more often than it underruns, and a quarter is a
 * cautious margin. Calibration replaces it with the spread of the studio's own residuals.
 */
export const DEFAULT_P80_FACTOR = 1.25;

export type P80Factors = Record<Stage, number>;

export interface LabourEstimateInput {
  pieces: PieceFeatures[];
  rates?: Partial<LabourRates>;
  /** per-stage P80 ÷ P50, e.g. from calibrateRates(); each ≥ 1 */
  p80Factors?: Partial<P80Factors>;
}

export interface StageEstimate {
  p50Minutes: number;
  p80Minutes: number;
  p50Hours: number;
  p80Hours: number;
}

export interface PieceEstimate {
  label?: string;
  p50Minutes: Record<Stage, number>;
  /** this piece's P80 per stage (its P50 × the stage's factor), e.g. to check calibration piece by piece */
  p80Minutes: Record<Stage, number>;
}

export interface LabourEstimate {
  stages: Record<Stage, StageEstimate>;
  /** sums of the rounded stage figures, so they add up on screen; the P80 total is cautious, as if every stage overran at once */
  totals: StageEstimate;
  /** calendar hours to dry after blocking (pieces dry side by side, so the longest); not labour */
  dryingHours: number;
  pieces: PieceEstimate[];
  rates: LabourRates;
  p80Factors: P80Factors;
}

export function resolveP80Factors(partial: Partial<P80Factors> = {}): P80Factors {
  const out = {} as P80Factors;
  for (const stage of STAGES) {
    const f = partial[stage] ?? DEFAULT_P80_FACTOR;
    if (!Number.isFinite(f) || f < 1) throw new RangeError(`p80Factors.${stage} must be a number ≥ 1 (got ${f})`);
    out[stage] = f;
  }
  return out;
}

// Labour minutes are not money: nearest whole minute is precise enough to plan and to price.
const toWholeMinutes = (m: number) => Math.round(m);
const toHours = (m: number) => Math.round((m / 60) * 100) / 100;

function stageEstimate(p50Minutes: number, p80Minutes: number): StageEstimate {
  return { p50Minutes, p80Minutes, p50Hours: toHours(p50Minutes), p80Hours: toHours(p80Minutes) };
}

export function estimateLabour(input: LabourEstimateInput): LabourEstimate {
  const rates = resolveRates(input.rates);
  const p80Factors = resolveP80Factors(input.p80Factors);
  input.pieces.forEach((p, i) => assertPieceFeatures(p, `pieces[${i}]`));
  const filled = input.pieces.map(fillPieceFeatures);

  const exact = Object.fromEntries(STAGES.map((s) => [s, 0])) as Record<Stage, number>;
  const pieces: PieceEstimate[] = filled.map((piece) => {
    const p50Minutes = {} as Record<Stage, number>;
    const p80Minutes = {} as Record<Stage, number>;
    for (const stage of STAGES) {
      const m = getStageMinutes(stage, piece, rates);
      exact[stage] += m;
      p50Minutes[stage] = toWholeMinutes(m);
      p80Minutes[stage] = toWholeMinutes(m * p80Factors[stage]);
    }
    return { label: piece.label, p50Minutes, p80Minutes };
  });

  const stages = {} as Record<Stage, StageEstimate>;
  let p50Total = 0;
  let p80Total = 0;
  for (const stage of STAGES) {
    const p50 = toWholeMinutes(exact[stage]);
    const p80 = toWholeMinutes(exact[stage] * p80Factors[stage]);
    stages[stage] = stageEstimate(p50, p80);
    p50Total += p50;
    p80Total += p80;
  }

  let dryingHours = 0;
  for (const piece of filled) {
    if (piece.blocked) dryingHours = Math.max(dryingHours, piece.dryingHours ?? rates.dryingHoursPerPiece);
  }

  return { stages, totals: stageEstimate(p50Total, p80Total), dryingHours, pieces, rates, p80Factors };
}
