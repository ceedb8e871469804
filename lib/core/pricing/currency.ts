// ISO 4217 currency codes and their minor-unit digits, as the runtime's Intl data knows them.
import { PricingInputError } from "./pricing-error";

let known: ReadonlySet<string> | null = null;
const digitsCache = new Map<string, number>();

function getKnownCurrencies(): ReadonlySet<string> {
  known ??= new Set(Intl.supportedValuesOf("currency"));
  return known;
}

export function isCurrencyCode(code: string): boolean {
  return /^[A-Z]{3}$/.test(code) && getKnownCurrencies().has(code);
}

export function assertCurrency(code: string, field = "currency"): void {
  if (!isCurrencyCode(code)) {
    throw new PricingInputError(`${field} "${code}" is not an ISO 4217 currency code known here (e.g. GBP, EUR, JPY)`);
  }
}

/** Minor-unit digits (GBP 2, JPY 0, KWD 3) from Intl, so the table stays with the platform's. */
export function getMinorDigits(currency: string): number {
  const cached = digitsCache.get(currency);
  if (cached !== undefined) return cached;
  assertCurrency(currency);
  const digits = new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
  digitsCache.set(currency, digits);
  return digits;
}
