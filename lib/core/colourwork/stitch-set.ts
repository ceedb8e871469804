// The stitches of one colour, numbered in trade order (row 1 first, each row from the right), with
// a lookup from chart position to stitch number.
import type { Chart } from "@/lib/core/chart/model";

export interface StitchSet {
  n: number;
  width: number;
  height: number;
  /** core x (from the left) of each stitch */
  xs: Int32Array;
  /** core y (from the bottom) of each stitch */
  ys: Int32Array;
  /** stitch number at y * width + x, or -1 */
  idAt: Int32Array;
}

export function getStitchSet(chart: Pick<Chart, "width" | "height" | "cells">, colour: number): StitchSet {
  const { width, height, cells } = chart;
  let n = 0;
  for (let i = 0; i < cells.length; i++) if (cells[i] === colour) n++;
  const xs = new Int32Array(n);
  const ys = new Int32Array(n);
  const idAt = new Int32Array(width * height).fill(-1);
  let k = 0;
  for (let y = 0; y < height; y++) {
    for (let x = width - 1; x >= 0; x--) {
      const at = y * width + x;
      if (cells[at] !== colour) continue;
      xs[k] = x;
      ys[k] = y;
      idAt[at] = k++;
    }
  }
  return { n, width, height, xs, ys, idAt };
}

/** A stitch set from explicit positions (core coordinates); duplicates are ignored. */
export function createStitchSet(width: number, height: number, points: readonly { x: number; y: number }[]): StitchSet {
  const cells = new Uint8Array(width * height);
  for (const p of points) {
    if (p.x < 0 || p.y < 0 || p.x >= width || p.y >= height) throw new RangeError(`stitch (${p.x}, ${p.y}) is outside the chart`);
    cells[p.y * width + p.x] = 1;
  }
  return getStitchSet({ width, height, cells }, 1);
}

/** Stitch number at (x, y), or -1 when outside the chart or not in the set. */
export function stitchAt(set: StitchSet, x: number, y: number): number {
  if (x < 0 || y < 0 || x >= set.width || y >= set.height) return -1;
  return set.idAt[y * set.width + x];
}
