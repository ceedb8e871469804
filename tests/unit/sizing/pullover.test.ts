// Yoke pullover: the neck must pass over the head, and the percentage system (Zimmermann, Knitting
// Without Tears, 1971; from memory) is held to body measurements at large sizes.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { ceilMultiple, getEvenCastOn } from "@/lib/core/sizing/cast-on";
import { getPercentCuffTarget, getPercentYokeDepthCm, planBackNeckShortRows } from "@/lib/core/sizing/pullover";
import { sizeGarment } from "@/lib/core/sizing/size-garment";
import { getAssumedHead, getWristEstimateCm, getYokeDepthCapCm } from "@/lib/core/sizing/standard-sizes";

const GAUGE = { stitchesPer10cm: 22, rowsPer10cm: 30 };
const neckWarning = (w: string[]) => w.filter((x) => /neck opening/.test(x)).join(" ");

describe("the head a neck is checked against when none is measured", () => {
  // Typical Head Sizes table (HEAD_SIZES): woman 21–23.5 in → 22.25 in = 56.5 cm; man 22–24.5 → 23.25 in
  // = 59.1 cm; child 19–20.5 → 19.75 in = 50.2 cm; toddler 18–20 → 19 in = 48.3 cm. Chest bounds 71.1 cm
  // (28 in) and 55.9 cm (22 in) are ours (memory).
  test.each([
    { size: "women-M", chest: 94, cm: 56.5 },
    { size: "men-XL", chest: 119.4, cm: 59.1 },
    { size: undefined, chest: 71.1, cm: 56.5 }, // exactly the smallest adult chest
    { size: undefined, chest: 71, cm: 50.2 }, // just under: a child's
    { size: undefined, chest: 55.9, cm: 50.2 },
    { size: undefined, chest: 55.8, cm: 48.3 },
  ])("$size, chest $chest cm → $cm cm", ({ size, chest, cm }) => {
    expect(getAssumedHead(size, chest).cm).toBe(cm);
  });

  test("a women's M with no head measured is warned: a 40.9 cm neck may not pass over a 56.5 cm head", () => {
    // body (94 + 7.5) × 2.2 = 223.3 → 224 sts (even); neck 0.4 × 224 = 89.6 → 90 sts = 40.9 cm; a rib
    // stretching about a third (memory) reaches 54.5 cm < 56.5 cm (the woman's row). Before, the check
    // used a 48 cm toddler's head and said nothing.
    const r = sizeGarment({ garment: "pullover", size: "women-M", gauge: GAUGE });
    expect(r.counts.neck).toBe(90);
    expect(neckWarning(r.warnings)).toMatch(/neck opening is 40\.9 cm around.*56\.5 cm head \(a typical woman's head/);
  });

  test("a neck that passes over the assumed head is not warned", () => {
    // a measured 50.2 cm child's head needs 50.2 × 0.75 = 37.65 cm; the child's default is the same head
    const r = sizeGarment({ garment: "pullover", measurements: { chestCm: 60, bodyLengthCm: 25, sleeveLengthCm: 28, headCircumferenceCm: 50.2 }, gauge: GAUGE });
    expect(neckWarning(r.warnings)).toBe("");
  });
});

describe("a measured head and a repeat: the neck is rounded up to the repeat", () => {
  test.each([
    { x: 72, m: 8, up: 72 }, // exactly a multiple
    { x: 72 + 1e-12, m: 8, up: 72 }, // a binary hair over is the multiple
    { x: 72.1, m: 8, up: 80 }, // just over → the next
    { x: 71.9, m: 8, up: 72 }, // just under → this one
    { x: 3, m: 8, up: 8 }, // at least one repeat
  ])("ceilMultiple($x, $m) = $up", ({ x, m, up }) => {
    expect(ceilMultiple(x, m)).toBe(up);
  });

  test("a 50 cm head at 24 sts / 10 cm with an 8-st repeat: 90 sts needed → 96, not 88", () => {
    // head 50 cm ÷ (4/3) = 37.5 cm × 2.4 = 90 sts at least; 90 / 8 = 11.25: nearest was 88 (below the
    // minimum, warned); up is 96 = 40 cm, 40 × 4/3 = 53.3 cm ≥ 50 cm
    const r = sizeGarment({
      garment: "pullover",
      measurements: { chestCm: 60, bodyLengthCm: 25, sleeveLengthCm: 28, headCircumferenceCm: 50 },
      gauge: { stitchesPer10cm: 24, rowsPer10cm: 32 },
      repeat: 8,
    });
    expect(r.counts.neck).toBe(96);
    expect(neckWarning(r.warnings)).toBe("");
  });

  test("property: with a measured head the neck is a multiple of the repeat and passes over the head (or is warned)", () => {
    fc.assert(
      fc.property(
        fc.record({
          chest: fc.double({ min: 55, max: 150, noNaN: true }),
          head: fc.double({ min: 40, max: 62, noNaN: true }),
          sts: fc.double({ min: 16, max: 34, noNaN: true }),
          repeat: fc.integer({ min: 1, max: 12 }),
          shortRows: fc.boolean(),
        }),
        ({ chest, head, sts, repeat, shortRows }) => {
          const r = sizeGarment({
            garment: "pullover",
            measurements: { chestCm: chest, bodyLengthCm: 0.4 * chest, sleeveLengthCm: 0.45 * chest, headCircumferenceCm: head },
            gauge: { stitchesPer10cm: sts, rowsPer10cm: sts * 1.35 },
            repeat,
            options: { backNeckShortRows: shortRows },
          });
          expect(r.counts.neck % repeat).toBe(0);
          if (shortRows) expect(r.counts.backNeckShortRowStitches).toBeGreaterThan(0);
          const reach = (r.counts.neck / (sts / 10)) * (4 / 3);
          if (reach < head - 1e-9) expect(neckWarning(r.warnings)).toMatch(/may not pass over/);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe("percentage method held to the body at large sizes", () => {
  test.each([
    // cap (16.2 + 3.8 cm cuff ease, memory) × 2 sts/cm = 40 sts; a fifth of the body (Zimmermann, memory)
    { body: 200, expected: 40 }, // exactly at the cap: 0.2 × 200 = 40
    { body: 199, expected: 39.8 }, // just under: the percentage
    { body: 201, expected: 40 }, // just over (40.2): the cap
  ])("cuff: body $body sts, wrist 16.2 cm, 2 sts/cm → $expected sts", ({ body, expected }) => {
    expect(getPercentCuffTarget(body, 16.2, 2)).toBeCloseTo(expected, 9);
  });

  test.each([
    // 0.22 × finished chest (memory), capped at 22 cm
    { finished: 100, expected: 22 }, // exactly the cap
    { finished: 99.5, expected: 21.89 }, // just under
    { finished: 100.5, expected: 22 }, // just over
  ])("yoke depth: finished chest $finished cm, cap 22 cm → $expected cm", ({ finished, expected }) => {
    expect(getPercentYokeDepthCm(finished, 22)).toBeCloseTo(expected, 9);
  });

  test.each([
    // men's chest 46–48 in (CYC, memory) → 47 in = 119.4 cm; wrist 6½ + (47 − 35)/16 = 7.25 in = 18.4 cm;
    // yoke cap 2⅝ + 47/8 + 1¾ = 10.25 in = 26.0 cm
    { size: "men-XL", chest: 119.4, wrist: 18.4, yokeCap: 26 },
    // women's bust 36–38 in → 37 in = 94 cm; wrist 5¾ + (37 − 29)/16 = 6.25 in = 15.9 cm; cap 9 in = 22.9 cm
    { size: "women-M", chest: 94, wrist: 15.9, yokeCap: 22.9 },
  ])("$size: wrist $wrist cm and yoke cap $yokeCap cm (memory)", ({ size, chest, wrist, yokeCap }) => {
    expect(getWristEstimateCm(size, chest)).toBe(wrist);
    expect(getYokeDepthCapCm(chest)).toBe(yokeCap);
  });

  test("men's XL at 22 sts / 10 cm: a 21.8 cm cuff (not 25.5) and a 26 cm yoke (not 28)", () => {
    // body (119.4 + 7.5) × 2.2 = 279.2 → 280 sts (even) = 127.3 cm. Percentage cuff 0.2 × 280 = 56 sts
    // (25.5 cm); cap (18.4 + 3.8) × 2.2 = 48.8 → 48 sts = 21.8 cm. Yoke 0.22 × 127.3 = 28.0 cm; cap 26.0 cm
    const r = sizeGarment({ garment: "pullover", size: "men-XL", gauge: GAUGE });
    expect(r.counts.body).toBe(280);
    expect(r.counts.sleeveCastOn).toBe(48);
    expect(r.finished.cuff.cm).toBe(21.8);
    expect(r.measurements.yokeDepthCm.cm).toBe(26);
    expect(r.measurements.wristCm).toMatchObject({ cm: 18.4, from: "derived" });
  });

  test("a women's M keeps its percentage counts (44-st cuff, 22.4 cm yoke under its 22.9 cm cap)", () => {
    // cuff: 0.2 × 224 = 44.8 against a cap of (15.9 + 3.8) × 2.2 = 43.3: both round to 44 sts;
    // yoke 0.22 × 224 / 2.2 = 22.4 cm
    const r = sizeGarment({ garment: "pullover", size: "women-M", gauge: GAUGE });
    expect(r.counts.sleeveCastOn).toBe(44);
    expect(r.measurements.yokeDepthCm.cm).toBe(22.4);
  });

  test("a women's 5X neck is held to the head: 124 sts, not 143", () => {
    // body (154.9 + 7.5) × 2.2 = 357.3 → 358 (even); 0.4 × 358 = 143.2 sts = 65 cm; a 56.5 cm woman's head × 2.2
    // = 124.3 → 124 sts = 56.4 cm (a neck wider than the head only gapes; ours)
    const r = sizeGarment({ garment: "pullover", size: "women-5X", gauge: GAUGE });
    expect(r.counts.neck).toBe(124);
  });

  test("given lengths and wrists are kept as given", () => {
    const r = sizeGarment({ garment: "pullover", size: "men-XL", measurements: { wristCm: 20 }, gauge: GAUGE, options: { yokeDepthCm: 28 } });
    expect(r.measurements.yokeDepthCm).toBeUndefined();
    expect(r.rows.yoke).toBe(84); // 28 cm × 3 rnds/cm
    // wrist 20 × the body's fit (127.3 / 119.4) × 2.2 = 46.9 → 46 sts
    expect(r.counts.sleeveCastOn).toBe(46);
  });
});

describe("back-neck short rows (an option)", () => {
  test.each([
    // neck 89, raise 2.5 cm × 3 rnds/cm = 7.5 → 8 rows → 4 pairs; half 22, first 44, step ⌊(44 − 15) / 6⌋ = 4:
    // rows 22, 44, 40, 36, 32, 28, 24, 20, then 22 − 12 = 10 back to the centre: 256 sts
    { neck: 89, raiseRows: 8, pairs: 4, step: 4, stitches: 256 },
    // 7 rows → round(3.5) = 4 pairs (a tie up); 6 → 3 pairs: step ⌊29 / 4⌋ = 7: 22, 44, 37, 30, 23, 16, 22 − 14 = 8
    { neck: 89, raiseRows: 7, pairs: 4, step: 4, stitches: 256 },
    { neck: 89, raiseRows: 6, pairs: 3, step: 7, stitches: 180 },
    // a tiny neck: half 2, first 4, step 1; pairs held to 2 so every turn stays off the centre: 2, 4, 3, 2, 1
    { neck: 8, raiseRows: 8, pairs: 2, step: 1, stitches: 12 },
  ])("neck $neck, $raiseRows rows → $pairs pairs, step $step, $stitches sts", ({ neck, raiseRows, pairs, step, stitches }) => {
    const p = planBackNeckShortRows(neck, raiseRows);
    expect([p.pairs, p.step, p.stitches]).toEqual([pairs, step, stitches]);
    expect(p.rowLengths.every((n) => n >= 1)).toBe(true);
  });

  test("the yoke counts exactly the short rows' stitches, and the recipe gives them", () => {
    const base = { garment: "pullover", size: "women-M", gauge: GAUGE } as const;
    const plain = sizeGarment(base);
    const raised = sizeGarment({ ...base, options: { backNeckShortRows: true } });
    const yoke = (r: typeof plain) => r.pieces.find((p) => p.name === "yoke")!.stitches;
    expect(yoke(raised) - yoke(plain)).toBe(256);
    expect(raised.counts.backNeckShortRowStitches).toBe(256);
    expect(raised.rows.backNeckShortRows).toBe(8);
    expect(raised.recipe.metric.join(" ")).toMatch(/Knit 22, turn; purl 44, turn\. Then 3 times: knit to 4 sts before the last turn/);
    expect(raised.recipe.imperial.join(" ")).toMatch(/raise the back neck about 1 in/);
    // other pieces and the charts are untouched
    expect(raised.charts).toEqual(plain.charts);
    expect(plain.recipe.metric.join(" ")).not.toMatch(/short rows/);
  });

  test("short rows are for pullovers only", () => {
    expect(() => sizeGarment({ garment: "hat", size: "woman", gauge: GAUGE, options: { backNeckShortRows: true } })).toThrow(/options\.backNeckShortRows: applies to pullovers only/);
  });
});

describe("a pullover's body and neck are even, so the ribs close and back and front split evenly", () => {
  test.each([
    // perCm = 1: repeat 1 → multiples of 2; 223.3 / 2 = 111.65 → 224; exactly 223 (111.5, a tie) → 224
    { raw: 223.3, repeat: 1, expected: 224 },
    { raw: 223, repeat: 1, expected: 224 },
    { raw: 222.9, repeat: 1, expected: 222 },
    // repeat 3 → multiples of 6: 225 / 6 = 37.5, a tie → 228; 224.9 → 222
    { raw: 225, repeat: 3, expected: 228 },
    { raw: 224.9, repeat: 3, expected: 222 },
    // a single odd repeat wider than half the piece stays one repeat
    { raw: 9, repeat: 7, expected: 7 },
  ])("$raw sts, repeat $repeat → $expected", ({ raw, repeat, expected }) => {
    expect(getEvenCastOn(raw, 1, repeat)).toBe(expected);
  });

  test("property: body, cuffs and neck are even and the body and sleeve ribs never end k1", () => {
    fc.assert(
      fc.property(
        fc.record({
          chest: fc.double({ min: 60, max: 150, noNaN: true }),
          sts: fc.double({ min: 16, max: 34, noNaN: true }),
          repeat: fc.integer({ min: 1, max: 9 }),
          style: fc.constantFrom("yoke" as const, "bands" as const),
        }),
        ({ chest, sts, repeat, style }) => {
          const r = sizeGarment({
            garment: "pullover",
            measurements: { chestCm: chest, bodyLengthCm: 0.4 * chest, sleeveLengthCm: 0.45 * chest },
            gauge: { stitchesPer10cm: sts, rowsPer10cm: sts * 1.35 },
            repeat,
            options: { style },
          });
          expect(r.counts.body % 2).toBe(0);
          expect(r.counts.body % repeat).toBe(0);
          expect(r.counts.sleeveCastOn % 2).toBe(0);
          // the neck is even unless an odd repeat's previous section (a multiple of the repeat) holds it
          expect(r.counts.neck % 2 === 0 || r.counts.neck >= r.counts.yokeDecrease2).toBe(true);
          const bodyAndSleeves = r.recipe.metric.filter((l) => /^(Body|Sleeves)/.test(l)).join(" ");
          expect(bodyAndSleeves).not.toMatch(/ending k1/);
        },
      ),
      { numRuns: 200 },
    );
  });
});
