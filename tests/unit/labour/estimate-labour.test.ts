import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { defaultRates, rateSources, RATE_KEYS } from "@/lib/core/labour/default-rates";
import { DEFAULT_P80_FACTOR, estimateLabour } from "@/lib/core/labour/estimate-labour";
import { STAGES } from "@/lib/core/labour/stages";

// A worked adult mitten at our default rates (all defaults are ours, see rateSources):
//   design    120 (new design) + 1 proof × 30                                   = 150 min
//   knitting  2000 plain ÷ 25/min = 80; 3000 stranded ÷ 15/min = 200;
//             12 shaping rounds × 2 = 24; 1 thumb × 20 = 20; 120 catches × 3 s = 6 = 330 min
//   embroidery 60 duplicate × 30 s = 30; 6 ends × 3 = 18; 40 cm × 5 s = 3.33  = 51.33 → 51 min
//   blocking 15; finishing 20
const mitten = {
  label: "left mitten",
  proofRounds: 1,
  plainStitches: 2000,
  strandedStitches: 3000,
  shapingRounds: 12,
  thumbs: 1,
  floatCatches: 120,
  duplicateStitches: 60,
  ends: 6,
  carryCm: 40,
};

describe("estimateLabour", () => {
  test.each([
    ["design", 150, 188], // 150 × 1.25 = 187.5 → 188
    ["knitting", 330, 413], // 412.5 → 413
    ["embroidery", 51, 64], // 51.33 × 1.25 = 64.17 → 64
    ["blocking", 15, 19], // 18.75 → 19
    ["finishing", 20, 25],
  ] as const)("worked mitten: %s P50 %i min, P80 %i min", (stage, p50, p80) => {
    const e = estimateLabour({ pieces: [mitten] });
    expect(e.stages[stage].p50Minutes).toBe(p50);
    expect(e.stages[stage].p80Minutes).toBe(p80);
  });

  test("totals are the sums of the rounded stage figures; drying is a day (common practice: a day or two)", () => {
    const e = estimateLabour({ pieces: [mitten] });
    expect(e.totals.p50Minutes).toBe(150 + 330 + 51 + 15 + 20);
    expect(e.totals.p80Minutes).toBe(188 + 413 + 64 + 19 + 25);
    expect(e.dryingHours).toBe(24);
  });

  test("the second mitten of a pair reuses the design: only its knitting onwards is added", () => {
    const pair = estimateLabour({ pieces: [mitten, { ...mitten, label: "right mitten", newDesign: false, proofRounds: 0 }] });
    expect(pair.stages.design.p50Minutes).toBe(150);
    expect(pair.stages.knitting.p50Minutes).toBe(660);
    // Pieces dry side by side, so a pair takes as long to dry as one.
    expect(pair.dryingHours).toBe(24);
    expect(pair.pieces.map((p) => p.label)).toEqual(["left mitten", "right mitten"]);
  });

  test("studio rates and calibrated P80 factors replace the defaults", () => {
    const e = estimateLabour({
      pieces: [{ plainStitches: 4000 }],
      rates: { plainStitchesPerMinute: 40, blockingMinutesPerPiece: 0, finishingMinutesPerPiece: 0, designBaseMinutes: 0 },
      p80Factors: { knitting: 1.1 },
    });
    expect(e.stages.knitting).toMatchObject({ p50Minutes: 100, p80Minutes: 110 });
    expect(e.stages.design.p50Minutes).toBe(0);
  });

  test("an unblocked piece needs no blocking time and no drying", () => {
    const e = estimateLabour({ pieces: [{ plainStitches: 100, blocked: false }] });
    expect(e.stages.blocking.p50Minutes).toBe(0);
    expect(e.dryingHours).toBe(0);
  });

  test("a piece's own drying hours override the default (a sweater takes longer)", () => {
    const e = estimateLabour({ pieces: [mitten, { plainStitches: 90000, dryingHours: 48 }] });
    expect(e.dryingHours).toBe(48);
  });

  test.each([
    [{ rates: { plainStitchesPerMinute: -3 } }, /plainStitchesPerMinute must not be negative/],
    [{ rates: { strandedStitchesPerMinute: 0 } }, /strandedStitchesPerMinute must be greater than 0/],
    [{ pieces: [{ ends: -1 }] }, /pieces\[0\]\.ends must be a number ≥ 0/],
    [{ p80Factors: { knitting: 0.9 } }, /p80Factors\.knitting must be a number ≥ 1/],
  ])("bad input is refused with a message naming the field (%#)", (patch, message) => {
    expect(() => estimateLabour({ pieces: [mitten], ...patch })).toThrow(message);
  });

  test("every default rate is marked as common practice or (memory)", () => {
    for (const key of RATE_KEYS) expect(["common practice", "(memory)"]).toContain(rateSources[key].basis);
    // TRADE-REFERENCES.md: reported speeds ~20–30 sts/min casual, 40–50 experienced.
    expect(defaultRates.plainStitchesPerMinute).toBeGreaterThanOrEqual(20);
    expect(defaultRates.plainStitchesPerMinute).toBeLessThanOrEqual(50);
  });

  test("P80 defaults to P50 × 1.25 (our stated assumption)", () => {
    expect(DEFAULT_P80_FACTOR).toBe(1.25);
  });

  test("property: P80 ≥ P50 per stage, and more stitches never take less time", () => {
    const piece = fc.record({
      plainStitches: fc.nat(20000),
      strandedStitches: fc.nat(20000),
      duplicateStitches: fc.nat(2000),
      ends: fc.nat(60),
      carryCm: fc.nat(500),
      thumbs: fc.nat(2),
    });
    fc.assert(
      fc.property(fc.array(piece, { minLength: 1, maxLength: 4 }), fc.nat(5000), (pieces, extra) => {
        const e = estimateLabour({ pieces });
        for (const s of STAGES) expect(e.stages[s].p80Minutes).toBeGreaterThanOrEqual(e.stages[s].p50Minutes);
        const more = estimateLabour({ pieces: [{ ...pieces[0], strandedStitches: pieces[0].strandedStitches + extra }, ...pieces.slice(1)] });
        expect(more.stages.knitting.p50Minutes).toBeGreaterThanOrEqual(e.stages.knitting.p50Minutes);
        expect(more.totals.p50Minutes - e.totals.p50Minutes).toBe(more.stages.knitting.p50Minutes - e.stages.knitting.p50Minutes);
      }),
    );
  });
});
