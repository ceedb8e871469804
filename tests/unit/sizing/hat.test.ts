// Hat cast-on: the count must close the brim rib, divide into whole crown sectors and hold whole
// repeats. Sector counts and penalties are ours (HAT_CAST_ON_PENALTY_CM); 8 sectors is common practice.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getHatCastOn } from "@/lib/core/sizing/hat";
import { getHatHeightCm } from "@/lib/core/sizing/standard-sizes";
import { sizeGarment } from "@/lib/core/sizing/size-garment";

describe("getHatCastOn: nearest count once the rib and the crown are counted", () => {
  // perCm = 1, so the target in cm is the raw stitch count and a penalty of 0.3 cm is 0.3 sts.
  test.each([
    // 106.1: 106 = 2 × 53 has no sectors; 104 (8 × 13, k2, p2) is 2.1 off; 108 (9 × 12) is 1.9 + 0.3 = 2.2 → 104
    { raw: 106.1, repeat: 1, around: 104, sectors: 8 },
    // 106.15: 104 is 2.15 off; 108 is 1.85 + 0.3 = 2.15: exactly a tie, which goes up → 108, 9 sectors
    { raw: 106.15, repeat: 1, around: 108, sectors: 9 },
    { raw: 106.2, repeat: 1, around: 108, sectors: 9 },
    // 110.88 (a 56 cm head − 10 % at 22 sts / 10 cm, in sts): 112 = 8 × 14 is 1.12 off; 110 needs
    // k1, p1 (+1) and 10 sectors (+0.6) → 112
    { raw: 110.88, repeat: 1, around: 112, sectors: 8 },
    // 101: 100 = 10 × 10, k2, p2: 1 + 0.6 = 1.6; 102 = 6 × 17 but k1, p1: 1 + 1 + 0.6; 96 = 8 × 12: 5 → 100
    { raw: 101, repeat: 1, around: 100, sectors: 10 },
    // repeat 5 → multiples of lcm(2, 5) = 10: 100 (10 sectors, k2, p2: 0.6); 90 and 110 are 10 off → 100
    { raw: 100, repeat: 5, around: 100, sectors: 10 },
    // repeat 6 → multiples of 6: 96 = 8 × 12, k2, p2, 0.5 off; 102 is 5.5 off and k1, p1 → 96
    { raw: 96.5, repeat: 6, around: 96, sectors: 8 },
  ])("$raw sts, repeat $repeat → $around in $sectors sectors", ({ raw, repeat, around, sectors }) => {
    expect(getHatCastOn(raw, 1, repeat)).toEqual({ around, sectors });
  });

  test("no count within one unit or 6 % divides into sectors: null (the template falls back, with a warning)", () => {
    // repeat 11 → multiples of 22; raw 40 (window ±22): 22 and 44 divide by none of 6–10
    expect(getHatCastOn(40, 1, 11)).toBeNull();
    const r = sizeGarment({ garment: "hat", measurements: { headCircumferenceCm: 40 }, easeCm: 0, gauge: { stitchesPer10cm: 10, rowsPer10cm: 14 }, repeat: 11 });
    expect(r.castOn).toBe(44);
    expect(r.counts.crownStart).toBe(40);
    expect(r.warnings.join(" ")).toMatch(/crown starts with a decrease round to 40 sts/);
  });
});

