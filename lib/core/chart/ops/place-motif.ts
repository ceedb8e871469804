// Putting library motifs on a chart: once at a point, or tiled across a rectangle.
import { assertColour, clipRect, cloneChart, createChart, type Chart, type Gauge, type PaletteColour, type Point, type Rect } from "../model";
import { MOTIF_PATTERN, type Motif } from "../motifs";
import { applyPatch, TRANSPARENT, type Patch } from "./patch";

export interface MotifColours {
  /** palette index for the motif's pattern stitches ('X') */
  pattern: number;
  /** palette index for its background ('.'); leave out to keep the chart's own stitches there */
  background?: number;
}

function motifPatch(motif: Motif, colours: MotifColours): Patch {
  const cells = new Int16Array(motif.width * motif.height);
  const bg = colours.background ?? TRANSPARENT;
  motif.rows.forEach((row, i) => {
    const y = motif.height - 1 - i; // rows are written top first
    let x = 0;
    for (const ch of row) cells[y * motif.width + x++] = ch === MOTIF_PATTERN ? colours.pattern : bg;
  });
  return { width: motif.width, height: motif.height, cells };
}

function checkColours(chart: Chart, colours: MotifColours): void {
  assertColour(chart, colours.pattern);
  if (colours.background !== undefined) assertColour(chart, colours.background);
}

/** Places one repeat of the motif with its bottom-left cell at `at` (clipped to the chart). */
export function placeMotif(chart: Chart, motif: Motif, at: Point, colours: MotifColours): Chart {
  checkColours(chart, colours);
  return applyPatch(chart, motifPatch(motif, colours), at);
}

/**
 * Repeats the motif across `rect`; `origin` is where one repeat's bottom-left cell falls (by default
 * the rectangle's bottom-left), so a border can be centred by shifting it.
 */
export function tileMotif(chart: Chart, motif: Motif, rect: Rect, colours: MotifColours, origin?: Point): Chart {
  checkColours(chart, colours);
  const out = cloneChart(chart);
  const clip = clipRect(chart, rect);
  if (!clip) return out;
  const patch = motifPatch(motif, colours);
  const ox = origin?.x ?? Math.min(rect.x, rect.x + rect.width);
  const oy = origin?.y ?? Math.min(rect.y, rect.y + rect.height);
  for (let y = clip.y; y < clip.y + clip.height; y++) {
    const py = (((y - oy) % patch.height) + patch.height) % patch.height;
    for (let x = clip.x; x < clip.x + clip.width; x++) {
      const px = (((x - ox) % patch.width) + patch.width) % patch.width;
      const c = patch.cells[py * patch.width + px];
      if (c !== TRANSPARENT) out.cells[y * chart.width + x] = c;
    }
  }
  return out;
}

const DEFAULT_MOTIF_PALETTE: PaletteColour[] = [
  { key: ".", name: "Background", hex: "#F2EDE3" },
  { key: "X", name: "Pattern", hex: "#1F3A5F" },
];

/** One repeat of the motif as a two-colour chart (background index 0, pattern index 1). */
export function motifToChart(
  motif: Motif,
  palette: PaletteColour[] = DEFAULT_MOTIF_PALETTE,
  gauge: Gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 },
): Chart {
  const chart = createChart(motif.width, motif.height, gauge, palette);
  return placeMotif(chart, motif, { x: 0, y: 0 }, { pattern: 1, background: 0 });
}
