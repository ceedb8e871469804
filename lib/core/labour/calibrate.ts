// Re-estimate a studio's rates from finished pieces and their logged minutes, per stage, with a
// robust non-negative fit, and report how well defaults and fitted rates predict held-back pieces.
import { resolveRates, type LabourRates } from "./default-rates";
import { DEFAULT_P80_FACTOR, type P80Factors } from "./estimate-labour";
import { assertPieceFeatures, fillPieceFeatures, type FilledPieceFeatures, type PieceFeatures } from "./piece-features";
import { fitRobustLogNnls, type RobustWeighting } from "./robust-fit";
import { spreadFromLogRatios, type Spread } from "./spread";
import { STAGE_TERMS, getStageMinutes } from "./stage-model";
import { STAGES, type Stage } from "./stages";

export interface LoggedPiece {
  features: PieceFeatures;
  /** minutes logged per stage; a missing or zero stage is left out of that stage's fit */
  loggedMinutes: Partial<Record<Stage, number>>;
}

export interface CalibrationOptions {
  /** rates to start from and to keep where history cannot say (defaults to defaultRates) */
  baseRates?: Partial<LabourRates>;
  weighting?: RobustWeighting;
  /** fewest pieces a stage needs before its rates are refitted (at least coefficients + 1) */
  minPieces?: number;
  /** every n-th piece (n-th, 2n-th, …) is held back to measure accuracy */
  holdBackEvery?: number;
}

export interface StageCalibration {
  /** pieces with minutes logged for this stage */
  pieces: number;
  fitted: boolean;
  /** rates left at the base value because the history does not determine them */
  keptRates: (keyof LabourRates)[];
  /** pieces given less than half weight by the robust fit (likely mislogged or unusual) */
  downWeighted: number;
  p80Factor: number;
  p80Source: "history" | "default";
  /**
   * Leave-one-out check behind the P80 factor (null when too few pieces): median actual ÷ predicted
   * (near 1 when the fitted P50 is a median), sd of the log ratios, pieces and degrees of freedom.
   */
  spread: Spread | null;
}

export interface StageAccuracy {
  /** mean absolute percentage error on held-back pieces, %; null when none logged the stage */
  before: number | null;
  after: number | null;
  pieces: number;
  /**
   * share of held-back pieces logged at or below the P50 and the P80 fitted without them, %
   * (aim: about 50 and at least 80); null when none logged the stage
   */
  p50Coverage: number | null;
  p80Coverage: number | null;
}

export interface AccuracyReport {
  trainedPieces: number;
  heldBackPieces: number;
  stages: Record<Stage, StageAccuracy>;
  /** on each held-back piece's total over its logged stages */
  overall: StageAccuracy;
}

export interface CalibrationResult {
  /** fitted on every piece; the accuracy report uses a separate fit without the held-back ones */
  rates: LabourRates;
  stages: Record<Stage, StageCalibration>;
  p80Factors: P80Factors;
  accuracy: AccuracyReport | null;
  notes: string[];
}

/** A spread needs this many pieces before it replaces the default P80 factor. */
export const MIN_SPREAD_PIECES = 5;
export const DEFAULT_MIN_PIECES = 3;
export const DEFAULT_HOLD_BACK_EVERY = 5;

interface StageRow {
  piece: FilledPieceFeatures;
  minutes: number;
}

function getStageRows(stage: Stage, pieces: LoggedPiece[]): StageRow[] {
  return pieces.flatMap((p) => {
    const minutes = p.loggedMinutes[stage];
    return minutes !== undefined && minutes > 0 ? [{ piece: fillPieceFeatures(p.features), minutes }] : [];
  });
}

interface StageFit {
  rates: Partial<LabourRates>;
  fitted: boolean;
  keptRates: (keyof LabourRates)[];
  downWeighted: number;
  /** out-of-sample log(actual ÷ predicted) per piece the fit did not set aside; empty when not asked */
  looLogRatios: number[];
  /** coefficients the fit chose (0 when nothing was fitted) */
  freeCoefficients: number;
}

/** Up to this many pieces a stage's spread comes from leave-one-out refits; beyond, from ten folds. */
export const LOO_MAX_PIECES = 60;
const CROSS_FOLDS = 10;

/** A piece given less than this robustness weight counts as set aside (likely mislogged). */
const SET_ASIDE_WEIGHT = 0.5;

