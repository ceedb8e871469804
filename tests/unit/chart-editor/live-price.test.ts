import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { answer, readGarment } from "@/components/chart-editor/garment-reading";
import { LivePrice, LivePriceView } from "@/components/chart-editor/live-price";
import type { ChartPiece } from "@/lib/core/pricing/live-price";
import type { SizingResult } from "@/lib/core/sizing";
import { createChart } from "@/lib/core/chart/model";
import { sizeGarment } from "@/lib/core/sizing";

const palette = [
  { key: "A", name: "Oat", hex: "#EFE6D2" },
  { key: "B", name: "Red", hex: "#9E2B25" },
];
const pricing = {
  policy: { currency: "JPY", hourlyRateMinor: 3000, labourPolicy: "p80" as const, taxRatePercent: 10, pricesIncludeTax: true, depositPercent: 50 },
  designFeeMinor: 2000,
  floatLimitStitches: 5,
};

// The view as it shows once the worker has answered: the same reading the worker makes
// (garment-reading.ts), for the opened version and now.
function answered(charts: ChartPiece[], sizing: SizingResult | null, sizingNote?: string) {
  const read = readGarment(sizing, charts, pricing);
  return createElement(LivePriceView, { reading: { read, pending: false, baseline: { key: "0", read } }, baselineKey: "0", pricing, sizingNote });
}

describe("LivePrice", () => {
  // The live price reads the whole garment built from the sizing passed in, not the charts alone.
  const sizing = sizeGarment({ garment: "mitten", size: "child", gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 } });
  const back = sizing.charts.find((c) => c.area === "back of hand")!;

  test("prices every piece of the garment in the commission's currency with a polite live region", () => {
    const chart = createChart(back.width, back.height, sizing.gauge, palette);
    const html = renderToStaticMarkup(answered([{ area: "back-of-hand", label: "Back of hand", chart }], sizing, "Size child: estimated."));
    expect(html).toContain('aria-live="polite"');
    expect(html).toContain("No change since the version you opened.");
    expect(html).toContain("JP¥3,000 an hour");
    expect(html).toContain("left mitten, right mitten");
    expect(html).toContain("Size child: estimated.");
    expect(html).toMatch(/<caption/);
  });

  test("a chart that does not fit its area is named as not counted", () => {
    const chart = createChart(back.width + 2, back.height, sizing.gauge, palette);
    const html = renderToStaticMarkup(answered([{ area: "back-of-hand", label: "Back of hand", chart }], sizing));
    expect(html).toContain("Not counted: Back of hand");
  });

  test("without a sizing it says there is no garment to price", () => {
    const chart = createChart(20, 10, { stitchesPer10cm: 32, rowsPer10cm: 36 }, palette);
    const html = renderToStaticMarkup(answered([{ area: "band", label: "Band", chart }], null));
    expect(html).toContain("no garment to price");
  });

  test("the garment is not read while rendering: the first render says the price is being worked out", () => {
    const chart = createChart(back.width, back.height, sizing.gauge, palette);
    const html = renderToStaticMarkup(createElement(LivePrice, { charts: [{ area: "back-of-hand", label: "Back of hand", chart }], baselineKey: "0", pricing, sizing }));
    expect(html).toContain("Working out the price");
    expect(html).not.toContain("<caption");
  });

  test("while a newer reading is pending, the last price stays on screen and says it is from before the edit", () => {
    const chart = createChart(back.width, back.height, sizing.gauge, palette);
    const read = readGarment(sizing, [{ area: "back-of-hand", label: "Back of hand", chart }], pricing);
    const html = renderToStaticMarkup(createElement(LivePriceView, { reading: { read, pending: true, baseline: { key: "0", read } }, baselineKey: "0", pricing }));
    expect(html).toContain("Working out the price");
    expect(html).toContain("from before your last edit");
    expect(html).toMatch(/<caption/);
  });
});

describe("the garment worker's messages", () => {
  const sizing = sizeGarment({ garment: "mitten", size: "child", gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 } });
  const back = sizing.charts.find((c) => c.area === "back of hand")!;

  test("a request survives the structured clone a worker receives, and its answer carries its number", () => {
    const chart = createChart(back.width, back.height, sizing.gauge, palette);
    chart.cells[back.width + Math.floor(back.width / 2)] = 1;
    const req = { seq: 7, sizing, charts: [{ area: "back-of-hand", label: "Back of hand", chart }], pricing };
    const here = answer(req);
    const there = structuredClone(answer(structuredClone(req)));
    expect(there.seq).toBe(7);
    expect(there.read.error).toBeNull();
    expect(there.read.pieces).toEqual(here.read.pieces);
    expect(there.read.rounds.length).toBe(here.read.rounds.length);
  });
});
