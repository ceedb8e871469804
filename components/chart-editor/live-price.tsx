"use client";
// The live price beside the colour plan: the whole garment (every stitch of every piece, built in
// the browser from the commission's sizing) with the design's charts on it, priced by the same pure
// core the quote uses (labour at the studio's rate plus the design fee), with what changed since the
// version the maker opened (or since "compare from here").
import { useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import type { RoundReading } from "@/lib/core/garment";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { livePrice, type ChartPiece } from "@/lib/core/pricing/live-price";
import type { SizingResult } from "@/lib/core/sizing";
import type { LivePricing } from "./garment-reading";
import { useGarmentReading, type GarmentReading } from "./use-garment-reading";

export type { LivePricing } from "./garment-reading";

export interface LivePriceProps {
  charts: ChartPiece[];
  pricing: LivePricing;
  /** changes when another version is opened: that version becomes the baseline */
  baselineKey: string;
  /** the commission's sizing: the garment priced */
  sizing: SizingResult | null;
  sizingNote?: string | null;
  /** the garment's round-by-round reading after each settled edit (for the colour plan's table) */
  onRounds?: (rounds: RoundReading[] | null) => void;
}

export function LivePrice({ charts, pricing, baselineKey, sizing, sizingNote, onRounds }: LivePriceProps) {
  // The garment is read in a worker once editing pauses; the last reading stays while the next is worked out.
  const garment = useGarmentReading(sizing, charts, pricing, baselineKey);
  return <LivePriceView reading={garment} pricing={pricing} baselineKey={baselineKey} sizingNote={sizingNote} onRounds={onRounds} />;
}

export interface LivePriceViewProps extends Pick<LivePriceProps, "pricing" | "baselineKey" | "sizingNote" | "onRounds"> {
  reading: GarmentReading;
}

/** The live price for a reading of the garment (the latest answered, the baseline, whether one is pending). */
export function LivePriceView({ reading: garment, pricing, baselineKey, sizingNote, onRounds }: LivePriceViewProps) {
  const { policy, designFeeMinor } = pricing;
  const read = garment.read;
  const pieces = useMemo(() => read?.pieces ?? [], [read]);
  useEffect(() => {
    if (read) onRounds?.(read.error ? null : read.rounds);
  }, [read, onRounds]);
  // "Compare from here" replaces the opened version's reading until another version is opened.
  const [here, setHere] = useState<{ key: string; pieces: PieceFeatures[] } | null>(null);
  const opened = garment.baseline;
  const baseline = useMemo(
    () =>
      here && here.key === baselineKey
        ? { from: "here" as const, pieces: here.pieces }
        : opened && opened.key === baselineKey
          ? { from: "opened" as const, pieces: opened.read.pieces }
          : null,
    [here, opened, baselineKey],
  );

  const result = useMemo(() => {
    if (!read || !baseline) return null;
    if (read.error) return { ok: false as const, message: read.error };
    try {
      return { ok: true as const, value: livePrice(baseline.pieces, pieces, policy, designFeeMinor) };
    } catch (e) {
      return { ok: false as const, message: e instanceof Error ? e.message : String(e) };
    }
  }, [read, baseline, pieces, policy, designFeeMinor]);

  const money = (minor: number, signed = false) => formatMoney(minor, policy.currency, "en-GB", signed ? { signDisplay: "exceptZero" } : {});
  let sentence = "";
  if (result?.ok && baseline) {
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
        <Button variant="secondary" className="!px-3 !py-1.5 text-sm" onClick={() => setHere({ key: baselineKey, pieces })} disabled={!result?.ok || result.value.change.changes.length === 0}>
          Compare from here
        </Button>
      </div>
      <p aria-live="polite" aria-atomic="true" className="font-semibold" data-testid="live-price-change">
        {sentence}
      </p>
      {garment.pending ? (
        <p role="status" className="text-sm" data-testid="live-price-pending">
          Working out the price…{result ? " (the figures below are from before your last edit)" : ""}
        </p>
      ) : null}
      {sizingNote ? (
        <p className="text-sm font-semibold" data-testid="live-price-sizing-note">
          {sizingNote}
        </p>
      ) : null}
      {read?.problems.length ? (
        // The live region wraps the list: a role on the <ul> itself would hide its items from the list.
        <div role="status">
          <ul className="list-disc pl-5 text-sm font-semibold text-madder-dark" data-testid="live-price-problems">
            {read.problems.map((p) => (
              <li key={p.index}>
                Not counted: {p.label} ({p.message})
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {result === null ? null : result.ok ? (
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <caption className="mb-1 text-left">
              Labour for every stitch of the garment ({pieces.map((p) => p.label).join(", ")}) at {money(policy.hourlyRateMinor)} an hour ({policy.labourPolicy === "p80" ? "the cautious P80 estimate" : "the typical P50 estimate"}), with the design fee. Yarn,
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
