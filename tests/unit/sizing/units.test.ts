import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { cmToIn, formatCm, formatIn, inToCm, roundTo } from "@/lib/core/sizing/units";

describe("unit conversions", () => {
  // 1 in = 25.4 mm exactly (international yard and pound agreement, 1959).
  test.each([
    { inches: 1, cm: 2.5 }, // 2.54 kept to the mm
    { inches: 22, cm: 55.9 }, // 55.88
    { inches: 4, cm: 10.2 }, // 10.16
    { inches: 37, cm: 94 }, // 93.98
    { inches: 0.5, cm: 1.3 }, // 1.27
  ])("$inches in = $cm cm to the mm", ({ inches, cm }) => {
    expect(inToCm(inches)).toBe(cm);
  });

  test.each([
    { cm: 2.54, inches: 1 },
    { cm: 56, inches: 22.05 },
    { cm: 10, inches: 3.94 },
  ])("$cm cm = $inches in to 0.01 in", ({ cm, inches }) => {
    expect(cmToIn(cm)).toBe(inches);
  });

  test("cm → in → cm returns within 1 mm", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 500, noNaN: true }), (cm) => {
        expect(Math.abs(inToCm(cmToIn(cm)) - cm)).toBeLessThanOrEqual(0.1 + 1e-9);
      }),
    );
  });

  test("in → cm → in returns within 1 mm", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 200, noNaN: true }), (inches) => {
        expect(Math.abs(cmToIn(inToCm(inches)) - inches) * 25.4).toBeLessThanOrEqual(1);
      }),
    );
  });

  test("roundTo goes half away from zero and leaves clean decimals", () => {
    expect(roundTo(55.88, 0.1)).toBe(55.9);
    expect(roundTo(0.25, 0.5)).toBe(0.5);
    expect(roundTo(-0.04, 0.1)).toBe(0);
    expect(roundTo(105.6, 0.1)).toBe(105.6);
  });

  test.each([
    { cm: 6.35, text: "2½ in" },
    { cm: 0.6, text: "¼ in" },
    { cm: 50.8, text: "20 in" },
    { cm: 7, text: "2¾ in" },
  ])("recipe inches: $cm cm → $text", ({ cm, text }) => {
    expect(formatIn(cm)).toBe(text);
  });

  test.each([
    { cm: 6.6, text: "6.5 cm" },
    { cm: 6.8, text: "7 cm" },
  ])("recipe cm: $cm → $text", ({ cm, text }) => {
    expect(formatCm(cm)).toBe(text);
  });
});
