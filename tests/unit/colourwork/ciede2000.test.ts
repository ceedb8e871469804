import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getCiede2000, getColourDifference, hexToLab } from "@/lib/core/colourwork/ciede2000";

// G. Sharma, W. Wu, E. N. Dalal, "The CIEDE2000 color-difference formula: implementation notes,
// supplementary test data, and mathematical observations", Color Res. Appl. 30(1), 2005, Table 1:
// L1, a1, b1, L2, a2, b2, ΔE00 (published to 4 decimals).
const SHARMA_2005_TABLE_1: [number, number, number, number, number, number, number][] = [
  [50.0, 2.6772, -79.7751, 50.0, 0.0, -82.7485, 2.0425],
  [50.0, 3.1571, -77.2803, 50.0, 0.0, -82.7485, 2.8615],
  [50.0, 2.8361, -74.02, 50.0, 0.0, -82.7485, 3.4412],
  [50.0, -1.3802, -84.2814, 50.0, 0.0, -82.7485, 1.0],
  [50.0, -1.1848, -84.8006, 50.0, 0.0, -82.7485, 1.0],
  [50.0, -0.9009, -85.5211, 50.0, 0.0, -82.7485, 1.0],
  [50.0, 0.0, 0.0, 50.0, -1.0, 2.0, 2.3669],
  [50.0, -1.0, 2.0, 50.0, 0.0, 0.0, 2.3669],
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.0009, 7.1792],
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.001, 7.1792],
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.0011, 7.2195],
  [50.0, 2.49, -0.001, 50.0, -2.49, 0.0012, 7.2195],
  [50.0, -0.001, 2.49, 50.0, 0.0009, -2.49, 4.8045],
  [50.0, -0.001, 2.49, 50.0, 0.001, -2.49, 4.8045],
  [50.0, -0.001, 2.49, 50.0, 0.0011, -2.49, 4.7461],
  [50.0, 2.5, 0.0, 50.0, 0.0, -2.5, 4.3065],
  [50.0, 2.5, 0.0, 73.0, 25.0, -18.0, 27.1492],
  [50.0, 2.5, 0.0, 61.0, -5.0, 29.0, 22.8977],
  [50.0, 2.5, 0.0, 56.0, -27.0, -3.0, 31.903],
  [50.0, 2.5, 0.0, 58.0, 24.0, 15.0, 19.4535],
  [50.0, 2.5, 0.0, 50.0, 3.1736, 0.5854, 1.0],
  [50.0, 2.5, 0.0, 50.0, 3.2972, 0.0, 1.0],
  [50.0, 2.5, 0.0, 50.0, 1.8634, 0.5757, 1.0],
  [50.0, 2.5, 0.0, 50.0, 3.2592, 0.335, 1.0],
  [60.2574, -34.0099, 36.2677, 60.4626, -34.1751, 39.4387, 1.2644],
  [63.0109, -31.0961, -5.8663, 62.8187, -29.7946, -4.0864, 1.263],
  [61.2901, 3.7196, -5.3901, 61.4292, 2.248, -4.962, 1.8731],
  [35.0831, -44.1164, 3.7933, 35.0232, -40.0716, 1.5901, 1.8645],
  [22.7233, 20.0904, -46.694, 23.0331, 14.973, -42.5619, 2.0373],
  [36.4612, 47.858, 18.3852, 36.2715, 50.5065, 21.2231, 1.4146],
  [90.8027, -2.0831, 1.441, 91.1528, -1.6435, 0.0447, 1.4441],
  [90.9257, -0.5406, -0.9208, 88.6381, -0.8985, -0.7239, 1.5381],
  [6.7747, -0.2908, -2.4247, 5.8714, -0.0985, -2.2286, 0.6377],
  [2.0776, 0.0795, -1.135, 0.9033, -0.0636, -0.5514, 0.9082],
];

describe("getCiede2000", () => {
  test.each(SHARMA_2005_TABLE_1.map((r, i) => [i + 1, ...r]))(
    "Sharma, Wu & Dalal (2005) Table 1 pair %i",
    (_pair, L1, a1, b1, L2, a2, b2, expected) => {
      // The table is rounded to 4 decimals, so agreement to 5e-5 is exact agreement.
      expect(Math.abs(getCiede2000({ L: L1, a: a1, b: b1 }, { L: L2, a: a2, b: b2 }) - expected)).toBeLessThanOrEqual(5e-5);
    },
  );

  test("is symmetric, zero for equal colours and positive otherwise", () => {
    const lab = fc.record({ L: fc.double({ min: 0, max: 100, noNaN: true }), a: fc.double({ min: -100, max: 100, noNaN: true }), b: fc.double({ min: -100, max: 100, noNaN: true }) });
    fc.assert(
      fc.property(lab, lab, (x, y) => {
        const d = getCiede2000(x, y);
        expect(Math.abs(d - getCiede2000(y, x))).toBeLessThan(1e-9);
        expect(getCiede2000(x, x)).toBe(0);
        expect(d).toBeGreaterThanOrEqual(0);
        if (Math.abs(x.L - y.L) + Math.abs(x.a - y.a) + Math.abs(x.b - y.b) > 1e-6) expect(d).toBeGreaterThan(0);
      }),
    );
  });
});

describe("hexToLab", () => {
  test.each([
    // sRGB white and black under D65 are L* 100 and 0 with a* = b* = 0 (definition of CIELAB's white point).
    ["#FFFFFF", 100, 0, 0],
    ["#000000", 0, 0, 0],
    // #777777 by hand: 119/255 → linear 0.1845 (sRGB curve) → Y 0.1845 → L* = 116·Y^(1/3) − 16 ≈ 50.03.
    ["#777777", 50.03, 0, 0],
  ])("%s", (hex, L, a, b) => {
    const lab = hexToLab(hex);
    expect(lab.L).toBeCloseTo(L, 1);
    expect(lab.a).toBeCloseTo(a, 1);
    expect(lab.b).toBeCloseTo(b, 1);
  });

  test("rejects text that is not #RRGGBB", () => {
    expect(() => hexToLab("navy")).toThrow(/#RRGGBB/);
  });

  test("black and white are ΔE00 100 apart (only L* differs, and S_L = 1 at mean L* 50)", () => {
    expect(getColourDifference("#000000", "#FFFFFF")).toBeCloseTo(100, 4);
  });
});
