import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { fromTrade, type Chart } from "@/lib/core/chart/model";
import { getCarryGeometry } from "@/lib/core/colourwork/carry-geometry";
import { getCarryBoundCm, getStitchComponents } from "@/lib/core/colourwork/darning-bounds";
import { planDarning } from "@/lib/core/colourwork/darning-plan";
import { getNaiveRoute } from "@/lib/core/colourwork/naive-route";
import { routeStitchSet } from "@/lib/core/colourwork/route-colour";
import { getStitchSet } from "@/lib/core/colourwork/stitch-set";
import { chartFromRows, HALF_CM_GAUGE } from "./chart-from-rows";
import { checkRoute, type CheckedStep, type Spot } from "./route-checks";

// At HALF_CM_GAUGE stitches and rows are 0.5 cm, so the default 2.5 cm limit is 5 stitches.
describe("darning routes worked out by hand (0.5 cm stitches, 2.5 cm limit)", () => {
  test.each([
    // three touching stitches: one strand, nothing carried
    ["a line", ["CCC"], 1, 0, 0],
    // two stitches three apart: 1.5 cm, within the limit
    ["a short gap", ["C..C"], 1, 1.5, 1.5],
    // two stitches six apart: 3 cm is over the limit, so two strands (4 ends) and no carry
    ["a long gap", ["C.....C"], 2, 0, 0],
    // a T: three ends of strokes need one carry at least; the cheapest is 1.0 cm, from the foot of
    // the stem up the left arm, then across the two-stitch gap to the right arm (bound 0: all touch)
    ["a T", ["CCCCC", "..C..", "..C.."], 1, 1.0, 0],
    // four dots at the corners of a 2-stitch square: three sides of 1.0 cm (= its spanning tree)
    ["four dots", ["C.C", "...", "C.C"], 1, 3.0, 3.0],
    // a line of 7 and a dot two rows above its middle: working the line end to end and carrying
    // √(1.5² + 1²) = 1.80 cm between the dot and an end beats dropping into the middle (3.0 cm)
    ["a line and a dot", ["...C...", ".......", "CCCCCCC"], 1, 1.8, 1.0],
  ])("%s", (_name, rows, strands, carryCm, boundCm) => {
    const plan = planDarning(chartFromRows(rows, ["A", "C"]), { darn: ["C"] });
    const c = plan.colours[0];
    expect(c.strands).toHaveLength(strands);
    expect(c.ends).toBe(2 * strands);
    expect(c.lowerBound.ends).toBe(2 * strands);
    expect(c.carryCm).toBeCloseTo(carryCm, 1);
    expect(c.lowerBound.carryCm).toBeCloseTo(boundCm, 1);
  });

  test("a long T needs a carry through worked stitches: 3.0 cm back along the bar", () => {
    // Bar of 13 on top, stem of 8 below its middle. Best by hand: up the stem, along the bar to
    // its left end, then back 6 stitches (3.0 cm, over the limit, so behind worked bar stitches) to
    // the first unworked one, and on to the right end.
    const rows = ["CCCCCCCCCCCCC", ...Array.from({ length: 8 }, () => "......C......")];
    const plan = planDarning(chartFromRows(rows, ["A", "C"]), { darn: ["C"] });
    const c = plan.colours[0];
    expect(c.ends).toBe(2);
    expect(c.carryCm).toBeCloseTo(3.0, 1);
    const chained = c.strands[0].stitches.filter((s) => s.via);
    expect(chained).toHaveLength(1);
  });

  test("row-by-row baseline: rows from the bottom, each from the right, cut when out of reach", () => {
    const chart = chartFromRows(["CCCCC", "..C..", "..C.."], ["A", "C"]);
    const g = getCarryGeometry(chart.gauge, 2.5);
    // (2,0) → (2,1) touch; (2,1) → rightmost of the bar is 2 across, 1 up: √(1² + 0.5²) = 1.118 cm
    expect(getNaiveRoute(getStitchSet(chart, 1), g)).toEqual({ strands: 1, ends: 2, carryCm: Math.hypot(1, 0.5) });
    const far = chartFromRows(["C.....C", "C......"], ["A", "C"]);
    // bottom-left, then top-right (6 across, 1 up: over the limit → cut), then top-left (3 cm: cut)
    expect(getNaiveRoute(getStitchSet(far, 1), getCarryGeometry(far.gauge, 2.5))).toMatchObject({ strands: 3, ends: 6 });
  });

  test("a chart with no stitch of the colour is a plan with no strands", () => {
    const plan = planDarning(chartFromRows(["AAB", "BAA"], ["A", "B", "C"]), { darn: ["C"] });
    expect(plan.colours[0]).toMatchObject({ stitches: 0, strands: [], ends: 0, carryCm: 0, yarnCm: 0, minutes: 0 });
    expect(plan.totals).toMatchObject({ stitches: 0, strands: 0, ends: 0, carryCm: 0, minutes: 0 });
  });
});

