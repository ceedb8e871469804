import { mkdirSync, writeFileSync } from "node:fs";
import sharp from "sharp";
import { describe, expect, test } from "vitest";
import { createChart, placeLettering } from "@/lib/core/chart";
import { renderChartPng, renderPreviewPng } from "@/lib/server/chart-png";

const chart = placeLettering(
  createChart(24, 12, { stitchesPer10cm: 32, rowsPer10cm: 36 }, [
    { key: "A", name: "Gull white", hex: "#F2EEE4" },
    { key: "B", name: "Loch blue", hex: "#2E5A7A" },
  ]),
  { text: "PO", font: "5x7", box: { x: 0, y: 0, width: 24, height: 12 }, colour: 1 },
);

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

describe("chart PNG on the server", () => {
  test("the chart renders as a PNG with both colours in it", async () => {
    const png = await renderChartPng(chart, { cellPx: 12 });
    expect(png.subarray(0, 8).equals(PNG_MAGIC)).toBe(true);
    const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
    expect(info.width).toBeGreaterThanOrEqual(24 * 12);
    const seen = new Set<string>();
    for (let i = 0; i < data.length; i += info.channels) seen.add(`${data[i]},${data[i + 1]},${data[i + 2]}`);
    expect(seen.has("46,90,122")).toBe(true); // Loch blue
    expect(seen.has("242,238,228")).toBe(true); // Gull white
    mkdirSync("test-results/png", { recursive: true });
    writeFileSync("test-results/png/chart.png", png);
  });

  test("the knitted preview keeps the gauge's proportions and honours the width limit", async () => {
    const png = await renderPreviewPng(chart, { stitchPx: 20 });
    const meta = await sharp(png).metadata();
    // 24 stitches × 20 px wide; 12 rows × 20 × (32 / 36) px tall: a stitch is wider than it is tall
    expect(meta.width).toBeGreaterThanOrEqual(480);
    expect((meta.height ?? 0) / (meta.width ?? 1)).toBeLessThan(12 / 24);
    const small = await renderPreviewPng(chart, { stitchPx: 20, maxWidthPx: 200 });
    expect((await sharp(small).metadata()).width).toBe(200);
    writeFileSync("test-results/png/preview.png", png);
  });
});
