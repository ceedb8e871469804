import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { solveNnls } from "@/lib/core/labour/nnls";

function gradient(a: number[][], b: number[], x: number[]): number[] {
  return x.map((_, j) => a.reduce((s, row, i) => s + row[j] * (b[i] - row.reduce((t, v, k) => t + v * x[k], 0)), 0));
}

describe("solveNnls (Lawson–Hanson)", () => {
  test("an exactly consistent system with a positive solution is solved exactly", () => {
    const a = [
      [1, 0, 2],
      [0, 1, 1],
      [1, 1, 0],
      [2, 1, 1],
    ];
    const truth = [3, 0.5, 2];
    const b = a.map((row) => row.reduce((s, v, j) => s + v * truth[j], 0));
    const r = solveNnls(a, b);
    r.x.forEach((v, j) => expect(v).toBeCloseTo(truth[j], 9));
    expect(r.residualNorm).toBeLessThan(1e-9);
  });

  test("a coefficient the unconstrained fit would make negative is held at zero", () => {
    // Worked by hand: unconstrained least squares gives x = (2, -1); with x ≥ 0 the best is
    // x₂ = 0 and x₁ = (Σ aᵢ₁ bᵢ) / (Σ aᵢ₁²) = (1·1 + 1·0 + 1·2) / 3 = 1.
    const a = [
      [1, 1],
      [1, 2],
      [1, 0],
    ];
    const b = [1, 0, 2];
    const r = solveNnls(a, b);
    expect(r.x[1]).toBe(0);
    expect(r.x[0]).toBeCloseTo(1, 9);
  });

  test("columns on very different scales (thousands of stitches, a handful of thumbs) are fitted", () => {
    const a = [
      [5000, 1],
      [3000, 0],
      [8000, 1],
      [1000, 0],
    ];
    const truth = [1 / 25, 20];
    const b = a.map((row) => row[0] * truth[0] + row[1] * truth[1]);
    const r = solveNnls(a, b);
    expect(r.x[0]).toBeCloseTo(truth[0], 9);
    expect(r.x[1]).toBeCloseTo(truth[1], 6);
  });

  test("an all-zero column gets a zero coefficient", () => {
    const r = solveNnls([[1, 0], [2, 0]], [2, 4]);
    expect(r.x[0]).toBeCloseTo(2, 12);
    expect(r.x[1]).toBe(0);
  });

  test("property: the result satisfies the Kuhn–Tucker conditions of NNLS", () => {
    const size = fc.integer({ min: 1, max: 5 });
    fc.assert(
      fc.property(
        size.chain((n) =>
          fc.tuple(
            fc.array(fc.array(fc.integer({ min: -20, max: 20 }), { minLength: n, maxLength: n }), { minLength: n + 1, maxLength: 12 }),
            fc.array(fc.integer({ min: -50, max: 50 }), { minLength: 12, maxLength: 12 }),
          ),
        ),
        ([a, bAll]) => {
          const b = bAll.slice(0, a.length);
          const { x } = solveNnls(a, b);
          const w = gradient(a, b, x);
          const scale = 1e-6 * (1 + Math.max(...b.map(Math.abs))) * (1 + Math.max(...a.flat().map(Math.abs))) ** 2;
          x.forEach((xj, j) => {
            expect(xj).toBeGreaterThanOrEqual(0);
            // At the optimum the gradient of ½‖b − Ax‖² is ≤ 0 where x is 0 and 0 where x > 0.
            if (xj > 1e-9) expect(Math.abs(w[j])).toBeLessThan(scale);
            else expect(w[j]).toBeLessThan(scale);
          });
        },
      ),
    );
  });
});
