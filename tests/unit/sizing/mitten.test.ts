// Mitten cast-on, top and thumb: the rules a knitter checks on the needles.
// Back and palm are worked as two equal halves (each a whole number of the chart's repeats), the rib
// must close in the round, and the top must end on a count that grafts back to palm or draws together.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getMittenCastOn, planMittenTop } from "@/lib/core/sizing/mitten";
import { sizeGarment } from "@/lib/core/sizing/size-garment";

describe("mitten cast-on: a multiple of 2 × repeat, so back = palm, each whole repeats", () => {
  // perCm = 1 so the target in cm is the raw stitch count; a tie goes up (SIZING.md, Rounding).
  test.each([
    // repeat 1 → multiple of 2: 61 / 2 = 30.5, a tie → 31 × 2 = 62
    { raw: 61, repeat: 1, expected: 62 },
    { raw: 60.99, repeat: 1, expected: 60 }, // 30.495 → 30 → 60
    { raw: 61.01, repeat: 1, expected: 62 },
    // repeat 3 → multiple of 6 (= lcm(2, 3) and 2 × 3): 57 / 6 = 9.5, a tie → 10 × 6 = 60
    { raw: 57, repeat: 3, expected: 60 },
    { raw: 56.9, repeat: 3, expected: 54 }, // 9.48 → 9 → 54 (27 + 27, 9 repeats each)
    { raw: 57.1, repeat: 3, expected: 60 },
    // repeat 4 → multiple of 8 (lcm(2, 4) = 4 would leave 30 + 30, not whole repeats): 60 / 8 = 7.5 → 8 → 64
    { raw: 60, repeat: 4, expected: 64 },
    { raw: 59.9, repeat: 4, expected: 56 },
    // a repeat exactly as wide as half the hand: one repeat each side
    { raw: 60, repeat: 30, expected: 60 },
  ])("$raw sts asked, repeat $repeat → $expected", ({ raw, repeat, expected }) => {
    const n = getMittenCastOn(raw, 1, repeat);
    expect(n).toBe(expected);
    expect((n / 2) % repeat).toBe(0);
  });

  test("a repeat just wider than half the hand is refused, naming the halves", () => {
    expect(() => getMittenCastOn(60, 1, 31)).toThrow(/repeat of 31 stitches is wider than the hand's back or palm \(30 stitches each/);
  });

  test("the issue's case: a 17 cm hand, 1.5 cm ease, 29.8 sts / 10 cm, no repeat", () => {
    // 18.5 cm × 2.98 sts/cm = 55.13: before, 55 sts (28 + 27, rib ending k1); now 55.13 / 2 = 27.6 → 28 → 56
    const r = sizeGarment({ garment: "mitten", measurements: { handCircumferenceCm: 17, handLengthCm: 17 }, gauge: { stitchesPer10cm: 29.8, rowsPer10cm: 36 } });
    expect(r.castOn).toBe(56);
    expect([r.counts.back, r.counts.palm]).toEqual([28, 28]);
    // 56 = 4 × 14: a k2, p2 rib closes
    expect(r.recipe.metric.join(" ")).toMatch(/of k2, p2 rib/);
  });

  test("an even count that is not a multiple of 4 says why the rib is k1, p1", () => {
    // 17 cm + 1.5 cm = 18.5 cm × 2.9 = 53.65 → 53.65 / 2 = 26.8 → 27 → 54 = 4 × 13 + 2
    const r = sizeGarment({ garment: "mitten", measurements: { handCircumferenceCm: 17, handLengthCm: 17 }, gauge: { stitchesPer10cm: 29, rowsPer10cm: 36 } });
    expect(r.castOn).toBe(54);
    expect(r.recipe.metric.join(" ")).toMatch(/k1, p1 rib \(a k2, p2 rib needs a multiple of 4 sts to close\)/);
    expect(r.recipe.metric.join(" ")).not.toMatch(/ending k1/);
  });
});

describe("mitten top: ends on a multiple of 4, back = palm, grafted or drawn together", () => {
  test.each([
    // 56: 56→52→…→28 every other rnd (7 decreases while more than 28 remain: 52, 48, 44, 40, 36, 32, 28),
    // then 24, 20, 16, 12, 8 every rnd: 7 × 2 + 5 = 19 rnds, 8 sts left (4 + 4), no last round
    { hand: 56, rows: 19, remaining: 8, lastRound: false },
    // 54: 54→50…→26 every other rnd (7 × 2 = 14 rnds: 50, 46, 42, 38, 34, 30, 26), then 22, 18, 14, 10 every
    // rnd (4), then one rnd taking 1 st from each half: 10 → 8 (5 + 5 → 4 + 4): 19 rnds
    { hand: 54, rows: 19, remaining: 8, lastRound: true },
    // 12: 12 → 8 (more than half left before it: every other rnd, 2 rnds)
    { hand: 12, rows: 2, remaining: 8, lastRound: false },
    // 10: no 4-st decrease fits above 8; one 2-st rnd → 8
    { hand: 10, rows: 1, remaining: 8, lastRound: true },
    // 8: nothing to decrease; 6: one 2-st rnd → 4 (2 + 2)
    { hand: 8, rows: 0, remaining: 8, lastRound: false },
    { hand: 6, rows: 1, remaining: 4, lastRound: true },
  ])("hand $hand → $remaining sts after $rows rnds", ({ hand, rows, remaining, lastRound }) => {
    const top = planMittenTop(hand);
    expect(top.rows).toBe(rows);
    expect(top.remaining).toBe(remaining);
    expect(top.lastRound).toBe(lastRound);
    expect(top.counts.length).toBe(rows);
  });

  test("the recipe says how the top closes, with the stitches on each half", () => {
    const r = sizeGarment({ garment: "mitten", size: "woman", gauge: { stitchesPer10cm: 30, rowsPer10cm: 32 } });
    const text = r.recipe.metric.join(" ");
    expect(text).toMatch(/4 sts remain on the back and 4 on the palm: graft them together \(Kitchener stitch, back to palm\), or draw the yarn through all 8/);
    expect(r.counts.top).toBe(8);
    expect(r.counts.topPerHalf).toBe(4);
  });
});

describe("mitten properties", () => {
  const arb = fc.record({
    hand: fc.double({ min: 11, max: 26, noNaN: true }),
    length: fc.double({ min: 0.9, max: 1.15, noNaN: true }),
    sts: fc.double({ min: 16, max: 36, noNaN: true }),
    rowRatio: fc.double({ min: 1.2, max: 1.45, noNaN: true }),
    repeat: fc.integer({ min: 1, max: 13 }),
    thumb: fc.constantFrom("gusset" as const, "afterthought" as const),
  });

  test("for any hand, gauge and repeat: even cast-on, back = palm, whole repeats each half, a clean top, exact stitch totals", () => {
    fc.assert(
      fc.property(arb, ({ hand, length, sts, rowRatio, repeat, thumb }) => {
        fc.pre(((hand + 1.5) * sts) / 10 / 2 >= repeat);
        const r = sizeGarment({
          garment: "mitten",
          measurements: { handCircumferenceCm: hand, handLengthCm: Math.min(27, hand * length) },
          gauge: { stitchesPer10cm: sts, rowsPer10cm: sts * rowRatio },
          repeat,
          options: { thumb },
        });
        expect(r.castOn % 2).toBe(0);
        expect(r.counts.back).toBe(r.counts.palm);
        expect(r.counts.back % repeat).toBe(0);
        expect(r.counts.top % 4).toBe(0);
        expect(r.counts.top).toBeLessThanOrEqual(8);
        expect(r.counts.topPerHalf * 2).toBe(r.counts.top);
        const text = r.recipe.metric.join(" ");
        expect(text).not.toMatch(/ending k1/);
        expect(text).toMatch(/graft them together/);
        // every stitch once: the areas cover the mitten; an afterthought thumb adds nothing to the hand
        const areas = r.charts.reduce((s, c) => s + c.stitches * c.repeats, 0);
        const mitten = r.pieces.find((p) => p.name === "mitten")!.stitches;
        if (thumb === "afterthought") expect(mitten).toBe(areas);
        else expect(mitten).toBeGreaterThan(areas);
      }),
      { numRuns: 150 },
    );
  });
});

describe("afterthought thumb: its length is measured from the opening", () => {
  const base = { garment: "mitten", gauge: { stitchesPer10cm: 30, rowsPer10cm: 32 } } as const;
  test.each([
    // 6 cm × 3.2 rnds/cm = 19.2 → 19 rnds. Before: 6 + (crotch 0.4 × 18 = 7.2 − opening 0.25 × 18 = 4.5)
    // = 8.7 cm → 28 rnds, 2.7 cm too long ((memory) proportions, MITTEN_PROPORTIONS)
    { thumbLengthCm: 6, rows: 19 },
    // 6.25 cm × 3.2 = 20 rnds exactly
    { thumbLengthCm: 6.25, rows: 20 },
    // 6.09375 × 3.2 = 19.5: a tie goes up → 20
    { thumbLengthCm: 6.09375, rows: 20 },
    // just under the tie: 6.09 × 3.2 = 19.488 → 19
    { thumbLengthCm: 6.09, rows: 19 },
  ])("a $thumbLengthCm cm thumb → $rows rnds, the same as a gusset thumb", ({ thumbLengthCm, rows }) => {
    const measurements = { handCircumferenceCm: 19, handLengthCm: 18, thumbLengthCm };
    const after = sizeGarment({ ...base, measurements, options: { thumb: "afterthought" } });
    const gusset = sizeGarment({ ...base, measurements, options: { thumb: "gusset" } });
    expect(after.rows.thumb).toBe(rows);
    expect(gusset.rows.thumb).toBe(rows);
    expect(after.recipe.metric.join(" ")).toMatch(new RegExp(`the thumb is ${rows} rnds, [\\d.]+ cm, from the opening`));
  });
});
