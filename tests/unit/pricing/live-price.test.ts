import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import type { QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { livePrice, piecesFromCharts } from "@/lib/core/pricing/live-price";

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

describe("piecesFromCharts", () => {
  test("a third colour is darned along its route: stitches and two ends", () => {
    const palette = [
      { key: "a", name: "Cream", hex: "#ffffff" },
      { key: "b", name: "Blue", hex: "#0000ff" },
      { key: "c", name: "Red", hex: "#ff0000" },
    ];
    const chart = createChart(10, 2, { stitchesPer10cm: 30, rowsPer10cm: 32 }, palette);
    chart.cells.set([1, 1, 1, 2, 0, 0, 0, 0, 0, 0], 0);
    // Bottom row b b b c a a a a a a, top row all a: pair a+b is knitted (row 1 stranded, row 2
    // plain, 10 each); the single c is darned: one strand, 2 ends.
    const [piece] = piecesFromCharts([{ label: "Cuff", chart }]);
    expect(piece).toMatchObject({ label: "Cuff", newDesign: true, proofRounds: 1, blocked: true, plainStitches: 10, strandedStitches: 10, duplicateStitches: 1, ends: 2 });
  });
});
