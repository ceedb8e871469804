// The card-payment provider's own currency rules, applied to amounts in ISO 4217 minor units, so the
// quote builder can warn before anything is sent and the payments layer never sends a refused amount.
//
// Source (read through the project's reference search, 2026-12-03): Stripe, "Supported currencies"
// (docs.stripe.com/currencies), sections "Zero-decimal currencies", "Three-decimal currencies" and
// "Special cases"; and Stripe support, "Deprecation of fractional ISK charges and refunds" (from
// 2023-04-14 ISK amounts must be multiples of 100 in the API; ISK stays two-decimal there).
// - Zero-decimal: the API amount is in whole units (¥500 → 500): BIF CLP DJF GNF JPY KMF KRW MGA PYG
//   RWF UGX VND VUV XAF XOF XPF. MGA has 2 digits in ISO 4217, so only whole ariary can be charged.
// - Three-decimal: BHD JOD KWD OMR TND are sent in thousandths, but "the least-significant (last)
//   digit [must] be 0 … round amounts to the nearest ten" (5.124 KWD → 5120 or 5130).
// - ISK: 0 digits in ISO 4217, two decimals in the API, amounts divisible by 100 (5 ISK → 500).
// - HUF, TWD: charged as two-decimal amounts; only *payouts* are whole units (divisible by 100), which
//   Darnwell never makes, so charges and refunds keep their 2 digits.
// - Every other supported currency: two decimals, as ISO 4217 has them.
// The supported (presentment) list below is from memory of the same page (it could not be read in full
// here); a currency not on it is refused with a clear message rather than sent.
import { getMinorDigits, isCurrencyCode } from "./currency";
import { minorToDecimalString } from "./format-money";

export const PROVIDER_RULES_SOURCE =
  "Stripe, Supported currencies (docs.stripe.com/currencies): zero-decimal, three-decimal and special cases; Stripe support, Deprecation of fractional ISK charges and refunds (2023)";

export const PROVIDER_ZERO_DECIMAL: readonly string[] = ["BIF", "CLP", "DJF", "GNF", "JPY", "KMF", "KRW", "MGA", "PYG", "RWF", "UGX", "VND", "VUV", "XAF", "XOF", "XPF"];
export const PROVIDER_THREE_DECIMAL: readonly string[] = ["BHD", "JOD", "KWD", "OMR", "TND"];

/** Presentment currencies the provider takes for card payments (from memory of its currencies page). */
// prettier-ignore
export const PROVIDER_CURRENCIES: readonly string[] = [
  "AED", "AFN", "ALL", "AMD", "ANG", "AOA", "ARS", "AUD", "AWG", "AZN", "BAM", "BBD", "BDT", "BGN", "BHD", "BIF", "BMD", "BND", "BOB",
  "BRL", "BSD", "BWP", "BYN", "BZD", "CAD", "CDF", "CHF", "CLP", "CNY", "COP", "CRC", "CVE", "CZK", "DJF", "DKK", "DOP", "DZD", "EGP",
  "ETB", "EUR", "FJD", "FKP", "GBP", "GEL", "GIP", "GMD", "GNF", "GTQ", "GYD", "HKD", "HNL", "HTG", "HUF", "IDR", "ILS", "INR", "ISK",
  "JMD", "JOD", "JPY", "KES", "KGS", "KHR", "KMF", "KRW", "KWD", "KYD", "KZT", "LAK", "LBP", "LKR", "LRD", "LSL", "MAD", "MDL", "MGA",
  "MKD", "MMK", "MNT", "MOP", "MUR", "MVR", "MWK", "MXN", "MYR", "MZN", "NAD", "NGN", "NIO", "NOK", "NPR", "NZD", "OMR", "PAB", "PEN",
  "PGK", "PHP", "PKR", "PLN", "PYG", "QAR", "RON", "RSD", "RUB", "RWF", "SAR", "SBD", "SCR", "SEK", "SGD", "SHP", "SLE", "SOS", "SRD",
  "SZL", "THB", "TJS", "TND", "TOP", "TRY", "TTD", "TWD", "TZS", "UAH", "UGX", "USD", "UYU", "UZS", "VND", "VUV", "WST", "XAF", "XCD",
  "XOF", "XPF", "YER", "ZAR", "ZMW",
];

const SUPPORTED = new Set(PROVIDER_CURRENCIES);
const ZERO = new Set(PROVIDER_ZERO_DECIMAL);
const THREE = new Set(PROVIDER_THREE_DECIMAL);

interface ApiRule {
  /** decimals of the API's `amount` */
  apiDigits: number;
  /** the API amount must be a multiple of this */
  apiMultiple: number;
}

function apiRule(currency: string): ApiRule | null {
  if (!SUPPORTED.has(currency) || !isCurrencyCode(currency)) return null;
  if (ZERO.has(currency)) return { apiDigits: 0, apiMultiple: 1 };
  if (THREE.has(currency)) return { apiDigits: 3, apiMultiple: 10 };
  if (currency === "ISK") return { apiDigits: 2, apiMultiple: 100 };
  return { apiDigits: 2, apiMultiple: 1 };
}

const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));

export function isProviderCurrency(currency: string): boolean {
  return apiRule(currency) !== null;
}

/** The step (in ISO minor units) every chargeable amount must be a multiple of: KWD 10, MGA 100, GBP 1; null if not taken. */
export function providerStepMinor(currency: string): number | null {
  const rule = apiRule(currency);
  if (!rule) return null;
  const iso = getMinorDigits(currency);
  if (rule.apiDigits >= iso) {
    const scale = 10 ** (rule.apiDigits - iso);
    return rule.apiMultiple / gcd(rule.apiMultiple, scale);
  }
  return 10 ** (iso - rule.apiDigits) * rule.apiMultiple;
}

