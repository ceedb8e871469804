import { describe, expect, test } from "vitest";
import { serializeChart } from "@/lib/core/chart/format";
import { planDarning } from "@/lib/core/colourwork/darning-plan";
import { defaultDarningRates } from "@/lib/core/colourwork/darning-rates";
import { run as runPlanColours } from "@/scripts/core-verbs/plan-colours";
import { run as runPlanDarning } from "@/scripts/core-verbs/plan-darning";
import { chartFromRows } from "./chart-from-rows";

describe("planDarning", () => {
  test("two stitches 3 apart: positions in trade numbering, carry, yarn and minutes by hand", () => {
    // Row 1 "C..C": stitches 4 and 1 (counted from the right); 3 × 0.5 cm = 1.5 cm apart.
    const plan = planDarning(chartFromRows(["C..C"], ["A", "C"]), { darn: ["C"] });
    const c = plan.colours[0];
    const positions = c.strands[0].stitches.map((s) => s.stitch).sort();
    expect(positions).toEqual([1, 4]);
    expect(c.strands[0].stitches.every((s) => s.row === 1)).toBe(true);
    expect(c.strands[0].stitches[0].carryCm).toBeUndefined();
    expect(c.strands[0].stitches[1].carryCm).toBe(1.5);
    // loop ≈ 4.2 ÷ 2 sts/cm = 2.1 cm (fully relaxed Kw ≈ 4.2: Knapton et al. 1968, geometry after Munden 1959): 2 × 2.1 + 2 tails × 15 + 1.5 = 35.7 → 36 cm
    expect(c.yarnCm).toBe(36);
    // 2 × 30 s + 2 ends × 3 min + 1.5 cm × 5 s = 7.125 min
    expect(c.minutes).toBe(7.1);
    expect(plan.settings).toEqual({ carryLimitCm: 2.5, tailCm: 15, loopCm: 2.1, rates: defaultDarningRates, routeInTheRound: false });
  });

  test("the carry limit is a setting: at 1 cm the same two stitches need two strands", () => {
    const plan = planDarning(chartFromRows(["C..C"], ["A", "C"]), { darn: ["C"], carryLimitCm: 1 });
    expect(plan.colours[0]).toMatchObject({ ends: 4, carryCm: 0, lowerBound: { ends: 4, carryCm: 0 } });
  });

  test("totals add up the colours and compare with row by row", () => {
    // C: an H-free row pattern that row by row must cut (rows 6 apart at 0.5 cm = 3 cm),
    // while a route joins each column's stitches, 2 rows apart.
    const rows = ["C....D", "......", "C....D", "......", "C....D"];
    const plan = planDarning(chartFromRows(rows, ["A", "C", "D"]), { darn: ["C", "D"] });
    const [c, d] = plan.colours;
    expect(c).toMatchObject({ key: "C", stitches: 3, ends: 2, carryCm: 2, naive: { ends: 2, carryCm: 2 } });
    expect(d).toMatchObject({ key: "D", stitches: 3, ends: 2, carryCm: 2 });
    expect(plan.totals).toMatchObject({ stitches: 6, strands: 2, ends: 4, carryCm: 4, lowerBound: { ends: 4, carryCm: 4 } });
    expect(plan.totals.saved.ends).toBe(plan.totals.naive.ends - plan.totals.ends);
  });

  test("row by row cuts where a route carries: a column of dots two rows apart, six stitches across", () => {
    // Stitches (0,0), (5,0), (0,2), (5,2): each row's pair is 2.5 cm apart (carried); between rows
    // the walk goes right to left then jumps from the left end of a row to the right end of the
    // next: √(2.5² + 1²) > 2.5 → cut. A route goes up one column and down the other: 1 + 2.5 + 1.
    const plan = planDarning(chartFromRows(["C....C", "......", "C....C"], ["A", "C"]), { darn: ["C"] });
    const c = plan.colours[0];
    expect(c.naive).toMatchObject({ ends: 4, carryCm: 5 });
    expect(c).toMatchObject({ ends: 2, carryCm: 4.5 });
  });

  test("without darn, the colour plan decides what is darned", () => {
    const plan = planDarning(chartFromRows(["ABBA", "ACAA", "AAAA"], ["A", "B", "C"]));
    expect(plan.knit).toEqual(["A", "B"]);
    expect(plan.colours.map((c) => c.key)).toEqual(["C"]);
  });

  test("options are checked with messages that name the field", () => {
    const chart = chartFromRows(["AC"], ["A", "C"]);
    expect(() => planDarning(chart, { darn: ["Q"] })).toThrow("options.darn[0]: colour 'Q' is not in the chart's palette (A, C)");
    expect(() => planDarning(chart, { darn: ["C", "C"] })).toThrow("options.darn[1]: colour 'C' is named twice");
    expect(() => planDarning(chart, { carryLimitCm: -1 })).toThrow("options.carryLimitCm: must be more than 0 (got -1)");
    expect(() => planDarning(chart, { tailCm: "long" })).toThrow("options.tailCm must be a number");
  });
});

describe("core verbs", () => {
  const chart = serializeChart(chartFromRows(["AAAAAAAA", "ABBAABBA", "AACAACAA", "AAAAAAAA"], ["A", "B", "C"]));

  test("plan-colours returns the plan as JSON", () => {
    const out = runPlanColours({ chart, options: { inTheRound: true } }) as Record<string, unknown>;
    // The C row is knitted A A B A A B A A from the right (red goes under navy): in the round the
    // runs of A at both ends join into the longest float, 4.
    expect(out).toMatchObject({ knit: ["A", "B"], darn: ["C"], darnedStitches: 2, totals: { catches: 0, longestFloat: 4 } });
    expect((out.rows as unknown[]).length).toBe(4);
    expect(JSON.parse(JSON.stringify(out))).toEqual(out);
  });

  test("plan-darning returns strands, bounds and the baseline", () => {
    const out = runPlanDarning({ chart, options: { darn: ["C"] } }) as { colours: { key: string; strands: unknown[]; lowerBound: unknown; naive: unknown }[]; totals: Record<string, number> };
    expect(out.colours[0]).toMatchObject({ key: "C", ends: 2, carryCm: 1.5, lowerBound: { ends: 2, carryCm: 1.5 }, naive: { ends: 2, carryCm: 1.5 } });
    expect(out.totals).toMatchObject({ stitches: 2, strands: 1, ends: 2, carryCm: 1.5, minutes: 7.1 });
  });

  test("bad input gives one clear message", () => {
    expect(() => runPlanDarning({ chart: { ...chart, width: 9 } })).toThrow(/chart is not valid: .*row 4 has 8 stitches, expected 9/);
    expect(() => runPlanDarning({ options: {} })).toThrow("chart is missing");
    expect(() => runPlanColours({ chart, options: { knit: ["A", "Q"] } })).toThrow("options.knit[1]: colour 'Q' is not in the chart's palette");
    expect(() => runPlanColours({ chart, extra: 1 })).toThrow("unknown field: extra");
  });
});
