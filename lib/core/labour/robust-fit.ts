// Robust non-negative linear fit: iteratively reweighted NNLS, first with Huber weights (which
// only soften outliers), then with Tukey biweights from that start (which can ignore them fully).
import { solveNnls } from "./nnls";

export type RobustWeighting = "huber" | "tukey";

export interface RobustFitOptions {
  /** per-row multiplier on the residual, e.g. 1 / logged minutes to fit relative errors */
  rowScale?: number[];
  weighting?: RobustWeighting;
  maxIterations?: number;
}

export interface RobustFitResult {
  coefficients: number[];
  /** final robustness weight per row, 0 (ignored) to 1 (full) */
  weights: number[];
  /** robust scale (1.4826 × median |scaled residual|) the weights were judged against */
  scale: number;
  iterations: number;
}

// Tuning constants giving 95 % efficiency on normal errors (Huber 1964; Beaton & Tukey 1974).
const HUBER_K = 1.345;
const TUKEY_C = 4.685;
// Turns the median absolute deviation into a standard-deviation estimate for normal errors.
const MAD_TO_SIGMA = 1.4826;

function median(values: number[]): number {
  if (values.length === 0) return 0;
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

function residuals(x: number[][], y: number[], beta: number[], rowScale: number[]): number[] {
  return x.map((row, i) => {
    let pred = 0;
    for (let j = 0; j < beta.length; j++) pred += row[j] * beta[j];
    return (y[i] - pred) * rowScale[i];
  });
}

function weightedNnls(x: number[][], y: number[], rowScale: number[], weights: number[]): number[] {
  const a: number[][] = [];
  const b: number[] = [];
  x.forEach((row, i) => {
    const f = rowScale[i] * Math.sqrt(weights[i]);
    if (f === 0) return;
    a.push(row.map((v) => v * f));
    b.push(y[i] * f);
  });
  if (a.length === 0) return new Array<number>(x[0]?.length ?? 0).fill(0);
  return solveNnls(a, b).x;
}

function converged(prev: number[], next: number[]): boolean {
  return next.every((v, j) => Math.abs(v - prev[j]) <= 1e-9 * Math.max(1e-12, Math.abs(v), Math.abs(prev[j])));
}

export function fitRobustNnls(x: number[][], y: number[], options: RobustFitOptions = {}): RobustFitResult {
  const rowScale = options.rowScale ?? y.map(() => 1);
  const weighting = options.weighting ?? "tukey";
  const maxIterations = options.maxIterations ?? 50;
  let weights = y.map(() => 1);
  let beta = weightedNnls(x, y, rowScale, weights);
  let scale = 0;
  let iterations = 1;

  // Huber phase: re-estimate the scale every round.
  for (; iterations < maxIterations; iterations++) {
    const r = residuals(x, y, beta, rowScale);
    scale = MAD_TO_SIGMA * median(r.map(Math.abs));
    if (scale <= 1e-12) break;
    weights = r.map((ri) => {
      const u = Math.abs(ri) / (HUBER_K * scale);
      return u <= 1 ? 1 : 1 / u;
    });
    const next = weightedNnls(x, y, rowScale, weights);
    const done = converged(beta, next);
    beta = next;
    if (done) break;
  }

  if (weighting === "tukey" && scale > 1e-12) {
    // Tukey phase: the scale stays fixed at the Huber estimate so rejected rows cannot shrink it.
    for (let k = 0; k < maxIterations; k++, iterations++) {
      const r = residuals(x, y, beta, rowScale);
      weights = r.map((ri) => {
        const u = ri / (TUKEY_C * scale);
        return Math.abs(u) < 1 ? (1 - u * u) ** 2 : 0;
      });
      const next = weightedNnls(x, y, rowScale, weights);
      const done = converged(beta, next);
      beta = next;
      if (done) break;
    }
  }
  return { coefficients: beta, weights, scale, iterations };
}

export interface RobustLogFitOptions {
  /** known part of each row's prediction (minutes of terms held at their base rate); default 0 */
  offset?: number[];
  weighting?: RobustWeighting;
  maxIterations?: number;
  /** start from these coefficients and keep these robustness weights (leave-one-out refits) */
  start?: number[];
  fixedWeights?: number[];
}

export interface RobustLogFitResult extends RobustFitResult {
  /** log(y ÷ prediction) per row at the solution */
  logResiduals: number[];
}

// A prediction this far below the logged value (e^-3 ≈ 5 %) is treated as that far when linearising,
// so one row with a near-zero prediction cannot dominate a step.
const MIN_PREDICTION_SHARE = Math.exp(-3);

function predictions(x: number[][], beta: number[], offset: number[]): number[] {
  return x.map((row, i) => {
    let p = offset[i];
    for (let j = 0; j < beta.length; j++) p += row[j] * beta[j];
    return p;
  });
}

function logResidualsOf(y: number[], mu: number[]): number[] {
  return y.map((yi, i) => Math.log(yi / Math.max(mu[i], yi * MIN_PREDICTION_SHARE)));
}

function weightedLogLoss(r: number[], w: number[]): number {
  return r.reduce((s, ri, i) => s + w[i] * ri * ri, 0);
}

/**
 * One projected Gauss–Newton step for Σ wᵢ (log yᵢ − log μᵢ)², μ = offset + X·β, β ≥ 0: around μ⁰,
 * log y − log μ ≈ (z − offset − X·β) ÷ μ⁰ with z = μ⁰ (1 + log(y ÷ μ⁰)), a weighted NNLS problem.
 * Halves the step while the loss grows.
 */
function logStep(x: number[][], y: number[], offset: number[], beta: number[], weights: number[]): number[] {
  const mu = predictions(x, beta, offset).map((m, i) => Math.max(m, y[i] * MIN_PREDICTION_SHARE));
  const r = logResidualsOf(y, mu);
  const z = mu.map((m, i) => m * (1 + r[i]) - offset[i]);
  const target = weightedNnls(x, z, mu.map((m) => 1 / m), weights);
  const before = weightedLogLoss(r, weights);
  let step = 1;
  for (let k = 0; k < 12; k++, step /= 2) {
    const next = beta.map((b, j) => b + step * (target[j] - b));
    if (weightedLogLoss(logResidualsOf(y, predictions(x, next, offset)), weights) <= before * (1 + 1e-12)) return next;
  }
  return beta;
}

/**
 * Robust non-negative fit of y ≈ offset + X·β in log space: the residuals are log(y ÷ prediction),
 * so with multiplicative noise the fit is a median (a fit of relative errors weighted by 1/y is
 * pulled low, by about exp(−1.5σ²) under log-normal noise of σ). Starts from the relative-error
 * fit, then Huber and Tukey weights on the log residuals exactly as fitRobustNnls does.
 * Every y must be > 0.
 */
export function fitRobustLogNnls(x: number[][], y: number[], options: RobustLogFitOptions = {}): RobustLogFitResult {
  if (y.some((v) => !(v > 0))) throw new RangeError("fitRobustLogNnls: every logged value must be greater than 0");
  const offset = options.offset ?? y.map(() => 0);
  const weighting = options.weighting ?? "tukey";
  const maxIterations = options.maxIterations ?? 50;
  let beta =
    options.start ?? fitRobustNnls(x, y.map((v, i) => v - offset[i]), { rowScale: y.map((v) => 1 / v), weighting: "huber", maxIterations }).coefficients;
  let iterations = 0;

  if (options.fixedWeights) {
    const weights = options.fixedWeights;
    for (; iterations < maxIterations; iterations++) {
      const next = logStep(x, y, offset, beta, weights);
      const done = converged(beta, next);
      beta = next;
      if (done) break;
    }
    const logResiduals = logResidualsOf(y, predictions(x, beta, offset));
    return { coefficients: beta, weights, scale: MAD_TO_SIGMA * median(logResiduals.map(Math.abs)), iterations, logResiduals };
  }

  let weights = y.map(() => 1);
  let scale = 0;
  // Huber phase: the scale is re-estimated from the log residuals every round.
  for (; iterations < maxIterations; iterations++) {
    const r = logResidualsOf(y, predictions(x, beta, offset));
    scale = MAD_TO_SIGMA * median(r.map(Math.abs));
    if (scale <= 1e-12) break;
    weights = r.map((ri) => {
      const u = Math.abs(ri) / (HUBER_K * scale);
      return u <= 1 ? 1 : 1 / u;
    });
    const next = logStep(x, y, offset, beta, weights);
    const done = converged(beta, next);
    beta = next;
    if (done) break;
  }
  if (weighting === "tukey" && scale > 1e-12) {
    // Tukey phase: the scale stays at the Huber estimate so rejected rows cannot shrink it.
    for (let k = 0; k < maxIterations; k++, iterations++) {
      const r = logResidualsOf(y, predictions(x, beta, offset));
      weights = r.map((ri) => {
        const u = ri / (TUKEY_C * scale);
        return Math.abs(u) < 1 ? (1 - u * u) ** 2 : 0;
      });
      const next = logStep(x, y, offset, beta, weights);
      const done = converged(beta, next);
      beta = next;
      if (done) break;
    }
  }
  return { coefficients: beta, weights, scale, iterations, logResiduals: logResidualsOf(y, predictions(x, beta, offset)) };
}
