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
