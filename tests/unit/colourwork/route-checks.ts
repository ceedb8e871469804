// Test helpers written independently of the planner: a checker for darning routes and an
// exhaustive search over every order of a few stitches.
import { expect } from "vitest";

export interface Spot {
  x: number;
  y: number;
}

export interface Geometry {
  /** stitch width and row height, cm */
  w: number;
  h: number;
  /** longest single stretch, cm */
  limitCm: number;
  /** in the round: stitches per row, the first and last of a row being neighbours */
  wrapWidth?: number;
}

/** Column difference, the shorter way round when in the round. */
const gapX = (g: Geometry | undefined, dx: number) => {
  const w = g?.wrapWidth;
  if (!w) return dx;
  const d = ((dx % w) + w) % w;
  return Math.min(d, w - d);
};
const touching = (a: Spot, b: Spot, g?: Geometry) => Math.abs(gapX(g, a.x - b.x)) <= 1 && Math.abs(a.y - b.y) <= 1 && (a.x !== b.x || a.y !== b.y);
const length = (g: Geometry, a: Spot, b: Spot) => Math.hypot(gapX(g, a.x - b.x) * g.w, (a.y - b.y) * g.h);
const stretchOk = (g: Geometry, a: Spot, b: Spot) => touching(a, b, g) || length(g, a, b) <= g.limitCm + 1e-9;

export interface CheckedStep extends Spot {
  carryCm: number;
  via: Spot[];
}

/**
 * Asserts every rule of a route: each stitch of `stitches` worked exactly once; a step onto a touching
 * new stitch carries nothing; any other step runs through worked stitches of the same strand or an
 * earlier one, each stretch touching or within the limit, and its carry is that chain's length
 * (within `tolerance`, for rounded output). Returns the total carry recomputed from the geometry.
 */
export function checkRoute(g: Geometry, stitches: Spot[], strands: CheckedStep[][], tolerance = 1e-6): number {
  const key = (p: Spot) => `${p.x},${p.y}`;
  const wanted = new Set(stitches.map(key));
  const worked = new Set<string>();
  let total = 0;
  for (const strand of strands) {
    expect(strand.length).toBeGreaterThan(0);
    strand.forEach((step, k) => {
      expect(wanted.has(key(step)), `stitch ${key(step)} is not one of the colour's`).toBe(true);
      expect(worked.has(key(step)), `stitch ${key(step)} worked twice`).toBe(false);
      if (k === 0) {
        expect(step.carryCm).toBe(0);
      } else {
        const prev = strand[k - 1];
        if (touching(prev, step, g)) {
          expect(step.carryCm).toBe(0);
          expect(step.via).toHaveLength(0);
        } else {
          const chain = [prev, ...step.via, step];
          let sum = 0;
          for (let i = 1; i < chain.length; i++) {
            expect(stretchOk(g, chain[i - 1], chain[i]), `stretch ${key(chain[i - 1])} → ${key(chain[i])} is over the limit`).toBe(true);
            sum += length(g, chain[i - 1], chain[i]);
          }
          for (const v of step.via) expect(worked.has(key(v)), `carry passes behind ${key(v)} before it is worked`).toBe(true);
          expect(Math.abs(sum - step.carryCm)).toBeLessThanOrEqual(tolerance);
          total += sum;
        }
      }
      worked.add(key(step));
    });
  }
  expect(worked.size).toBe(wanted.size);
  return total;
}

/**
 * Least (ends, carry) over every order of the stitches, cutting the yarn only where a step has no
 * chain through worked stitches. Depth-first with pruning on the best found; for up to ~9 stitches.
 */
export function bestOverAllOrders(g: Geometry, pts: Spot[]): { ends: number; carryCm: number } {
  const n = pts.length;
  if (n === 0) return { ends: 0, carryCm: 0 };
  const len = pts.map((a) => pts.map((b) => length(g, a, b)));
  const ok = pts.map((a) => pts.map((b) => stretchOk(g, a, b)));
  const touch = pts.map((a) => pts.map((b) => touching(a, b, g)));
  let best = { ends: Infinity, carryCm: Infinity };
  const full = (1 << n) - 1;
  const visit = (mask: number, p: number, ends: number, carry: number) => {
    if (ends > best.ends || (ends === best.ends && carry >= best.carryCm - 1e-12)) return;
    if (mask === full) {
      best = { ends, carryCm: carry };
      return;
    }
    // Shortest chains from p through the worked stitches (plain Dijkstra on the few stitches).
    const dist = new Array<number>(n).fill(Infinity);
    const done = new Array<boolean>(n).fill(false);
    dist[p] = 0;
    for (;;) {
      let u = -1;
      for (let i = 0; i < n; i++) if (mask & (1 << i) && !done[i] && dist[i] < Infinity && (u < 0 || dist[i] < dist[u])) u = i;
      if (u < 0) break;
      done[u] = true;
      for (let v = 0; v < n; v++) if (mask & (1 << v) && ok[u][v] && dist[u] + len[u][v] < dist[v]) dist[v] = dist[u] + len[u][v];
    }
    for (let q = 0; q < n; q++) {
      if (mask & (1 << q)) continue;
      let c = touch[p][q] ? 0 : Infinity;
      if (c !== 0) for (let u = 0; u < n; u++) if (mask & (1 << u) && ok[u][q]) c = Math.min(c, dist[u] + len[u][q]);
      if (c === Infinity) visit(mask | (1 << q), q, ends + 2, carry);
      else visit(mask | (1 << q), q, ends, carry + c);
    }
  };
  for (let s = 0; s < n; s++) visit(1 << s, s, 2, 0);
  return best;
}
