"use client";
// The live price beside the colour plan: the whole garment (every stitch of every piece, built in
// the browser from the commission's sizing) with the design's charts on it, priced by the same pure
// core the quote uses (labour at the studio's rate plus the design fee), with what changed since the
// version the maker opened (or since "compare from here").
import { useEffect, useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import type { RoundReading } from "@/lib/core/garment";
import { readDesignOnGarment, type ChartProblem } from "@/lib/core/design-garment";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import type { QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { livePrice, type ChartPiece } from "@/lib/core/pricing/live-price";
import type { SizingResult } from "@/lib/core/sizing";

export interface LivePricing {
  policy: QuotePolicy;
  designFeeMinor: number;
  floatLimitStitches: number;
  floatLimitCm?: number;
  carryLimitCm?: number;
}

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

interface Read {
  pieces: PieceFeatures[];
  problems: ChartProblem[];
  rounds: RoundReading[];
  error: string | null;
}

function readGarment(sizing: SizingResult | null, charts: ChartPiece[], pricing: LivePricing): Read {
  if (!sizing) return { pieces: [], problems: [], rounds: [], error: "The design has no garment to price (no commission sizing)." };
  try {
    const r = readDesignOnGarment(sizing, charts, {
      proofRounds: 1,
      rates: pricing.policy.rates,
      floatLimitStitches: pricing.floatLimitStitches,
      ...(pricing.floatLimitCm !== undefined ? { floatLimitCm: pricing.floatLimitCm } : {}),
      ...(pricing.carryLimitCm !== undefined ? { carryLimitCm: pricing.carryLimitCm } : {}),
    });
    return { pieces: r.pieces, problems: r.problems, rounds: r.reading.rounds, error: null };
  } catch (e) {
    return { pieces: [], problems: [], rounds: [], error: e instanceof Error ? e.message : String(e) };
  }
}

const DEBOUNCE_MS = 300;

export function LivePrice({ charts, pricing, baselineKey, sizing, sizingNote, onRounds }: LivePriceProps) {
  const { policy, designFeeMinor } = pricing;
  // A stroke stays smooth: the price follows the charts once editing pauses.
  const [settled, setSettled] = useState(charts);
  useEffect(() => {
    const t = setTimeout(() => setSettled(charts), DEBOUNCE_MS);
    return () => clearTimeout(t);
  }, [charts]);

  const read = useMemo(() => readGarment(sizing, settled, pricing), [sizing, settled, pricing]);
  const pieces = read.pieces;
  useEffect(() => onRounds?.(read.error ? null : read.rounds), [read, onRounds]);
  const [baseline, setBaseline] = useState<{ key: string; from: "opened" | "here"; pieces: PieceFeatures[] }>(() => ({
    key: baselineKey,
    from: "opened",
    pieces: readGarment(sizing, charts, pricing).pieces,
  }));
  // Another version opened: price changes from there (set during render, React's reset pattern).
  if (baseline.key !== baselineKey) setBaseline({ key: baselineKey, from: "opened", pieces: readGarment(sizing, charts, pricing).pieces });

  const result = useMemo(() => {
    if (read.error) return { ok: false as const, message: read.error };
    try {
      return { ok: true as const, value: livePrice(baseline.pieces, pieces, policy, designFeeMinor) };
    } catch (e) {
      return { ok: false as const, message: e instanceof Error ? e.message : String(e) };
    }
  }, [read.error, baseline.pieces, pieces, policy, designFeeMinor]);

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
      {sizingNote ? (
        <p className="text-sm font-semibold" data-testid="live-price-sizing-note">
          {sizingNote}
        </p>
      ) : null}
      {read.problems.length ? (
        <ul role="status" className="list-disc pl-5 text-sm font-semibold text-madder-dark" data-testid="live-price-problems">
          {read.problems.map((p) => (
            <li key={p.index}>
              Not counted: {p.label} ({p.message})
            </li>
          ))}
        </ul>
      ) : null}
      {result.ok ? (
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
