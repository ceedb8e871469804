// Synthetic knitted-chart "photos" for the photo → chart tests: charts with lettering, motifs and
// stripes in 2 to 6 yarn colours (some close to each other), drawn at the gauge's proportions, then
// blurred, noised and JPEG-compressed (see degrade.ts) the way a held-out check would.
import { getColourDifference } from "@/lib/core/colourwork/ciede2000";
import { serializeChart, type ChartV1 } from "@/lib/core/chart/format";
import { createChart, type Gauge, type PaletteColour } from "@/lib/core/chart/model";
import { getMotif, MOTIFS } from "@/lib/core/chart/motifs";
import { drawLine, drawRect, placeLettering, placeMotif, tileMotif } from "@/lib/core/chart/ops";
import { seededRandom } from "@/lib/core/photo";

/** Yarn-like colours; several come in near pairs (ΔE00 about 5 to 12) on purpose. */
export const YARNS: PaletteColour[] = [
  { key: ".", name: "Oat", hex: "#EFE6D2" },
  { key: "X", name: "Midnight", hex: "#1F3A5F" },
  { key: "r", name: "Lingonberry", hex: "#A3243B" },
  { key: "g", name: "Spruce", hex: "#2F5D50" },
  { key: "y", name: "Mustard", hex: "#D4A236" },
  { key: "b", name: "Harbour", hex: "#2E5E8C" },
  { key: "p", name: "Heather", hex: "#8E6C8A" },
  { key: "k", name: "Peat", hex: "#3B2F2A" },
  { key: "c", name: "Coral", hex: "#E07A5F" },
  { key: "m", name: "Moss", hex: "#6B7F3A" },
  { key: "s", name: "Sky", hex: "#9CC3E0" },
  { key: "w", name: "Snow", hex: "#FAFAF7" },
  { key: "R", name: "Rowan red", hex: "#9E2B25" },
  { key: "G", name: "Sage", hex: "#8FA58A" },
  { key: "Y", name: "Honey", hex: "#C8922E" },
  { key: "B", name: "Navy", hex: "#22304F" },
];

export interface SynthCase {
  chart: ChartV1;
  /** pixels per stitch across and per row down (at the gauge's proportions) */
  cellWidth: number;
  cellHeight: number;
  /** smallest ΔE00 between two colours of the palette */
  closestPair: number;
}

const GAUGES: Gauge[] = [
  { stitchesPer10cm: 24, rowsPer10cm: 30 },
  { stitchesPer10cm: 32, rowsPer10cm: 36 },
  { stitchesPer10cm: 20, rowsPer10cm: 28 },
  { stitchesPer10cm: 28, rowsPer10cm: 34 },
];
const WORDS = ["ANNA", "JO & MAE", "1987", "HELLO", "FOX", "BEA", "TOM 7", "WOOL"];

/** Palette of n yarns; with `similar`, the second pattern colour is a near neighbour of the first. */
function pickPalette(n: number, random: () => number, similar: boolean): PaletteColour[] {
  const pool = [...YARNS];
  const out: PaletteColour[] = [];
  const take = (i: number) => out.push(pool.splice(i, 1)[0]);
  take(Math.floor(random() * pool.length));
  while (out.length < n) {
    if (similar && out.length === 2) {
      // Nearest remaining yarn to colour 1 (ΔE00 ≥ 4 so that it is a different yarn at all).
      let best = -1;
      let bestD = Infinity;
      pool.forEach((p, i) => {
        const d = getColourDifference(p.hex, out[1].hex);
        if (d >= 4 && d < bestD) [best, bestD] = [i, d];
      });
      take(best);
      continue;
    }
    // Otherwise any yarn at least ΔE00 4 from those taken.
    const ok = pool.map((p, i) => [p, i] as const).filter(([p]) => out.every((o) => getColourDifference(o.hex, p.hex) >= 4));
    take(ok[Math.floor(random() * ok.length)][1]);
  }
  return out;
}

export function closestPair(palette: PaletteColour[]): number {
  let min = Infinity;
  for (let i = 0; i < palette.length; i++) for (let j = i + 1; j < palette.length; j++) min = Math.min(min, getColourDifference(palette[i].hex, palette[j].hex));
  return min;
}

