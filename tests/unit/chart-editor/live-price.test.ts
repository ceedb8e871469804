import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { LivePrice } from "@/components/chart-editor/live-price";
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

describe("LivePrice", () => {
  // The live price reads the whole garment built from the sizing passed in, not the charts alone.
  const sizing = sizeGarment({ garment: "mitten", size: "child", gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 } });
  const back = sizing.charts.find((c) => c.area === "back of hand")!;

  test("prices every piece of the garment in the commission's currency with a polite live region", () => {
    const chart = createChart(back.width, back.height, sizing.gauge, palette);
    const html = renderToStaticMarkup(
      createElement(LivePrice, { charts: [{ area: "back-of-hand", label: "Back of hand", chart }], baselineKey: "0", pricing, sizing, sizingNote: "Size child: estimated." }),
    );
    expect(html).toContain('aria-live="polite"');
    expect(html).toContain("No change since the version you opened.");
    expect(html).toContain("JP¥3,000 an hour");
    expect(html).toContain("left mitten, right mitten");
    expect(html).toContain("Size child: estimated.");
    expect(html).toMatch(/<caption/);
  });

  test("a chart that does not fit its area is named as not counted", () => {
    const chart = createChart(back.width + 2, back.height, sizing.gauge, palette);
    const html = renderToStaticMarkup(createElement(LivePrice, { charts: [{ area: "back-of-hand", label: "Back of hand", chart }], baselineKey: "0", pricing, sizing }));
    expect(html).toContain("Not counted: Back of hand");
  });

  test("without a sizing it says there is no garment to price", () => {
    const chart = createChart(20, 10, { stitchesPer10cm: 32, rowsPer10cm: 36 }, palette);
    const html = renderToStaticMarkup(createElement(LivePrice, { charts: [{ area: "band", label: "Band", chart }], baselineKey: "0", pricing, sizing: null }));
    expect(html).toContain("no garment to price");
  });
});
