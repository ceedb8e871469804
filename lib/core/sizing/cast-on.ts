// Stitch and row counts from lengths. Ties go up (a garment a hair larger fits; one smaller may not).
import { SizingError } from "./sizing-error";

// Binary fractions make 14.5 arrive as 14.499999…: treat anything this close to a half as the half.
const TIE_EPSILON = 1e-9;

function roundHalfUp(x: number): number {
  return Math.floor(x + 0.5 + TIE_EPSILON);
}

/**
 * The multiple of `repeat` nearest to `targetCm × stitchesPerCm` (a tie goes up).
 * Throws when the repeat is wider than the piece, or when no whole repeat fits.
 */
export function getCastOn(targetCm: number, perCm: number, repeat: number, field = "repeat", piece = "piece"): number {
  const raw = targetCm * perCm;
  if (repeat > raw + TIE_EPSILON) {
    throw new SizingError(
      field,
      `a repeat of ${repeat} stitches is wider than the ${piece} (${Math.round(raw * 10) / 10} stitches around at this gauge); choose a narrower motif or a finer gauge`,
    );
  }
  const n = roundHalfUp(raw / repeat) * repeat;
  return Math.max(repeat, n);
}

/** Rows (rounds) for a length at the row gauge, nearest, a tie up; 0 for no length. */
export function getRows(lengthCm: number, perCm: number): number {
  if (lengthCm <= 0) return 0;
  return roundHalfUp(lengthCm * perCm);
}

/** The even number nearest to x (a tie goes up), at least `min`. */
export function nearestEven(x: number, min = 2): number {
  return Math.max(min, 2 * roundHalfUp(x / 2));
}

/** The multiple of m nearest to x (a tie goes up), at least m. */
export function nearestMultiple(x: number, m: number): number {
  return Math.max(m, m * roundHalfUp(x / m));
}

/** The smallest multiple of m that is at least x (x a hair over a multiple counts as that multiple). */
export function ceilMultiple(x: number, m: number): number {
  return Math.max(m, m * Math.ceil(x / m - TIE_EPSILON));
}

export function lcm(a: number, b: number): number {
  const gcd = (x: number, y: number): number => (y === 0 ? x : gcd(y, x % y));
  return (a / gcd(a, b)) * b;
}

/**
 * A cast-on in the round whose rib closes: the multiple of lcm(2, repeat) nearest the target (a tie
 * up), so front and back (or a k1, p1 rib) split evenly; refuses a repeat wider than the piece. Only
 * when the piece holds a single odd repeat is the count the repeat itself.
 */
export function getEvenCastOn(targetCm: number, perCm: number, repeat: number, field = "repeat", piece = "piece"): number {
  const plain = getCastOn(targetCm, perCm, repeat, field, piece);
  const unit = lcm(2, repeat);
  return targetCm * perCm + TIE_EPSILON >= unit ? getCastOn(targetCm, perCm, unit, field, piece) : plain;
}
