import { describe, expect, test } from "vitest";
import { run } from "@/scripts/core-verbs/yarn";

// A 4 × 3 chart at 20 sts / 10 cm: loop 2.1 cm, stitch 0.5 cm (fully relaxed Kw ≈ 4.2: Knapton et al. 1968, geometry after Munden 1959).
const CHART = {
  version: 1,
  width: 4,
  height: 3,
  gauge: { stitchesPer10cm: 20, rowsPer10cm: 28 },
  palette: [
    { key: ".", name: "Cream", hex: "#F0EAD6" },
    { key: "x", name: "Navy", hex: "#1F2A44" },
    { key: "r", name: "Red", hex: "#C0392B" },
  ],
  rows: ["x..x", ".rr.", "...."],
};

// The plan-darning output carries more than the yarn estimate reads (strands, totals, settings…).
const PLAN = {
  knit: [".", "x"],
  colours: [
    {
      key: "r",
      name: "Red",
      stitches: 2,
      strands: [{ stitches: [{ row: 2, stitch: 3 }, { row: 2, stitch: 2 }], carryCm: 0 }],
      ends: 2,
      carryCm: 1.2,
      yarnCm: 40,
      minutes: 3,
    },
  ],
  totals: { stitches: 2, strands: 1, ends: 2, carryCm: 1.2, yarnCm: 40, minutes: 3 },
};

const YARNS = [
  { key: ".", name: "Cream wool", metresPerSkein: 175, gramsPerSkein: 50, stockSkeins: 4 },
  { key: "x", name: "Navy wool", yardsPerSkein: 191, gramsPerSkein: 50 },
  { key: "r", name: "Red wool", metresPerSkein: 10, gramsPerSkein: 5 },
];

type Out = {
  knit: string[];
  colours: { key: string; role: string; totalCm: number; metres: number; breakdownCm: Record<string, number>; skeins: { skeins: number } | null }[];
  totals: { skeins: number };
  warnings: string[];
};

describe("core verb yarn", () => {
  test("metres and skeins per colour from a chart and a darning plan", () => {
    const out = run({ chart: CHART, plan: PLAN, yarns: YARNS }) as Out;
    expect(out.knit).toEqual([".", "x"]);
    const red = out.colours.find((c) => c.key === "r");
    expect(red?.role).toBe("darned");
    // 2 × 2.1 × 1.3 = 5.46 darned + 2 ends × 15 + 1.2 carried = 36.66; × 1.1 = 40.326 → 41 cm
    expect(red?.totalCm).toBe(41);
    expect(red?.breakdownCm.carries).toBe(1);
    expect(out.colours.every((c) => c.skeins?.skeins === 1)).toBe(true);
    expect(out.totals.skeins).toBe(3);
  });

  test("plan null: ends estimated from the areas", () => {
    const out = run({ chart: CHART, plan: null, yarns: YARNS }) as Out;
    expect(out.colours.find((c) => c.key === "r")?.breakdownCm.tails).toBe(30);
  });

  test("a garment's plain parts go to the main colour", () => {
    const out = run({
      chart: CHART,
      plan: null,
      yarns: YARNS,
      garment: { garment: "hat", size: "woman", gauge: { stitchesPer10cm: 20, rowsPer10cm: 28 } },
      chartedAreas: ["band"],
    }) as Out;
    const cream = out.colours.find((c) => c.key === ".");
    expect(cream?.breakdownCm.plain).toBeGreaterThan(5000);
  });

  test.each([
    [{ chart: { ...CHART, rows: ["x..x", ".rr."] }, plan: null, yarns: [] }, /chart: .*the chart has 2 rows, expected 3/],
    [{ chart: CHART, plan: { colours: [{ key: "r", stitches: 2 }] }, yarns: [] }, /plan\.colours\[0\]\.ends/],
    [{ chart: CHART, plan: null, yarns: [{ key: ".", name: "Cream", gramsPerSkein: 50 }] }, /give metresPerSkein or yardsPerSkein/],
    [{ chart: CHART, plan: null, yarns: [{ key: ".", name: "Cream", metresPerSkein: 0, gramsPerSkein: 50 }] }, /metresPerSkein must be more than 0/],
    [{ chart: CHART, plan: null, yarns: [], options: { knit: ["q"] } }, /knit: colour 'q' is not in the chart's palette/],
    [{ chart: CHART, plan: null, yarns: [], chartedAreas: ["band"] }, /give the garment's size input/],
  ])("bad input %# → a message naming the field", (input, message) => {
    expect(() => run(input)).toThrow(message);
  });

  test("a colour with more skeins than its one dye lot gets a note", () => {
    const out = run({ chart: CHART, plan: null, yarns: [{ key: ".", name: "Cream wool", metresPerSkein: 0.1, gramsPerSkein: 1, stockSkeins: 2 }] }) as Out;
    expect(out.warnings.join(" ")).toMatch(/second dye lot/);
  });
});
