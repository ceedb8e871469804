"use client";
// The colour plan beside the chart: the knitted pair, what is darned, every pair compared, floats
// over the limit (marked on the chart) and the darning route per colour as a numbered stitch map.
import { useQuery } from "@tanstack/react-query";
import { useEffect, useMemo, useState } from "react";
import { serializeChart, type Chart, type ChartV1 } from "@/lib/core/chart";
import type { ColourPlan } from "@/lib/core/colourwork/colour-plan";
import type { DarningPlan } from "@/lib/core/colourwork/darning-plan";
import type { CellMark } from "./chart-canvas";
import { Spinner } from "@/components/ui/skeleton";
import { DarningMap } from "./darning-map";
import { RoundsTable, type Pinning } from "./rounds-table";
import type { RoundReading } from "@/lib/core/garment";

export interface PlanPanelProps {
  chart: Chart;
  defaults: { carryLimitCm: number; floatLimitStitches: number; floatLimitCm: number };
  inTheRound: boolean;
  onMarks?: (marks: CellMark[]) => void;
  /** the whole garment read round by round (from the live price), when the design has a commission */
  rounds?: RoundReading[] | null;
  /** pinned pairs for ranges of rounds (saved with the design), when the editor can change them */
  pinning?: Pinning;
}

interface PlanResponse {
  colours: ColourPlan;
  darning: DarningPlan;
}

const fmt = (n: number) => n.toLocaleString("en-GB", { maximumFractionDigits: 1 });

/** Float marks (trade numbering) → the cells of each float over the limit, in core coordinates. */
export function floatCells(plan: ColourPlan, width: number): CellMark[] {
  const out: CellMark[] = [];
  for (const row of plan.rows) {
    for (const f of row.floats) {
      for (let k = 0; k < f.length; k++) {
        const stitch = ((f.fromStitch - 1 + k) % width) + 1;
        out.push({ x: width - stitch, y: row.row - 1 });
      }
    }
  }
  return out;
}

