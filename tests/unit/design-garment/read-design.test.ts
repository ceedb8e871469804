import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import { areaShapeMask, chartDarn, findPaintOutsideShape, matchArea, readDesignOnGarment, rowShape } from "@/lib/core/design-garment";
import { areaShape, garmentFromSizing } from "@/lib/core/garment";
import { sizeGarment } from "@/lib/core/sizing";

const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
const sizing = sizeGarment({ garment: "mitten", size: "child", gauge });
const back = sizing.charts.find((c) => c.area === "back of hand")!;
const palette = [
  { key: "A", name: "Cream", hex: "#ffffff" },
  { key: "B", name: "Blue", hex: "#0000ff" },
  { key: "C", name: "Red", hex: "#ff0000" },
];

describe("area slugs", () => {
  test.each([
    ["back-of-hand", "back of hand", null],
    ["back-of-hand-left", "back of hand", "left"],
    ["back-of-hand-right", "back of hand", "right"],
    ["palm-2", "palm", null],
  ])("%s → %s (%s)", (slug, area, side) => {
    expect(matchArea({ chartAreas: sizing.charts.map((c) => c.area) }, slug)).toEqual({ area, side });
  });
  test("an unknown slug matches nothing", () => {
    expect(matchArea({ chartAreas: ["cuff", "palm"] }, "crown")).toBeNull();
  });
});

describe("an area's shape", () => {
  test("edges: a 26-wide row of 4 keeps the middle four (11 cells each side)", () => {
    const row = rowShape({ width: 26, height: 1, rowStitches: [4], narrowing: "edges" }, 0);
    expect(row.map((v) => (v ? 1 : 0)).join("")).toBe("00000000000111100000000000");
  });
  test("sector end: the stitches nearest stitch 1 (the right) are kept", () => {
    expect(rowShape({ width: 5, height: 1, rowStitches: [2], narrowing: "sector end" }, 0)).toEqual([false, false, false, true, true]);
  });
  test("even: n of w spread across the row", () => {
    expect(rowShape({ width: 6, height: 1, rowStitches: [3], narrowing: "even" }, 0).filter(Boolean)).toHaveLength(3);
  });
  test("the mask holds exactly the area's in-shape stitches (the size verb's count)", () => {
    expect(areaShapeMask(back).reduce((s, v) => s + v, 0)).toBe(back.rowStitches!.reduce((s, n) => s + n, 0));
  });
  test("one rule: the editor's mask is the garment's own shape for every area of a mitten, a hat and a pullover", () => {
    const inputs = [
      { garment: "mitten", size: "child", gauge },
      { garment: "mitten", size: "woman M", gauge: { stitchesPer10cm: 27, rowsPer10cm: 30 } },
      { garment: "hat", size: "woman", gauge },
      { garment: "pullover", size: "woman M", gauge: { stitchesPer10cm: 20, rowsPer10cm: 28 } },
    ];
    let areas = 0;
    for (const input of inputs) {
      let s;
      try {
        s = sizeGarment(input);
      } catch {
        continue; // a size label this table does not know; the others still check the rule
      }
      const g = garmentFromSizing(s);
      for (const a of s.charts) {
        expect(Array.from(areaShapeMask(a)), `${input.garment} ${a.area}`).toEqual(Array.from(areaShape(g, a.area).inShape));
        areas++;
      }
    }
    expect(areas).toBeGreaterThan(4);
  });
  test("paint outside is found at its place; the background colour is not paint", () => {
    const chart = createChart(back.width, back.height, gauge, palette);
    expect(findPaintOutsideShape(chart, back)).toBeNull();
    chart.cells[(back.height - 1) * back.width] = 1;
    expect(findPaintOutsideShape(chart, back)).toEqual({ x: 0, y: back.height - 1 });
  });
});

describe("darning and pins", () => {
  // Row 1 of the back holds three colours: A, B and one C.
  const chart = createChart(back.width, back.height, gauge, palette);
  chart.cells[0] = 1;
  chart.cells[1] = 2;
  test("with nothing chosen, the colour plan's choice darns the odd colour", () => {
    expect(chartDarn({ chart })).toEqual(["C"]);
    const r = readDesignOnGarment(sizing, [{ area: "back-of-hand", label: "Back", chart }]);
    expect(r.problems).toEqual([]);
    expect(r.pieces.map((p) => p.duplicateStitches)).toEqual([1, 1]);
  });
  test("the maker's explicit 'darn nothing' is kept, and the core's refusal is reported, not dropped", () => {
    const r = readDesignOnGarment(sizing, [{ area: "back-of-hand", label: "Back", chart, options: { darn: [] } }]);
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0].message).toMatch(/three colours/);
    expect(r.pieces.map((p) => p.strandedStitches)).toEqual([0, 0]);
  });
  test("a pinned pair for the chart's first round is honoured by the round reading", () => {
    const round = (back.fromRound ?? 0) + 1;
    const r = readDesignOnGarment(sizing, [{ area: "back-of-hand", label: "Back", chart, options: { darn: [], pins: [{ fromRound: round, toRound: round, pair: ["A", "C"] }] } }]);
    expect(r.problems).toEqual([]);
    const at = r.reading.rounds.find((x) => x.piece === "left mitten" && x.round === round && x.knit.length === 2)!;
    expect([...at.knit].sort()).toEqual(["A", "C"]);
    expect(at.darned).toBe(1);
  });
});