function fitStage(stage: Stage, rows: StageRow[], base: LabourRates, options: CalibrationOptions, withLoo: boolean): StageFit {
  const terms = STAGE_TERMS[stage];
  const values = rows.map((r) => terms.map((t) => t.valueOf(r.piece)));
  // A term no piece has cannot be learnt from this history.
  const fixed = terms.map((_, j) => values.every((row) => row[j] === 0));
  const baseCoefficients = terms.map((t) => t.toCoefficient(base[t.rate]));
  // Nothing fitted: the base rates predict every piece, and their ratios are already out of sample.
  const keepAll = (): StageFit => ({
    rates: {},
    fitted: false,
    keptRates: terms.map((t) => t.rate),
    downWeighted: 0,
    looLogRatios: withLoo
      ? rows.flatMap((r, i) => {
          const predicted = values[i].reduce((s, v, j) => s + v * baseCoefficients[j], 0);
          return predicted > 0 ? [Math.log(r.minutes / predicted)] : [];
        })
      : [],
    freeCoefficients: 0,
  });

  for (let attempt = 0; attempt <= terms.length; attempt++) {
    const free = terms.flatMap((_, j) => (fixed[j] ? [] : [j]));
    if (free.length === 0) return keepAll();
    if (rows.length < Math.max(options.minPieces ?? DEFAULT_MIN_PIECES, free.length + 1)) return keepAll();
    const x = values.map((row) => free.map((j) => row[j]));
    // Fixed terms keep their base minutes; the fit explains the rest of each logged total.
    const offset = values.map((row) => fixed.reduce((s, f, j) => s + (f ? row[j] * baseCoefficients[j] : 0), 0));
    const y = rows.map((r) => r.minutes);
    // In log space: minutes vary multiplicatively (a sweater's more than a mitten's), and the fit is a median.
    const fit = fitRobustLogNnls(x, y, { offset, weighting: options.weighting });
    const coefficients = [...baseCoefficients];
    free.forEach((j, k) => (coefficients[j] = fit.coefficients[k]));
    // A speed cannot come from 0 minutes per stitch: keep that rate and refit the others.
    const impossible = free.filter((j) => terms[j].fromCoefficient(coefficients[j]) === null);
    if (impossible.length > 0) {
      impossible.forEach((j) => (fixed[j] = true));
      continue;
    }
    const rates: Partial<LabourRates> = {};
    terms.forEach((t, j) => {
      if (!fixed[j]) rates[t.rate] = t.fromCoefficient(coefficients[j]) as number;
    });
    const looLogRatios: number[] = [];
    if (withLoo) {
      // Out of sample: refit without a piece (from the full fit, keeping its robustness weights) and
      // predict it; beyond LOO_MAX_PIECES pieces, ten folds of pieces instead of one piece at a time.
      // Pieces the robust fit rejected outright (weight 0: mislogged) say nothing about the spread;
      // pieces it only softened still count, so real overruns widen the P80.
      const folds = rows.length <= LOO_MAX_PIECES ? rows.length : CROSS_FOLDS;
      for (let f = 0; f < folds; f++) {
        const out = rows.flatMap((_, i) => (i % folds === f && fit.weights[i] > 0 ? [i] : []));
        if (out.length === 0) continue;
        const keep = (_: unknown, k: number) => k % folds !== f;
        const refit = fitRobustLogNnls(x.filter(keep), y.filter(keep), {
          offset: offset.filter(keep),
          start: fit.coefficients,
          fixedWeights: fit.weights.filter(keep),
          maxIterations: 20,
        });
        for (const i of out) {
          const predicted = offset[i] + x[i].reduce((s, v, k) => s + v * refit.coefficients[k], 0);
          if (predicted > 0) looLogRatios.push(Math.log(y[i] / predicted));
        }
      }
    }
    return {
      rates,
      fitted: true,
      keptRates: terms.flatMap((t, j) => (fixed[j] ? [t.rate] : [])),
      downWeighted: fit.weights.filter((w) => w < SET_ASIDE_WEIGHT).length,
      looLogRatios,
      freeCoefficients: free.length,
    };
  }
  return keepAll();
}

function fitAll(pieces: LoggedPiece[], base: LabourRates, options: CalibrationOptions) {
  const rates: LabourRates = { ...base };
  const fits = {} as Record<Stage, StageFit & { rows: StageRow[]; spread: Spread | null }>;
  const p80Factors = {} as P80Factors;
  for (const stage of STAGES) {
    const rows = getStageRows(stage, pieces);
    const fit = fitStage(stage, rows, base, options, true);
    Object.assign(rates, fit.rates);
    const spread = fit.looLogRatios.length >= MIN_SPREAD_PIECES ? spreadFromLogRatios(fit.looLogRatios, fit.freeCoefficients) : null;
    p80Factors[stage] = spread?.p80Factor ?? DEFAULT_P80_FACTOR;
    fits[stage] = { ...fit, rows, spread };
  }
  return { rates, fits, p80Factors };
}

const toPercent = (fraction: number) => Math.round(fraction * 1000) / 10;

function meanAbsolutePercentError(pairs: { actual: number; predicted: number }[]): number | null {
  if (pairs.length === 0) return null;
  const sum = pairs.reduce((s, p) => s + Math.abs(p.predicted - p.actual) / p.actual, 0);
  return toPercent(sum / pairs.length);
}

function coverage(pairs: { actual: number; bound: number }[]): number | null {
  if (pairs.length === 0) return null;
  return toPercent(pairs.filter((p) => p.actual <= p.bound).length / pairs.length);
}

