// A patch is a block of colours to lay over a chart; -1 leaves the cell underneath unchanged.
import { assertColour, cloneChart, type Chart, type Point } from "../model";

export const TRANSPARENT = -1;

export interface Patch {
  width: number;
  height: number;
  /** palette index or TRANSPARENT per cell, row-major from the bottom like Chart.cells */
  cells: Int16Array;
}

/** A patch from a chart's cells; cells of colour `transparent` (if given) let the chart show through. */
export function patchFromChart(source: Pick<Chart, "width" | "height" | "cells">, transparent?: number): Patch {
  const cells = new Int16Array(source.cells.length);
  for (let i = 0; i < cells.length; i++) {
    const c = source.cells[i];
    cells[i] = c === transparent ? TRANSPARENT : c;
  }
  return { width: source.width, height: source.height, cells };
}

/** Copies the chart and lays the patch over it with its bottom-left cell at `at`, clipped to the chart. */
export function applyPatch(chart: Chart, patch: Patch, at: Point): Chart {
  for (let i = 0; i < patch.cells.length; i++) {
    const c = patch.cells[i];
    if (c !== TRANSPARENT) assertColour(chart, c);
  }
  const out = cloneChart(chart);
  applyPatchInPlace(out.cells, chart.width, chart.height, patch, at);
  return out;
}

/** Writes into `cells` (a buffer the caller owns); used by the pure operations after copying. */
export function applyPatchInPlace(cells: Uint8Array, width: number, height: number, patch: Patch, at: Point): void {
  const x0 = Math.max(0, at.x);
  const x1 = Math.min(width, at.x + patch.width);
  if (x1 <= x0) return;
  for (let py = 0; py < patch.height; py++) {
    const y = at.y + py;
    if (y < 0 || y >= height) continue;
    const src = py * patch.width - at.x;
    const dst = y * width;
    for (let x = x0; x < x1; x++) {
      const c = patch.cells[src + x];
      if (c !== TRANSPARENT) cells[dst + x] = c;
    }
  }
}
