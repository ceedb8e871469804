import { describe, expect, test } from "vitest";
import { EASE_CATEGORIES, getEaseCategory } from "@/lib/core/sizing/ease";
import { BODY_SIZES, HEAD_SIZES, MITTEN_SIZES, STANDARD_SIZES, getStandardMeasurements, middleCm } from "@/lib/core/sizing/standard-sizes";
import { CM_PER_IN, inToCm } from "@/lib/core/sizing/units";

describe("ease categories", () => {
  // Craft Yarn Council, Standards & Guidelines, body measurements and ease (TRADE-REFERENCES.md; wording from memory)
  test.each([
    { key: "very-close", cm: [null, 0], inches: [null, 0] },
    { key: "close", cm: [2.5, 5], inches: [1, 2] },
    { key: "standard", cm: [5, 10], inches: [2, 4] },
    { key: "loose", cm: [10, 15], inches: [4, 6] },
    { key: "oversized", cm: [15, null], inches: [6, null] },
  ] as const)("$key: $cm cm, $inches in", ({ key, cm, inches }) => {
    const c = getEaseCategory(key);
    expect([c.rangeCm.min, c.rangeCm.max]).toEqual(cm);
    expect([c.rangeIn.min, c.rangeIn.max]).toEqual(inches);
    // the default lies in the range
    if (c.rangeCm.min !== null) expect(c.defaultCm).toBeGreaterThanOrEqual(c.rangeCm.min);
    if (c.rangeCm.max !== null) expect(c.defaultCm).toBeLessThanOrEqual(c.rangeCm.max);
  });

  test("the table carries its source", () => {
    expect(EASE_CATEGORIES.source).toMatch(/Craft Yarn Council/);
  });
});

describe("standard sizes", () => {
  test("every table names a source", () => {
    for (const t of Object.values(STANDARD_SIZES)) expect(t.source.length).toBeGreaterThan(10);
  });

  // Women's bust (CYC, in): XS 28–30 … 5X 60–62; the same ranges in cm in published pattern-book
  // specifications: 71–76, 81–86, 91–97, 102–107, 112–117, 122–127, 132–137, 142–147, 152–157.
  test.each([
    ["women-XS", 28, 30, 71, 76],
    ["women-S", 32, 34, 81, 86],
    ["women-M", 36, 38, 91, 97],
    ["women-L", 40, 42, 102, 107],
    ["women-1X", 44, 46, 112, 117],
    ["women-2X", 48, 50, 122, 127],
    ["women-3X", 52, 54, 132, 137],
    ["women-4X", 56, 58, 142, 147],
    ["women-5X", 60, 62, 152, 157],
  ])("%s: %d–%d in, published as %d–%d cm", (key, minIn, maxIn, minCm, maxCm) => {
    const s = BODY_SIZES.sizes.find((x) => x.key === key);
    expect(s?.chestIn).toEqual({ min: minIn, max: maxIn });
    // the published cm figures are the inch ranges converted exactly, rounded to the whole cm
    expect(Math.round(minIn * CM_PER_IN)).toBe(minCm);
    expect(Math.round(maxIn * CM_PER_IN)).toBe(maxCm);
  });

  // Men's chest (CYC, in; memory): S 34–36, M 38–40, L 42–44, XL 46–48, 2XL 50–52
  test.each([
    ["men-S", 34, 36],
    ["men-M", 38, 40],
    ["men-L", 42, 44],
    ["men-XL", 46, 48],
    ["men-2XL", 50, 52],
  ])("%s: %d–%d in", (key, min, max) => {
    expect(BODY_SIZES.sizes.find((x) => x.key === key)?.chestIn).toEqual({ min, max });
  });

  // Mitten sizes by knuckle circumference, thumb excluded (designers following CYC): man 7.5–9 in,
  // woman 6–7.5, child 5.5–6, toddler 4–5.5, baby 3–4.
  test.each([
    ["man", 7.5, 9],
    ["woman", 6, 7.5],
    ["child", 5.5, 6],
    ["toddler", 4, 5.5],
    ["baby", 3, 4],
  ])("mitten %s: %d–%d in around the knuckles", (key, min, max) => {
    expect(MITTEN_SIZES.sizes.find((x) => x.key === key)?.knuckleIn).toEqual({ min, max });
  });

  test("adult hand lengths are the NASA anthropometric averages (men 7.6 in, women 6.8 in)", () => {
    expect(MITTEN_SIZES.sizes.find((x) => x.key === "man")?.handLengthIn).toBe(7.6);
    expect(MITTEN_SIZES.sizes.find((x) => x.key === "woman")?.handLengthIn).toBe(6.8);
  });

  // Typical Head Sizes table (knittingfiend hat pages): woman 21–23.5 in, man 22–24.5 in, child 19–20.5 in
  test.each([
    ["woman", 21, 23.5],
    ["man", 22, 24.5],
    ["child", 19, 20.5],
  ])("head %s: %d–%d in", (key, min, max) => {
    expect(HEAD_SIZES.sizes.find((x) => x.key === key)?.headIn).toEqual({ min, max });
  });

  test("a standard size stands for the middle of its range, converted exactly", () => {
    // women's M 36–38 in → 37 in = 93.98 cm → 94.0 cm
    expect(getStandardMeasurements("pullover", "women-M")?.chestCm).toBe(94);
    expect(middleCm({ min: 21, max: 23.5 })).toBe(inToCm(22.25));
    expect(getStandardMeasurements("hat", "nobody")).toBeNull();
  });
});
