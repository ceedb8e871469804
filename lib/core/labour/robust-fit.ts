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