/** A chart with stripes, a tiled border, a motif and lettering, in `colours` colours. */
export function makeCase(seed: number, colours: number, size: { width: number; height: number } = { width: 60, height: 80 }): SynthCase {
  const random = seededRandom(seed);
  const int = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
  const gauge = GAUGES[seed % GAUGES.length];
  const palette = pickPalette(colours, random, colours >= 3 && random() < 0.7);
  const { width, height } = size;
  let chart = createChart(width, height, gauge, palette);
  const col = (i: number) => Math.min(palette.length - 1, i);
  // A tiled border near the bottom and near the top.
  const borders = MOTIFS.filter((m) => m.tags[0] === "border" && m.height <= 9);
  const b1 = borders[int(0, borders.length - 1)];
  chart = tileMotif(chart, b1, { x: 0, y: 2, width, height: b1.height }, { pattern: col(1) });
  chart = tileMotif(chart, b1, { x: 0, y: height - 2 - b1.height, width, height: b1.height }, { pattern: col(colours >= 4 ? 3 : 1) });
  // Stripes one and two rows tall.
  chart = drawRect(chart, { x: 0, y: b1.height + 4, width, height: 1 }, col(2), { filled: true });
  chart = drawRect(chart, { x: 0, y: b1.height + 6, width, height: 2 }, col(colours >= 5 ? 4 : 1), { filled: true });
  // A pictorial motif in the middle.
  const pictures = MOTIFS.filter((m) => m.tags[0] === "motif" && m.width <= width - 4 && m.height <= height / 2 - 6);
  if (pictures.length) {
    const m = pictures[int(0, pictures.length - 1)];
    chart = placeMotif(chart, m, { x: int(1, width - m.width - 1), y: Math.floor(height / 2) - 4 }, { pattern: col(2) });
  }
  // A diagonal line and a small box outline.
  chart = drawLine(chart, { x: int(0, 5), y: b1.height + 10 }, { x: int(width - 10, width - 1), y: Math.floor(height / 2) - 6 }, col(colours >= 6 ? 5 : 3));
  chart = drawRect(chart, { x: int(2, 10), y: int(b1.height + 12, b1.height + 16), width: 7, height: 5 }, col(1));
  // Lettering across, 5×7 if it fits, else 3×5.
  const word = WORDS[int(0, WORDS.length - 1)];
  const box = { x: 1, y: height - b1.height - 14, width: width - 2, height: 9 };
  try {
    chart = placeLettering(chart, { text: word, font: "5x7", box, colour: col(colours >= 4 ? 3 : 2), background: random() < 0.5 ? undefined : 0 });
  } catch {
    chart = placeLettering(chart, { text: word.slice(0, 3), font: "3x5", box: { ...box, height: 6 }, colour: col(2) });
  }
  // A few lone stitches (eyes, dots) in the last colour.
  for (let i = 0; i < 6; i++) chart = drawRect(chart, { x: int(0, width - 1), y: int(0, height - 1), width: 1, height: 1 }, col(colours - 1));
  // Cell size at the gauge's proportions: height ÷ width = stitches ÷ rows per 10 cm.
  const cellWidth = int(8, 14);
  const cellHeight = Math.max(1, Math.round((cellWidth * gauge.stitchesPer10cm) / gauge.rowsPer10cm));
  return { chart: serializeChart(chart), cellWidth, cellHeight, closestPair: closestPair(palette) };
}

/** Share of stitches equal in two charts of the same size (by key). */
export function agreement(expected: ChartV1, actual: ChartV1): number {
  let same = 0;
  expected.rows.forEach((row, r) => {
    const a = Array.from(actual.rows[r]);
    Array.from(row).forEach((ch, c) => {
      if (a[c] === ch) same++;
    });
  });
  return same / (expected.width * expected.height);
}

/** Best share of stitches equal when the actual chart's colours are matched one to one to the expected ones (brute force over permutations). */
export function agreementMatched(expected: ChartV1, actual: ChartV1): number {
  const ek = expected.palette.map((p) => p.key);
  const ak = actual.palette.map((p) => p.key);
  const confusion = ak.map(() => ek.map(() => 0));
  expected.rows.forEach((row, r) => {
    const a = Array.from(actual.rows[r]);
    Array.from(row).forEach((ch, c) => {
      confusion[ak.indexOf(a[c])][ek.indexOf(ch)]++;
    });
  });
  let best = 0;
  const used = new Array<boolean>(ek.length).fill(false);
  const search = (i: number, sum: number) => {
    if (i === ak.length) {
      best = Math.max(best, sum);
      return;
    }
    let any = false;
    for (let j = 0; j < ek.length; j++) {
      if (used[j]) continue;
      any = true;
      used[j] = true;
      search(i + 1, sum + confusion[i][j]);
      used[j] = false;
    }
    if (!any) search(i + 1, sum);
  };
  search(0, 0);
  return best / (expected.width * expected.height);
}

export { getMotif };
