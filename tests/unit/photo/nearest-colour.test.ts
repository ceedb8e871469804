// The batched CIEDE2000 gives the project's getCiede2000 values (Sharma, Wu, Dalal 2005).
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getCiede2000 } from "@/lib/core/colourwork/ciede2000";
import { ciede2000, nearestByCiede2000 } from "@/lib/core/photo/nearest-colour";

const labArb = fc.record({
  L: fc.double({ min: 0, max: 100, noNaN: true }),
  a: fc.double({ min: -128, max: 128, noNaN: true }),
  b: fc.double({ min: -128, max: 128, noNaN: true }),
});

describe("batched CIEDE2000", () => {
  test("equals getCiede2000 on any pair", () => {
    fc.assert(
      fc.property(labArb, labArb, (x, y) => {
        const fast = ciede2000(x.L, x.a, x.b, Math.hypot(x.a, x.b), y.L, y.a, y.b, Math.hypot(y.a, y.b));
        expect(fast).toBeCloseTo(getCiede2000(x, y), 9);
      }),
      { numRuns: 2000, seed: 2005 },
    );
  });

  test("Sharma et al. 2005, Table 1, pairs 1, 7 and 17", () => {
    const pairs: [number[], number[], number][] = [
      [[50, 2.6772, -79.7751], [50, 0, -82.7485], 2.0425],
      [[50, 0, 0], [50, -1, 2], 2.3669],
      [[50, 2.5, 0], [73, 25, -18], 27.1492],
    ];
    for (const [p, q, expected] of pairs) {
      expect(ciede2000(p[0], p[1], p[2], Math.hypot(p[1], p[2]), q[0], q[1], q[2], Math.hypot(q[1], q[2]))).toBeCloseTo(expected, 4);
    }
  });

  test("nearest target per stitch", () => {
    const labs = Float64Array.from([50, 0, 0, 90, 0, 0, 20, 40, 20]);
    const out = nearestByCiede2000(labs, [{ L: 95, a: 0, b: 0 }, { L: 45, a: 0, b: 0 }, { L: 25, a: 45, b: 25 }]);
    expect(Array.from(out.labels)).toEqual([1, 0, 2]);
  });
});
