// Show an amount of minor units in a locale, without ever turning it into a float.
import { getMinorDigits } from "./currency";

export interface FormatMoneyOptions {
  /** "exceptZero" shows "+£11.20" for changes */
  signDisplay?: "auto" | "always" | "exceptZero" | "never";
}

/** The exact decimal text of an amount in major units: 1234 GBP → "12.34", 1234 JPY → "1234". */
export function minorToDecimalString(minor: number, currency: string): `${number}` {
  if (!Number.isSafeInteger(minor)) throw new RangeError(`amount must be a whole number of minor units (got ${minor})`);
  const digits = getMinorDigits(currency);
  const negative = minor < 0;
  const abs = (negative ? -BigInt(minor) : BigInt(minor)).toString().padStart(digits + 1, "0");
  const whole = abs.slice(0, abs.length - digits);
  const fraction = abs.slice(abs.length - digits);
  return `${negative ? "-" : ""}${whole}${digits > 0 ? "." + fraction : ""}` as `${number}`;
}

/**
 * The inverse of minorToDecimalString: "12.34" GBP → 1234, "-0.050" KWD → −50. Refuses (null) text with
 * more decimals than the currency has, a missing whole part, or a result past 2^53.
 */
export function decimalStringToMinor(text: string, currency: string): number | null {
  const digits = getMinorDigits(currency);
  const m = /^(-?)(\d+)(?:\.(\d+))?$/.exec(text);
  if (!m || (m[3] !== undefined && (digits === 0 || m[3].length > digits))) return null;
  const units = BigInt(m[2] + (m[3] ?? "").padEnd(digits, "0"));
  const minor = Number(m[1] ? -units : units);
  return Number.isSafeInteger(minor) ? minor : null;
}

/** Formats with exactly the ISO 4217 digits (min = max), so the locale data cannot add or drop any. */
export function formatMoney(minor: number, currency: string, locale = "en-GB", options: FormatMoneyOptions = {}): string {
  const digits = getMinorDigits(currency);
  const formatter = new Intl.NumberFormat(locale, {
    style: "currency",
    currency,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
    signDisplay: options.signDisplay ?? "auto",
  });
  // Intl formats a decimal string exactly (ES2023), so large amounts keep every digit.
  return formatter.format(minorToDecimalString(minor, currency));
}
