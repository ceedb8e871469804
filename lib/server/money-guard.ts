import "server-only";
// Stored amounts read back to be charged, refunded or printed: their stored ISO 4217 exponent must
// agree with the pinned table, and what goes to the payment provider must follow its currency rules.
// Both refuse with a message (409/422), never a 500.
import { storedDigitsProblem } from "@/lib/core/pricing/currency";
import { toProviderAmount } from "@/lib/core/pricing/provider-currency";
import { AppError } from "./errors";

/** `what`: "This deposit cannot be charged", … — the message goes on with why. */
export function assertStoredDigits(what: string, row: { currency: string; minorDigits: number }): void {
  const problem = storedDigitsProblem(row.currency, row.minorDigits);
  if (problem) throw new AppError(409, "currency_exponent_mismatch", `${what}: ${problem}`);
}

/** ISO minor units → the provider's amount and lower-case code, or a 422 with the provider's rule in words. */
export function providerAmountOrThrow(minor: number, currency: string): { amount: number; currency: string } {
  const r = toProviderAmount(minor, currency);
  if (!r.ok) throw new AppError(422, r.code === "unsupported_currency" ? "currency_not_offered" : "payment_amount_refused", r.message);
  return { amount: r.amount, currency: r.currency };
}
