// P80 factor from out-of-sample ratios (actual ÷ predicted): a one-sided 80 % prediction bound for
// one new piece, assuming the log ratios are roughly normal (log-normal minutes), with Student's t
// for the small-sample allowance. Method and sources: CALIBRATION.md beside this file.

/** Standard normal 80th percentile, Φ⁻¹(0.8). */
const Z80 = 0.8416212335729143;

/**
 * Student's t 80th percentile with ν degrees of freedom: exact closed forms for ν = 1 and 2, the
 * Cornish–Fisher expansion in 1/ν (Abramowitz & Stegun 26.7.5) above; it gives 0.978 at ν = 3,
 * 0.879 at ν = 10 and tends to 0.8416.
 */
export function studentT80(nu: number): number {
  if (!(nu >= 1)) throw new RangeError(`degrees of freedom must be ≥ 1 (got ${nu})`);
  if (nu === 1) return Math.tan(0.3 * Math.PI);
  if (nu === 2) return 0.6 / Math.sqrt(2 * 0.8 * 0.2);
  const z = Z80;
  const z3 = z ** 3;
  const z5 = z ** 5;
  const z7 = z ** 7;
  const z9 = z ** 9;
  return (
    z +
    (z3 + z) / (4 * nu) +
    (5 * z5 + 16 * z3 + 3 * z) / (96 * nu ** 2) +
    (3 * z7 + 19 * z5 + 17 * z3 - 15 * z) / (384 * nu ** 3) +
    (79 * z9 + 776 * z7 + 1482 * z5 - 1920 * z3 - 945 * z) / (92160 * nu ** 4)
  );
}

export interface Spread {
  /** P80 ÷ P50, at least 1 */
  p80Factor: number;
  /** median of the out-of-sample ratios actual ÷ predicted: near 1 when the P50 is a median */
  medianRatio: number;
  /** standard deviation of the log ratios */
  logSd: number;
  degreesOfFreedom: number;
  pieces: number;
}

/**
 * From n out-of-sample log ratios lᵢ = log(actual ÷ predicted) and p coefficients fitted:
 * log P80 factor = mean(l) + t₀.₈(ν) · sd(l) · √(1 + 1/n), ν = n − p (at least 1): the normal-theory
 * prediction bound for one new value, with the centre's own uncertainty and ν cautious by the fitted
 * coefficients. Null when there are fewer than two ratios.
 */
export function spreadFromLogRatios(logRatios: number[], fittedCoefficients: number): Spread | null {
  const n = logRatios.length;
  if (n < 2) return null;
  const mean = logRatios.reduce((s, v) => s + v, 0) / n;
  const sd = Math.sqrt(logRatios.reduce((s, v) => s + (v - mean) ** 2, 0) / (n - 1));
  const nu = Math.max(1, n - fittedCoefficients);
  const log80 = mean + studentT80(nu) * sd * Math.sqrt(1 + 1 / n);
  const sorted = [...logRatios].sort((a, b) => a - b);
  const mid = n >> 1;
  const medianLog = n % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
  // Rounded up to three decimals: a P80 is never made smaller by rounding.
  return {
    p80Factor: Math.max(1, Math.ceil(Math.exp(log80) * 1000 - 1e-9) / 1000),
    medianRatio: Math.round(Math.exp(medianLog) * 1000) / 1000,
    logSd: Math.round(sd * 1000) / 1000,
    degreesOfFreedom: nu,
    pieces: n,
  };
}
