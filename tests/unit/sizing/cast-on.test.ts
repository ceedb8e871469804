import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getCastOn, getRows, nearestEven, nearestMultiple } from "@/lib/core/sizing/cast-on";
import { resolveGauge } from "@/lib/core/sizing/gauge";
import { CM_PER_IN } from "@/lib/core/sizing/units";

describe("worked cast-on examples", () => {
  // Each row is a published tutorial example (TRADE-REFERENCES.md, "Worked examples for cast-on tests").
  test.each([
    // 48 cm × 22 sts / 10 cm = 105.6 → 106 sts
    { name: "48 cm at 22 sts/10 cm", targetCm: 48, gauge: { stitchesPer10cm: 22 }, repeat: 1, expected: 106 },
    // 21 in × 4.5 sts/in = 94.5; × 0.9 negative ease = 85.05; to a multiple of 6 → 84
    { name: "21 in at 4.5 sts/in, 10 % negative ease, repeat 6", targetCm: 21 * CM_PER_IN * 0.9, gauge: { stitchesPerIn: 4.5 }, repeat: 6, expected: 84 },
    // 32 sts over 14 cm = 2.2857 sts/cm; 58 cm × that = 132.6 → 133 sts
    { name: "58 cm at 32 sts over 14 cm", targetCm: 58, gauge: { stitches: 32, overCm: 14 }, repeat: 1, expected: 133 },
  ])("$name → $expected", ({ targetCm, gauge, repeat, expected }) => {
    const g = resolveGauge(gauge).gauge;
    expect(getCastOn(targetCm, g.stitchesPer10cm / 10, repeat)).toBe(expected);
  });
});

describe("rounding rules", () => {
  test.each([
    { raw: 87, repeat: 6, expected: 90, why: "87 is halfway between 84 and 90: a tie goes up" },
    { raw: 86.9, repeat: 6, expected: 84, why: "just under halfway goes down" },
    { raw: 100.5, repeat: 1, expected: 101, why: "a half stitch goes up" },
    { raw: 14.5, repeat: 1, expected: 15, why: "tie up despite binary fractions (1.45 × 10)" },
  ])("$raw sts, repeat $repeat → $expected ($why)", ({ raw, repeat, expected }) => {
    expect(getCastOn(raw / 10, 10, repeat)).toBe(expected);
  });

  test("a repeat wider than the piece is refused with the piece's width in stitches", () => {
    expect(() => getCastOn(20, 2, 48, "repeat", "hand")).toThrow(/repeat of 48 stitches is wider than the hand \(40 stitches/);
  });

  test.each([
    { cm: 5, perCm: 3, rows: 15 },
    { cm: 5.5, perCm: 3, rows: 17 }, // 16.5 → 17, a tie goes up
    { cm: 0, perCm: 3, rows: 0 },
  ])("rows for $cm cm at $perCm rows/cm = $rows", ({ cm, perCm, rows }) => {
    expect(getRows(cm, perCm)).toBe(rows);
  });

  test("nearest even and multiple", () => {
    expect(nearestEven(21)).toBe(22);
    expect(nearestEven(20.9)).toBe(20);
    expect(nearestMultiple(50, 8)).toBe(48);
    expect(nearestMultiple(52, 8)).toBe(56);
  });
});

describe("cast-on properties", () => {
  const arb = fc.record({
    bodyCm: fc.double({ min: 10, max: 150, noNaN: true }),
    perCm: fc.double({ min: 1, max: 4, noNaN: true }),
    repeat: fc.integer({ min: 1, max: 24 }),
    ease: fc.double({ min: -5, max: 20, noNaN: true }),
    more: fc.double({ min: 0, max: 20, noNaN: true }),
  });

  test("the cast-on is always a whole multiple of the repeat, within half a repeat of the target", () => {
    fc.assert(
      fc.property(arb, ({ bodyCm, perCm, repeat, ease }) => {
        const raw = (bodyCm + ease) * perCm;
        fc.pre(raw >= repeat);
        const n = getCastOn(bodyCm + ease, perCm, repeat);
        expect(n % repeat).toBe(0);
        expect(Math.abs(n - raw)).toBeLessThanOrEqual(repeat / 2 + 1e-6);
      }),
    );
  });

  test("more ease never gives fewer stitches", () => {
    fc.assert(
      fc.property(arb, ({ bodyCm, perCm, repeat, ease, more }) => {
        fc.pre((bodyCm + ease) * perCm >= repeat);
        expect(getCastOn(bodyCm + ease + more, perCm, repeat)).toBeGreaterThanOrEqual(getCastOn(bodyCm + ease, perCm, repeat));
      }),
    );
  });
});
