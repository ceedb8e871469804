// Mirror images: the whole chart or a region, left-right or top-bottom.
import { clipRect, cloneChart, type Chart, type Rect } from "../model";

/** Mirrors left to right (stitch 1 swaps with the last stitch); `region` limits it to a rectangle. */
export function flipHorizontal(chart: Chart, region?: Rect): Chart {
  const out = cloneChart(chart);
  const r = region ? clipRect(chart, region) : { x: 0, y: 0, width: chart.width, height: chart.height };
  if (!r) return out;
  const w = chart.width;
  for (let y = r.y; y < r.y + r.height; y++) {
    const row = y * w;
    for (let i = 0; i < r.width; i++) out.cells[row + r.x + i] = chart.cells[row + r.x + r.width - 1 - i];
  }
  return out;
}

/** Mirrors top to bottom (row 1 swaps with the top row); `region` limits it to a rectangle. */
export function flipVertical(chart: Chart, region?: Rect): Chart {
  const out = cloneChart(chart);
  const r = region ? clipRect(chart, region) : { x: 0, y: 0, width: chart.width, height: chart.height };
  if (!r) return out;
  const w = chart.width;
  for (let i = 0; i < r.height; i++) {
    const src = (r.y + r.height - 1 - i) * w + r.x;
    out.cells.set(chart.cells.subarray(src, src + r.width), (r.y + i) * w + r.x);
  }
  return out;
}
