import { describe, expect, test } from "vitest";
import { run as runEstimate } from "@/scripts/core-verbs/estimate";
import { run as runCalibrate } from "@/scripts/core-verbs/calibrate";
import { run as runQuote } from "@/scripts/core-verbs/quote";
import { makeHistory } from "./synthetic-history";

describe("core verb estimate", () => {
  test("gives P50/P80 minutes per stage that feed the quote verb's labourMinutes", () => {
    const est = runEstimate({ pieces: [{ plainStitches: 2500, strandedStitches: 1500 }] }) as {
      stages: Record<string, { p50Minutes: number; p80Minutes: number }>;
    };
    // 2500 ÷ 25 + 1500 ÷ 15 = 200 min at our default speeds; P80 = 250.
    expect(est.stages.knitting).toMatchObject({ p50Minutes: 200, p80Minutes: 250 });
    const q = runQuote({ currency: "GBP", hourlyRateMinor: 1800, labourMinutes: { knitting: est.stages.knitting } }) as { totalMinor: number };
    // Quotes charge P80 by default: 250 min × £18.00/h = £75.00.
    expect(q.totalMinor).toBe(7500);
  });

  test.each([
    [{ pieces: [] }, /pieces: give at least one piece/],
    [{ pieces: [{ plainStitch: 5 }] }, /pieces\[0\]: Unrecognized key: "plainStitch"/],
    [{ pieces: [{ ends: -2 }] }, /pieces\[0\]\.ends: must not be negative/],
    [{ pieces: [{ ends: 2 }], rates: { minutesPerEnd: -1 } }, /rates\.minutesPerEnd: a rate must not be negative/],
    [{ pieces: [{ ends: 2 }], rates: { plainStitchesPerMinute: 0 } }, /rates\.plainStitchesPerMinute: must be greater than 0/],
  ])("bad input %# → a message naming the field", (input, message) => {
    expect(() => runEstimate(input)).toThrow(message);
  });
});

describe("core verb calibrate", () => {
  test("returns fitted rates, pieces per stage and accuracy before/after", () => {
    const out = runCalibrate({ pieces: makeHistory({ seed: 2, count: 20, noise: 0.05, outlierEvery: 0 }) }) as {
      rates: Record<string, number>;
      pieces: Record<string, number>;
      accuracy: { heldBackPieces: number; overall: { before: number; after: number } };
    };
    expect(out.pieces.knitting).toBe(20);
    expect(out.accuracy.heldBackPieces).toBe(4);
    expect(out.accuracy.overall.after).toBeLessThan(out.accuracy.overall.before);
    // True plain speed is 35 sts/min (synthetic-history TRUE_RATES).
    expect(out.rates.plainStitchesPerMinute).toBeGreaterThan(31);
    expect(out.rates.plainStitchesPerMinute).toBeLessThan(39);
  });

  test("its rates and p80Factors feed the estimate verb as they are (through JSON), with coverage in the accuracy report", () => {
    const history = makeHistory({ seed: 6, count: 30, noise: 0.1, outlierEvery: 0 });
    const out = JSON.parse(JSON.stringify(runCalibrate({ pieces: history }))) as {
      rates: Record<string, number>;
      p80Factors: Record<string, number>;
      stages: Record<string, { spread: { medianRatio: number } | null }>;
      accuracy: { stages: Record<string, { p50Coverage: number; p80Coverage: number }>; overall: { p50Coverage: number; p80Coverage: number } };
    };
    const est = runEstimate({ pieces: [history[0].features], rates: out.rates, p80Factors: out.p80Factors }) as {
      p80Factors: Record<string, number>;
      stages: Record<string, { p50Minutes: number; p80Minutes: number }>;
      pieces: { p50Minutes: Record<string, number>; p80Minutes: Record<string, number> }[];
    };
    expect(est.p80Factors).toEqual(out.p80Factors);
    expect(est.pieces[0].p80Minutes.knitting).toBe(est.stages.knitting.p80Minutes);
    expect(est.pieces[0].p50Minutes.knitting).toBe(est.stages.knitting.p50Minutes);
    expect(out.stages.knitting.spread).not.toBeNull();
    expect(out.accuracy.overall.p80Coverage).toBeGreaterThanOrEqual(out.accuracy.overall.p50Coverage);
    expect(Object.keys(out.accuracy.stages.knitting)).toEqual(expect.arrayContaining(["before", "after", "pieces", "p50Coverage", "p80Coverage"]));
  });

  test("refuses a logged stage that does not exist", () => {
    expect(() => runCalibrate({ pieces: [{ features: {}, loggedMinutes: { dyeing: 30 } }] })).toThrow(/loggedMinutes: Unrecognized key: "dyeing"/);
  });
});
