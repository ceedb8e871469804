import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import { planColours } from "@/lib/core/colourwork/colour-plan";
import { ColourworkError } from "@/lib/core/colourwork/colourwork-error";
import { chartFromRows } from "./chart-from-rows";

// Default rates: 30 s per duplicate stitch, 3 min per end, 5 s per cm carried, 3 s per catch.
describe("planColours: the knitted pair", () => {
  const chart = chartFromRows(["AAAAAAAA", "ABBAABBA", "AACAACAA", "AAAAAAAA"], ["A", "B", "C"]);

  test("knits the pair that leaves the least work and darns the rest", () => {
    const plan = planColours(chart);
    expect(plan.knit).toEqual(["A", "B"]);
    expect(plan.darn).toEqual(["C"]);
    expect(plan.darnedStitches).toBe(2);
    // A+B darns the two C (3 apart: 1.5 cm, one strand): 1 min + 2 ends × 3 + 1.5 × 5 s = 7.125 min;
    // no float passes 5 stitches, so the red C go under navy B (ΔE00 38.0, against 51.7 to cream).
    expect(plan.candidates[0]).toEqual({ knit: ["A", "B"], darn: ["C"], darnedStitches: 2, catches: 0, ends: 2, carryCm: 1.5, minutes: 7.1 });
    // A+C would darn four B: at least 4 × 30 s + 2 ends = 8 min > 7.125, so it is set aside unrouted.
    expect(plan.candidates[1]).toEqual({ knit: ["A", "C"], darn: ["B"], darnedStitches: 4, minutes: 8, minutesAtLeast: true });
    expect(plan.candidates.map((c) => c.knit.join(""))).toEqual(["AB", "AC", "BC"]);
    expect(plan.underlay).toEqual([{ key: "C", onto: { A: 0, B: 2 } }]);
  });

  test("takes the pair the maker fixes, in the maker's order, and prices it in full", () => {
    const plan = planColours(chart, { knit: ["C", "A"] });
    expect(plan.knit).toEqual(["C", "A"]);
    expect(plan.darn).toEqual(["B"]);
    // four B in two pairs 3 apart (1.5 cm): 2 min + 6 min + 0.125 min
    expect(plan.candidates.find((c) => c.knit.join("") === "AC")).toEqual({
      knit: ["A", "C"],
      darn: ["B"],
      darnedStitches: 4,
      catches: 0,
      ends: 2,
      carryCm: 1.5,
      minutes: 8.1,
    });
  });

  test("a chart in two colours has nothing to darn", () => {
    const plan = planColours(chartFromRows(["ABAB", "BABA"], ["A", "B", "C"]));
    expect(plan).toMatchObject({ knit: ["A", "B"], darn: [], darnedStitches: 0, underlay: [] });
    expect(plan.candidates[0]).toMatchObject({ knit: ["A", "B"], minutes: 0, ends: 0 });
  });

  test("a one-colour palette knits that colour alone", () => {
    const plan = planColours(chartFromRows(["AAA"], ["A"]));
    expect(plan.knit).toEqual(["A"]);
    expect(plan.darn).toEqual([]);
    expect(plan.totals).toEqual({ catches: 0, longestFloat: 0 });
  });
});

describe("planColours: underlay", () => {
  test("on a float tie, the knitted colour closest by CIEDE2000 goes under the darned stitch", () => {
    // L is near-white (closest to cream A), N near-navy (closest to navy B). Flat, limit 5:
    // top row from the right B A L A A: L under A gives B A4, under B gives B A B A2 — no catch either way → A;
    // bottom row B A A N A: N under B gives B A2 B A, under A gives B A4 — no catch either way → B.
    const plan = planColours(chartFromRows(["AALAB", "ANAAB"], ["A", "B", "L", "N"]), { knit: ["A", "B"], inTheRound: false });
    expect(plan.knittedRows).toEqual(["AAAAB", "ABAAB"]);
    expect(plan.underlay).toEqual([
      { key: "L", onto: { A: 1, B: 0 } },
      { key: "N", onto: { A: 0, B: 1 } },
    ]);
  });

  test("floats come before colour: a near-white stitch goes under navy to split a float of 11", () => {
    // From the right: B, A×5, L, A×5. Under A the A-run is 11 long (2 catches); under B, 5 and 5.
    const plan = planColours(chartFromRows(["AAAAALAAAAAB"], ["A", "B", "L"]), { knit: ["A", "B"], inTheRound: false });
    expect(plan.knittedRows).toEqual(["AAAAABAAAAAB"]);
    expect(plan.totals).toEqual({ catches: 0, longestFloat: 5 });
  });
});

