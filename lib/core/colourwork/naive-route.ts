// The row-by-row way to darn one colour, as a baseline: rows from the bottom, each from the right,
// carrying straight to the next stitch when it touches or lies within the limit, and cutting the
// yarn for a new strand otherwise.
import { CM_EPSILON, type CarryGeometry } from "./carry-geometry";
import { columnGap, type StitchSet } from "./stitch-set";

// A module-level copy: reading an imported binding in hot loops is slower under some loaders.
const EPS = CM_EPSILON;

export interface NaiveRoute {
  strands: number;
  ends: number;
  carryCm: number;
}

export function getNaiveRoute(set: StitchSet, g: CarryGeometry): NaiveRoute {
  if (set.n === 0) return { strands: 0, ends: 0, carryCm: 0 };
  // Stitch numbers already run row by row from the bottom, each row from the right.
  let strands = 1;
  let carryCm = 0;
  for (let i = 1; i < set.n; i++) {
    const dx = columnGap(set, set.xs[i] - set.xs[i - 1]);
    const dy = set.ys[i] - set.ys[i - 1];
    if (dx >= -1 && dx <= 1 && dy >= -1 && dy <= 1) continue;
    const len = Math.hypot(dx * g.w, dy * g.h);
    if (len <= g.limitCm + EPS) carryCm += len;
    else strands++;
  }
  return { strands, ends: 2 * strands, carryCm };
}
