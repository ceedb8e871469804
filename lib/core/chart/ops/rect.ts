import { assertColour, clipRect, cloneChart, type Chart, type Rect } from "../model";

/** Draws a rectangle's outline (one stitch wide) or fills it; parts outside the chart are clipped. */
export function drawRect(chart: Chart, rect: Rect, colour: number, options: { filled?: boolean } = {}): Chart {
  assertColour(chart, colour);
  const out = cloneChart(chart);
  // Normalise first so the outline sits on the rectangle's own edges, not the clipped ones.
  const x0 = Math.min(rect.x, rect.x + rect.width);
  const y0 = Math.min(rect.y, rect.y + rect.height);
  const x1 = Math.max(rect.x, rect.x + rect.width) - 1;
  const y1 = Math.max(rect.y, rect.y + rect.height) - 1;
  const clip = clipRect(chart, rect);
  if (!clip) return out;
  const w = chart.width;
  for (let y = clip.y; y < clip.y + clip.height; y++) {
    for (let x = clip.x; x < clip.x + clip.width; x++) {
      if (options.filled || x === x0 || x === x1 || y === y0 || y === y1) out.cells[y * w + x] = colour;
    }
  }
  return out;
}
