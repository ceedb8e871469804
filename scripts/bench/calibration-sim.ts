// Coverage simulation for labour calibration: a seeded studio with known "true" rates logs finished
// pieces with log-normal noise; the history goes through the `calibrate` verb, and fresh pieces from
// the same generator go, one at a time, through the `estimate` verb with the fitted rates and P80
// factors (exactly as calibrate's output feeds estimate's input). Coverage is the share of fresh
// pieces whose logged minutes are at or below the estimate, per stage and on the whole piece.
// Shared by scripts/bench/calibration-coverage.ts (prints JSON lines) and the unit test.
import type { LoggedPiece } from "@/lib/core/labour/calibrate";
import type { LabourRates } from "@/lib/core/labour/default-rates";
import { fillPieceFeatures, type PieceFeatures } from "@/lib/core/labour/piece-features";
import { getStageMinutes } from "@/lib/core/labour/stage-model";
import { STAGES, type Stage } from "@/lib/core/labour/stages";
import { run as runCalibrate } from "@/scripts/core-verbs/calibrate";
import { run as runEstimate } from "@/scripts/core-verbs/estimate";

/** mulberry32: a small, well-known 32-bit seeded generator; enough for simulation. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) | 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A standard normal draw by the Box–Muller transform. */
function normal(rnd: () => number): number {
  const u = 1 - rnd(); // (0, 1]: log(0) never happens
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rnd());
}

