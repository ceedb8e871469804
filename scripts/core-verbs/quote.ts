// core verb `quote`: currency, hourly rate, labour minutes, materials, fees, tax and deposit
// settings → quote lines and totals in integer minor units.
import { parseOrThrow } from "../../lib/core/labour/describe-issues";
import { buildQuote } from "../../lib/core/pricing/build-quote";
import { quoteInputSchema } from "../../lib/core/pricing/schemas";

export function run(input: unknown): unknown {
  const quote = buildQuote(parseOrThrow(quoteInputSchema, input));
  return {
    currency: quote.currency,
    /** ISO 4217 minor-unit digits of every amount below (JPY 0, GBP 2, KWD 3), from the pinned table */
    minorDigits: quote.minorDigits,
    lines: quote.lines.map((l) => ({ label: l.label, amountMinor: l.amountMinor })),
    subtotalMinor: quote.subtotalMinor,
    taxMinor: quote.taxMinor,
    totalMinor: quote.totalMinor,
    depositMinor: quote.depositMinor,
    balanceMinor: quote.balanceMinor,
  };
}
