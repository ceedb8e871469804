// Chart → RGBA pixels for a canvas (ImageData / putImageData). Top chart row is the first pixel row.
import { hexToRgb } from "./colour";
import type { Chart } from "./model";

export interface RasterImage {
  width: number;
  height: number;
  /** RGBA, 4 bytes per pixel, row by row from the top */
  data: Uint8ClampedArray;
}

export interface RasterOptions {
  /** pixels per stitch across (default 4) */
  pxPerStitch?: number;
  /** row height: "gauge" for the true stitch shape (default), "square", or a height ÷ width ratio */
  aspect?: "gauge" | "square" | number;
  /** RGBA drawn on each stitch's top and left pixel line; only when stitches are 3 px or larger */
  grid?: readonly [number, number, number, number];
}

const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

function pack(r: number, g: number, b: number, a: number): number {
  return LITTLE_ENDIAN ? ((a << 24) | (b << 16) | (g << 8) | r) >>> 0 : ((r << 24) | (g << 16) | (b << 8) | a) >>> 0;
}

/** Pixels per row for the requested aspect, rounded to the nearest pixel and never below 1. */
export function getRowPx(chart: Pick<Chart, "gauge">, pxPerStitch: number, aspect: RasterOptions["aspect"] = "gauge"): number {
  // A stitch is (10 / stitchesPer10cm) wide and (10 / rowsPer10cm) tall, so height ÷ width = sts ÷ rows.
  const ratio = aspect === "square" ? 1 : aspect === "gauge" ? chart.gauge.stitchesPer10cm / chart.gauge.rowsPer10cm : aspect;
  return Math.max(1, Math.round(pxPerStitch * ratio));
}

export function rasterizeChart(chart: Chart, options: RasterOptions = {}): RasterImage {
  const px = options.pxPerStitch ?? 4;
  if (!Number.isInteger(px) || px < 1 || px > 64) throw new RangeError(`pxPerStitch must be a whole number from 1 to 64 (got ${px})`);
  const rowPx = getRowPx(chart, px, options.aspect);
  const width = chart.width * px;
  const height = chart.height * rowPx;
  const data = new Uint8ClampedArray(width * height * 4);
  const out = new Uint32Array(data.buffer);
  const colours = new Uint32Array(chart.palette.map((c) => pack(...hexToRgb(c.hex), 255)));
  const grid = options.grid && px >= 3 ? pack(...options.grid) : undefined;
  const line = new Uint32Array(width);
  for (let row = 0; row < chart.height; row++) {
    const y = chart.height - 1 - row;
    const src = y * chart.width;
    for (let x = 0; x < chart.width; x++) line.fill(colours[chart.cells[src + x]], x * px, x * px + px);
    if (grid !== undefined) for (let x = 0; x < width; x += px) line[x] = grid;
    const top = row * rowPx * width;
    out.set(line, top);
    // Repeat the first pixel row for the rest of the stitch: copyWithin is a memmove.
    for (let k = 1; k < rowPx; k++) out.copyWithin(top + k * width, top, top + width);
    if (grid !== undefined && rowPx >= 3) out.fill(grid, top, top + width);
  }
  return { width, height, data };
}
