"use client";
// Recharts plots for the insights page; each has a table view with the same figures.
import type { ReactNode } from "react";
import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

const STAGE_FILL: Record<string, string> = { knitting: "#A3342A", embroidery: "#2F5D7C", blocking: "#3F5E3A", finishing: "#6D5A7E" };
const STAGE_NAME: Record<string, string> = { knitting: "Knitting", embroidery: "Embroidery", blocking: "Blocking", finishing: "Finishing" };

export interface Column {
  key: string;
  label: string;
  align?: "right";
  format?: (v: number | string) => string;
}

function TableView({ caption, columns, rows }: { caption: string; columns: Column[]; rows: Record<string, number | string>[] }) {
  return (
    <details className="mt-3">
      <summary className="cursor-pointer font-semibold">Table view: {caption}</summary>
      <div className="mt-2 overflow-x-auto" tabIndex={0} role="region" aria-label={`Table: ${caption}`}>
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr className="border-b border-bark/30 text-bark">
              {columns.map((c, i) => (
                <th key={c.key} scope="col" className={`py-1 pr-3 ${c.align === "right" ? "text-right" : ""}`}>
                  {i === 0 ? c.label : c.label}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i} className="border-b border-bark/10">
                {columns.map((c, j) =>
                  j === 0 ? (
                    <th key={c.key} scope="row" className="py-1 pr-3 font-normal">
                      {c.format ? c.format(r[c.key]) : String(r[c.key])}
                    </th>
                  ) : (
                    <td key={c.key} className={`py-1 pr-3 tabular-nums ${c.align === "right" ? "text-right" : ""}`}>
                      {c.format ? c.format(r[c.key]) : String(r[c.key])}
                    </td>
                  ),
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

function Plot({ title, summary, children }: { title: string; summary: string; children: ReactNode }) {
  return (
    <figure className="m-0">
      <figcaption className="sr-only">{title}: {summary}</figcaption>
      <div className="h-64 w-full" aria-hidden="true">
        <ResponsiveContainer width="100%" height="100%">{children as React.ReactElement}</ResponsiveContainer>
      </div>
    </figure>
  );
}

export function HoursByMonthChart({ rows }: { rows: Record<string, number | string>[] }) {
  const stages = Object.keys(STAGE_FILL);
  return (
    <>
      <Plot title="Hours per stage per month" summary={`${rows.length} months of logged hours`}>
        <BarChart data={rows} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} accessibilityLayer={false}>
          <CartesianGrid strokeDasharray="3 3" stroke="#D9D2C5" />
          <XAxis dataKey="month" />
          <YAxis unit=" h" />
          <Tooltip />
          <Legend />
          {stages.map((s) => (
            <Bar key={s} dataKey={s} name={STAGE_NAME[s]} stackId="h" fill={STAGE_FILL[s]} isAnimationActive={false} />
          ))}
        </BarChart>
      </Plot>
      <TableView
        caption="hours per stage per month"
        columns={[{ key: "month", label: "Month" }, ...stages.map((s) => ({ key: s, label: `${STAGE_NAME[s]} (h)`, align: "right" as const }))]}
        rows={rows}
      />
    </>
  );
}

export function SimpleBarChart({
  rows,
  xKey,
  bars,
  caption,
  columns,
  unit,
}: {
  rows: Record<string, number | string>[];
  xKey: string;
  bars: { key: string; name: string; fill: string }[];
  caption: string;
  columns: Column[];
  unit?: string;
}) {
  return (
    <>
      <Plot title={caption} summary={`${rows.length} rows`}>
        <BarChart data={rows} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} accessibilityLayer={false}>
          <CartesianGrid strokeDasharray="3 3" stroke="#D9D2C5" />
          <XAxis dataKey={xKey} />
          <YAxis unit={unit} />
          <Tooltip />
          {bars.length > 1 ? <Legend /> : null}
          {bars.map((b) => (
            <Bar key={b.key} dataKey={b.key} name={b.name} fill={b.fill} isAnimationActive={false} />
          ))}
        </BarChart>
      </Plot>
      <TableView caption={caption} columns={columns} rows={rows} />
    </>
  );
}

export function AccuracyChart({ rows }: { rows: Record<string, number | string>[] }) {
  return (
    <>
      <Plot title="Estimate accuracy over time" summary="mean error of the P50 estimate per month of closing">
        <LineChart data={rows} margin={{ top: 8, right: 8, bottom: 8, left: 0 }} accessibilityLayer={false}>
          <CartesianGrid strokeDasharray="3 3" stroke="#D9D2C5" />
          <XAxis dataKey="month" />
          <YAxis unit=" %" />
          <Tooltip />
          <Legend />
          <Line dataKey="meanAbsErrorPercent" name="Mean absolute error" stroke="#A3342A" isAnimationActive={false} />
          <Line dataKey="meanSignedErrorPercent" name="Mean signed error (+ over-estimate)" stroke="#2F5D7C" strokeDasharray="4 3" isAnimationActive={false} />
        </LineChart>
      </Plot>
      <TableView
        caption="estimate accuracy per month of closing"
        columns={[
          { key: "month", label: "Month closed" },
          { key: "pieces", label: "Pieces", align: "right" },
          { key: "meanAbsErrorPercent", label: "Mean absolute error (%)", align: "right" },
          { key: "meanSignedErrorPercent", label: "Mean signed error (%)", align: "right" },
        ]}
        rows={rows}
      />
    </>
  );
}
