// ISO 4217 currency codes and their minor-unit digits, from the pinned List One table (iso4217.ts),
// never from the runtime's locale data (which says 0 for HUF, IDR, COP, PKR, IQD… and can change).
import { ISO4217, ISO4217_EDITION } from "./iso4217";
import { PricingInputError } from "./pricing-error";

export { ISO4217_EDITION };

export function isCurrencyCode(code: string): boolean {
  return typeof code === "string" && /^[A-Z]{3}$/.test(code) && ISO4217.has(code);
}

export function assertCurrency(code: string, field = "currency"): void {
  if (!isCurrencyCode(code)) {
    throw new PricingInputError(`${field} "${code}" is not an ISO 4217 currency code known here (e.g. GBP, EUR, JPY)`);
  }
}

/** Minor-unit digits from ISO 4217 List One (GBP 2, JPY 0, KWD 3, HUF 2, CLF 4); unknown codes are refused. */
export function getMinorDigits(currency: string): number {
  assertCurrency(currency);
  return ISO4217.get(currency)!.minorDigits;
}

/** The currency's English name in List One ("Forint", "Kuwaiti Dinar"). */
export function getCurrencyName(currency: string): string {
  assertCurrency(currency);
  return ISO4217.get(currency)!.name;
}

/**
 * A stored amount's exponent checked against the table: `null` when they agree, else a message a
 * person can act on ("this amount was stored with 0 decimal places but HUF has 2 …").
 */
export function storedDigitsProblem(currency: string, storedDigits: number | null | undefined): string | null {
  if (!isCurrencyCode(currency)) return `this amount is in "${currency}", which is not an ISO 4217 currency code known here`;
  const digits = ISO4217.get(currency)!.minorDigits;
  if (storedDigits === digits) return null;
  const stored = storedDigits === null || storedDigits === undefined ? "no recorded number of" : String(storedDigits);
  return (
    `this amount was stored with ${stored} decimal places but ${currency} has ${digits} (${ISO4217_EDITION}), ` +
    `so its value is uncertain; it was not used. Re-issue the quote so its amounts are stored in ${currency}'s minor units.`
  );
}
