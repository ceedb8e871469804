import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { fromTrade, type Chart } from "@/lib/core/chart/model";
import { getCarryGeometry } from "@/lib/core/colourwork/carry-geometry";
import { getCarryBoundCm, getStitchComponents } from "@/lib/core/colourwork/darning-bounds";
import { planDarning } from "@/lib/core/colourwork/darning-plan";
import { routeStitchSet } from "@/lib/core/colourwork/route-colour";
import { getStitchSet } from "@/lib/core/colourwork/stitch-set";
import { chartFromRows, HALF_CM_GAUGE } from "./chart-from-rows";
import { bestOverAllOrders, checkRoute, type CheckedStep, type Spot } from "./route-checks";

// Gauge 20 × 20 per 10 cm: stitches and rows 0.5 cm; carry limit 2.5 cm (5 stitches).
describe("darning route in the round: the start of the round is no edge", () => {
  // A 3 × 2 motif split by the start of the round: two stitches at the left edge, one at the right.
  const rows = ["CC........C", "CC........C"];
  const chart = chartFromRows(rows, ["A", "C"]);

  test("flat, the two halves are 9 stitches (4.5 cm) apart: two strands, 4 ends", () => {
    const plan = planDarning(chart, { darn: ["C"] });
    expect(plan.colours[0].ends).toBe(4);
    expect(plan.settings.routeInTheRound).toBe(false);
  });

  test("in the round the last stitch touches the first: one strand, 2 ends, nothing carried", () => {
    const plan = planDarning(chart, { darn: ["C"], routeInTheRound: true });
    const c = plan.colours[0];
    expect(c.ends).toBe(2);
    expect(c.strands).toHaveLength(1);
    expect(c.carryCm).toBe(0);
    expect(c.lowerBound).toEqual({ ends: 2, carryCm: 0 });
    // 6 stitches × 30 s + 2 ends × 3 min = 9 min (against 12 min flat)
    expect(c.minutes).toBe(9);
    // the row-by-row baseline also steps across the start of the round
    expect(c.naive.ends).toBe(2);
  });

  test("a carry across the start of the round goes the short way: 1.5 cm, not 4 cm", () => {
    // stitches at the left edge and 2 from the right edge of an 11-stitch round (3 stitches apart across the start)
    const plan = planDarning(chartFromRows(["C.......C.."], ["A", "C"]), { darn: ["C"], routeInTheRound: true });
    expect(plan.colours[0]).toMatchObject({ ends: 2, carryCm: 1.5 });
  });
});

const chartArb = fc
  .record({
    width: fc.integer({ min: 3, max: 14 }),
    height: fc.integer({ min: 1, max: 8 }),
    density: fc.double({ min: 0.05, max: 0.6, noNaN: true }),
    seed: fc.integer({ min: 1, max: 2 ** 31 - 1 }),
    shift: fc.integer({ min: 1, max: 13 }),
    limit: fc.constantFrom(0.8, 1.2, 2.5),
  })
  .map(({ width, height, density, seed, shift, limit }) => {
    let s = seed;
    const grid = Array.from({ length: height }, () =>
      Array.from({ length: width }, () => {
        s = (Math.imul(s, 1103515245) + 12345) >>> 0;
        return s / 2 ** 32 < density ? "C" : "A";
      }),
    );
    const rows = grid.map((r) => r.join(""));
    const turned = grid.map((r) => r.map((_, x) => r[(x + shift) % width]).join(""));
    return { chart: chartFromRows(rows, ["A", "C"]), turned: chartFromRows(turned, ["A", "C"]), limit };
  });

function stitchesOf(chart: Chart): Spot[] {
  const out: Spot[] = [];
  for (let y = 0; y < chart.height; y++) for (let x = 0; x < chart.width; x++) if (chart.cells[y * chart.width + x] === 1) out.push({ x, y });
  return out;
}

describe("darning route in the round: properties", () => {
  test("every rule holds with the round closed, and ends never exceed the flat route's", () => {
    fc.assert(
      fc.property(chartArb, ({ chart, limit }) => {
        const round = planDarning(chart, { darn: ["C"], carryLimitCm: limit, routeInTheRound: true }).colours[0];
        const flat = planDarning(chart, { darn: ["C"], carryLimitCm: limit }).colours[0];
        const g = { w: 0.5, h: 0.5, limitCm: limit, wrapWidth: chart.width };
        const strands: CheckedStep[][] = round.strands.map((s) =>
          s.stitches.map((st) => ({ ...fromTrade(chart, st), carryCm: st.carryCm ?? 0, via: (st.via ?? []).map((v) => fromTrade(chart, v)) })),
        );
        checkRoute(g, stitchesOf(chart), strands, 0.006);
        expect(round.ends).toBe(round.lowerBound.ends);
        expect(round.ends).toBeLessThanOrEqual(flat.ends);
        expect(round.carryCm).toBeGreaterThanOrEqual(round.lowerBound.carryCm);
      }),
      { numRuns: 150 },
    );
  });

  test("where the round starts does not matter: turning every row alike keeps the ends and the bounds", () => {
    fc.assert(
      fc.property(chartArb, ({ chart, turned, limit }) => {
        const g = getCarryGeometry(HALF_CM_GAUGE, limit);
        const a = getStitchSet(chart, 1, true);
        const b = getStitchSet(turned, 1, true);
        expect(getStitchComponents(b, g).count).toBe(getStitchComponents(a, g).count);
        expect(getCarryBoundCm(b, g)).toBeCloseTo(getCarryBoundCm(a, g), 9);
        expect(routeStitchSet(b, g).ends).toBe(routeStitchSet(a, g).ends);
      }),
      { numRuns: 150 },
    );
  });

  test("small sets: the route in the round is as good as the best over every order", () => {
    fc.assert(
      fc.property(chartArb, ({ chart, limit }) => {
        const pts = stitchesOf(chart);
        if (pts.length > 8) return;
        const g = getCarryGeometry(HALF_CM_GAUGE, limit);
        const route = routeStitchSet(getStitchSet(chart, 1, true), g);
        const best = bestOverAllOrders({ w: 0.5, h: 0.5, limitCm: limit, wrapWidth: chart.width }, pts);
        expect(route.ends).toBe(best.ends);
        expect(route.carryCm).toBeCloseTo(best.carryCm, 6);
      }),
      { numRuns: 150 },
    );
  });
});
