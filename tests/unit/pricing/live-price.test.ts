import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import type { QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { rowShape } from "@/lib/core/design-garment";
import { livePrice, piecesFromGarment } from "@/lib/core/pricing/live-price";
import { sizeGarment } from "@/lib/core/sizing";

const mitten: PieceFeatures = { label: "Back", newDesign: true, proofRounds: 1, plainStitches: 2000, strandedStitches: 3000, duplicateStitches: 60, ends: 6, carryCm: 40, blocked: true };
const more: PieceFeatures = { ...mitten, duplicateStitches: 98, ends: 10 };

const policy = (currency: string, hourlyRateMinor: number, extra: Partial<QuotePolicy> = {}): QuotePolicy => ({
  currency,
  hourlyRateMinor,
  labourPolicy: "p50",
  taxRatePercent: 0,
  pricesIncludeTax: true,
  depositPercent: 50,
  ...extra,
});

// Embroidery at the default rates: 51.33 → 82.33 min, so 51 → 82 min, 31 more minutes (P50).
describe("livePrice: two feature sets → sentence and amount", () => {
  test.each([
    { name: "GBP £24.00/h", p: policy("GBP", 2400), text: "+38 duplicate stitches, +4 ends: +£12.40", amount: 1240, total: 1240 },
    { name: "JPY ¥2,400/h (0 minor digits)", p: policy("JPY", 2400), text: "+38 duplicate stitches, +4 ends: +JP¥1,240", amount: 1240, total: 1240 },
    { name: "JPY removing work", p: policy("JPY", 3000), before: more, after: mitten, text: "-38 duplicate stitches, -4 ends: -JP¥1,550", amount: -1550, total: -1550 },
    // P80 (× 1.25): 64 → 103 min, 39 min × 40p = £15.60; the total adds 20 % tax on top: +£18.72.
    { name: "GBP P80, tax added", p: policy("GBP", 2400, { labourPolicy: "p80", taxRatePercent: 20, pricesIncludeTax: false }), text: "+38 duplicate stitches, +4 ends: +£15.60", amount: 1560, total: 1872 },
  ])("$name", ({ p, before, after, text, amount, total }) => {
    const r = livePrice([before ?? mitten], [after ?? more], p, 5000);
    expect(r.change.text).toBe(text);
    expect(r.change.amountDeltaMinor).toBe(amount);
    expect(r.totalDeltaMinor).toBe(total);
    expect(r.composed.quote.currency).toBe(p.currency);
    expect(r.composed.quote.lines.some((l) => l.kind === "design" || /design fee/i.test(l.label))).toBe(true);
  });

  test("no change says so, and the quote still prices the pieces", () => {
    const r = livePrice([mitten], [mitten], policy("GBP", 2400), 0);
    expect(r.change.text).toBe("no change: £0.00");
    expect(r.totalDeltaMinor).toBe(0);
    expect(r.composed.quote.totalMinor).toBeGreaterThan(0);
  });
});

describe("piecesFromGarment: the live price reads the whole garment", () => {
  // A child mitten pair at 32 sts / 36 rnds per 10 cm; every count below is read from the size
  // verb's own output (pieces × quantity), not from the garment reading under test.
  const sizing = sizeGarment({ garment: "mitten", size: "child", gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 } });
  const sizedStitches = sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0);
  const back = sizing.charts.find((c) => c.area === "back of hand")!;
  const palette = [
    { key: "a", name: "Cream", hex: "#ffffff" },
    { key: "b", name: "Blue", hex: "#0000ff" },
  ];

  test("no charts: every stitch of both mittens, plain; design once, blocking per mitten", () => {
    const { pieces, problems } = piecesFromGarment(sizing, []);
    expect(problems).toEqual([]);
    expect(pieces.map((p) => p.label)).toEqual(["left mitten", "right mitten"]);
    expect(pieces.reduce((s, p) => s + (p.plainStitches ?? 0) + (p.strandedStitches ?? 0), 0)).toBe(sizedStitches);
    expect(pieces.map((p) => p.newDesign)).toEqual([true, false]);
    expect(pieces.map((p) => p.thumbs)).toEqual([1, 1]);
    expect(pieces.every((p) => p.blocked === true && p.strandedStitches === 0)).toBe(true);
  });

  test("a two-colour back-of-hand chart adds exactly the area's in-shape stitches to stranded, per mitten; totals unchanged", () => {
    const chart = createChart(back.width, back.height, sizing.gauge, palette);
    // Two colours in every row, and nothing painted outside the narrowing top.
    for (let y = 0; y < back.height; y++) {
      const mask = rowShape(back, y);
      const x = mask.indexOf(true);
      chart.cells[y * back.width + x] = 1;
    }
    const plain = piecesFromGarment(sizing, []).pieces;
    const { pieces, problems } = piecesFromGarment(sizing, [{ area: "back-of-hand", label: "Back", chart }]);
    expect(problems).toEqual([]);
    for (const [i, p] of pieces.entries()) {
      expect((p.plainStitches ?? 0) + (p.strandedStitches ?? 0)).toBe((plain[i].plainStitches ?? 0) + (plain[i].strandedStitches ?? 0));
    }
    // The garment rule: exactly the area's in-shape stitches (the size verb's charts[].stitches), on each mitten.
    expect(pieces.map((p) => p.strandedStitches)).toEqual([back.stitches, back.stitches]);
  });

  test("a chart of the wrong size or an unknown area is reported with its label, never silently dropped", () => {
    const wrong = createChart(back.width + 1, back.height, sizing.gauge, palette);
    const { problems } = piecesFromGarment(sizing, [
      { area: "back-of-hand", label: "Too wide", chart: wrong },
      { area: "sleeve", label: "Elsewhere", chart: createChart(4, 4, sizing.gauge, palette) },
    ]);
    expect(problems.map((p) => p.label)).toEqual(["Too wide", "Elsewhere"]);
    expect(problems[0].message).toMatch(/back of hand is \d+ stitches × \d+ rows/);
    expect(problems[1].message).toMatch(/not an area of this mitten/);
  });
});
