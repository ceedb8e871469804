// The round clean-up: specks of a third colour folded into the round's knitted pair, real darned
// areas kept, and the plan's cost (darned stitches, ends, minutes) never higher than before.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import type { ChartV1 } from "@/lib/core/chart/format";
import { parseChart } from "@/lib/core/chart/format";
import { planRoundPairs } from "@/lib/core/colourwork/round-pairs";
import { limitRoundColours, PhotoError } from "@/lib/core/photo";

const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
const palette = [
  { key: "A", name: "Cream", hex: "#F2EBDD" },
  { key: "B", name: "Navy", hex: "#1F2A44" },
  { key: "C", name: "Red", hex: "#B22222" },
  { key: "D", name: "Sky", hex: "#7FB3D5" },
];
const doc = (rows: string[], pal = palette): ChartV1 => ({ version: 1, width: rows[0].length, height: rows.length, gauge, palette: pal, rows });

/** A navy/cream check ground (two colours in every round), rows top first. */
function ground(width: number, height: number): string[][] {
  return Array.from({ length: height }, (_, r) => Array.from({ length: width }, (_, x) => ((x >> 1) + (r >> 1)) % 3 === 0 ? "B" : "A"));
}

describe("limitRoundColours", () => {
  test("one-stitch specks of a third colour go; a real three-colour motif stays", () => {
    const g = ground(24, 16);
    // a red 4 × 4 heart-ish block: a real darned area
    for (let r = 4; r < 8; r++) for (let x = 10; x < 14; x++) g[r][x] = "C";
    // specks: a red stitch far from the motif and a sky stitch
    g[13][3] = "C";
    g[1][20] = "D";
    const input = doc(g.map((r) => r.join("")));
    const out = limitRoundColours(input, { maxStitches: 3 });
    // exactly the two specks changed, each into one of its round's knitted colours
    // top-first row 13 of 16 is row 3 from the bottom; x 3 of 24 is stitch 21 from the right
    expect(out.changed.map((c) => [c.row, c.stitch, c.from])).toEqual([
      [3, 21, "C"],
      [15, 4, "D"],
    ]);
    for (const c of out.changed) expect(["A", "B"]).toContain(c.to);
    // the motif is still there, all 16 stitches
    const rows = out.chart.rows;
    let red = 0;
    for (const row of rows) for (const ch of row) if (ch === "C") red++;
    expect(red).toBe(16);
    expect(out.groups.folded).toBe(2);
    expect(out.after.darnedStitches).toBeLessThan(out.before.darnedStitches);
    expect(out.after.ends).toBeLessThan(out.before.ends);
    expect(out.after.minutes).toBeLessThan(out.before.minutes);
    expect(out.after.darnedStitches).toBeGreaterThanOrEqual(16 - 8); // the motif is still darned in part
  });

  test("changed stitches are in trade numbering and match the chart", () => {
    const g = ground(10, 6);
    g[0][0] = "D"; // top row, leftmost: row 6 from the bottom, stitch 10 from the right
    const out = limitRoundColours(doc(g.map((r) => r.join(""))));
    expect(out.changed).toEqual([{ row: 6, stitch: 10, from: "D", to: out.chart.rows[0][0] }]);
    // Sky is nearer cream than navy by CIEDE2000
    expect(out.changed[0].to).toBe("A");
  });

  test("a speck folds into the nearer of its round's pair by CIEDE2000", () => {
    const g = ground(12, 6);
    g[2][5] = "C"; // red: nearer navy than cream
    const out = limitRoundColours(doc(g.map((r) => r.join(""))));
    expect(out.changed).toHaveLength(1);
    expect(out.changed[0].to).toBe("B");
  });

  test("groups above the threshold are kept; the threshold decides", () => {
    const g = ground(16, 8);
    for (let x = 4; x < 8; x++) g[3][x] = "C"; // a 4-stitch red line in one round
    const rows = g.map((r) => r.join(""));
    const keep = limitRoundColours(doc(rows), { maxStitches: 3 });
    expect(keep.changed).toEqual([]);
    expect(keep.chart.rows).toEqual(rows);
    expect(keep.groups).toEqual({ folded: 0, kept: 1, keptDearer: 0 });
    const fold = limitRoundColours(doc(rows), { maxStitches: 4 });
    expect(fold.changed).toHaveLength(4);
    expect(fold.after.darnedStitches).toBe(0);
    expect(fold.after.roundsOverTwo).toBe(0);
  });

  test("a speck whose fold would cost more is kept (it joins two strands of a darned area)", () => {
    const g = ground(24, 10);
    // two red blocks 9 stitches apart (beyond the 2.5 cm carry at 32 sts per 10 cm), one strand
    // through the red stitch between them
    for (let r = 4; r < 6; r++) for (let x = 0; x < 4; x++) g[r][x] = "C";
    for (let r = 4; r < 6; r++) for (let x = 12; x < 16; x++) g[r][x] = "C";
    g[4][8] = "C";
    const rows = g.map((r) => r.join(""));
    const out = limitRoundColours(doc(rows), { maxStitches: 2 });
    expect(out.changed).toEqual([]);
    expect(out.chart.rows).toEqual(rows);
    expect(out.groups).toEqual({ folded: 0, kept: 2, keptDearer: 1 });
    expect(out.after).toEqual(out.before);
    // with a second speck elsewhere the two are judged together: kept together when the total falls
    g[0][20] = "D";
    const both = limitRoundColours(doc(g.map((r) => r.join(""))), { maxStitches: 2 });
    expect(both.after.ends).toBeLessThanOrEqual(both.before.ends);
    expect(both.after.minutes).toBeLessThan(both.before.minutes);
  });

  test("a chart already within two colours per round is unchanged", () => {
    const g = ground(20, 12);
    // a third colour in rounds of its own with one other: the round pair knits it, nothing darned
    g[5] = g[5].map((c) => (c === "B" ? "C" : c));
    const rows = g.map((r) => r.join(""));
    const out = limitRoundColours(doc(rows));
    expect(out.changed).toEqual([]);
    expect(out.chart.rows).toEqual(rows);
    expect(out.before).toEqual(out.after);
    expect(out.before.darnedStitches).toBe(0);
  });

  test("the reported cost is the planner's own for the result", () => {
    const g = ground(14, 10);
    g[2][2] = "C";
    g[7][9] = "D";
    g[7][10] = "D";
    const out = limitRoundColours(doc(g.map((r) => r.join(""))));
    const chart = parseChart(out.chart);
    const rounds = Array.from({ length: chart.height }, (_, y) => Array.from({ length: chart.width }, (_, k) => chart.cells[y * chart.width + chart.width - 1 - k]));
    const plan = planRoundPairs({ rounds, palette, gauge });
    expect(out.after).toMatchObject({ darnedStitches: plan.totals.darnedStitches, ends: plan.totals.ends, minutes: plan.totals.minutes });
  });

  test("bad options name the field", () => {
    const rows = ground(4, 4).map((r) => r.join(""));
    expect(() => limitRoundColours(doc(rows), { maxStitches: 0 })).toThrow(PhotoError);
    expect(() => limitRoundColours(doc(rows), { maxStitches: 2.5 })).toThrow(/limitRounds\.maxStitches/);
  });

  test("property: never more ends, darned stitches or minutes than the input", () => {
    const keys = ["A", "B", "C", "D"];
    const chartArb = fc
      .record({ width: fc.integer({ min: 2, max: 9 }), height: fc.integer({ min: 1, max: 8 }), colours: fc.integer({ min: 2, max: 4 }), max: fc.integer({ min: 1, max: 4 }), round: fc.boolean() })
      .chain(({ width, height, colours, max, round }) =>
        fc
          .array(fc.array(fc.constantFrom(...keys.slice(0, colours)), { minLength: width, maxLength: width }), { minLength: height, maxLength: height })
          .map((cells) => ({ rows: cells.map((r) => r.join("")), max, round })),
      );
    fc.assert(
      fc.property(chartArb, ({ rows, max, round }) => {
        const out = limitRoundColours(doc(rows), { maxStitches: max, inTheRound: round });
        expect(out.after.ends).toBeLessThanOrEqual(out.before.ends);
        expect(out.after.darnedStitches).toBeLessThanOrEqual(out.before.darnedStitches);
        expect(out.after.minutes).toBeLessThanOrEqual(out.before.minutes);
        // only darned stitches change, and only into a colour already in the chart
        expect(out.changed.length).toBeLessThanOrEqual(out.before.darnedStitches);
        if (out.changed.length === 0) expect(out.chart.rows).toEqual(rows);
      }),
      { numRuns: 60, seed: 19 },
    );
  });
});
