// The colourwork chart model shared by every part of the core.
// Coordinates are zero-based: x from the left, y from the bottom. What a person sees follows the
// trade instead: rows numbered from the bottom, stitches numbered from the right (see toTrade).

export const MAX_PALETTE = 16;
export const MAX_WIDTH = 400;
export const MAX_HEIGHT = 400;

export interface Gauge {
  /** stitches per 10 cm, measured over stockinette */
  stitchesPer10cm: number;
  /** rows (rounds) per 10 cm */
  rowsPer10cm: number;
}

export interface PaletteColour {
  /** one printable character used in the exchange format */
  key: string;
  name: string;
  /** #RRGGBB */
  hex: string;
}

export interface Chart {
  width: number;
  height: number;
  gauge: Gauge;
  palette: PaletteColour[];
  /** palette index per cell, row-major from the bottom row: cells[y * width + x] */
  cells: Uint8Array;
}

export interface TradePosition {
  /** row from the bottom, from 1 */
  row: number;
  /** stitch from the right, from 1 */
  stitch: number;
}

export function createChart(
  width: number,
  height: number,
  gauge: Gauge,
  palette: PaletteColour[],
  fill = 0,
): Chart {
  const cells = new Uint8Array(width * height);
  if (fill !== 0) cells.fill(fill);
  return { width, height, gauge, palette: palette.map((p) => ({ ...p })), cells };
}

export function cellAt(chart: Pick<Chart, "width" | "cells">, x: number, y: number): number {
  return chart.cells[y * chart.width + x];
}

export function inBounds(chart: Pick<Chart, "width" | "height">, x: number, y: number): boolean {
  return x >= 0 && y >= 0 && x < chart.width && y < chart.height;
}

export function toTrade(chart: Pick<Chart, "width">, x: number, y: number): TradePosition {
  return { row: y + 1, stitch: chart.width - x };
}

export function fromTrade(chart: Pick<Chart, "width">, pos: TradePosition): { x: number; y: number } {
  return { x: chart.width - pos.stitch, y: pos.row - 1 };
}

/** Stitch width and row height in cm at the chart's gauge. */
export function stitchSizeCm(gauge: Gauge): { w: number; h: number } {
  return { w: 10 / gauge.stitchesPer10cm, h: 10 / gauge.rowsPer10cm };
}

/** A cell position in core coordinates (zero-based, x from the left, y from the bottom). */
export interface Point {
  x: number;
  y: number;
}

/** A rectangle of cells; (x, y) is its bottom-left cell in core coordinates. */
export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** A new chart value with its own cells and palette; charts are treated as immutable values. */
export function cloneChart(chart: Chart, cells: Uint8Array = chart.cells.slice()): Chart {
  return {
    width: chart.width,
    height: chart.height,
    gauge: { ...chart.gauge },
    palette: chart.palette.map((p) => ({ ...p })),
    cells,
  };
}

/** Throws a RangeError when `colour` is not an index into the chart's palette. */
export function assertColour(chart: Pick<Chart, "palette">, colour: number): void {
  if (!Number.isInteger(colour) || colour < 0 || colour >= chart.palette.length) {
    throw new RangeError(
      `colour ${colour} is not in the palette (it has ${chart.palette.length} colour${chart.palette.length === 1 ? "" : "s"})`,
    );
  }
}

/** Intersection of a rectangle with the chart, or null when nothing is left. */
export function clipRect(chart: Pick<Chart, "width" | "height">, rect: Rect): Rect | null {
  const x0 = Math.max(0, Math.min(rect.x, rect.x + rect.width));
  const y0 = Math.max(0, Math.min(rect.y, rect.y + rect.height));
  const x1 = Math.min(chart.width, Math.max(rect.x, rect.x + rect.width));
  const y1 = Math.min(chart.height, Math.max(rect.y, rect.y + rect.height));
  if (x1 <= x0 || y1 <= y0) return null;
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}