function getAccuracy(heldBack: LoggedPiece[], before: LabourRates, after: LabourRates, p80: P80Factors, trained: number): AccuracyReport {
  const stages = {} as Record<Stage, StageAccuracy>;
  for (const stage of STAGES) {
    const rows = getStageRows(stage, heldBack).map((r) => ({ ...r, predicted: getStageMinutes(stage, r.piece, after) }));
    stages[stage] = {
      before: meanAbsolutePercentError(rows.map((r) => ({ actual: r.minutes, predicted: getStageMinutes(stage, r.piece, before) }))),
      after: meanAbsolutePercentError(rows.map((r) => ({ actual: r.minutes, predicted: r.predicted }))),
      pieces: rows.length,
      p50Coverage: coverage(rows.map((r) => ({ actual: r.minutes, bound: r.predicted }))),
      p80Coverage: coverage(rows.map((r) => ({ actual: r.minutes, bound: r.predicted * p80[stage] }))),
    };
  }
  const totals = heldBack.flatMap((p) => {
    const piece = fillPieceFeatures(p.features);
    const logged = STAGES.filter((s) => (p.loggedMinutes[s] ?? 0) > 0);
    if (logged.length === 0) return [];
    const actual = logged.reduce((s, st) => s + (p.loggedMinutes[st] ?? 0), 0);
    const predict = (r: LabourRates, factor: (st: Stage) => number = () => 1) =>
      logged.reduce((s, st) => s + getStageMinutes(st, piece, r) * factor(st), 0);
    // The whole piece's P80 is the sum of its stages' P80s, as the estimate's totals are.
    return [{ actual, before: predict(before), after: predict(after), p80: predict(after, (st) => p80[st]) }];
  });
  return {
    trainedPieces: trained,
    heldBackPieces: heldBack.length,
    stages,
    overall: {
      before: meanAbsolutePercentError(totals.map((t) => ({ actual: t.actual, predicted: t.before }))),
      after: meanAbsolutePercentError(totals.map((t) => ({ actual: t.actual, predicted: t.after }))),
      pieces: totals.length,
      p50Coverage: coverage(totals.map((t) => ({ actual: t.actual, bound: t.after }))),
      p80Coverage: coverage(totals.map((t) => ({ actual: t.actual, bound: t.p80 }))),
    },
  };
}

function assertLoggedPiece(p: LoggedPiece, i: number): void {
  assertPieceFeatures(p.features, `pieces[${i}].features`);
  for (const [stage, v] of Object.entries(p.loggedMinutes)) {
    if (!(STAGES as readonly string[]).includes(stage)) {
      throw new RangeError(`pieces[${i}].loggedMinutes.${stage} is not a stage (use ${STAGES.join(", ")})`);
    }
    if (v !== undefined && (typeof v !== "number" || !Number.isFinite(v) || v < 0)) {
      throw new RangeError(`pieces[${i}].loggedMinutes.${stage} must be a number ≥ 0 (got ${String(v)})`);
    }
  }
}

export function calibrateRates(pieces: LoggedPiece[], options: CalibrationOptions = {}): CalibrationResult {
  pieces.forEach(assertLoggedPiece);
  const base = resolveRates(options.baseRates);
  const every = options.holdBackEvery ?? DEFAULT_HOLD_BACK_EVERY;
  if (!Number.isInteger(every) || every < 2) throw new RangeError(`holdBackEvery must be a whole number ≥ 2 (got ${every})`);
  const notes: string[] = [];

  const { rates, fits, p80Factors } = fitAll(pieces, base, options);
  const stages = {} as Record<Stage, StageCalibration>;
  for (const stage of STAGES) {
    const fit = fits[stage];
    stages[stage] = {
      pieces: fit.rows.length,
      fitted: fit.fitted,
      keptRates: fit.keptRates,
      downWeighted: fit.downWeighted,
      p80Factor: p80Factors[stage],
      p80Source: fit.spread ? "history" : "default",
      spread: fit.spread,
    };
    if (!fit.fitted) notes.push(`${stage}: ${fit.rows.length} logged piece(s) are too few to refit; base rates kept`);
    if (fit.downWeighted > 0) notes.push(`${stage}: ${fit.downWeighted} piece(s) looked unusual and were given little weight`);
    if (!fit.spread && fit.rows.length > 0) {
      notes.push(`${stage}: the P80 margin stays at the default ×${DEFAULT_P80_FACTOR} until ${MIN_SPREAD_PIECES} pieces can be checked one by one`);
    }
  }

  let accuracy: AccuracyReport | null = null;
  const heldBack = pieces.filter((_, i) => i % every === every - 1);
  const trained = pieces.filter((_, i) => i % every !== every - 1);
  if (heldBack.length === 0) {
    notes.push(`accuracy needs at least ${every} pieces so that one can be held back`);
  } else {
    // Rates and P80 factors fitted without the held-back pieces, then checked on them.
    const fitTrained = fitAll(trained, base, options);
    accuracy = getAccuracy(heldBack, base, fitTrained.rates, fitTrained.p80Factors, trained.length);
  }
  return { rates, stages, p80Factors, accuracy, notes };
}
