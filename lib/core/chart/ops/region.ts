// Selections: copy a region out as its own chart, stamp a chart back in, move a region.
import { assertColour, clipRect, cloneChart, type Chart, type Point, type Rect } from "../model";
import { applyPatch, applyPatchInPlace, patchFromChart } from "./patch";

/** The cells inside `rect` (clipped to the chart) as a chart of their own, same palette and gauge. */
export function copyRegion(chart: Chart, rect: Rect): Chart {
  const clip = clipRect(chart, rect);
  if (!clip) throw new RangeError(`the region ${describeRect(rect)} lies outside the ${chart.width} × ${chart.height} chart`);
  const cells = new Uint8Array(clip.width * clip.height);
  for (let y = 0; y < clip.height; y++) {
    const src = (clip.y + y) * chart.width + clip.x;
    cells.set(chart.cells.subarray(src, src + clip.width), y * clip.width);
  }
  return { ...cloneChart(chart, cells), width: clip.width, height: clip.height };
}

/** Cropping is copying a region and keeping only it. */
export const cropChart = copyRegion;

/**
 * Lays `stamp` over the chart with its bottom-left cell at `at`. Stamp cells of colour
 * `transparent` (if given) leave the chart unchanged. The stamp's colour indices are the chart's.
 */
export function stampChart(chart: Chart, stamp: Pick<Chart, "width" | "height" | "cells">, at: Point, options: { transparent?: number } = {}): Chart {
  return applyPatch(chart, patchFromChart(stamp, options.transparent), at);
}

/** Moves the cells of `rect` so its bottom-left lands on `to`; the vacated cells take `fill`. */
export function moveRegion(chart: Chart, rect: Rect, to: Point, options: { fill: number; transparent?: number }): Chart {
  assertColour(chart, options.fill);
  const clip = clipRect(chart, rect);
  if (!clip) return cloneChart(chart);
  const region = copyRegion(chart, clip);
  const out = cloneChart(chart);
  for (let y = clip.y; y < clip.y + clip.height; y++) {
    out.cells.fill(options.fill, y * chart.width + clip.x, y * chart.width + clip.x + clip.width);
  }
  // Keep the selection's own offset when the requested rect started outside the chart.
  const at = { x: to.x + (clip.x - Math.min(rect.x, rect.x + rect.width)), y: to.y + (clip.y - Math.min(rect.y, rect.y + rect.height)) };
  applyPatchInPlace(out.cells, chart.width, chart.height, patchFromChart(region, options.transparent), at);
  return out;
}

function describeRect(rect: Rect): string {
  return `${rect.width} × ${rect.height} at (${rect.x}, ${rect.y})`;
}