describe("planColours: floats and catches per row", () => {
  const chart = chartFromRows(["AAAABAAA", "AAAAAAAA"], ["A", "B"]);

  test("in the round the row wraps: stitches 5–8 and 1–3 make one float of 7 behind which B is carried", () => {
    const plan = planColours(chart, { inTheRound: true });
    expect(plan.rows[1]).toEqual({
      row: 2,
      longestFloat: 7,
      catches: 1, // ceil(7 / 5) - 1
      // caught round(7 / 2) = 4 stitches in: stitch 5 + 4 → wraps to stitch 1
      floats: [{ carried: "B", fromStitch: 5, toStitch: 3, length: 7, catchStitches: [1] }],
    });
    // row 1 is all A: B is not carried there, so it has no float at all
    expect(plan.rows[0]).toEqual({ row: 1, longestFloat: 0, catches: 0, floats: [] });
    expect(plan.totals).toEqual({ catches: 1, longestFloat: 7 });
  });

  test("flat the row does not wrap: floats of 3 and 4, no catch", () => {
    const plan = planColours(chart, { inTheRound: false });
    expect(plan.rows[1]).toEqual({ row: 2, longestFloat: 4, catches: 0, floats: [] });
  });

  test("the length limit at the gauge can be tighter than the stitch limit", () => {
    // 12 sts per 10 cm: 2.5 cm is 3 stitches, so the wrapped float of 7 needs ceil(7 / 3) - 1 = 2 catches.
    const coarse = chartFromRows(["AAAABAAA"], ["A", "B"], { stitchesPer10cm: 12, rowsPer10cm: 16 });
    const plan = planColours(coarse);
    expect(plan.settings.floatLimitStitches).toBe(3);
    expect(plan.rows[0].catches).toBe(2);
    expect(planColours(coarse, { floatLimitCm: 5 }).rows[0].catches).toBe(1); // now 5 stitches
  });

  test("catches are staggered: the same float in three rows is caught at stitch 6, 5, 6, never twice running", () => {
    // In knitting order each row is B then seven A: a float of 7 (limit 5) needs one catch. The
    // even place is 4 stitches in (stitch 6); the row above keeps off it and takes the next most
    // even place, 3 in (stitch 5: pieces 3 + 4); the third row is free to use stitch 6 again.
    const plan = planColours(chartFromRows(["AAAAAAAB", "AAAAAAAB", "AAAAAAAB"], ["A", "B"]));
    expect(plan.rows.map((r) => r.floats.map((f) => f.catchStitches))).toEqual([[[6]], [[5]], [[6]]]);
    expect(plan.totals.catches).toBe(3);
  });
});

describe("planColours: options are checked with messages that name the field", () => {
  const chart = chartFromRows(["ABC"], ["A", "B", "C"]);
  test.each([
    [{ knit: ["A", "Z"] }, "options.knit[1]: colour 'Z' is not in the chart's palette (A, B, C)"],
    [{ knit: ["A", "A"] }, "options.knit: must name two different colours"],
    [{ knit: ["A"] }, "options.knit: must name exactly two colours"],
    [{ carryLimitCm: 0 }, "options.carryLimitCm: must be more than 0 (got 0)"],
    [{ carryLimitCm: -2 }, "options.carryLimitCm: must be more than 0 (got -2)"],
    [{ floatLimitStitches: 2.5 }, "options.floatLimitStitches: must be a whole number of stitches (got 2.5)"],
    [{ inTheRound: "yes" }, "options.inTheRound must be a boolean"],
    [{ rates: { minutesPerEnd: -1 } }, "options.rates.minutesPerEnd: must be a number ≥ 0 (got -1)"],
    [{ colours: 2 }, "options has unknown field: colours"],
  ])("%j", (options, message) => {
    expect(() => planColours(chart, options)).toThrow(ColourworkError);
    expect(() => planColours(chart, options)).toThrow(message);
  });

  test("a chart of more than 16 colours is refused", () => {
    const palette = Array.from({ length: 17 }, (_, i) => ({ key: String.fromCharCode(65 + i), name: `c${i}`, hex: "#808080" }));
    const chart17 = createChart(17, 1, { stitchesPer10cm: 20, rowsPer10cm: 20 }, palette);
    chart17.cells.forEach((_, i) => (chart17.cells[i] = i));
    expect(() => planColours(chart17)).toThrow("chart.palette: the chart has 17 colours; at most 16 are allowed");
  });
});