/** Random small charts of one darned colour 'C' on 'A'. */
const chartArb = fc
  .record({
    width: fc.integer({ min: 2, max: 14 }),
    height: fc.integer({ min: 1, max: 10 }),
    density: fc.double({ min: 0.05, max: 0.7, noNaN: true }),
    seed: fc.integer({ min: 1, max: 2 ** 31 - 1 }),
    gauge: fc.constantFrom(HALF_CM_GAUGE, { stitchesPer10cm: 28, rowsPer10cm: 32 }, { stitchesPer10cm: 14, rowsPer10cm: 20 }),
    limit: fc.constantFrom(0.8, 1.2, 2.5, 4),
  })
  .map(({ width, height, density, seed, gauge, limit }) => {
    let s = seed;
    const rows = Array.from({ length: height }, () =>
      Array.from({ length: width }, () => {
        s = (Math.imul(s, 1103515245) + 12345) >>> 0;
        return s / 2 ** 32 < density ? "C" : "A";
      }).join(""),
    );
    return { chart: chartFromRows(rows, ["A", "C"], gauge), limit };
  });

function stitchesOf(chart: Chart, colour: number): Spot[] {
  const out: Spot[] = [];
  for (let y = 0; y < chart.height; y++) for (let x = 0; x < chart.width; x++) if (chart.cells[y * chart.width + x] === colour) out.push({ x, y });
  return out;
}

describe("darning route properties", () => {
  test("every rule holds on random charts (plan output, trade numbering)", () => {
    fc.assert(
      fc.property(chartArb, ({ chart, limit }) => {
        const plan = planDarning(chart, { darn: ["C"], carryLimitCm: limit });
        const c = plan.colours[0];
        const g = { w: 10 / chart.gauge.stitchesPer10cm, h: 10 / chart.gauge.rowsPer10cm, limitCm: limit };
        const strands: CheckedStep[][] = c.strands.map((s) =>
          s.stitches.map((st) => ({ ...fromTrade(chart, st), carryCm: st.carryCm ?? 0, via: (st.via ?? []).map((v) => fromTrade(chart, v)) })),
        );
        // step carries are rounded to 0.01 cm in the plan
        const total = checkRoute(g, stitchesOf(chart, 1), strands, 0.006);
        expect(c.ends).toBe(2 * c.strands.length);
        expect(c.ends).toBe(c.lowerBound.ends);
        expect(c.carryCm).toBeGreaterThanOrEqual(c.lowerBound.carryCm);
        expect(Math.abs(total - c.carryCm)).toBeLessThan(0.06 + 0.006 * c.stitches);
        expect(c.stitches).toBe(stitchesOf(chart, 1).length);
      }),
      { numRuns: 150 },
    );
  });

  test("unrounded routes: carry is at least the spanning-tree bound, ends exactly the bound", () => {
    fc.assert(
      fc.property(chartArb, ({ chart, limit }) => {
        const g = getCarryGeometry(chart.gauge, limit);
        const set = getStitchSet(chart, 1);
        const route = routeStitchSet(set, g);
        const components = getStitchComponents(set, g);
        expect(route.strands).toHaveLength(components.count);
        expect(route.ends).toBe(2 * components.count);
        expect(route.carryCm).toBeGreaterThanOrEqual(getCarryBoundCm(set, g) - 1e-9);
        const geometry = { w: g.w, h: g.h, limitCm: limit };
        const strands: CheckedStep[][] = route.strands.map((s) =>
          Array.from(s.order, (id, k) => ({
            x: set.xs[id],
            y: set.ys[id],
            carryCm: s.carries[k],
            via: Array.from(s.vias.get(k) ?? [], (v) => ({ x: set.xs[v], y: set.ys[v] })),
          })),
        );
        expect(checkRoute(geometry, stitchesOf(chart, 1), strands)).toBeCloseTo(route.carryCm, 6);
      }),
      { numRuns: 150 },
    );
  });

  test("the same chart always gets the same route", () => {
    const chart = chartFromRows(["C.C..C.CC", ".C..C....", "C...C.C.C", "..C...C.."], ["A", "C"]);
    expect(planDarning(chart, { darn: ["C"] })).toEqual(planDarning(chart, { darn: ["C"] }));
  });
});
