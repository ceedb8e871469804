"use client";
// The design's yarn per studio yarn, beside the quote's yarn lines, with a button that copies the
// skeins into them. The figures come from lib/core/yarn/design-yarn (server side).
import { Button } from "@/components/ui/button";
import type { DesignYarnLine } from "@/lib/core/yarn/design-yarn";

export interface DesignYarnPanelData {
  designTitle: string;
  designVersion: number;
  marginPercent: number;
  lines: DesignYarnLine[];
  totals: { metres: number; yards: number };
  warnings: string[];
  sources: string[];
  plainNote: string;
}

const fmt = (n: number) => n.toLocaleString("en-GB", { maximumFractionDigits: 1 });

export function DesignYarnPanel(props: { data: DesignYarnPanelData; onUse: (materials: { yarnId: string; skeins: number }[]) => void }) {
  const { data } = props;
  const usable = data.lines.filter((l) => l.yarnId && l.skeins).map((l) => ({ yarnId: l.yarnId as string, skeins: l.skeins!.skeins }));
  return (
    <section aria-labelledby="design-yarn-title" className="rounded-md border border-bark/20 bg-white/60 p-3">
      <h3 id="design-yarn-title" className="text-lg">
        Yarn from the design ({data.designTitle}, version {data.designVersion})
      </h3>
      <p className="text-sm text-bark">
        {data.plainNote} Includes a {data.marginPercent} % margin. Skeins are rounded up per yarn over the whole garment.
      </p>
      <div className="overflow-x-auto">
        <table className="mt-2 w-full text-left text-sm">
          <caption className="sr-only">Yarn per colour from the design</caption>
          <thead>
            <tr>
              <th scope="col" className="py-1 pr-3">Yarn</th>
              <th scope="col" className="py-1 pr-3">Worked as</th>
              <th scope="col" className="py-1 pr-3 text-right">Metres</th>
              <th scope="col" className="py-1 pr-3 text-right">Yards</th>
              <th scope="col" className="py-1 pr-3 text-right">Skeins</th>
              <th scope="col" className="py-1 text-right">Grams</th>
            </tr>
          </thead>
          <tbody>
            {data.lines.map((l) => (
              <tr key={`${l.yarnId ?? l.hex}-${l.label}`} className="border-t border-bark/10">
                <th scope="row" className="py-1 pr-3 font-normal">
                  <span aria-hidden className="mr-2 inline-block h-3 w-3 rounded-sm border border-bark/40 align-middle" style={{ backgroundColor: l.hex }} />
                  {l.label}
                  {l.yarnId ? null : <span className="text-bark"> (not a studio yarn)</span>}
                </th>
                <td className="py-1 pr-3">{l.roles.join(" and ")}</td>
                <td className="py-1 pr-3 text-right">{fmt(l.metres)}</td>
                <td className="py-1 pr-3 text-right">{fmt(l.yards)}</td>
                <td className="py-1 pr-3 text-right">{l.skeins ? l.skeins.skeins : "–"}</td>
                <td className="py-1 text-right">{l.skeins ? l.skeins.grams : "–"}</td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="border-t border-bark/30 font-semibold">
              <th scope="row" className="py-1 pr-3">All colours</th>
              <td />
              <td className="py-1 pr-3 text-right">{fmt(data.totals.metres)}</td>
              <td className="py-1 pr-3 text-right">{fmt(data.totals.yards)}</td>
              <td />
              <td />
            </tr>
          </tfoot>
        </table>
      </div>
      {data.warnings.length ? (
        <ul className="mt-2 list-disc pl-5 text-sm">
          {data.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
      <details className="mt-2 text-sm text-bark">
        <summary>How the yarn is worked out</summary>
        <ul className="list-disc pl-5">
          {data.sources.map((s) => (
            <li key={s}>{s}</li>
          ))}
        </ul>
      </details>
      {usable.length ? (
        <div className="mt-3">
          <Button variant="secondary" onClick={() => props.onUse(usable)}>
            Use these skeins
          </Button>
        </div>
      ) : null}
    </section>
  );
}
