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
  /**
   * Worked in the round: the first and last stitch of a row are neighbours (columns wrap), and a
   * step between two columns goes the shorter way round.
   */
  wrap?: boolean;
}

/**
 * Column reached from x by dx, or -1 when outside. In the round columns wrap, and an offset longer
 * than half the round is refused: the shorter offset the other way reaches the same stitch.
 */
export function stepColumn(set: Pick<StitchSet, "width" | "wrap">, x: number, dx: number): number {
  const nx = x + dx;
  if (!set.wrap) return nx >= 0 && nx < set.width ? nx : -1;
  const w = set.width;
  if (2 * Math.abs(dx) > w) return -1;
  return ((nx % w) + w) % w;
}

/** Column difference the shorter way: in the round, the way across the start of the round when shorter. */
export function columnGap(set: Pick<StitchSet, "width" | "wrap">, dx: number): number {
  if (!set.wrap) return dx;
  const w = set.width;
  let d = ((dx % w) + w) % w;
  if (2 * d > w) d -= w;
  return d;
}

export function getStitchSet(chart: Pick<Chart, "width" | "height" | "cells">, colour: number, wrap = false): StitchSet {
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
  return wrap ? { n, width, height, xs, ys, idAt, wrap } : { n, width, height, xs, ys, idAt };
}

/** A stitch set from explicit positions (core coordinates); duplicates are ignored. */
export function createStitchSet(width: number, height: number, points: readonly { x: number; y: number }[], wrap = false): StitchSet {
  const cells = new Uint8Array(width * height);
  for (const p of points) {
    if (p.x < 0 || p.y < 0 || p.x >= width || p.y >= height) throw new RangeError(`stitch (${p.x}, ${p.y}) is outside the chart`);
    cells[p.y * width + p.x] = 1;
  }
  return getStitchSet({ width, height, cells }, 1, wrap);
}

/** Stitch number at (x, y), or -1 when outside the chart or not in the set. */
export function stitchAt(set: StitchSet, x: number, y: number): number {
  if (set.wrap && set.width > 0) x = ((x % set.width) + set.width) % set.width;
  if (x < 0 || y < 0 || x >= set.width || y >= set.height) return -1;
  return set.idAt[y * set.width + x];
}
