import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import { countAreas, estimateChartYarn } from "@/lib/core/yarn/chart-yarn";
import { estimateYarn } from "@/lib/core/yarn/estimate-yarn";
import { getLoopLengthCm } from "@/lib/core/yarn/loop-length";
import { PALETTE, chartOf } from "./charts";

// At 20 sts / 10 cm: loop length 4.2 ÷ 2 = 2.1 cm (fully relaxed Kw ≈ 4.2: Knapton et al. 1968, geometry after Munden 1959), stitch width 0.5 cm.
const SMALL = chartOf(["ABCA", "AAAA"]);

describe("a small chart worked by hand", () => {
  const est = estimateChartYarn(SMALL, null);
  const byKey = Object.fromEntries(est.colours.map((c) => [c.key, c]));

  test("the knitted pair defaults to the two most-used colours (a tie to the earlier palette entry)", () => {
    expect(est.knit).toEqual(["A", "B"]);
    expect(byKey.C.role).toBe("darned");
  });

  test("knitted stitches include the underlay under darned stitches", () => {
    expect(byKey.A.knittedStitches).toBe(7); // 6 cream + 1 under the red
    expect(byKey.B.knittedStitches).toBe(1);
  });

  test("floats: in the top row cream is carried past 1 stitch, navy past 3 (carried around the round)", () => {
    expect(byKey.A.cm.floats).toBeCloseTo(0.5, 9);
    expect(byKey.B.cm.floats).toBeCloseTo(1.5, 9);
  });

  test("'span' carries a colour only between its first and last stitch in the row", () => {
    const span = estimateChartYarn(SMALL, null, { carry: "span" });
    expect(span.colours.find((c) => c.key === "B")?.cm.floats).toBe(0);
    expect(span.colours.find((c) => c.key === "A")?.cm.floats).toBeCloseTo(0.5, 9);
  });

  test("knitted yarn = stitches × loop length; cast-on ≈ 3 × width in the main colour (Righetti)", () => {
    expect(byKey.A.cm.knitted).toBeCloseTo(7 * 2.1, 9);
    expect(byKey.A.cm.castOn).toBeCloseTo(3 * 2, 9); // 4 sts × 0.5 cm = 2 cm wide
    expect(byKey.B.cm.castOn).toBe(0);
  });

  test("darned yarn = stitches × loop × coverage 1.3, plus 15 cm an end, 2 ends an area without a plan", () => {
    expect(byKey.C.cm.darned).toBeCloseTo(1 * 2.1 * 1.3, 9);
    expect(byKey.C.ends).toBe(2);
    expect(byKey.C.cm.tails).toBe(30);
  });

  test("totals with the 10 % margin, rounded up to the cm", () => {
    const out = estimateYarn({ chart: SMALL, plan: null, yarns: [] });
    const total = Object.fromEntries(out.colours.map((c) => [c.key, c.totalCm]));
    expect(total.A).toBe(Math.ceil((14.7 + 0.5 + 6 + 30) * 1.1)); // 56.32 → 57
    expect(total.B).toBe(Math.ceil((2.1 + 1.5 + 30) * 1.1)); // 36.96 → 37
    expect(total.C).toBe(37); // (2.73 + 30) × 1.1 = 36.003 → 37
    expect(out.colours.find((c) => c.key === "A")?.metres).toBe(0.6);
  });
});

