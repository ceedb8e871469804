// What changed between two versions of a quote, line by line, in amounts and in words.
import type { Quote, QuoteLine, QuoteLineKind } from "./build-quote";
import { formatMoney } from "./format-money";
import { PricingInputError } from "./pricing-error";

export interface QuoteLineChange {
  kind: QuoteLineKind;
  /** the later label where the line kept its place but its label changed (e.g. new minutes) */
  label: string;
  beforeMinor: number;
  afterMinor: number;
  deltaMinor: number;
  change: "added" | "removed" | "changed";
}

export interface QuoteDiff {
  currency: string;
  changes: QuoteLineChange[];
  totalDeltaMinor: number;
  taxDeltaMinor: number;
  depositDeltaMinor: number;
  /** e.g. "Knitting labour +£12.50; Rush fee added +£30.00 → total +£45.00" */
  summary: string;
}

// Labour lines carry their minutes in the label, so match them on the stage word instead.
function lineKey(line: QuoteLine): string {
  if (line.kind === "labour") return `labour:${line.label.replace(/ \(.*\)$/, "")}`;
  return `${line.kind}:${line.label}`;
}

export function diffQuotes(before: Quote, after: Quote, locale = "en-GB"): QuoteDiff {
  if (before.currency !== after.currency) {
    throw new PricingInputError(`cannot compare a ${before.currency} quote with a ${after.currency} quote`);
  }
  const currency = after.currency;
  const remaining = new Map<string, QuoteLine[]>();
  for (const line of before.lines) remaining.set(lineKey(line), [...(remaining.get(lineKey(line)) ?? []), line]);

  const changes: QuoteLineChange[] = [];
  for (const line of after.lines) {
    const queue = remaining.get(lineKey(line));
    const prev = queue?.shift();
    if (!prev) {
      changes.push({ kind: line.kind, label: line.label, beforeMinor: 0, afterMinor: line.amountMinor, deltaMinor: line.amountMinor, change: "added" });
    } else if (prev.amountMinor !== line.amountMinor) {
      changes.push({ kind: line.kind, label: line.label, beforeMinor: prev.amountMinor, afterMinor: line.amountMinor, deltaMinor: line.amountMinor - prev.amountMinor, change: "changed" });
    }
  }
  for (const queue of remaining.values()) {
    for (const line of queue) {
      changes.push({ kind: line.kind, label: line.label, beforeMinor: line.amountMinor, afterMinor: 0, deltaMinor: -line.amountMinor, change: "removed" });
    }
  }

  const signed = (minor: number) => formatMoney(minor, currency, locale, { signDisplay: "exceptZero" });
  const totalDeltaMinor = after.totalMinor - before.totalMinor;
  const parts = changes.map((c) => {
    const name = c.kind === "labour" ? c.label.replace(/ \(.*\)$/, "") : c.label;
    const how = c.change === "changed" ? "" : ` ${c.change}`;
    return `${name}${how} ${signed(c.deltaMinor)}`;
  });
  const summary = parts.length === 0 ? "no change" : `${parts.join("; ")} → total ${signed(totalDeltaMinor)}`;

  return {
    currency,
    changes,
    totalDeltaMinor,
    taxDeltaMinor: after.taxMinor - before.taxMinor,
    depositDeltaMinor: after.depositMinor - before.depositMinor,
    summary,
  };
}
