// P80 factor from out-of-sample ratios (actual ÷ predicted): a one-sided 80 % bound for one new
// piece, assuming the log ratios are roughly normal (log-normal minutes), with a small-sample
// allowance (Student's t prediction bound, or a 75 %-confidence tolerance bound where wider).
// Method and sources: CALIBRATION.md beside this file.

/** Standard normal 80th percentile, Φ⁻¹(0.8). */
const Z80 = 0.8416212335729143;
/** Confidence of the small-sample allowance: Φ⁻¹(0.75). */
export const P80_CONFIDENCE = 0.75;
const Z_CONFIDENCE = 0.6744897501960817;

/**
 * One-sided normal tolerance factor k: with confidence γ (P80_CONFIDENCE), at least 80 % of new
 * values lie below mean + k·sd, from a sample of n. Natrella's approximation (M. G. Natrella,
 * *Experimental Statistics*, NBS Handbook 91, 1963, §2-5; also Hahn & Meeker ch. 4; from memory):
 * k = (z_p + √(z_p² − a·b)) ÷ a, a = 1 − z_γ² ÷ 2(n − 1), b = z_p² − z_γ² ÷ n.
 * A small history gets a wider margin (k ≈ 1.34 at n = 4, 1.06 at 15, 0.97 at 40, 0.92 at 100),
 * tending to z₀.₈ as the history grows.
 */
export function toleranceK80(n: number): number {
  return toleranceK(n, Z80, Z_CONFIDENCE);
}

/** The same approximation for any content z_p and confidence z_γ (normal quantiles). */
export function toleranceK(n: number, zp: number, zg: number): number {
  if (!(n >= 2)) throw new RangeError(`a tolerance bound needs at least 2 values (got ${n})`);
  const a = 1 - zg ** 2 / (2 * (n - 1));
  const b = zp ** 2 - zg ** 2 / n;
  if (!(a > 0)) throw new RangeError(`too few values (${n}) for this confidence`);
  return (zp + Math.sqrt(zp ** 2 - a * b)) / a;
}

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
  // The larger of two allowances for a small history: the prediction bound (80 % on average over
  // the histories a studio could have had) and the tolerance bound (80 % with 75 % confidence, over
  // the n − p + 1 values the fit leaves free), so one short history rarely gives a P80 that covers
  // much less than four pieces in five.
  const k = Math.max(studentT80(nu) * Math.sqrt(1 + 1 / n), toleranceK80(nu + 1));
  const log80 = mean + k * sd;
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