describe("options and plans", () => {
  test("a darning plan's ends and carries are used for its colour", () => {
    const plan = { colours: [{ key: "C", stitches: 1, ends: 3, carryCm: 4.5 }] };
    const c = estimateChartYarn(SMALL, plan).colours.find((x) => x.key === "C");
    expect(c?.ends).toBe(3);
    expect(c?.cm.tails).toBe(45);
    expect(c?.cm.carries).toBe(4.5);
  });

  test("the plan's knitted pair is used when none is given", () => {
    const est = estimateChartYarn(SMALL, { knit: ["A", "C"], colours: [] });
    expect(est.knit).toEqual(["A", "C"]);
    expect(est.colours.find((c) => c.key === "B")?.role).toBe("darned");
  });

  test("a mismatch between plan and chart is reported, the chart's count used", () => {
    const est = estimateChartYarn(SMALL, { colours: [{ key: "C", stitches: 5, ends: 2, carryCm: 0 }] });
    expect(est.warnings.join(" ")).toMatch(/plan has 5 stitches of 'C' but the chart has 1/);
  });

  test("an explicit knit pair and underlay", () => {
    const est = estimateChartYarn(SMALL, null, { knit: ["A", "B"], underlay: { C: "B" } });
    expect(est.colours.find((c) => c.key === "B")?.knittedStitches).toBe(2);
  });

  test.each([
    { options: { knit: ["Z"] }, message: /knit: colour 'Z' is not in the chart's palette/ },
    { options: { knit: ["A", "A"] }, message: /must differ/ },
    { options: { underlay: { C: "D" } }, message: /'D' is not one of the knitted colours/ },
    { options: { quantity: 0 }, message: /quantity/ },
  ])("bad option $options", ({ options, message }) => {
    expect(() => estimateChartYarn(SMALL, null, options)).toThrow(message);
  });

  test("quantity 2 doubles every length", () => {
    const one = estimateChartYarn(SMALL, null);
    const two = estimateChartYarn(SMALL, null, { quantity: 2 });
    two.colours.forEach((c, i) => {
      for (const k of Object.keys(c.cm) as (keyof typeof c.cm)[]) expect(c.cm[k]).toBeCloseTo(2 * one.colours[i].cm[k], 9);
    });
  });

  test("areas count stitches touching at a corner as one (darning runs diagonally)", () => {
    const chart = chartOf(["CAAC", "ACAA", "AAAA", "CCAA"]);
    expect(countAreas(chart, 2)).toBe(3);
  });
});

describe("properties", () => {
  const arbChart = fc
    .record({ w: fc.integer({ min: 1, max: 12 }), h: fc.integer({ min: 1, max: 10 }), sts: fc.integer({ min: 12, max: 36 }) })
    .chain(({ w, h, sts }) =>
      fc.record({ w: fc.constant(w), h: fc.constant(h), sts: fc.constant(sts), cells: fc.array(fc.integer({ min: 0, max: 3 }), { minLength: w * h, maxLength: w * h }) }),
    )
    .map(({ w, h, sts, cells }) => {
      const chart = createChart(w, h, { stitchesPer10cm: sts, rowsPer10cm: sts * 1.3 }, PALETTE);
      chart.cells.set(cells);
      return chart;
    });

  test("every cell is knitted once by the pair; darned colours cover their cells; span floats ≤ round floats", () => {
    fc.assert(
      fc.property(arbChart, (chart) => {
        const round = estimateChartYarn(chart, null);
        const span = estimateChartYarn(chart, null, { carry: "span" });
        const knitted = round.colours.reduce((s, c) => s + c.knittedStitches, 0);
        expect(knitted).toBe(chart.width * chart.height);
        for (const c of round.colours.filter((x) => x.role === "darned")) expect(c.darnedStitches).toBe(c.cells);
        round.colours.forEach((c, i) => expect(span.colours[i].cm.floats).toBeLessThanOrEqual(c.cm.floats + 1e-9));
      }),
    );
  });

  test("each colour needs at least its stitches' loops; a larger margin never needs less", () => {
    fc.assert(
      fc.property(arbChart, fc.integer({ min: 0, max: 30 }), fc.integer({ min: 0, max: 30 }), (chart, m1, extra) => {
        const loop = getLoopLengthCm(chart.gauge.stitchesPer10cm);
        const a = estimateYarn({ chart, plan: null, yarns: [], options: { marginPercent: m1 } });
        const b = estimateYarn({ chart, plan: null, yarns: [], options: { marginPercent: m1 + extra } });
        a.colours.forEach((c, i) => {
          expect(c.totalCm).toBeGreaterThanOrEqual((c.knittedStitches + c.darnedStitches) * loop - 1e-6);
          expect(b.colours[i].totalCm).toBeGreaterThanOrEqual(c.totalCm);
        });
      }),
    );
  });
});
