// Shared state for routing one colour: which stitches are worked, and searches for the shortest
// carry from the stitch just worked to a new one by way of worked stitches only.
//
// The carry model, precisely:
// - stepping onto a new stitch that touches the stitch just worked (one of its 8 neighbours) is
//   stitching, not carrying: 0 cm;
// - any other step carries the yarn on the wrong side from the stitch just worked to the new one,
//   as a chain of straight stretches between stitch centres whose inner points are stitches of this
//   colour already worked; each stretch must be within the carry limit (touching stitches may
//   always be joined); the step's carry is the chain's length. Passing behind a worked stitch,
//   even a touching one, is carrying and costs its length.
import { CM_EPSILON, type CarryGeometry } from "./carry-geometry";
import { MinHeap } from "./min-heap";
import { columnGap, stepColumn, type StitchSet } from "./stitch-set";

// A module-level copy: reading an imported binding in hot loops is slower under some loaders.
const EPS = CM_EPSILON;

export class RouteWorkspace {
  readonly set: StitchSet;
  readonly g: CarryGeometry;
  readonly worked: Uint8Array;
  /** per-stitch scratch space for callers (local numbering inside one group) */
  readonly scratch: Int32Array;
  private readonly dist: Float64Array;
  private readonly prev: Int32Array;
  private readonly stamp: Int32Array;
  private epoch = 0;
  private readonly heap = new MinHeap(256);

  constructor(set: StitchSet, g: CarryGeometry) {
    this.set = set;
    this.g = g;
    this.worked = new Uint8Array(set.n);
    this.scratch = new Int32Array(set.n);
    this.dist = new Float64Array(set.n);
    this.prev = new Int32Array(set.n);
    this.stamp = new Int32Array(set.n);
  }

  /** Stitch at (x, y) (in the round x wraps), or -1. */
  at(x: number, y: number): number {
    const s = this.set;
    if (s.wrap && s.width > 0) x = ((x % s.width) + s.width) % s.width;
    if (x < 0 || y < 0 || x >= s.width || y >= s.height) return -1;
    return s.idAt[y * s.width + x];
  }

  touches(p: number, q: number): boolean {
    const { xs, ys } = this.set;
    const dx = columnGap(this.set, xs[p] - xs[q]);
    const dy = ys[p] - ys[q];
    return dx >= -1 && dx <= 1 && dy >= -1 && dy <= 1;
  }

  straightCm(p: number, q: number): number {
    const { xs, ys } = this.set;
    return Math.hypot(columnGap(this.set, xs[p] - xs[q]) * this.g.w, (ys[p] - ys[q]) * this.g.h);
  }

  /** Whether one stretch may join p and q. */
  stretchAllowed(p: number, q: number): boolean {
    return this.touches(p, q) || this.straightCm(p, q) <= this.g.limitCm + EPS;
  }

  /** Stitch reached from (x, y) by one offset of the geometry, or -1 (see stepColumn). */
  atOffset(x: number, y: number, dx: number, dy: number): number {
    const s = this.set;
    const nx = stepColumn(s, x, dx);
    const ny = y + dy;
    if (nx < 0 || ny < 0 || ny >= s.height) return -1;
    return s.idAt[ny * s.width + nx];
  }

  /** Unworked stitches among the 8 neighbours of p. */
  openNeighbours(p: number): number {
    const { xs, ys } = this.set;
    const x = xs[p];
    const y = ys[p];
    let count = 0;
    for (let dy = -1; dy <= 1; dy++) {
      for (let dx = -1; dx <= 1; dx++) {
        if (dx === 0 && dy === 0) continue;
        const q = this.at(x + dx, y + dy);
        if (q >= 0 && this.worked[q] === 0) count++;
      }
    }
    return count;
  }

  /**
   * Carry from p (just worked) to the unworked stitch q, cm, or Infinity when no chain exists.
   * When `via` is given it receives the inner stitches of the chain, in order.
   */
  carry(p: number, q: number, via?: number[]): number {
    if (this.touches(p, q)) return 0;
    const direct = this.straightCm(p, q);
    if (direct <= this.g.limitCm + EPS) return direct;
    return this.searchChain(p, q, via, false);
  }

  /** Shortest chain from p to q through any stitches of the colour, worked or not (for repairs). */
  chainThroughAll(p: number, q: number, via: number[]): number {
    via.length = 0;
    if (this.touches(p, q)) return 0;
    const direct = this.straightCm(p, q);
    if (direct <= this.g.limitCm + EPS) return direct;
    return this.searchChain(p, q, via, true);
  }

