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
