"use client";
// What the maker knits and darns, round by round, read from the whole garment (the live price's
// reading): runs of rounds that knit the same colours and darn nothing are shown as one line.
import type { RoundReading } from "@/lib/core/garment";
import { roundRuns } from "@/lib/core/design-garment";
import { PinsForm, type PinsFormProps } from "./pins-form";

export type Pinning = Omit<PinsFormProps, "rounds">;

export function RoundsTable({ rounds, name, pinning }: { rounds: RoundReading[]; name: (key: string) => string; pinning?: Pinning }) {
  // The first piece is enough: a pair's second piece is read the same way (its rows are in the work sheet).
  const first = rounds[0]?.piece;
  const runs = roundRuns(rounds.filter((r) => r.piece === first));
  if (!runs.length) return null;
  return (
    <details className="rounded-md border border-bark/20 p-2" data-testid="rounds-table">
      <summary className="cursor-pointer font-semibold">Round by round: what is knitted and what is darned ({first})</summary>
      <div className="mt-2 max-h-80 overflow-auto">
        <table className="w-full text-sm">
          <caption className="mb-1 text-left text-bark">At most two colours are knitted in a round; the others are darned afterwards. Rounds from the cast-on, per part.</caption>
          <thead>
            <tr className="border-b border-bark/30 text-left">
              <th scope="col">Part</th>
              <th scope="col">Rounds</th>
              <th scope="col">Knitted</th>
              <th scope="col" className="text-right">
                Darned
              </th>
              <th scope="col">Why</th>
            </tr>
          </thead>
          <tbody>
            {runs.map((r) => (
              <tr key={`${r.part}-${r.from}`} className="border-b border-bark/10 align-top">
                <td>{r.part}</td>
                <td className="tabular-nums">{r.from === r.to ? r.from : `${r.from}–${r.to}`}</td>
                <td>{r.knit.map(name).join(" and ")}</td>
                <td className="text-right tabular-nums">{r.darned || ""}</td>
                <td>{r.why ?? (r.knit.length > 1 ? "two colours: stranded" : "one colour: plain")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {pinning ? <PinsForm rounds={rounds} {...pinning} /> : null}
    </details>
  );
}
