import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getColoursPerRow, getRowCounts, getRowSummaries, getStitchCounts, getStitchCountsByKey } from "@/lib/core/chart/counts";
import { parseChart } from "@/lib/core/chart/format";
import { canRedo, canUndo, commitChart, createHistory, redo, undo } from "@/lib/core/chart/history";
import { createChart } from "@/lib/core/chart/model";
import { paintCell } from "@/lib/core/chart/ops";
import { chartArb } from "./arbitraries";

const example = parseChart({
  version: 1,
  width: 8,
  height: 3,
  gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 },
  palette: [
    { key: "A", name: "Oat", hex: "#EFE6D2" },
    { key: "B", name: "Rowan red", hex: "#9E2B25" },
    { key: "C", name: "Moss", hex: "#3F5E3A" },
  ],
  rows: ["AABBAABB", "ABABABAB", "AAAAAAAA"],
});

describe("counts", () => {
  test("stitches per colour, per row and colours per row", () => {
    expect(getStitchCounts(example)).toEqual([16, 8, 0]);
    expect(getStitchCountsByKey(example)).toEqual({ A: 16, B: 8, C: 0 });
    expect(getRowCounts(example)).toEqual([[8, 0, 0], [4, 4, 0], [4, 4, 0]]);
    expect(getColoursPerRow(example)).toEqual([1, 2, 2]);
    expect(getRowSummaries(example)[0]).toEqual({ row: 3, counts: { A: 4, B: 4, C: 0 }, colours: 2 });
  });

  test("per-row counts add up to the width and to the chart totals", () => {
    fc.assert(
      fc.property(chartArb(), (chart) => {
        const rows = getRowCounts(chart);
        expect(rows).toHaveLength(chart.height);
        for (const row of rows) expect(row.reduce((a, b) => a + b, 0)).toBe(chart.width);
        const totals = chart.palette.map((_, i) => rows.reduce((sum, row) => sum + row[i], 0));
        expect(totals).toEqual(getStitchCounts(chart));
      }),
    );
  });
});

describe("history", () => {
  const palette = [
    { key: ".", name: "Oat", hex: "#EFE6D2" },
    { key: "X", name: "Red", hex: "#9E2B25" },
  ];
  const start = createChart(4, 4, { stitchesPer10cm: 30, rowsPer10cm: 30 }, palette);

  test("undo and redo walk through the committed values", () => {
    const a = paintCell(start, { x: 0, y: 0 }, 1);
    const b = paintCell(a, { x: 1, y: 0 }, 1);
    let h = commitChart(commitChart(createHistory(start), a), b);
    expect(h.present).toBe(b);
    h = undo(h);
    expect(h.present).toBe(a);
    h = undo(h);
    expect(h.present).toBe(start);
    expect(canUndo(h)).toBe(false);
    expect(undo(h)).toBe(h);
    h = redo(redo(h));
    expect(h.present).toBe(b);
    expect(canRedo(h)).toBe(false);
  });

  test("a new edit after undo drops the redo branch", () => {
    const a = paintCell(start, { x: 0, y: 0 }, 1);
    const c = paintCell(start, { x: 3, y: 3 }, 1);
    const h = commitChart(undo(commitChart(createHistory(start), a)), c);
    expect(h.present).toBe(c);
    expect(canRedo(h)).toBe(false);
    expect(undo(h).present).toBe(start);
  });

  test("keeps at most `limit` undo steps, dropping the oldest", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10 }), fc.integer({ min: 0, max: 30 }), (limit, edits) => {
        const charts = Array.from({ length: edits }, (_, i) => paintCell(start, { x: i % 4, y: 0 }, 1));
        let h = charts.reduce(commitChart, createHistory(start, limit));
        expect(h.past.length).toBe(Math.min(limit, edits));
        let steps = 0;
        while (canUndo(h)) {
          h = undo(h);
          steps++;
        }
        expect(steps).toBe(Math.min(limit, edits));
        expect(h.present).toBe(edits <= limit ? start : charts[edits - limit - 1]);
      }),
    );
  });

  test("a limit below 1 is refused", () => {
    expect(() => createHistory(start, 0)).toThrow("history limit must be a whole number of at least 1 (got 0)");
  });
});
