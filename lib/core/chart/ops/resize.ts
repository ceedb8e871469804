// Change a chart's size, keeping the part named by the anchor where it was.
import { MAX_HEIGHT, MAX_WIDTH, assertColour, cloneChart, type Chart } from "../model";

export const ANCHORS = [
  "top-left", "top", "top-right",
  "left", "centre", "right",
  "bottom-left", "bottom", "bottom-right",
] as const;
export type Anchor = (typeof ANCHORS)[number];

/** Offset of the old chart inside the new one along one axis; halves favour the far (right/top) side. */
function offset(from: number, to: number, side: "start" | "middle" | "end"): number {
  const d = to - from;
  if (side === "start") return 0;
  if (side === "end") return d;
  // Symmetric rounding so growing and then shrinking by the same amount is the identity.
  return d >= 0 ? Math.floor(d / 2) : -Math.floor(-d / 2);
}

function sides(anchor: Anchor): { h: "start" | "middle" | "end"; v: "start" | "middle" | "end" } {
  const h = anchor.endsWith("left") ? "start" : anchor.endsWith("right") ? "end" : "middle";
  // y counts from the bottom, so a top anchor keeps the top rows: the far end.
  const v = anchor.startsWith("top") ? "end" : anchor.startsWith("bottom") ? "start" : "middle";
  return { h, v };
}

/**
 * A chart of the new size: the old cells keep their place relative to the anchor, new cells take
 * `fill`, and cells that no longer fit are cropped.
 */
export function resizeChart(chart: Chart, width: number, height: number, anchor: Anchor, fill = 0): Chart {
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1 || width > MAX_WIDTH || height > MAX_HEIGHT) {
    throw new RangeError(`a chart must be from 1 × 1 to ${MAX_WIDTH} × ${MAX_HEIGHT} stitches (asked for ${width} × ${height})`);
  }
  assertColour(chart, fill);
  const s = sides(anchor);
  const dx = offset(chart.width, width, s.h);
  const dy = offset(chart.height, height, s.v);
  const cells = new Uint8Array(width * height);
  if (fill !== 0) cells.fill(fill);
  const x0 = Math.max(0, dx);
  const x1 = Math.min(width, dx + chart.width);
  for (let y = Math.max(0, dy); y < Math.min(height, dy + chart.height); y++) {
    const src = (y - dy) * chart.width + (x0 - dx);
    if (x1 > x0) cells.set(chart.cells.subarray(src, src + x1 - x0), y * width + x0);
  }
  return { ...cloneChart(chart, cells), width, height };
}