export type ProviderAmount =
  | { ok: true; amount: number; currency: string }
  | { ok: false; code: "unsupported_currency" | "invalid_amount"; message: string; nearestMinor?: number };

const money = (minor: number, currency: string) => `${minorToDecimalString(minor, currency)} ${currency}`;

/** What a step means in words: "multiples of 0.010 KWD", "whole MGA (multiples of 1.00 MGA)". */
function stepWords(step: number, currency: string): string {
  return `a multiple of ${money(step, currency)}`;
}

/** Nearest multiple of `step`; an exact half goes away from zero (MONEY.md's one rule). */
export function roundToStep(minor: number, step: number): number {
  const r = ((minor % step) + step) % step;
  if (r === 0) return minor;
  const down = minor - r;
  return 2 * r > step || (2 * r === step && minor > 0) ? down + step : down;
}

/** ISO minor units → the provider's `amount` (exact), or the reason it cannot be sent. */
export function toProviderAmount(minor: number, currency: string): ProviderAmount {
  const rule = apiRule(currency);
  if (!rule) {
    return { ok: false, code: "unsupported_currency", message: `Card payments in ${currency} are not offered by the payment service; take this payment another way.` };
  }
  if (!Number.isSafeInteger(minor) || minor <= 0) return { ok: false, code: "invalid_amount", message: `The amount must be a positive whole number of minor units (got ${minor}).` };
  const step = providerStepMinor(currency)!;
  if (minor % step !== 0) {
    const nearest = roundToStep(minor, step);
    return {
      ok: false,
      code: "invalid_amount",
      message: `${currency} card payments must be ${stepWords(step, currency)}: ${money(minor, currency)} cannot be charged (the nearest is ${money(nearest, currency)}).`,
      nearestMinor: nearest,
    };
  }
  const iso = getMinorDigits(currency);
  const amount = rule.apiDigits >= iso ? minor * 10 ** (rule.apiDigits - iso) : minor / 10 ** (iso - rule.apiDigits);
  if (!Number.isSafeInteger(amount)) return { ok: false, code: "invalid_amount", message: `${money(minor, currency)} is too large to charge.` };
  return { ok: true, amount, currency: currency.toLowerCase() };
}

/** The provider's `amount` → ISO minor units, exactly; null if it has no exact value (or the currency is not taken). */
export function fromProviderAmount(amount: number, currency: string): number | null {
  const code = currency.toUpperCase();
  const rule = apiRule(code);
  if (!rule || !Number.isSafeInteger(amount)) return null;
  const iso = getMinorDigits(code);
  if (rule.apiDigits >= iso) {
    const scale = 10 ** (rule.apiDigits - iso);
    return amount % scale === 0 ? amount / scale : null;
  }
  const minor = amount * 10 ** (iso - rule.apiDigits);
  return Number.isSafeInteger(minor) ? minor : null;
}

export type ProviderDeposit =
  | { ok: true; depositMinor: number; balanceMinor: number; rounded: boolean; note: string | null }
  | { ok: false; message: string };

/**
 * Fits a quote's deposit to what the provider can charge: the deposit goes to the nearest chargeable
 * amount (never above the total) and the balance stays total − deposit, so deposit + balance = total
 * exactly and both can be paid. A total that is not itself chargeable is refused: its balance could
 * not be paid online, and changing the price is the studio's decision, not ours.
 */
export function fitDepositForProvider(q: { currency: string; totalMinor: number; depositMinor: number }): ProviderDeposit {
  const { currency, totalMinor, depositMinor } = q;
  const step = providerStepMinor(currency);
  if (step === null) {
    return { ok: false, message: `Card payments in ${currency} are not offered by the payment service, so this quote's deposit could not be paid online.` };
  }
  if (totalMinor % step !== 0) {
    const down = totalMinor - (totalMinor % step);
    return {
      ok: false,
      message:
        `${currency} card payments must be ${stepWords(step, currency)}, and the total ${money(totalMinor, currency)} is not, so its balance could not be paid. ` +
        `Adjust a line so the total is ${money(down, currency)} or ${money(down + step, currency)}.`,
    };
  }
  let deposit = roundToStep(depositMinor, step);
  if (deposit > totalMinor) deposit -= step;
  if (deposit < 0) deposit = 0;
  const rounded = deposit !== depositMinor;
  return {
    ok: true,
    depositMinor: deposit,
    balanceMinor: totalMinor - deposit,
    rounded,
    note: rounded
      ? `${currency} deposits must be ${stepWords(step, currency)} for card payment: ${money(depositMinor, currency)} becomes ${money(deposit, currency)}; the balance is ${money(totalMinor - deposit, currency)}.`
      : null,
  };
}

/**
 * A built quote with its deposit fitted for card payment (see fitDepositForProvider): `note` says what
 * was rounded, `problem` why the quote cannot be paid online as it stands (the quote is then unchanged).
 * A currency the provider does not take is left as it is, with a problem the studio can read.
 */
export function withProviderDeposit<Q extends { currency: string; totalMinor: number; depositMinor: number; balanceMinor: number }>(
  quote: Q,
): { quote: Q; note: string | null; problem: string | null } {
  const fit = fitDepositForProvider(quote);
  if (!fit.ok) return { quote, note: null, problem: fit.message };
  return { quote: fit.rounded ? { ...quote, depositMinor: fit.depositMinor, balanceMinor: fit.balanceMinor } : quote, note: fit.note, problem: null };
}
