// Re-estimate a studio's rates from finished pieces and their logged minutes, per stage, with a
// robust non-negative fit, and report how well defaults and fitted rates predict held-back pieces.
import { resolveRates, type LabourRates } from "./default-rates";
import { DEFAULT_P80_FACTOR, type P80Factors } from "./estimate-labour";
import { assertPieceFeatures, fillPieceFeatures, type FilledPieceFeatures, type PieceFeatures } from "./piece-features";
import { fitRobustNnls, type RobustWeighting } from "./robust-fit";
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
}

export interface StageAccuracy {
  /** mean absolute percentage error on held-back pieces, %; null when none logged the stage */
  before: number | null;
  after: number | null;
  pieces: number;
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
}

function fitStage(stage: Stage, rows: StageRow[], base: LabourRates, options: CalibrationOptions): StageFit {
  const terms = STAGE_TERMS[stage];
  const values = rows.map((r) => terms.map((t) => t.valueOf(r.piece)));
  // A term no piece has cannot be learnt from this history.
  const fixed = terms.map((_, j) => values.every((row) => row[j] === 0));
  const baseCoefficients = terms.map((t) => t.toCoefficient(base[t.rate]));
  const keepAll: StageFit = { rates: {}, fitted: false, keptRates: terms.map((t) => t.rate), downWeighted: 0 };

  for (let attempt = 0; attempt <= terms.length; attempt++) {
    const free = terms.flatMap((_, j) => (fixed[j] ? [] : [j]));
    if (free.length === 0) return keepAll;
    if (rows.length < Math.max(options.minPieces ?? DEFAULT_MIN_PIECES, free.length + 1)) return keepAll;
    const x = values.map((row) => free.map((j) => row[j]));
    // Fixed terms keep their base minutes; the fit explains what is left.
    const y = rows.map((r, i) => r.minutes - fixed.reduce((s, f, j) => s + (f ? values[i][j] * baseCoefficients[j] : 0), 0));
    // Fit relative errors: a sweater's minutes vary more in absolute terms than a mitten's.
    const rowScale = rows.map((r) => 1 / r.minutes);
    const fit = fitRobustNnls(x, y, { rowScale, weighting: options.weighting });
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
    return {
      rates,
      fitted: true,
      keptRates: terms.flatMap((t, j) => (fixed[j] ? [t.rate] : [])),
      downWeighted: fit.weights.filter((w) => w < 0.5).length,
    };
  }
  return keepAll;
}

function quantile(values: number[], q: number): number {
  const s = [...values].sort((a, b) => a - b);
  const pos = (s.length - 1) * q;
  const lo = Math.floor(pos);
  const hi = Math.ceil(pos);
  return s[lo] + (s[hi] - s[lo]) * (pos - lo);
}

function fitAll(pieces: LoggedPiece[], base: LabourRates, options: CalibrationOptions) {
  const rates: LabourRates = { ...base };
  const fits = {} as Record<Stage, StageFit & { rows: StageRow[] }>;
  for (const stage of STAGES) {
    const rows = getStageRows(stage, pieces);
    const fit = fitStage(stage, rows, base, options);
    Object.assign(rates, fit.rates);
    fits[stage] = { ...fit, rows };
  }
  return { rates, fits };
}

const toPercent = (fraction: number) => Math.round(fraction * 1000) / 10;

function meanAbsolutePercentError(pairs: { actual: number; predicted: number }[]): number | null {
  if (pairs.length === 0) return null;
  const sum = pairs.reduce((s, p) => s + Math.abs(p.predicted - p.actual) / p.actual, 0);
  return toPercent(sum / pairs.length);
}

function getAccuracy(heldBack: LoggedPiece[], before: LabourRates, after: LabourRates, trained: number): AccuracyReport {
  const stages = {} as Record<Stage, StageAccuracy>;
  for (const stage of STAGES) {
    const rows = getStageRows(stage, heldBack);
    stages[stage] = {
      before: meanAbsolutePercentError(rows.map((r) => ({ actual: r.minutes, predicted: getStageMinutes(stage, r.piece, before) }))),
      after: meanAbsolutePercentError(rows.map((r) => ({ actual: r.minutes, predicted: getStageMinutes(stage, r.piece, after) }))),
      pieces: rows.length,
    };
  }
  const totals = heldBack.flatMap((p) => {
    const piece = fillPieceFeatures(p.features);
    const logged = STAGES.filter((s) => (p.loggedMinutes[s] ?? 0) > 0);
    if (logged.length === 0) return [];
    const actual = logged.reduce((s, st) => s + (p.loggedMinutes[st] ?? 0), 0);
    const predict = (r: LabourRates) => logged.reduce((s, st) => s + getStageMinutes(st, piece, r), 0);
    return [{ actual, before: predict(before), after: predict(after) }];
  });
  return {
    trainedPieces: trained,
    heldBackPieces: heldBack.length,
    stages,
    overall: {
      before: meanAbsolutePercentError(totals.map((t) => ({ actual: t.actual, predicted: t.before }))),
      after: meanAbsolutePercentError(totals.map((t) => ({ actual: t.actual, predicted: t.after }))),
      pieces: totals.length,
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

  const { rates, fits } = fitAll(pieces, base, options);
  const stages = {} as Record<Stage, StageCalibration>;
  const p80Factors = {} as P80Factors;
  for (const stage of STAGES) {
    const fit = fits[stage];
    const ratios = fit.rows.flatMap((r) => {
      const predicted = getStageMinutes(stage, r.piece, rates);
      return predicted > 0 ? [r.minutes / predicted] : [];
    });
    // The 80th percentile of actual ÷ estimate is the margin that covered four pieces in five.
    const fromHistory = ratios.length >= MIN_SPREAD_PIECES;
    p80Factors[stage] = fromHistory ? Math.max(1, Math.round(quantile(ratios, 0.8) * 1000) / 1000) : DEFAULT_P80_FACTOR;
    stages[stage] = {
      pieces: fit.rows.length,
      fitted: fit.fitted,
      keptRates: fit.keptRates,
      downWeighted: fit.downWeighted,
      p80Factor: p80Factors[stage],
      p80Source: fromHistory ? "history" : "default",
    };
    if (!fit.fitted) notes.push(`${stage}: ${fit.rows.length} logged piece(s) are too few to refit; base rates kept`);
    if (fit.downWeighted > 0) notes.push(`${stage}: ${fit.downWeighted} piece(s) looked unusual and were given little weight`);
  }

  let accuracy: AccuracyReport | null = null;
  const heldBack = pieces.filter((_, i) => i % every === every - 1);
  const trained = pieces.filter((_, i) => i % every !== every - 1);
  if (heldBack.length === 0) {
    notes.push(`accuracy needs at least ${every} pieces so that one can be held back`);
  } else {
    const trainedRates = fitAll(trained, base, options).rates;
    accuracy = getAccuracy(heldBack, base, trainedRates, trained.length);
  }
  return { rates, stages, p80Factors, accuracy, notes };
}
