import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { createChart, type Chart } from "@/lib/core/chart/model";
import { describeDiff, diffChart, diffProofCharts } from "@/lib/core/proofs";

const gauge = { stitchesPer10cm: 30, rowsPer10cm: 34 };
const palette = [
  { key: "A", name: "Oat", hex: "#EFE6D2" },
  { key: "B", name: "Rowan red", hex: "#9E2B25" },
  { key: "C", name: "Gorse", hex: "#E0B33A" },
];
const chart = (w: number, h: number, paint: [number, number, number][] = [], pal = palette): Chart => {
  const c = createChart(w, h, gauge, pal);
  for (const [x, y, v] of paint) c.cells[y * w + x] = v;
  return c;
};

describe("diffChart", () => {
  test("counts changed stitches in trade numbering and names added and removed colours", () => {
    const before = chart(10, 4, [[0, 0, 1]]);
    const after = chart(10, 4, [[9, 0, 2], [9, 3, 2]]);
    const d = diffChart(before, after);
    expect(d.cellsChanged).toBe(3);
    // x 9 is stitch 1 (from the right), y 0 is row 1 (from the bottom)
    expect(d.sample).toContainEqual({ row: 1, stitch: 1 });
    expect(d.sample).toContainEqual({ row: 4, stitch: 1 });
    expect(d.sample).toContainEqual({ row: 1, stitch: 10 });
    expect(d.coloursAdded).toEqual(["Gorse"]);
    expect(d.coloursRemoved).toEqual(["Rowan red"]);
    expect(d.sizeChanged).toBe(false);
  });

  test("a reordered palette with the same colours is no change", () => {
    const before = chart(3, 1, [[1, 0, 1]]);
    const swapped = [palette[1], palette[0], palette[2]];
    const after = chart(3, 1, [[0, 0, 1], [2, 0, 1]], swapped);
    const d = diffChart(before, after);
    expect(d.cellsChanged).toBe(0);
    expect(d.coloursAdded).toEqual([]);
  });

  test("a wider chart counts the new stitches as changed", () => {
    const d = diffChart(chart(4, 2), chart(5, 2));
    expect(d.sizeChanged).toBe(true);
    expect(d.cellsChanged).toBe(2);
    expect(d.sample.every((p) => p.stitch === 5)).toBe(true);
  });

  test("property: a chart against itself has no change; the count is symmetric", () => {
    const arb = fc.record({ w: fc.integer({ min: 1, max: 12 }), h: fc.integer({ min: 1, max: 8 }), seed: fc.array(fc.integer({ min: 0, max: 2 }), { minLength: 96, maxLength: 96 }) });
    fc.assert(
      fc.property(arb, arb, (a, b) => {
        const ca = chart(a.w, a.h);
        ca.cells.set(a.seed.slice(0, a.w * a.h));
        const cb = chart(b.w, b.h);
        cb.cells.set(b.seed.slice(0, b.w * b.h));
        expect(diffChart(ca, ca).cellsChanged).toBe(0);
        expect(diffChart(ca, cb).cellsChanged).toBe(diffChart(cb, ca).cellsChanged);
      }),
    );
  });
});

describe("diffProofCharts", () => {
  test("matches by area and reports added, removed, changed and same", () => {
    const a = chart(4, 2);
    const b = chart(4, 2, [[0, 0, 1]]);
    const out = diffProofCharts(
      [
        { area: "left", label: "Left mitten", chart: a },
        { area: "right", label: "Right mitten", chart: a },
        { area: "old", label: "Thumb", chart: a },
      ],
      [
        { area: "left", label: "Left mitten", chart: b },
        { area: "right", label: "Right mitten", chart: a },
        { area: "band", label: "Cuff band", chart: a },
      ],
    );
    expect(out.map((d) => [d.area, d.status])).toEqual([
      ["left", "changed"],
      ["right", "same"],
      ["band", "added"],
      ["old", "removed"],
    ]);
    expect(describeDiff(out[0])).toBe("Left mitten: 1 stitch changed; colours added: Rowan red.");
    expect(describeDiff(out[1])).toBe("Right mitten: no change.");
  });
});
