// Which cells of a chart are real stitches of its area: an area narrower than its chart on some
// rows (a mitten's top, a crown sector) leaves cells that are never knitted. The editor greys
// them and refuses paint there; saves are refused when they are painted.
import { toTrade, type Chart } from "../chart/model";
import type { ChartArea } from "../sizing/sizing-result";

export type AreaShape = Pick<ChartArea, "width" | "height" | "rowStitches" | "narrowing">;

/**
 * In-shape columns (x from the left) of chart row `y`, as a mask of `width` booleans.
 * "edges": decreases at both edges, stitches centred (an odd leftover goes to the left edge);
 * "sector end": stitches at the sector's start in knitting order (the right of the chart, where
 * stitch 1 is), decreases at its end; "even": spread evenly across the row.
 */
export function rowShape(area: AreaShape, y: number): boolean[] {
  const w = area.width;
  const n = Math.max(0, Math.min(w, area.rowStitches?.[y] ?? w));
  const mask = new Array<boolean>(w).fill(false);
  if (n === w) return mask.fill(true);
  const narrowing = area.narrowing ?? "edges";
  if (narrowing === "sector end") {
    for (let x = w - n; x < w; x++) mask[x] = true;
  } else if (narrowing === "even") {
    for (let x = 0; x < w; x++) mask[x] = Math.floor(((x + 1) * n) / w) > Math.floor((x * n) / w);
  } else {
    const left = Math.ceil((w - n) / 2);
    for (let x = left; x < left + n; x++) mask[x] = true;
  }
  return mask;
}

/** The whole chart's mask, row-major from the bottom like `Chart.cells` (1 = a real stitch). */
export function areaShapeMask(area: AreaShape): Uint8Array {
  const mask = new Uint8Array(area.width * area.height);
  for (let y = 0; y < area.height; y++) {
    const row = rowShape(area, y);
    for (let x = 0; x < area.width; x++) mask[y * area.width + x] = row[x] ? 1 : 0;
  }
  return mask;
}

/** True when the area narrows somewhere (some cell of its chart is not knitted). */
export function hasOutsideCells(area: AreaShape): boolean {
  return (area.rowStitches ?? []).some((n) => n < area.width);
}

/** How a knitter reads a cell outside the shape. */
export function outsideMessage(chart: Pick<Chart, "width">, x: number, y: number, label?: string): string {
  const t = toTrade(chart, x, y);
  return `${label ? `${label}: ` : ""}row ${t.row} from the bottom, stitch ${t.stitch} from the right is outside the shape (not knitted); leave it in the background colour`;
}

/**
 * The first painted cell outside the shape (a cell not in the background colour, palette index 0),
 * bottom row first, or null. Nothing outside the shape is ever knitted, so paint there would be lost.
 */
export function findPaintOutsideShape(chart: Pick<Chart, "width" | "height" | "cells">, area: AreaShape): { x: number; y: number } | null {
  if (chart.width !== area.width || chart.height !== area.height) return null;
  for (let y = 0; y < chart.height; y++) {
    const row = rowShape(area, y);
    for (let x = 0; x < chart.width; x++) if (!row[x] && chart.cells[y * chart.width + x] !== 0) return { x, y };
  }
  return null;
}
