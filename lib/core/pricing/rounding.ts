// Integer division with one rounding rule for all money: round half away from zero.
// Chosen over half-even because it is the rule clients check by hand ("5 and up rounds up"),
// and being symmetric it gives a discount the same magnitude as the same positive amount.

/** round(numerator / denominator), half away from zero; denominator must be positive. */
export function divideRounded(numerator: bigint, denominator: bigint): bigint {
  if (denominator <= 0n) throw new RangeError("divideRounded: denominator must be positive");
  const q = numerator / denominator; // truncates toward zero
  const r = numerator % denominator;
  const twiceRemainder = (r < 0n ? -r : r) * 2n;
  if (twiceRemainder >= denominator) return numerator < 0n ? q - 1n : q + 1n;
  return q;
}

/** Back to a JS number, refusing anything a number cannot hold exactly. */
export function toSafeMinor(value: bigint, what = "amount"): number {
  const n = Number(value);
  if (!Number.isSafeInteger(n)) throw new RangeError(`${what} is too large to handle exactly`);
  return n;
}