describe("hat properties", () => {
  const arb = fc.record({
    head: fc.double({ min: 35, max: 64, noNaN: true }),
    sts: fc.double({ min: 14, max: 34, noNaN: true }),
    repeat: fc.integer({ min: 1, max: 12 }),
    ease: fc.double({ min: -8, max: 2, noNaN: true }),
  });

  test("cast-on: even, whole repeats, whole crown sectors, and a k2, p2 brim or a stated k1, p1", () => {
    fc.assert(
      fc.property(arb, ({ head, sts, repeat, ease }) => {
        const r = sizeGarment({ garment: "hat", measurements: { headCircumferenceCm: head }, easeCm: ease, gauge: { stitchesPer10cm: sts, rowsPer10cm: sts * 1.35 }, repeat });
        expect(r.castOn % 2).toBe(0);
        expect(r.castOn % repeat).toBe(0);
        if (r.counts.crownStart === r.castOn) expect(r.castOn % r.counts.crownSectors).toBe(0);
        else expect(r.warnings.join(" ")).toMatch(/crown starts with a decrease round/);
        const text = r.recipe.metric.join(" ");
        if (r.castOn % 4 === 0) expect(text).toMatch(/of k2, p2 rib/);
        else expect(text).toMatch(/k1, p1 rib \(a k2, p2 rib needs a multiple of 4 sts to close\)/);
        // within 6 % or one unit of the target
        const raw = ((head + ease) * sts) / 10;
        expect(Math.abs(r.castOn - raw)).toBeLessThanOrEqual(Math.max(2 * repeat, 0.06 * raw) + 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  test("with no repeat every standard hat size closes a k2, p2 brim and divides into whole sectors", () => {
    for (const size of ["child", "teen", "woman", "man"]) {
      const r = sizeGarment({ garment: "hat", size, gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 } });
      expect(r.castOn % 4).toBe(0);
      expect(r.castOn % r.counts.crownSectors).toBe(0);
    }
  });
});

describe("hat styles: a fitted beanie, a taller hat and a folded brim", () => {
  // Craft Yarn Council hat heights (TRADE-REFERENCES.md): child 8.5 in, teen 10, woman 11, man 11.5, brim
  // to crown for a hat with some slouch or a folded brim. Between rows we read at the middles of the
  // Typical Head Sizes ranges (ours): child 19.75 in, teen 21.25, woman 22.25, man 23.25.
  test.each([
    { size: "child", head: 50.2, cm: 21.6 }, // 8.5 in = 21.59 cm
    { size: "teen", head: 54, cm: 25.4 }, // 10 in
    { size: "woman", head: 56.5, cm: 27.9 }, // 11 in = 27.94
    { size: "man", head: 59.1, cm: 29.2 }, // 11.5 in = 29.21
    // measured heads: exactly the man's middle (23.25 in = 59.055 cm) → 11.5 in
    { size: undefined, head: 59.055, cm: 29.2 },
    // just under: 58 cm = 22.835 in, between the woman's (22.25) and the man's middle:
    // 11 + 0.5 × (22.835 − 22.25) = 11.29 in = 28.7 cm
    { size: undefined, head: 58, cm: 28.7 },
    // just over and beyond: no taller than the man's row
    { size: undefined, head: 62, cm: 29.2 },
    // below the child's middle, in proportion: 40 cm = 15.75 in × 8.5 / 19.75 = 6.78 in = 17.2 cm
    { size: undefined, head: 40, cm: 17.2 },
  ])("$size / $head cm → $cm cm", ({ size, head, cm }) => {
    expect(getHatHeightCm(size, head)).toBe(cm);
  });

  const hat = (style: string, size = "woman") => sizeGarment({ garment: "hat", size, gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 }, options: { style } });

  test("a woman's taller hat is the standard's 11 in; the beanie stays 0.39 × head", () => {
    // beanie 0.39 × 56.5 = 22.0 cm (ours, cross-checked against a published three-gauge pattern)
    expect(hat("beanie").measurements.hatHeightCm.cm).toBe(22);
    const tall = hat("tall");
    expect(tall.style).toBe("tall");
    expect(tall.measurements.hatHeightCm.cm).toBe(27.9);
    // 27.9 cm × 3 rnds/cm = 83.7 → 84 rnds
    expect(tall.rows.total).toBe(84);
    expect(tall.sources.join(" ")).toMatch(/Craft Yarn Council hat heights/);
  });

  test("a folded brim: knitted twice as deep and turned up, 11 in as worn", () => {
    // brim as worn 0.09 × 56.5 = 5.1 cm; knitted 10.2 cm × 3 = 30.6 → 31 rnds, folded 15 rnds;
    // knitted height 27.9 + 5.1 = 33.0 cm = 99 rnds; worn (99 − 15) / 3 = 28.0 cm
    const r = hat("folded-brim");
    expect(r.measurements.hatHeightCm.cm).toBe(33);
    expect(r.rows.brim).toBe(31);
    expect(r.rows.brimFold).toBe(15);
    expect(r.rows.total).toBe(99);
    expect(r.finished.wornHeight.cm).toBe(28);
    expect(r.recipe.metric.join(" ")).toMatch(/Brim: work 31 rnds \(10\.5 cm\) of k2, p2 rib; it is folded up in half when worn \(5 cm deep\)/);
  });

  test.each([
    { style: "fitted", as: "beanie" },
    { style: "slouch", as: "tall" },
    { style: "folded", as: "folded-brim" },
  ])("$style is read as $as", ({ style, as }) => {
    expect(hat(style).style).toBe(as);
  });

  test.each([
    { garment: "hat", style: "bands", message: /options\.style: a hat's style is beanie or folded-brim or tall \(got bands\)/ },
    { garment: "pullover", style: "tall", message: /options\.style: a pullover's style is yoke or bands/ },
    { garment: "mitten", style: "beanie", message: /options\.style: applies to hats .* and pullovers .* only/ },
  ])("a $style $garment is refused", ({ garment, style, message }) => {
    expect(() => sizeGarment({ garment, size: garment === "pullover" ? "women-M" : "woman", gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 }, options: { style } })).toThrow(message);
  });

  test("property: every style counts each stitch once (brim + band + crown) and is worn no taller than knitted", () => {
    fc.assert(
      fc.property(
        fc.record({
          head: fc.double({ min: 40, max: 64, noNaN: true }),
          sts: fc.double({ min: 16, max: 32, noNaN: true }),
          style: fc.constantFrom("beanie", "tall", "folded-brim"),
        }),
        ({ head, sts, style }) => {
          const r = sizeGarment({ garment: "hat", measurements: { headCircumferenceCm: head }, gauge: { stitchesPer10cm: sts, rowsPer10cm: sts * 1.35 }, options: { style } });
          const band = r.charts.find((c) => c.area === "band")!;
          const crown = r.charts.find((c) => c.area === "crown")!;
          if (r.counts.crownStart === r.castOn) expect(r.pieces[0].stitches).toBe(r.castOn * r.rows.brim + band.stitches + crown.stitches);
          expect(r.finished.wornHeight.cm).toBeLessThanOrEqual(r.finished.height.cm);
          if (style !== "folded-brim") expect(r.finished.wornHeight.cm).toBe(r.finished.height.cm);
        },
      ),
      { numRuns: 200 },
    );
  });
});
