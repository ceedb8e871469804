import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { LivePrice } from "@/components/chart-editor/live-price";
import { createChart } from "@/lib/core/chart/model";

const palette = [
  { key: "A", name: "Oat", hex: "#EFE6D2" },
  { key: "B", name: "Red", hex: "#9E2B25" },
];

describe("LivePrice", () => {
  test("prices the charts in the commission's currency with a polite live region", () => {
    const chart = createChart(20, 10, { stitchesPer10cm: 32, rowsPer10cm: 36 }, palette);
    const html = renderToStaticMarkup(
      createElement(LivePrice, {
        charts: [{ label: "Back of hand", chart }],
        baselineKey: "0",
        pricing: {
          policy: { currency: "JPY", hourlyRateMinor: 3000, labourPolicy: "p80", taxRatePercent: 10, pricesIncludeTax: true, depositPercent: 50 },
          designFeeMinor: 2000,
          floatLimitStitches: 5,
        },
      }),
    );
    expect(html).toContain('aria-live="polite"');
    expect(html).toContain("No change since the version you opened.");
    expect(html).toContain("JP¥3,000 an hour");
    expect(html).toMatch(/<caption/);
  });
});
