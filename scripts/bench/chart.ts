// Chart core benchmark: median milliseconds per operation on a 300 × 200 chart.
// Run with `npm run bench:chart`; prints one JSON line per item, then a summary line.
import { getStitchCounts, getRowCounts } from "@/lib/core/chart/counts";
import { parseChart, serializeChart } from "@/lib/core/chart/format";
import { makeMirroredPair } from "@/lib/core/chart/layered-design";
import { createChart, type Chart } from "@/lib/core/chart/model";
import { getMotif } from "@/lib/core/chart/motifs";
import {
  copyRegion,
  drawLine,
  drawRect,
  flipHorizontal,
  flipVertical,
  floodFill,
  moveRegion,
  paintCell,
  paintCells,
  placeLettering,
  placeMotif,
  resizeChart,
  stampChart,
  tileMotif,
  tileRepeat,
} from "@/lib/core/chart/ops";
import { rasterizeChart } from "@/lib/core/chart/raster";
import { renderChartSvg, renderPreviewSvg } from "@/lib/core/chart/render-svg";
import { benchPhoto } from "./photo";

const RUNS = 50;
const WARMUP = 5;
const W = 300;
const H = 200;

const palette = [
  { key: ".", name: "Natural", hex: "#F2EDE3" },
  { key: "X", name: "Midnight", hex: "#1F3A5F" },
  { key: "r", name: "Lingonberry", hex: "#A3243B" },
  { key: "g", name: "Spruce", hex: "#2F5D50" },
];

function buildChart(): Chart {
  let chart = createChart(W, H, { stitchesPer10cm: 32, rowsPer10cm: 36 }, palette);
  chart = tileMotif(chart, getMotif("lattice"), { x: 0, y: 0, width: W, height: H }, { pattern: 1 });
  chart = tileMotif(chart, getMotif("star-eight"), { x: 0, y: 60, width: W, height: 13 }, { pattern: 2, background: 0 });
  return chart;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

// Keep results reachable so the engine cannot drop the work.
let sink = 0;
function consume(v: unknown): void {
  if (v && typeof v === "object" && "cells" in v) sink ^= (v as Chart).cells[0];
  else if (typeof v === "string") sink ^= v.length;
  else if (v && typeof v === "object" && "data" in v) sink ^= (v as { data: Uint8ClampedArray }).data[0];
  else sink ^= 1;
}

const chart = buildChart();
const doc = serializeChart(chart);
const region = copyRegion(chart, { x: 10, y: 10, width: 40, height: 30 });
const brush = Array.from({ length: 100 }, (_, i) => ({ x: (i * 37) % W, y: (i * 53) % H }));
// One solid colour everywhere: the worst case for a fill, every cell is in the region.
const blank = drawRect(createChart(W, H, chart.gauge, palette), { x: 0, y: 0, width: W, height: H }, 1);

const items: [string, () => unknown][] = [
  ["repaint (raster 4 px/stitch, gauge aspect)", () => rasterizeChart(chart, { pxPerStitch: 4 })],
  ["repaint (raster 4 px/stitch, with grid)", () => rasterizeChart(chart, { pxPerStitch: 4, grid: [0, 0, 0, 60] })],
  ["paintCell", () => paintCell(chart, { x: 150, y: 100 }, 3)],
  ["paintCells (100 cells)", () => paintCells(chart, brush, 3)],
  ["floodFill (whole 300 × 200 area)", () => floodFill(blank, { x: 150, y: 100 }, 2)],
  ["floodFill (lattice cell)", () => floodFill(chart, { x: 2, y: 1 }, 3)],
  ["drawLine (diagonal)", () => drawLine(chart, { x: 0, y: 0 }, { x: 299, y: 199 }, 3)],
  ["drawRect outline", () => drawRect(chart, { x: 20, y: 20, width: 200, height: 150 }, 3)],
  ["drawRect filled", () => drawRect(chart, { x: 20, y: 20, width: 200, height: 150 }, 3, { filled: true })],
  ["copyRegion 40 × 30", () => copyRegion(chart, { x: 10, y: 10, width: 40, height: 30 })],
  ["stampChart 40 × 30 (transparent)", () => stampChart(chart, region, { x: 200, y: 120 }, { transparent: 0 })],
  ["moveRegion 40 × 30", () => moveRegion(chart, { x: 10, y: 10, width: 40, height: 30 }, { x: 200, y: 120 }, { fill: 0 })],
  ["flipHorizontal (whole)", () => flipHorizontal(chart)],
  ["flipVertical (whole)", () => flipVertical(chart)],
  ["flipHorizontal (region 100 × 100)", () => flipHorizontal(chart, { x: 50, y: 50, width: 100, height: 100 })],
  ["resizeChart to 320 × 220 (centre)", () => resizeChart(chart, 320, 220, "centre", 0)],
  ["tileRepeat 40 × 30 across 300 × 200", () => tileRepeat(region, W, H)],
  ["tileMotif across the chart", () => tileMotif(chart, getMotif("snowflake-small"), { x: 0, y: 0, width: W, height: H }, { pattern: 2 })],
  ["placeMotif (reindeer)", () => placeMotif(chart, getMotif("reindeer"), { x: 100, y: 100 }, { pattern: 3, background: 0 })],
  ["placeLettering 5×7", () => placeLettering(chart, { text: "ANNA & JO", font: "5x7", box: { x: 100, y: 150, width: 80, height: 9 }, colour: 2, background: 0 })],
  ["makeMirroredPair (one lettering layer)", () => makeMirroredPair(chart, [{ text: "ANNA", font: "5x7", box: { x: 20, y: 150, width: 40, height: 9 }, colour: 2 }])],
  ["getStitchCounts", () => getStitchCounts(chart)],
  ["getRowCounts", () => getRowCounts(chart)],
  ["serializeChart", () => serializeChart(chart)],
  ["parseChart (validate + build)", () => parseChart(doc)],
  ["renderChartSvg", () => renderChartSvg(chart, { cellPx: 8 })],
  ["renderPreviewSvg", () => renderPreviewSvg(chart, { stitchPx: 6 })],
];

const results: { item: string; medianMs: number }[] = [];
for (const [item, fn] of items) {
  for (let i = 0; i < WARMUP; i++) consume(fn());
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    consume(fn());
    times.push(performance.now() - t0);
  }
  const medianMs = Math.round(median(times) * 1000) / 1000;
  results.push({ item, medianMs });
  process.stdout.write(JSON.stringify({ item, chart: `${W}x${H}`, runs: RUNS, medianMs, minMs: Math.round(Math.min(...times) * 1000) / 1000 }) + "\n");
}
const repaint = results[0].medianMs;
const slowest = results.reduce((a, b) => (b.medianMs > a.medianMs ? b : a));
const editing = results.filter((r) => !/Svg|parseChart|serializeChart/.test(r.item));
process.stdout.write(
  JSON.stringify({
    summary: true,
    chart: `${W}x${H}`,
    runs: RUNS,
    items: results.length,
    repaintMs: repaint,
    slowestEditMs: Math.max(...editing.map((r) => r.medianMs)),
    slowest: slowest.item,
    slowestMs: slowest.medianMs,
    checksum: sink & 1,
  }) + "\n",
);
// Photo → chart: a 12-megapixel picture to a 60 × 80 chart (scripts/bench/photo.ts).
benchPhoto();
