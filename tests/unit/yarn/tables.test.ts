import { describe, expect, test } from "vitest";
import { getLoopLengthCm, MUNDEN_KC, MUNDEN_KW } from "@/lib/core/yarn/loop-length";
import { getNeedleMmFromUs, getNeedleSize, NO_EQUIVALENT } from "@/lib/core/yarn/needle-sizes";
import { checkGauge, getTypicalStitchesPer10cm, getYarnWeight, YARN_WEIGHTS } from "@/lib/core/yarn/yarn-weights";

describe("loop length (fully relaxed Kw ≈ 4.2, Kc ≈ 5.5: Knapton et al. 1968, on Munden's 1959 geometry)", () => {
  test("the worked value: about 2.1 cm at 20 sts / 10 cm", () => {
    expect(getLoopLengthCm(20)).toBeCloseTo(2.1, 9);
  });
  test("constants as published", () => {
    expect(MUNDEN_KW).toBe(4.2);
    expect(MUNDEN_KC).toBe(5.5);
  });
  test("a finer gauge makes a shorter loop", () => {
    expect(getLoopLengthCm(30)).toBeLessThan(getLoopLengthCm(20));
  });
  test("gauge zero is refused", () => {
    expect(() => getLoopLengthCm(0)).toThrow(/more than 0/);
  });
});

describe("Standard Yarn Weight System (Craft Yarn Council, edition with category 7, added 2015)", () => {
  // Values from TRADE-REFERENCES.md, which pins the current edition.
  test.each([
    [0, "Lace", 33, 40, 1.5, 2.25, "000", "1"],
    [1, "Super Fine", 27, 32, 2.25, 3.25, "1", "3"],
    [2, "Fine", 23, 26, 3.25, 3.75, "3", "5"],
    [3, "Light", 21, 24, 3.75, 4.5, "5", "7"],
    [4, "Medium", 16, 20, 4.5, 5.5, "7", "9"],
    [5, "Bulky", 12, 15, 5.5, 8, "9", "11"],
    [6, "Super Bulky", 7, 11, 8, 12.75, "11", "17"],
    [7, "Jumbo", null, 6, 12.75, null, "17", null],
  ])("category %i %s: %s–%s sts, %s–%s mm, US %s–%s", (cat, name, sMin, sMax, nMin, nMax, uMin, uMax) => {
    const w = getYarnWeight(cat);
    expect(w.name).toBe(name);
    expect(w.stitchesPer10cm).toEqual({ min: sMin, max: sMax });
    expect(w.needleMm).toEqual({ min: nMin, max: nMax });
    expect(w.needleUs).toEqual({ min: uMin, max: uMax });
  });

  test("the edition is pinned: category 6 is 7–11 sts, not the older 6–11", () => {
    expect(getYarnWeight(6).stitchesPer10cm.min).toBe(7);
    expect(YARN_WEIGHTS.source).toMatch(/category 7/);
  });

  test("typical gauge is the middle of the range", () => {
    expect(getTypicalStitchesPer10cm(4)).toBe(18);
    expect(getTypicalStitchesPer10cm(7)).toBe(6);
  });
});

describe("checkGauge", () => {
  test("within the range: no message", () => {
    expect(checkGauge(4, 18, "hat")).toMatchObject({ within: true, message: null });
  });
  test("a firm gauge for mittens is explained, not refused", () => {
    const c = checkGauge(4, 24, "mitten");
    expect(c.within).toBe(false);
    expect(c.direction).toBe("firmer");
    expect(c.message).toMatch(/normal for mittens/);
  });
  test("a firm gauge for a pullover warns of a stiff fabric", () => {
    expect(checkGauge(4, 24, "pullover").message).toMatch(/dense and stiff/);
  });
  test("a loose gauge warns", () => {
    expect(checkGauge(3, 16).message).toMatch(/looser than the usual range for category 3 Light \(21–24/);
  });
  test("open-ended ranges", () => {
    expect(checkGauge(7, 4).within).toBe(true);
    expect(checkGauge(7, 8).direction).toBe("firmer");
  });
  test("unknown category", () => {
    expect(() => checkGauge(9, 20)).toThrow(/0–7/);
  });
});

describe("needle sizes (published conversion tables where they agree)", () => {
  test.each([
    [2, "0", "14"],
    [2.25, "1", "13"],
    [2.75, "2", "12"],
    [3.25, "3", "10"],
    [3.75, "5", "9"],
    [4, "6", "8"],
    [4.5, "7", "7"],
    [5, "8", "6"],
    [5.5, "9", "5"],
    [6, "10", "4"],
    [6.5, "10½", "3"],
    [8, "11", "0"],
    [9, "13", "00"],
    [10, "15", "000"],
  ])("%s mm = US %s = old UK %s", (mm, us, uk) => {
    expect(getNeedleSize(mm)).toMatchObject({ us, ukOld: uk, known: true });
  });

  test.each([
    [2.5, NO_EQUIVALENT, NO_EQUIVALENT],
    [3, NO_EQUIVALENT, "11"],
    [3.5, "4", NO_EQUIVALENT],
    [7, NO_EQUIVALENT, "2"],
  ])("%s mm: US %s, old UK %s", (mm, us, uk) => {
    expect(getNeedleSize(mm)).toMatchObject({ us, ukOld: uk });
  });

  test("above 10 mm the tables disagree: no equivalent is given", () => {
    const n = getNeedleSize(12);
    expect(n.us).toBe(NO_EQUIVALENT);
    expect(n.note).toMatch(/disagree above 10 mm/);
  });

  test("US names back to mm", () => {
    expect(getNeedleMmFromUs("8")).toBe(5);
    expect(getNeedleMmFromUs("10.5")).toBe(6.5);
    expect(getNeedleMmFromUs("US 6")).toBe(4);
    expect(getNeedleMmFromUs("12")).toBeNull();
  });
});
