import { describe, expect, test } from "vitest";
import { run } from "@/scripts/core-verbs/plan-rounds";

const PIECE = {
  rounds: ["AAAA", "ABBA", ["A", "C", "C", "A"]],
  palette: [
    { key: "A", hex: "#F2EAD3" },
    { key: "B", hex: "#1F2A44" },
    { key: "C", hex: "#B3282D" },
  ],
  gauge: { stitchesPer10cm: 20, rowsPer10cm: 20 },
};

describe("plan-rounds verb", () => {
  test("rounds may be drawn as strings; the plan comes back round by round", () => {
    const out = run({ piece: PIECE }) as { rounds: { pair: string[]; knit: string[] }[]; totals: { darnedStitches: number } };
    expect(out.rounds.map((r) => r.knit.join(""))).toEqual(["A", "AB", "AC"]);
    expect(out.totals.darnedStitches).toBe(0);
  });

  test("bad input is a message naming the field", () => {
    expect(() => run({ piece: { ...PIECE, rounds: ["AAXA"] } })).toThrow(/round 1, stitch 3/);
    expect(() => run({})).toThrow(/piece is missing/);
    expect(() => run({ piece: PIECE, extra: 1 })).toThrow(/extra/);
  });
});
