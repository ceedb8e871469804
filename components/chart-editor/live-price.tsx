"use client";
// The live price beside the colour plan: every chart of the design read as a piece, priced in the
// browser by the same pure core the quote uses (labour at the studio's rate plus the design fee),
// with what changed since the version the maker opened (or since "compare from here").
import { useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import type { QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { livePrice, piecesFromCharts, type ChartPiece } from "@/lib/core/pricing/live-price";

export interface LivePricing {
  policy: QuotePolicy;
  designFeeMinor: number;
  floatLimitStitches: number;
  carryLimitCm?: number;
}

export interface LivePriceProps {
  charts: ChartPiece[];
  pricing: LivePricing;
  /** changes when another version is opened: that version becomes the baseline */
  baselineKey: string;
}

const DEBOUNCE_MS = 300;

export function LivePrice({ charts, pricing, baselineKey }: LivePriceProps) {
  const { policy, designFeeMinor, floatLimitStitches, carryLimitCm } = pricing;
  // A stroke stays smooth: the price follows the charts once editing pauses.
  const [settled, setSettled] = useState(charts);
  useEffect(() => {
    const t = setTimeout(() => setSettled(charts), DEBOUNCE_MS);
    return () => clearTimeout(t);
  }, [charts]);

  const pieces = useMemo(() => piecesFromCharts(settled, floatLimitStitches, carryLimitCm), [settled, floatLimitStitches, carryLimitCm]);
  const [baseline, setBaseline] = useState<{ key: string; from: "opened" | "here"; pieces: typeof pieces }>(() => ({
    key: baselineKey,
    from: "opened",
    pieces: piecesFromCharts(charts, floatLimitStitches, carryLimitCm),
  }));
  // Another version opened: price changes from there (set during render, React's reset pattern).
  if (baseline.key !== baselineKey) setBaseline({ key: baselineKey, from: "opened", pieces: piecesFromCharts(charts, floatLimitStitches, carryLimitCm) });

  const result = useMemo(() => {
    try {
      return { ok: true as const, value: livePrice(baseline.pieces, pieces, policy, designFeeMinor) };
    } catch (e) {
      return { ok: false as const, message: e instanceof Error ? e.message : String(e) };
    }
  }, [baseline.pieces, pieces, policy, designFeeMinor]);

  const money = (minor: number, signed = false) => formatMoney(minor, policy.currency, "en-GB", signed ? { signDisplay: "exceptZero" } : {});
  let sentence = "";
  if (result.ok) {
    const { change, totalDeltaMinor } = result.value;
    const since = baseline.from === "opened" ? "the version you opened" : "you chose to compare";
    sentence = change.changes.length === 0 ? `No change since ${since}.` : `Since ${since}: ${change.text}`;
    if (change.changes.length && totalDeltaMinor !== change.amountDeltaMinor) sentence += ` (total with tax ${money(totalDeltaMinor, true)})`;
  }

  return (
    <section aria-labelledby="live-price-heading" className="space-y-3 rounded-md border border-bark/30 bg-white p-3" data-testid="live-price">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="live-price-heading" className="text-lg">
          Live price
        </h2>
        <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => setBaseline({ key: baselineKey, from: "here", pieces })} disabled={!result.ok || result.value.change.changes.length === 0}>
          Compare from here
        </Button>
      </div>
      <p aria-live="polite" aria-atomic="true" className="font-semibold" data-testid="live-price-change">
        {sentence}
      </p>
      {result.ok ? (
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <caption className="mb-1 text-left">
              Labour from the charts at {money(policy.hourlyRateMinor)} an hour ({policy.labourPolicy === "p80" ? "the cautious P80 estimate" : "the typical P50 estimate"}), with the design fee. Yarn,
              extras and shipping are added in the quote.
            </caption>
            <thead>
              <tr className="border-b border-bark/30 text-left">
                <th scope="col">Line</th>
                <th scope="col" className="text-right">
                  Amount
                </th>
              </tr>
            </thead>
            <tbody>
              {result.value.composed.quote.lines.map((l, i) => (
                <tr key={`${l.kind}-${i}`} className="border-b border-bark/10">
                  <th scope="row" className="text-left font-normal">
                    {l.label}
                  </th>
                  <td className="text-right tabular-nums">{money(l.amountMinor)}</td>
                </tr>
              ))}
            </tbody>
            <tfoot>
              <tr>
                <th scope="row" className="text-left">
                  Total{result.value.composed.quote.pricesIncludeTax ? "" : " with tax"}
                </th>
                <td className="text-right font-semibold tabular-nums" data-testid="live-price-total">
                  {money(result.value.composed.quote.totalMinor)}
                </td>
              </tr>
              <tr>
                <th scope="row" className="text-left font-normal">
                  Deposit to book
                </th>
                <td className="text-right tabular-nums">{money(result.value.composed.quote.depositMinor)}</td>
              </tr>
            </tfoot>
          </table>
        </div>
      ) : (
        <p role="alert" className="font-semibold text-madder-dark">
          The price could not be worked out: {result.message}
        </p>
      )}
    </section>
  );
}
