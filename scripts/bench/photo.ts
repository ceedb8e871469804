// Photo → chart benchmark: a 12-megapixel picture (4000 × 3000) to a 60 × 80 chart, with a palette
// and with colours chosen, against a baseline in the same run: one plain pass reading every pixel.
// By default only the middle half of each stitch (a quarter of the pixels) is read; the inset-0 line
// reads every pixel.
// Printed by `npm run bench:chart` (last lines) and on its own by `npm run bench:photo`.
import { pathToFileURL } from "node:url";
import { chartToPixels, photoToChart, type RgbaImage } from "@/lib/core/photo";

const RUNS = 7;

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

function time(fn: () => number): { medianMs: number; sink: number } {
  let sink = fn(); // warm-up
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    sink ^= fn();
    times.push(performance.now() - t0);
  }
  return { medianMs: Math.round(median(times) * 10) / 10, sink };
}

/** 4000 × 3000 px: an 80 × 60 chart of blocks and stripes drawn 50 px per stitch, with pixel noise. */
export function makePhoto(): RgbaImage {
  const palette = [
    { key: ".", name: "Oat", hex: "#EFE6D2" },
    { key: "X", name: "Midnight", hex: "#1F3A5F" },
    { key: "r", name: "Lingonberry", hex: "#A3243B" },
    { key: "g", name: "Spruce", hex: "#2F5D50" },
  ];
  const rows = Array.from({ length: 60 }, (_, r) => Array.from({ length: 80 }, (_, c) => ".Xrg"[(Math.floor(c / 7) + Math.floor(r / 5) + (r % 9 === 0 ? 2 : 0)) % 4]).join(""));
  const img = chartToPixels({ version: 1, width: 80, height: 60, gauge: { stitchesPer10cm: 24, rowsPer10cm: 30 }, palette, rows }, 50, 50);
  let s = 12345;
  for (let i = 0; i < img.data.length; i++) {
    if ((i & 3) === 3) continue;
    s = (s * 1103515245 + 12345) >>> 0;
    img.data[i] = Math.max(0, Math.min(255, img.data[i] + ((s >>> 24) % 17) - 8));
  }
  return img;
}

export function benchPhoto(): void {
  const img = makePhoto();
  const gauge = { stitchesPer10cm: 24, rowsPer10cm: 30 };
  const palette = [
    { key: ".", name: "Oat", hex: "#EFE6D2" },
    { key: "X", name: "Midnight", hex: "#1F3A5F" },
    { key: "r", name: "Lingonberry", hex: "#A3243B" },
    { key: "g", name: "Spruce", hex: "#2F5D50" },
    { key: "y", name: "Mustard", hex: "#D4A236" },
  ];
  const baseline = time(() => {
    let sum = 0;
    const d = img.data;
    for (let i = 0; i < d.length; i++) sum += d[i];
    return sum & 1;
  });
  const items: [string, () => number][] = [
    ["photoToChart 12 MP → 60 × 80, palette of 5", () => photoToChart(img, { width: 60, height: 80, gauge, palette }).chart.rows.length],
    ["photoToChart 12 MP → 60 × 80, palette of 5, every pixel (inset 0)", () => photoToChart(img, { width: 60, height: 80, gauge, palette, sampling: { inset: 0 } }).chart.rows.length],
    ["photoToChart 12 MP → 60 × 80, 6 colours chosen", () => photoToChart(img, { width: 60, height: 80, gauge, colours: 6 }).chart.rows.length],
    ["photoToChart 12 MP → 400 × 400, 16 colours chosen", () => photoToChart(img, { width: 400, height: 400, gauge, colours: 16 }).chart.rows.length],
  ];
  for (const [item, fn] of items) {
    const r = time(fn);
    process.stdout.write(
      JSON.stringify({
        item,
        pixels: img.width * img.height,
        runs: RUNS,
        medianMs: r.medianMs,
        baselineMs: baseline.medianMs,
        baseline: "one plain pass reading every byte of the same pixels",
        ratio: Math.round((r.medianMs / baseline.medianMs) * 10) / 10,
        checksum: (r.sink ^ baseline.sink) & 1,
      }) + "\n",
    );
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) benchPhoto();
