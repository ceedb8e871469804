// The cheapest order for a small group of stitches, found exactly by dynamic programming over
// (stitches worked, stitch just worked): the carry of every later step depends on nothing else.
import { CM_EPSILON } from "./carry-geometry";
import type { RouteWorkspace } from "./route-workspace";

// A module-level copy: reading an imported binding in hot loops is slower under some loaders.
const EPS = CM_EPSILON;

/** Largest group solved exactly by default (512 × 9 states). */
export const EXACT_ROUTE_LIMIT = 9;

/** Exact cheapest order of `members` (one connected component, at most 12 stitches). */
export function getExactOrder(ws: RouteWorkspace, members: ArrayLike<number>): { order: Int32Array; carryCm: number } {
  const m = members.length;
  if (m > 12) throw new RangeError(`exact routing is limited to 12 stitches (got ${m})`);
  const ids = Array.from(members);
  const touch = new Uint8Array(m * m);
  const allowed = new Uint8Array(m * m);
  const len = new Float64Array(m * m);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < m; j++) {
      if (i === j) continue;
      touch[i * m + j] = ws.touches(ids[i], ids[j]) ? 1 : 0;
      allowed[i * m + j] = ws.stretchAllowed(ids[i], ids[j]) ? 1 : 0;
      len[i * m + j] = ws.straightCm(ids[i], ids[j]);
    }
  }
  const full = (1 << m) - 1;
  const best = new Float64Array((full + 1) * m).fill(Infinity);
  const from = new Int8Array((full + 1) * m).fill(-1);
  for (let i = 0; i < m; i++) best[(1 << i) * m + i] = 0;
  const dm = new Float64Array(m);
  const done = new Uint8Array(m);
  for (let mask = 1; mask < full; mask++) {
    for (let p = 0; p < m; p++) {
      if (!(mask & (1 << p))) continue;
      const f = best[mask * m + p];
      if (f === Infinity) continue;
      // Shortest chains from p through the worked stitches.
      dm.fill(Infinity);
      done.fill(0);
      dm[p] = 0;
      for (;;) {
        let u = -1;
        for (let i = 0; i < m; i++) if (mask & (1 << i) && !done[i] && dm[i] < Infinity && (u < 0 || dm[i] < dm[u])) u = i;
        if (u < 0) break;
        done[u] = 1;
        for (let v = 0; v < m; v++) {
          if (!(mask & (1 << v)) || done[v] || !allowed[u * m + v]) continue;
          const d = dm[u] + len[u * m + v];
          if (d < dm[v]) dm[v] = d;
        }
      }
      for (let q = 0; q < m; q++) {
        if (mask & (1 << q)) continue;
        let c = Infinity;
        if (touch[p * m + q]) c = 0;
        else {
          for (let u = 0; u < m; u++) {
            if (!(mask & (1 << u)) || !allowed[u * m + q]) continue;
            const d = dm[u] + len[u * m + q];
            if (d < c) c = d;
          }
        }
        if (c === Infinity) continue;
        const next = (mask | (1 << q)) * m + q;
        if (f + c < best[next] - EPS) {
          best[next] = f + c;
          from[next] = p;
        }
      }
    }
  }
  let end = -1;
  for (let p = 0; p < m; p++) if (end < 0 || best[full * m + p] < best[full * m + end] - EPS) end = p;
  const carryCm = best[full * m + end];
  if (carryCm === Infinity) throw new RangeError("stitches given to exact routing are not one connected group");
  const order = new Int32Array(m);
  let mask = full;
  for (let k = m - 1, p = end; k >= 0; k--) {
    order[k] = ids[p];
    const prev = from[mask * m + p];
    mask ^= 1 << p;
    p = prev;
  }
  return { order, carryCm };
}