/** The simulated studio: faster than our defaults at knitting, slower at embroidery. */
export const SIM_TRUE_RATES: LabourRates = {
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

type Kind = "mitten" | "hat" | "cowl" | "pullover";

/** Stitch counts of the kinds of piece a small colourwork studio makes (rough sizes, ours). */
function makeFeatures(rnd: () => number): PieceFeatures {
  const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
  const kinds: Kind[] = ["mitten", "mitten", "hat", "hat", "cowl", "pullover"];
  const kind = kinds[Math.floor(rnd() * kinds.length)];
  const total = { mitten: int(4000, 8000), hat: int(6000, 14000), cowl: int(8000, 16000), pullover: int(60000, 140000) }[kind];
  const strandedShare = 0.1 + rnd() * 0.6;
  const stranded = Math.round(total * strandedShare);
  const newDesign = rnd() < 0.6;
  return {
    label: kind,
    newDesign,
    proofRounds: newDesign ? int(1, 3) : int(0, 1),
    plainStitches: total - stranded,
    strandedStitches: stranded,
    floatCatches: Math.round(stranded * (0.02 + rnd() * 0.06)),
    shapingRounds: kind === "pullover" ? int(30, 80) : kind === "cowl" ? int(0, 4) : int(8, 24),
    thumbs: kind === "mitten" ? 1 : 0,
    duplicateStitches: rnd() < 0.7 ? int(20, 400) : 0,
    ends: int(2, 24),
    carryCm: int(0, 250),
  };
}

export interface SimPiece extends LoggedPiece {
  features: PieceFeatures;
}

/** Pieces with minutes logged per stage: true minutes × exp(σ·Z), rounded to whole minutes as a timer logs them. */
export function makeLoggedPieces(rnd: () => number, count: number, sigma: number, rates: LabourRates = SIM_TRUE_RATES): SimPiece[] {
  const out: SimPiece[] = [];
  for (let i = 0; i < count; i++) {
    const features = makeFeatures(rnd);
    const filled = fillPieceFeatures(features);
    const loggedMinutes: Partial<Record<Stage, number>> = {};
    for (const stage of STAGES) {
      const m = Math.round(getStageMinutes(stage, filled, rates) * Math.exp(sigma * normal(rnd)));
      if (m > 0) loggedMinutes[stage] = m;
    }
    out.push({ features, loggedMinutes });
  }
  return out;
}

export interface Coverage {
  /** share of fresh pieces logged at or below P50 / P80, % */
  p50: number;
  p80: number;
  pieces: number;
}

export interface CoverageRun {
  sigma: number;
  historyPieces: number;
  histories: number;
  freshPerHistory: number;
  stages: Record<Stage, Coverage>;
  /** whole pieces against the sum of their stage figures */
  overall: Coverage;
  /** lowest P80 and the P50 range over the single histories, per stage, % */
  worstP80: Record<Stage, number>;
  p50Range: Record<Stage, [number, number]>;
  /** single histories whose P80 covered fewer than 75 % of their fresh pieces, per stage */
  historiesP80Below75: Record<Stage, number>;
}

interface Tally {
  p50: number;
  p80: number;
  n: number;
}

const pct = (k: number, n: number) => (n === 0 ? 0 : Math.round((k / n) * 1000) / 10);

interface EstimateOut {
  stages: Record<Stage, { p50Minutes: number; p80Minutes: number }>;
}

export function simulateCoverage(o: { seed: number; sigma: number; historyPieces: number; histories: number; fresh: number }): CoverageRun {
  const rnd = seededRandom(o.seed);
  const total = Object.fromEntries(STAGES.map((s) => [s, { p50: 0, p80: 0, n: 0 }])) as Record<Stage, Tally>;
  const overall: Tally = { p50: 0, p80: 0, n: 0 };
  const worstP80 = Object.fromEntries(STAGES.map((s) => [s, 100])) as Record<Stage, number>;
  const p50Range = Object.fromEntries(STAGES.map((s) => [s, [100, 0]])) as Record<Stage, [number, number]>;
  const below75 = Object.fromEntries(STAGES.map((s) => [s, 0])) as Record<Stage, number>;
  for (let h = 0; h < o.histories; h++) {
    const history = makeLoggedPieces(rnd, o.historyPieces, o.sigma);
    // Through the verbs, as a studio's data would go: calibrate's rates and p80Factors are estimate's input.
    const cal = runCalibrate(JSON.parse(JSON.stringify({ pieces: history }))) as { rates: LabourRates; p80Factors: Record<Stage, number> };
    const fresh = makeLoggedPieces(rnd, o.fresh, o.sigma);
    const mine = Object.fromEntries(STAGES.map((s) => [s, { p50: 0, p80: 0, n: 0 }])) as Record<Stage, Tally>;
    for (const piece of fresh) {
      const est = runEstimate(JSON.parse(JSON.stringify({ pieces: [piece.features], rates: cal.rates, p80Factors: cal.p80Factors }))) as EstimateOut;
      let logged = 0;
      let p50 = 0;
      let p80 = 0;
      for (const stage of STAGES) {
        const m = piece.loggedMinutes[stage];
        if (m === undefined) continue;
        const e = est.stages[stage];
        for (const t of [mine[stage], total[stage]]) {
          t.n++;
          if (m <= e.p50Minutes) t.p50++;
          if (m <= e.p80Minutes) t.p80++;
        }
        logged += m;
        p50 += e.p50Minutes;
        p80 += e.p80Minutes;
      }
      overall.n++;
      if (logged <= p50) overall.p50++;
      if (logged <= p80) overall.p80++;
    }
    for (const s of STAGES) {
      worstP80[s] = Math.min(worstP80[s], pct(mine[s].p80, mine[s].n));
      if (mine[s].n > 0 && mine[s].p80 / mine[s].n < 0.75) below75[s]++;
      p50Range[s] = [Math.min(p50Range[s][0], pct(mine[s].p50, mine[s].n)), Math.max(p50Range[s][1], pct(mine[s].p50, mine[s].n))];
    }
  }
  const cover = (t: Tally): Coverage => ({ p50: pct(t.p50, t.n), p80: pct(t.p80, t.n), pieces: t.n });
  return {
    sigma: o.sigma,
    historyPieces: o.historyPieces,
    histories: o.histories,
    freshPerHistory: o.fresh,
    stages: Object.fromEntries(STAGES.map((s) => [s, cover(total[s])])) as Record<Stage, Coverage>,
    overall: cover(overall),
    worstP80,
    p50Range,
    historiesP80Below75: below75,
  };
}

export const SIM_SIGMAS = [0.1, 0.2, 0.35, 0.5] as const;
export const SIM_HISTORY_SIZES = [8, 15, 40, 100] as const;
