// Distances on the wrong side between stitch centres at a chart's gauge, and the neighbourhood a
// single stretch of carried yarn may span.
import { stitchSizeCm, type Gauge } from "@/lib/core/chart/model";

/** Slack for comparing float lengths in cm, so 5 × 0.5 cm counts as 2.5 cm. */
export const CM_EPSILON = 1e-9;

export interface CarryGeometry {
  /** stitch width, cm */
  w: number;
  /** row height, cm */
  h: number;
  /** longest single stretch of carried yarn, cm */
  limitCm: number;
  /** offsets one stretch may span, nearest first */
  dx: Int32Array;
  dy: Int32Array;
  /** length of each offset, cm */
  len: Float64Array;
  /** number of offsets */
  count: number;
}

export function getCarryGeometry(gauge: Gauge, limitCm: number): CarryGeometry {
  const { w, h } = stitchSizeCm(gauge);
  const rx = Math.max(1, Math.floor(limitCm / w + CM_EPSILON));
  const ry = Math.max(1, Math.floor(limitCm / h + CM_EPSILON));
  const list: { dx: number; dy: number; len: number }[] = [];
  for (let dy = -ry; dy <= ry; dy++) {
    for (let dx = -rx; dx <= rx; dx++) {
      if (dx === 0 && dy === 0) continue;
      const len = Math.hypot(dx * w, dy * h);
      // The 8 neighbours are always reachable: passing behind a touching stitch is always possible.
      const neighbour = Math.abs(dx) <= 1 && Math.abs(dy) <= 1;
      if (neighbour || len <= limitCm + CM_EPSILON) list.push({ dx, dy, len });
    }
  }
  list.sort((p, q) => p.len - q.len || p.dy - q.dy || q.dx - p.dx);
  const n = list.length;
  const g: CarryGeometry = {
    w,
    h,
    limitCm,
    dx: new Int32Array(n),
    dy: new Int32Array(n),
    len: new Float64Array(n),
    count: n,
  };
  list.forEach((o, i) => {
    g.dx[i] = o.dx;
    g.dy[i] = o.dy;
    g.len[i] = o.len;
  });
  return g;
}

export function isNeighbour(x1: number, y1: number, x2: number, y2: number): boolean {
  return Math.abs(x1 - x2) <= 1 && Math.abs(y1 - y2) <= 1 && (x1 !== x2 || y1 !== y2);
}

/** Straight carry between two stitch centres, cm. */
export function carryLengthCm(g: Pick<CarryGeometry, "w" | "h">, dx: number, dy: number): number {
  return Math.hypot(dx * g.w, dy * g.h);
}

/** Whether one stretch may join two stitches: touching, or within the carry limit. */
export function isStretchAllowed(g: CarryGeometry, dx: number, dy: number): boolean {
  if (Math.abs(dx) <= 1 && Math.abs(dy) <= 1) return true;
  return carryLengthCm(g, dx, dy) <= g.limitCm + CM_EPSILON;
}