  private searchChain(p: number, q: number, via: number[] | undefined, anyStitch: boolean): number {
    const { xs, ys, idAt, width, height } = this.set;
    const g = this.g;
    const epoch = ++this.epoch;
    const { dist, prev, stamp, worked, heap } = this;
    const qx = xs[q];
    const qy = ys[q];
    const guess = (i: number) => Math.hypot(columnGap(this.set, xs[i] - qx) * g.w, (ys[i] - qy) * g.h);
    heap.clear();
    stamp[p] = epoch;
    dist[p] = 0;
    prev[p] = -1;
    heap.push(guess(p), p);
    while (heap.size > 0) {
      const key = heap.peekKey();
      const u = heap.pop();
      if (u === q) {
        if (via) {
          via.length = 0;
          for (let k = prev[q]; k !== p && k >= 0; k = prev[k]) via.push(k);
          via.reverse();
        }
        return dist[q];
      }
      if (key > dist[u] + guess(u) + EPS) continue; // stale entry
      const ux = xs[u];
      const uy = ys[u];
      for (let o = 0; o < g.count; o++) {
        const nx = stepColumn(this.set, ux, g.dx[o]);
        const ny = uy + g.dy[o];
        if (nx < 0 || ny < 0 || ny >= height) continue;
        const v = idAt[ny * width + nx];
        if (v < 0 || (v !== q && worked[v] === 0 && !anyStitch)) continue;
        const nd = dist[u] + g.len[o];
        if (stamp[v] !== epoch || nd < dist[v] - EPS) {
          stamp[v] = epoch;
          dist[v] = nd;
          prev[v] = u;
          heap.push(nd + guess(v), v);
        }
      }
    }
    return Infinity;
  }

  /**
   * The unworked stitches nearest to p by carry (all within a hair of the least), with that carry;
   * for use when p touches no unworked stitch. With `group`, only stitches whose `groupOf` equals
   * it count. Leaves `out` empty when none can be reached.
   */
  nearestOpen(p: number, out: number[], groupOf?: Int32Array, group = -1): number {
    out.length = 0;
    const { xs, ys, idAt, width, height } = this.set;
    const g = this.g;
    const x = xs[p];
    const y = ys[p];
    // Within one stretch the straight line is the shortest chain, so the nearest by distance wins.
    let best = Infinity;
    for (let o = 0; o < g.count; o++) {
      const len = g.len[o];
      if (len > best + EPS) break;
      const nx = stepColumn(this.set, x, g.dx[o]);
      const ny = y + g.dy[o];
      if (nx < 0 || ny < 0 || ny >= height) continue;
      const v = idAt[ny * width + nx];
      if (v < 0 || this.worked[v] !== 0 || (groupOf && groupOf[v] !== group)) continue;
      if (best === Infinity) best = len;
      out.push(v);
    }
    if (out.length > 0) return best;
    return this.searchNearest(p, out, groupOf, group);
  }

  private searchNearest(p: number, out: number[], groupOf: Int32Array | undefined, group: number): number {
    const { xs, ys, idAt, width, height } = this.set;
    const g = this.g;
    const epoch = ++this.epoch;
    const { dist, prev, stamp, worked, heap } = this;
    heap.clear();
    stamp[p] = epoch;
    dist[p] = 0;
    prev[p] = -1;
    heap.push(0, p);
    let best = Infinity;
    while (heap.size > 0) {
      const key = heap.peekKey();
      if (key > best + EPS) break;
      const u = heap.pop();
      if (key > dist[u] + EPS) continue;
      if (worked[u] === 0) {
        if (best === Infinity) best = key;
        out.push(u);
        continue; // a new stitch ends the chain
      }
      const ux = xs[u];
      const uy = ys[u];
      for (let o = 0; o < g.count; o++) {
        const nx = stepColumn(this.set, ux, g.dx[o]);
        const ny = uy + g.dy[o];
        if (nx < 0 || ny < 0 || ny >= height) continue;
        const v = idAt[ny * width + nx];
        if (v < 0) continue;
        // Unworked stitches outside the group are neither targets nor ways through.
        if (groupOf && worked[v] === 0 && groupOf[v] !== group) continue;
        const nd = key + g.len[o];
        if (stamp[v] !== epoch || nd < dist[v] - EPS) {
          stamp[v] = epoch;
          dist[v] = nd;
          prev[v] = u;
          heap.push(nd, v);
        }
      }
    }
    return best;
  }
}