export function PlanPanel({ chart, defaults, inTheRound: roundDefault, onMarks, rounds, pinning }: PlanPanelProps) {
  const [doc, setDoc] = useState<ChartV1>(() => serializeChart(chart));
  const [knit, setKnit] = useState<string>("");
  const [inTheRound, setInTheRound] = useState(roundDefault);
  const [showFloats, setShowFloats] = useState(true);
  const [colourKey, setColourKey] = useState<string>("");

  useEffect(() => {
    const t = setTimeout(() => setDoc(serializeChart(chart)), 600);
    return () => clearTimeout(t);
  }, [chart]);

  const pairs = useMemo(() => {
    const out: string[] = [];
    for (let i = 0; i < doc.palette.length; i++) for (let j = i + 1; j < doc.palette.length; j++) out.push(`${doc.palette[i].key}${doc.palette[j].key}`);
    return out;
  }, [doc.palette]);
  const knitOption = knit && pairs.includes(knit) ? Array.from(knit) : undefined;

  const plan = useQuery({
    queryKey: ["colour-plan", JSON.stringify(doc), knitOption?.join("") ?? "", inTheRound],
    queryFn: async (): Promise<PlanResponse> => {
      const res = await fetch("/api/colourwork/plan", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ chart: doc, options: { inTheRound, ...(knitOption ? { knit: knitOption } : {}) } }),
      });
      const body = await res.json();
      if (!res.ok) throw new Error(body.error?.message ?? `The plan could not be made (${res.status}).`);
      return body;
    },
    placeholderData: (prev) => prev,
  });

  const data = plan.data;
  useEffect(() => {
    if (!onMarks) return;
    onMarks(data && showFloats && data.colours.rows.length ? floatCells(data.colours, doc.width) : []);
  }, [data, showFloats, doc.width, onMarks]);

  const name = (key: string) => doc.palette.find((c) => c.key === key)?.name ?? key;
  const darned = data?.darning.colours ?? [];
  const current = darned.find((c) => c.key === colourKey) ?? darned[0];
  const overRows = data?.colours.rows.filter((r) => r.catches > 0) ?? [];

  return (
    <section aria-labelledby="plan-heading" className="space-y-4 rounded-md border border-bark/30 bg-white p-3" data-testid="plan-panel">
      <h2 id="plan-heading" className="text-lg">
        Colour plan
      </h2>
      {rounds?.length ? <RoundsTable rounds={rounds} name={name} {...(pinning ? { pinning } : {})} /> : null}
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex flex-col text-sm">
          Knitted pair
          <select className="rounded-md border border-bark/40 px-2 py-1" value={knit} onChange={(e) => setKnit(e.target.value)}>
            <option value="">Choose for me (least work)</option>
            {pairs.map((p) => (
              <option key={p} value={p}>
                {name(p[0])} and {name(p[1])}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={inTheRound} onChange={(e) => setInTheRound(e.target.checked)} /> Knitted in the round
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={showFloats} onChange={(e) => setShowFloats(e.target.checked)} /> Mark long floats on the chart (a bar under each stitch of the float)
        </label>
        <p className="text-sm text-bark">
          Limits: floats over {defaults.floatLimitStitches} stitches or {defaults.floatLimitCm} cm, carries over {defaults.carryLimitCm} cm (studio settings).
        </p>
      </div>
      {plan.isError ? (
        <p role="alert" className="font-semibold text-madder-dark">
          {(plan.error as Error).message}
        </p>
      ) : null}
      {!data && plan.isPending ? (
        <p role="status" aria-busy="true">
          <Spinner /> Working out the plan…
        </p>
      ) : null}
      {data ? (
        <div className="space-y-4" aria-busy={plan.isFetching}>
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
            <dt className="font-semibold">Knitted</dt>
            <dd data-testid="plan-knit">{data.colours.knit.map(name).join(" and ")}</dd>
            <dt className="font-semibold">Darned afterwards</dt>
            <dd>{data.colours.darn.length ? data.colours.darn.map(name).join(", ") : "nothing: every stitch is knitted"}</dd>
            <dt className="font-semibold">Float catches</dt>
            <dd>
              {data.colours.totals.catches} (longest float {data.colours.totals.longestFloat} stitches)
            </dd>
          </dl>

          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <caption className="mb-1 text-left font-semibold">Every knitted pair compared (cheapest first)</caption>
              <thead>
                <tr className="border-b border-bark/30 text-left">
                  <th scope="col">Pair</th>
                  <th scope="col">Darned stitches</th>
                  <th scope="col">Catches</th>
                  <th scope="col">Ends</th>
                  <th scope="col">Carry (cm)</th>
                  <th scope="col">Minutes</th>
                </tr>
              </thead>
              <tbody>
                {data.colours.candidates.map((c) => (
                  <tr key={c.knit.join("")} className="border-b border-bark/10">
                    <th scope="row" className="text-left font-normal">
                      {c.knit.map(name).join(" + ")}
                      {c.knit.join("") === data.colours.knit.join("") ? " (chosen)" : ""}
                    </th>
                    <td>{c.darnedStitches}</td>
                    <td>{c.catches ?? "–"}</td>
                    <td>{c.ends ?? "–"}</td>
                    <td>{c.carryCm === undefined ? "–" : fmt(c.carryCm)}</td>
                    <td>
                      {c.minutesAtLeast ? "≥ " : ""}
                      {fmt(c.minutes)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>

          {overRows.length ? (
            <div className="overflow-x-auto">
              <table className="w-full text-sm">
                <caption className="mb-1 text-left font-semibold">Rows with floats over the limit (marked on the chart when shown)</caption>
                <thead>
                  <tr className="border-b border-bark/30 text-left">
                    <th scope="col">Row</th>
                    <th scope="col">Longest float</th>
                    <th scope="col">Catches</th>
                    <th scope="col">Catch behind stitches</th>
                  </tr>
                </thead>
                <tbody>
                  {overRows.map((r) => (
                    <tr key={r.row} className="border-b border-bark/10">
                      <th scope="row" className="text-left font-normal">
                        {r.row}
                      </th>
                      <td>{r.longestFloat}</td>
                      <td>{r.catches}</td>
                      <td>{r.floats.flatMap((f) => f.catchStitches).join(", ")}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          ) : (
            <p>No float is over the limit.</p>
          )}

          <div>
            <h3 className="text-base font-semibold">Darning totals</h3>
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="plan-totals">
              <dt>Darned stitches</dt>
              <dd>{data.darning.totals.stitches}</dd>
              <dt>Strands</dt>
              <dd>{data.darning.totals.strands}</dd>
              <dt>Ends to weave in</dt>
              <dd>
                {data.darning.totals.ends} (fewest possible: {data.darning.totals.lowerBound.ends})
              </dd>
              <dt>Yarn carried</dt>
              <dd>
                {fmt(data.darning.totals.carryCm)} cm (at least {fmt(data.darning.totals.lowerBound.carryCm)} cm)
              </dd>
              <dt>Yarn for darning</dt>
              <dd>{fmt(data.darning.totals.yarnCm)} cm</dd>
              <dt>Time</dt>
              <dd>{fmt(data.darning.totals.minutes)} minutes</dd>
              <dt>Saved versus row by row</dt>
              <dd>
                {data.darning.totals.saved.ends} ends and {fmt(data.darning.totals.saved.minutes)} minutes (row by row: {data.darning.totals.naive.ends} ends,{" "}
                {fmt(data.darning.totals.naive.carryCm)} cm carried)
              </dd>
            </dl>
          </div>

          {darned.length && current ? (
            <div>
              <div className="flex flex-wrap items-end gap-3">
                <h3 className="text-base font-semibold">Darning route</h3>
                <label className="flex flex-col text-sm">
                  Colour
                  <select className="rounded-md border border-bark/40 px-2 py-1" value={current.key} onChange={(e) => setColourKey(e.target.value)}>
                    {darned.map((c) => (
                      <option key={c.key} value={c.key}>
                        {c.name} ({c.stitches} sts, {c.ends} ends)
                      </option>
                    ))}
                  </select>
                </label>
              </div>
              <DarningMap key={`${current.key}-${JSON.stringify(doc.rows)}`} chart={doc} colour={current} />
            </div>
          ) : null}
        </div>
      ) : null}
      {plan.isFetching && data ? (
        <p role="status" className="text-sm text-bark">
          <Spinner /> Updating the plan…
        </p>
      ) : null}
    </section>
  );
}
