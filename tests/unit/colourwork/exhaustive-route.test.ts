import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getCarryGeometry } from "@/lib/core/colourwork/carry-geometry";
import { routeStitchSet } from "@/lib/core/colourwork/route-colour";
import { createStitchSet } from "@/lib/core/colourwork/stitch-set";
import { bestOverAllOrders, checkRoute, type CheckedStep, type Spot } from "./route-checks";

const GAUGES = [
  { stitchesPer10cm: 20, rowsPer10cm: 20 },
  { stitchesPer10cm: 28, rowsPer10cm: 32 },
  { stitchesPer10cm: 12, rowsPer10cm: 16 },
];

/** Up to 9 distinct stitches in a 7 × 7 patch, a gauge and a carry limit. */
const caseArb = fc.record({
  points: fc.uniqueArray(fc.record({ x: fc.integer({ min: 0, max: 6 }), y: fc.integer({ min: 0, max: 6 }) }), {
    minLength: 1,
    maxLength: 9,
    selector: (p) => `${p.x},${p.y}`,
  }),
  gauge: fc.constantFrom(...GAUGES),
  limit: fc.constantFrom(0.6, 1.0, 1.5, 2.5),
});

function route(points: Spot[], gauge: (typeof GAUGES)[number], limit: number, exactUpTo?: number) {
  const g = getCarryGeometry(gauge, limit);
  const set = createStitchSet(7, 7, points);
  const r = routeStitchSet(set, g, exactUpTo === undefined ? {} : { exactUpTo });
  const strands: CheckedStep[][] = r.strands.map((s) =>
    Array.from(s.order, (id, k) => ({
      x: set.xs[id],
      y: set.ys[id],
      carryCm: s.carries[k],
      via: Array.from(s.vias.get(k) ?? [], (v) => ({ x: set.xs[v], y: set.ys[v] })),
    })),
  );
  checkRoute({ w: g.w, h: g.h, limitCm: limit }, points, strands);
  return r;
}

describe("exhaustive search over every order (up to 9 stitches)", () => {
  test("the planner's route is optimal: same ends, same carry", () => {
    const denseArb = fc.record({
      points: fc.uniqueArray(fc.record({ x: fc.integer({ min: 0, max: 4 }), y: fc.integer({ min: 0, max: 4 }) }), {
        minLength: 7,
        maxLength: 9,
        selector: (p) => `${p.x},${p.y}`,
      }),
      gauge: fc.constantFrom(...GAUGES),
      limit: fc.constantFrom(0.6, 1.0, 1.5),
    });
    fc.assert(
      fc.property(fc.oneof(caseArb, denseArb), ({ points, gauge, limit }) => {
        const best = bestOverAllOrders({ w: 10 / gauge.stitchesPer10cm, h: 10 / gauge.rowsPer10cm, limitCm: limit }, points);
        const r = route(points, gauge, limit);
        expect(r.ends).toBe(best.ends);
        expect(r.carryCm).toBeCloseTo(best.carryCm, 9);
      }),
      { numRuns: 160, seed: 20240611 },
    );
  });

  test("hand case with a carry through worked stitches: the oracle and the planner agree on 5.0 cm", () => {
    // Limit 1.0 cm at 0.5 cm stitches (2 stitches): (0,0) (2,0) (4,0) (6,0) in a row and (2,2)
    // above the second. Only 1.0 cm links exist: a star around (2,0) with arms to (0,0), (2,2) and
    // (4,0)–(6,0). No order walks it without going back along one 1.0 cm arm through (2,0), e.g.
    // (0,0), (2,0), (2,2), then 2.0 cm via (2,0) to (4,0), (6,0): 1 + 1 + 2 + 1 = 5.0 cm.
    const points = [
      { x: 0, y: 0 },
      { x: 2, y: 0 },
      { x: 4, y: 0 },
      { x: 6, y: 0 },
      { x: 2, y: 2 },
    ];
    const best = bestOverAllOrders({ w: 0.5, h: 0.5, limitCm: 1.0 }, points);
    expect(best).toEqual({ ends: 2, carryCm: 5 });
    const r = route(points, GAUGES[0], 1.0);
    expect(r.ends).toBe(2);
    expect(r.carryCm).toBeCloseTo(5, 9);
    expect(r.strands[0].vias.size).toBe(1);
  });

  test("without the exact step, walk and local search alone stay valid and reach the optimum on ≥ 95 of 100 dense cases", () => {
    // Nine stitches packed in a 5 × 5 patch, 1.0 cm limit: many touch, some must be carried back to.
    // Measured when written: 99 of 100 optimal, 0.3 % over in total; the exact step covers the rest.
    const dense = fc.uniqueArray(fc.record({ x: fc.integer({ min: 0, max: 4 }), y: fc.integer({ min: 0, max: 4 }) }), {
      minLength: 9,
      maxLength: 9,
      selector: (p) => `${p.x},${p.y}`,
    });
    let matched = 0;
    fc.assert(
      fc.property(dense, (points) => {
        const best = bestOverAllOrders({ w: 0.5, h: 0.5, limitCm: 1.0 }, points);
        const r = route(points, GAUGES[0], 1.0, 0);
        expect(r.ends).toBe(best.ends);
        expect(r.carryCm).toBeGreaterThanOrEqual(best.carryCm - 1e-9);
        if (r.carryCm <= best.carryCm + 1e-9) matched++;
      }),
      { numRuns: 100, seed: 3 },
    );
    expect(matched).toBeGreaterThanOrEqual(95);
  });
});
