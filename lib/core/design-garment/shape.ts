// Which cells of a chart are real stitches of its area: an area narrower than its chart on some
// rows (a mitten's top, a crown sector) leaves cells that are never knitted. The editor greys
// them and refuses paint there; saves are refused when they are painted.
import { toTrade, type Chart } from "../chart/model";
import { DEFAULT_NARROWING, inShapeColumns } from "../garment/build-garment";
import type { ChartArea } from "../sizing/sizing-result";


export type AreaShape = Pick<ChartArea, "width" | "height" | "rowStitches" | "narrowing">;

/**
 * In-shape columns (x from the left) of chart row `y`, as a mask of `width` booleans. The rule is
 * the garment's own (`inShapeColumns` in lib/core/garment, with its default narrowing), so the
 * editor greys exactly the cells the garment never knits: "edges" keeps the stitches centred (an
 * odd leftover goes to the right edge), "sector end" keeps the sector's start (the right of the
 * chart, where stitch 1 is), "even" spreads the decreases across the row.
 */
export function rowShape(area: AreaShape, y: number): boolean[] {
  const w = area.width;
  const n = Math.max(0, Math.min(w, Math.floor(area.rowStitches?.[y] ?? w)));
  const mask = new Array<boolean>(w).fill(false);
  for (const x of inShapeColumns(w, n, area.narrowing ?? DEFAULT_NARROWING)) mask[x] = true;
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
