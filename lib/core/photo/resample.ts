// Area-averaging resampler: each output cell is the mean colour of the part of the image it covers,
// counting a source pixel by the fraction of it that lies inside the cell (a box filter with
// fractional coverage). Separable and O(pixels + cells): every source row is summed into the cell
// columns once, and each row sum is added to the cell rows it overlaps.
import { SRGB_TO_LINEAR } from "./colour-space";

export interface PixelBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface RgbaPixels {
  width: number;
  height: number;
  data: Uint8Array | Uint8ClampedArray;
}

export interface ResampleOptions {
  /** average in linear light (true, the default) or on the sRGB-encoded values */
  linear?: boolean;
  /** fraction of each cell's width and height left out on every side (0 = the whole cell; < 0.5) */
  inset?: number;
}

/** Sample positions along one axis: for cell i, the source pixels it covers and by how much. */
interface AxisWeights {
  /** entries of cell i are start[i] … start[i + 1] − 1 */
  start: Int32Array;
  pixel: Int32Array;
  weight: Float64Array;
}

function axisWeights(origin: number, span: number, cells: number, inset: number): AxisWeights {
  const step = span / cells;
  const start = new Int32Array(cells + 1);
  const pixels: number[] = [];
  const weights: number[] = [];
  for (let i = 0; i < cells; i++) {
    start[i] = pixels.length;
    // Clamped to the box: (i + 1) × step can overshoot origin + span by a rounding error.
    const a = Math.max(origin, origin + (i + inset) * step);
    const b = Math.min(origin + span, origin + (i + 1 - inset) * step);
    const first = Math.floor(a);
    const last = Math.ceil(b) - 1;
    for (let p = first; p <= Math.max(first, last); p++) {
      const w = Math.min(b, p + 1) - Math.max(a, p);
      if (w > 0) {
        pixels.push(p);
        weights.push(w);
      }
    }
  }
  start[cells] = pixels.length;
  return { start, pixel: Int32Array.from(pixels), weight: Float64Array.from(weights) };
}

/**
 * Mean colour of each of `cols × rows` cells tiling `box` of the image, as RGB from 0 to 1 (linear
 * light unless `linear: false`), cell (c, r) at index (r * cols + c) * 3 with r = 0 the top row.
 * Transparent pixels are laid over white. The box must lie inside the image (checked by the caller).
 */
export function resampleArea(image: RgbaPixels, box: PixelBox, cols: number, rows: number, options: ResampleOptions = {}): Float64Array {
  const inset = options.inset ?? 0;
  const lut = options.linear === false ? SRGB_BYTE : SRGB_TO_LINEAR;
  const xs = axisWeights(box.x, box.width, cols, inset);
  const ys = axisWeights(box.y, box.height, rows, inset);
  const out = new Float64Array(cols * rows * 3);
  const area = new Float64Array(cols * rows);
  const rowSum = new Float64Array(cols * 3);
  const rowWeight = new Float64Array(cols);
  const data = image.data;
  const W = image.width;

  // Which cell rows each source row feeds: walk the y entries in order of source row.
  const order = Array.from(ys.pixel.keys()).sort((p, q) => ys.pixel[p] - ys.pixel[q]);
  const cellRowOf = new Int32Array(ys.pixel.length);
  for (let r = 0; r < rows; r++) for (let k = ys.start[r]; k < ys.start[r + 1]; k++) cellRowOf[k] = r;

  let k = 0;
  while (k < order.length) {
    const y = ys.pixel[order[k]];
    // Sum this source row into the cell columns.
    rowSum.fill(0);
    rowWeight.fill(0);
    const rowBase = y * W;
    for (let c = 0; c < cols; c++) {
      let r = 0;
      let g = 0;
      let b = 0;
      let wsum = 0;
      for (let e = xs.start[c]; e < xs.start[c + 1]; e++) {
        const i = (rowBase + xs.pixel[e]) * 4;
        const w = xs.weight[e];
        const alpha = data[i + 3];
        if (alpha === 255) {
          r += w * lut[data[i]];
          g += w * lut[data[i + 1]];
          b += w * lut[data[i + 2]];
        } else {
          // Over white: colour × alpha + 1 × (1 − alpha), in the same space as the average.
          const t = alpha / 255;
          r += w * (lut[data[i]] * t + 1 - t);
          g += w * (lut[data[i + 1]] * t + 1 - t);
          b += w * (lut[data[i + 2]] * t + 1 - t);
        }
        wsum += w;
      }
      rowSum[c * 3] = r;
      rowSum[c * 3 + 1] = g;
      rowSum[c * 3 + 2] = b;
      rowWeight[c] = wsum;
    }
    // Add it to every cell row this source row lies in.
    while (k < order.length && ys.pixel[order[k]] === y) {
      const e = order[k];
      const wy = ys.weight[e];
      const base = cellRowOf[e] * cols;
      for (let c = 0; c < cols; c++) {
        const o = (base + c) * 3;
        out[o] += wy * rowSum[c * 3];
        out[o + 1] += wy * rowSum[c * 3 + 1];
        out[o + 2] += wy * rowSum[c * 3 + 2];
        area[base + c] += wy * rowWeight[c];
      }
      k++;
    }
  }
  for (let i = 0; i < cols * rows; i++) {
    const a = area[i] || 1;
    out[i * 3] /= a;
    out[i * 3 + 1] /= a;
    out[i * 3 + 2] /= a;
  }
  return out;
}

const SRGB_BYTE: Float64Array = (() => {
  const lut = new Float64Array(256);
  for (let v = 0; v < 256; v++) lut[v] = v / 255;
  return lut;
})();
