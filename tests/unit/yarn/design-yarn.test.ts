import fc from "fast-check";
import { describe, expect, test } from "vitest";
import type { Chart } from "@/lib/core/chart/model";
import { estimateChartYarn } from "@/lib/core/yarn/chart-yarn";
import { estimateDesignYarn, matchStudioYarn, type StudioYarnRecord } from "@/lib/core/yarn/design-yarn";
import { chartOf } from "./charts";

const YARNS: StudioYarnRecord[] = [
  { id: "y-cream", name: "Fellside 4-ply", colourName: "Cream", hex: "#f0ead6", metresPerSkein: 2, gramsPerSkein: 50, lots: [{ lot: "L1", skeins: 40 }] },
  { id: "y-navy", name: "Fellside 4-ply", colourName: "Navy", hex: "#1F2A44", metresPerSkein: 2, gramsPerSkein: 50 },
  { id: "y-navy-2", name: "Tarn DK", colourName: "Midnight", hex: "#1F2A44", metresPerSkein: 2, gramsPerSkein: 50 },
];

// Two 4 × 4 charts, both with a red darned stitch: a pair, knitted one after the other.
const LEFT = chartOf(["AAAA", "ABCA", "AABA", "AAAA"]);
const RIGHT = chartOf(["AAAA", "ACBA", "ABAA", "AAAA"]);

describe("matching a palette colour to the studio's yarns", () => {
  test.each([
    { colour: { name: "Cream", hex: "#F0EAD6" }, id: "y-cream", why: "same hex, case ignored" },
    { colour: { name: "Navy", hex: "#1f2a44" }, id: "y-navy", why: "two yarns share the hex: the colour name decides" },
    { colour: { name: "Midnight", hex: "#1F2A44" }, id: "y-navy-2", why: "the colour name decides the other way" },
    { colour: { name: "Ink", hex: "#1F2A44" }, id: "y-navy", why: "no name matches: the first listed" },
    { colour: { name: "Red", hex: "#C0392B" }, id: null, why: "no yarn has the hex" },
  ])("$why", ({ colour, id }) => {
    expect(matchStudioYarn(colour, YARNS)?.id ?? null).toBe(id);
  });
});

describe("a pair of charts", () => {
  const est = estimateDesignYarn({ charts: [{ label: "Left", chart: LEFT, plan: null }, { label: "Right", chart: RIGHT, plan: null }], yarns: YARNS });
  const line = (label: string) => est.lines.find((l) => l.label === label);

  test("each colour's length is the sum over both charts, with the margin, rounded up to the cm", () => {
    const perChart = (c: Chart, key: string) => {
      const y = estimateChartYarn(c, null).colours.find((x) => x.key === key)!;
      return y.cm.knitted + y.cm.floats + y.cm.darned + y.cm.tails + y.cm.carries + y.cm.castOn + y.cm.bindOff;
    };
    const cream = perChart(LEFT, "A") + perChart(RIGHT, "A");
    expect(line("Fellside 4-ply, Cream")?.totalCm).toBe(Math.ceil(cream * 1.1 - 1e-9));
    expect(line("Fellside 4-ply, Cream")?.uses).toEqual(["Left", "Right"]);
  });

  test("skeins are counted once for the pair, not rounded up per chart", () => {
    const cream = line("Fellside 4-ply, Cream")!;
    expect(cream.skeins?.skeins).toBe(Math.ceil(cream.totalCm / 200));
    const single = estimateDesignYarn({ charts: [{ label: "Left", chart: LEFT, plan: null }], yarns: YARNS }).lines[0];
    expect(cream.skeins!.skeins).toBeLessThanOrEqual(2 * single.skeins!.skeins);
  });

  test("a colour no studio yarn has gets metres only and a warning naming it", () => {
    const red = line("Red")!;
    expect(red.yarnId).toBeNull();
    expect(red.skeins).toBeNull();
    expect(red.roles).toEqual(["darned"]);
    expect(est.warnings.some((w) => w.includes("Red") && w.includes("#C0392B"))).toBe(true);
  });

  test("lines come longest first and the totals add them up", () => {
    const cms = est.lines.map((l) => l.totalCm);
    expect([...cms].sort((a, b) => b - a)).toEqual(cms);
    expect(est.totals.metres).toBe(Math.ceil((cms.reduce((s, v) => s + v, 0) / 100) * 10 - 1e-9) / 10);
  });

  test("a yarn short in stock says so (Navy has no lots recorded, Cream has 40 skeins in one lot)", () => {
    const tight = estimateDesignYarn({
      charts: [{ label: "Left", chart: LEFT, plan: null }],
      yarns: [{ ...YARNS[0], lots: [{ lot: "L1", skeins: 0 }] }, YARNS[1]],
    });
    const cream = tight.lines.find((l) => l.yarnId === "y-cream")!;
    expect(cream.skeins?.shortBy).toBe(cream.skeins?.skeins);
    expect(tight.warnings.some((w) => w.includes("order"))).toBe(true);
  });
});

describe("the garment's plain parts", () => {
  const plain = { loopLengthCm: 2.1, pieces: [], totalCm: 1000 };

  test("are added to the first chart's main colour and carry the cast-on in place of the charts", () => {
    const without = estimateDesignYarn({ charts: [{ label: "Band", chart: LEFT, plan: null }], yarns: YARNS, options: { marginPercent: 0 } });
    const withPlain = estimateDesignYarn({ charts: [{ label: "Band", chart: LEFT, plan: null }], yarns: YARNS, plain, options: { marginPercent: 0 } });
    const castOn = estimateChartYarn(LEFT, null).colours.find((c) => c.key === "A")!.cm.castOn;
    const a = without.lines.find((l) => l.yarnId === "y-cream")!;
    const b = withPlain.lines.find((l) => l.yarnId === "y-cream")!;
    expect(b.uses).toContain("plain parts");
    expect(Math.abs(b.totalCm - (a.totalCm + 1000 - castOn))).toBeLessThanOrEqual(1);
  });
});

test("a margin outside 0–100 % is refused", () => {
  expect(() => estimateDesignYarn({ charts: [], yarns: [], options: { marginPercent: 150 } })).toThrow(/marginPercent/);
});

test("property: a bigger margin never asks for less yarn or fewer skeins", () => {
  fc.assert(
    fc.property(fc.integer({ min: 0, max: 60 }), fc.integer({ min: 0, max: 40 }), (m, extra) => {
      const charts = [{ label: "Left", chart: LEFT, plan: null }];
      const lo = estimateDesignYarn({ charts, yarns: YARNS, options: { marginPercent: m } });
      const hi = estimateDesignYarn({ charts, yarns: YARNS, options: { marginPercent: m + extra } });
      for (const l of lo.lines) {
        const h = hi.lines.find((x) => x.label === l.label)!;
        expect(h.totalCm).toBeGreaterThanOrEqual(l.totalCm);
        expect(h.skeins?.skeins ?? 0).toBeGreaterThanOrEqual(l.skeins?.skeins ?? 0);
      }
    }),
  );
});
