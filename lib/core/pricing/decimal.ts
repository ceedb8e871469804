// Exact decimals from what a person typed (a JSON number or a string): no float arithmetic.
import { PricingInputError } from "./pricing-error";

export interface ExactDecimal {
  /** value = units / 10^scale */
  units: bigint;
  scale: number;
}

const DECIMAL = /^([+-])?(\d+)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$|^([+-])?\.(\d+)(?:[eE]([+-]?\d+))?$/;

/**
 * Read a decimal exactly. A JSON number is read through its shortest round-trip text, which is
 * what the person typed (17.5 → "17.5"), so no binary-float error enters the arithmetic.
 */
export function parseExactDecimal(value: number | string, field: string, maxDecimals: number): ExactDecimal {
  if (typeof value === "number" && !Number.isFinite(value)) throw new PricingInputError(`${field} must be a finite number`);
  const text = String(value).trim();
  const m = DECIMAL.exec(text);
  if (!m) throw new PricingInputError(`${field} must be a decimal number (got "${text}")`);
  const sign = m[1] ?? m[5] ?? "";
  const whole = m[2] ?? "0";
  const fraction = m[3] ?? m[6] ?? "";
  const exponent = Number(m[4] ?? m[7] ?? "0");
  let digits = whole + fraction;
  let scale = fraction.length - exponent;
  if (scale < 0) {
    digits += "0".repeat(-scale);
    scale = 0;
  }
  // Drop trailing zeros in the fraction so 17.50 and 17.5 are the same value.
  while (scale > 0 && digits.endsWith("0")) {
    digits = digits.slice(0, -1);
    scale--;
  }
  if (scale > maxDecimals) {
    throw new PricingInputError(`${field} may have at most ${maxDecimals} decimal places (got ${text})`);
  }
  const units = BigInt(digits === "" ? "0" : digits) * (sign === "-" ? -1n : 1n);
  return { units, scale };
}

/** Parts per million in one percent: 1 % = 10 000 ppm, 100 % = 1 000 000 ppm. */
export const PPM_PER_PERCENT = 10_000n;
export const PPM_WHOLE = 1_000_000n;

/** A percentage (up to 4 decimal places, e.g. 8.875) as integer parts per million. */
export function percentToPpm(value: number | string, field: string, maxPercent = 100): bigint {
  const d = parseExactDecimal(value, field, 4);
  const ppm = (d.units * PPM_PER_PERCENT) / 10n ** BigInt(d.scale); // exact: scale ≤ 4
  if (ppm < 0n || ppm > BigInt(maxPercent) * PPM_PER_PERCENT) {
    throw new PricingInputError(`${field} must be between 0 and ${maxPercent} (got ${String(value)})`);
  }
  return ppm;
}
