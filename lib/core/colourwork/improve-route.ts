// Improving one strand's order after the walk, in two strengths:
// - for groups of moderate size, shortest carries between every two stitches of the group are
//   computed once (through any of its stitches), and the order is searched under those with
//   2-opt, or-opt and kicks;
// - for large groups, only moves whose new steps touch or lie within one stretch are allowed (their
//   carry is exact whatever is worked), removed steps priced at their traced carry.
// Carries through stitches that are not yet worked are not allowed in the route itself, so the
// caller traces the result again and keeps it only if it is really cheaper.
import { CM_EPSILON } from "./carry-geometry";
import { MinHeap } from "./min-heap";
import { PathSearch } from "./path-search";
import type { RouteWorkspace } from "./route-workspace";

// A module-level copy: reading an imported binding in hot loops is slower under some loaders.
const EPS = CM_EPSILON;

const NEAR = 6;
/** Stretches per stitch in the guide graph of the all-pairs search. */
const GUIDE_STRETCHES = 16;

/** Deterministic PRNG (mulberry32) so the same chart always gets the same route. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Local index of each stitch of `ids` in ws.scratch; returns, for each, the stitches within one
 * stretch, nearest first, at most `limit` of them.
 */
function stretchNeighbours(
  ws: RouteWorkspace,
  ids: Int32Array,
  limit = Infinity,
): { start: Int32Array; to: Int32Array; len: Float64Array } {
  const m = ids.length;
  for (let k = 0; k < m; k++) ws.scratch[ids[k]] = k;
  const { xs, ys } = ws.set;
  const g = ws.g;
  const to: number[] = [];
  const len: number[] = [];
  const start = new Int32Array(m + 1);
  for (let k = 0; k < m; k++) {
    start[k] = to.length;
    let found = 0;
    for (let t = 0; t < g.count && found < limit; t++) {
      const v = ws.atOffset(xs[ids[k]], ys[ids[k]], g.dx[t], g.dy[t]);
      if (v < 0) continue;
      to.push(ws.scratch[v]);
      len.push(g.len[t]);
      found++;
    }
  }
  start[m] = to.length;
  return { start, to: Int32Array.from(to), len: Float64Array.from(len) };
}

/**
 * Shortest carries between every two stitches of a group through any of its stitches (a guide: a
 * route may only pass behind stitches already worked), with each stitch's nearest few by that measure.
 */
export class AllPairsGuide {
  readonly m: number;
  readonly near: Int32Array;
  private readonly dist: Float64Array;
  private readonly touch: Uint8Array;
  private readonly local: Map<number, number>;
  readonly ids: Int32Array;

  constructor(ws: RouteWorkspace, members: Int32Array) {
    const m = members.length;
    this.m = m;
    this.ids = Int32Array.from(members);
    const ids = this.ids;
    // The nearest few stretches per stitch give chains close to the shortest at a fraction of the work.
    const adj = stretchNeighbours(ws, ids, GUIDE_STRETCHES);
    this.local = new Map();
    for (let k = 0; k < m; k++) this.local.set(ids[k], k);
    const dist = new Float64Array(m * m).fill(Infinity);
    const heap = new MinHeap(64);
    for (let s = 0; s < m; s++) {
      const row = s * m;
      dist[row + s] = 0;
      heap.clear();
      heap.push(0, s);
      while (heap.size > 0) {
        const d = heap.peekKey();
        const u = heap.pop();
        if (d > dist[row + u] + EPS) continue;
        for (let a = adj.start[u]; a < adj.start[u + 1]; a++) {
          const v = adj.to[a];
          const nd = d + adj.len[a];
          if (nd < dist[row + v] - EPS) {
            dist[row + v] = nd;
            heap.push(nd, v);
          }
        }
      }
    }
    this.dist = dist;
    const touch = new Uint8Array(m * m);
    for (let u = 0; u < m; u++) for (let v = 0; v < m; v++) if (u !== v && ws.touches(ids[u], ids[v])) touch[u * m + v] = 1;
    this.touch = touch;
    // Nearest NEAR stitches of each by the guide, by insertion into a short sorted list.
    const near = new Int32Array(m * NEAR).fill(-1);
    const nearCost = new Float64Array(NEAR);
    for (let u = 0; u < m; u++) {
      let n = 0;
      const base = u * NEAR;
      for (let v = 0; v < m; v++) {
        if (v === u) continue;
        const c = this.cost(u, v);
        if (n === NEAR && c >= nearCost[NEAR - 1]) continue;
        let i = n < NEAR ? n++ : NEAR - 1;
        while (i > 0 && nearCost[i - 1] > c) {
          nearCost[i] = nearCost[i - 1];
          near[base + i] = near[base + i - 1];
          i--;
        }
        nearCost[i] = c;
        near[base + i] = v;
      }
    }
    this.near = near;
  }

  /** Guide carry between local stitches u and v. */
  cost(u: number, v: number): number {
    return this.touch[u * this.m + v] ? 0 : this.dist[u * this.m + v];
  }

  /** Searches from `order` (stitch numbers of the group) with `rounds` kicks; returns stitch numbers. */
  search(order: Int32Array, rounds: number, seed: number): Int32Array {
    const start = Int32Array.from(order, (id) => this.local.get(id)!);
    const search = new PathSearch({ m: this.m, cost: (u, v) => this.cost(u, v), near: this.near, k: NEAR }, start);
    search.descend();
    search.kick(rounds, seededRandom(seed));
    return Int32Array.from(search.order, (k) => this.ids[k]);
  }
}

/** Search allowing only new steps within one stretch; for large groups. */
export function improveWithinStretch(ws: RouteWorkspace, order: Int32Array, carries: Float64Array): Int32Array {
  const m = order.length;
  if (m < 4) return order;
  const ids = order;
  const adj = stretchNeighbours(ws, ids);
  const near = new Int32Array(m * NEAR).fill(-1);
  for (let u = 0; u < m; u++) {
    let t = 0;
    for (let a = adj.start[u]; a < adj.start[u + 1] && t < NEAR; a++) near[u * NEAR + t++] = adj.to[a];
  }
  // Steps longer than one stretch keep their traced carry while they stay in the order.
  const chains = new Map<number, number>();
  const chainKey = (u: number, v: number) => (u < v ? u * m + v : v * m + u);
  const direct = (u: number, v: number) => {
    if (ws.touches(ids[u], ids[v])) return 0;
    const d = ws.straightCm(ids[u], ids[v]);
    return d <= ws.g.limitCm + EPS ? d : Infinity;
  };
  for (let k = 0; k < m - 1; k++) if (direct(k, k + 1) === Infinity) chains.set(chainKey(k, k + 1), carries[k + 1]);
  const cost = (u: number, v: number) => {
    const c = direct(u, v);
    return c !== Infinity ? c : (chains.get(chainKey(u, v)) ?? Infinity);
  };
  const start = new Int32Array(m);
  for (let k = 0; k < m; k++) start[k] = k;
  const search = new PathSearch({ m, cost, near, k: NEAR }, start);
  search.descend();
  return Int32Array.from(search.order, (k) => ids[k]);
}
