import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getSkeinNeed, METRES_PER_YARD } from "@/lib/core/yarn/skeins";

const WOOL = { key: "A", name: "Cream wool", metresPerSkein: 175, gramsPerSkein: 50 };

describe("skeins", () => {
  test.each([
    { cm: 35000, skeins: 2, grams: 100, why: "exactly two skeins' worth is two skeins" },
    { cm: 35001, skeins: 3, grams: 101, why: "a centimetre more needs a third" },
    { cm: 100, skeins: 1, grams: 1, why: "any yarn at all needs a skein" },
    { cm: 0, skeins: 0, grams: 0, why: "none needs none" },
  ])("$cm cm → $skeins skeins, $grams g ($why)", ({ cm, skeins, grams }) => {
    expect(getSkeinNeed(cm, WOOL)).toMatchObject({ skeins, grams, note: null });
  });

  test("more skeins than the one dye lot in stock: a note about a second lot", () => {
    const need = getSkeinNeed(60000, { ...WOOL, stockSkeins: 3 });
    expect(need.skeins).toBe(4);
    expect(need.secondDyeLot).toBe(true);
    expect(need.shortBy).toBe(1);
    expect(need.note).toMatch(/needs 4 skeins of Cream wool; 3 in stock: order 1 more.*second dye lot/);
  });

  test("enough in stock, but no single lot large enough", () => {
    const need = getSkeinNeed(60000, { ...WOOL, lots: [{ lot: "L12", skeins: 2 }, { lot: "L15", skeins: 3 }] });
    expect(need.shortBy).toBe(0);
    expect(need.note).toMatch(/largest dye lot in stock \(L15\) has 3: a second dye lot is needed/);
  });

  test("one lot covers it: no note", () => {
    expect(getSkeinNeed(60000, { ...WOOL, lots: [{ lot: "L15", skeins: 5 }] }).note).toBeNull();
  });

  test("the yard is 0.9144 m exactly (international yard)", () => {
    expect(METRES_PER_YARD).toBe(0.9144);
  });

  test("skeins always hold the length asked for, and at most one skein more", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500000 }), fc.double({ min: 20, max: 1000, noNaN: true }), (cm, metres) => {
        const n = getSkeinNeed(cm, { ...WOOL, metresPerSkein: metres }).skeins;
        expect(n * metres * 100).toBeGreaterThanOrEqual(cm - 1e-6);
        expect((n - 1) * metres * 100).toBeLessThan(cm);
      }),
    );
  });
});
