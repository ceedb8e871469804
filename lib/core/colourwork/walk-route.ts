// A greedy walk through one connected group of stitches: step onto a touching new stitch whenever
// there is one, otherwise carry to the nearest new stitch. Which touching stitch to take matters:
// where the stitch just worked splits the unworked stitches into separate pockets, the smallest
// pocket is finished first (so the walk never has to come back far for it), and otherwise the
// stitch with the fewest unworked neighbours is taken (so none is left stranded behind). When the
// walk has to carry, it finishes the touching group it is in before it moves on to another.
import type { StitchComponents } from "./darning-bounds";
import type { RouteWorkspace } from "./route-workspace";
import { columnGap } from "./stitch-set";

const RING_DX = [1, 1, 0, -1, -1, -1, 0, 1];
const RING_DY = [0, 1, 1, 1, 0, -1, -1, -1];
/** Pockets larger than this count as large; only small ones change the walk. */
const POCKET_CAP = 256;

export class GroupWalker {
  private readonly ws: RouteWorkspace;
  private readonly floodMark: Int32Array;
  private readonly floodLabel: Int32Array;
  private floodEpoch = 0;
  private queue: Int32Array;
  private readonly near: number[] = [];
  /** touching group of each stitch, and unworked stitches left in each group */
  private readonly groupOf: Int32Array;
  private readonly open: Int32Array;

  constructor(ws: RouteWorkspace, groups: StitchComponents) {
    this.ws = ws;
    this.groupOf = groups.of;
    this.open = new Int32Array(groups.count);
    for (let gi = 0; gi < groups.count; gi++) this.open[gi] = groups.start[gi + 1] - groups.start[gi];
    this.floodMark = new Int32Array(ws.set.n);
    this.floodLabel = new Int32Array(ws.set.n);
    this.queue = new Int32Array(64);
  }

  /** Walks the whole group from `start`; leaves the worked marks of the group cleared. */
  walk(members: ArrayLike<number>, start: number): { order: Int32Array; carryCm: number } {
    const ws = this.ws;
    const m = members.length;
    const order = new Int32Array(m);
    let total = 0;
    let p = start;
    let dir = -1;
    const { groupOf, open } = this;
    ws.worked[p] = 1;
    open[groupOf[p]]--;
    order[0] = p;
    for (let k = 1; k < m; k++) {
      let q = this.chooseNeighbour(p, dir);
      if (q >= 0) {
        dir = ringIndex(columnGap(ws.set, ws.set.xs[q] - ws.set.xs[p]), ws.set.ys[q] - ws.set.ys[p]);
      } else {
        const group = groupOf[p];
        let carry = open[group] > 0 ? ws.nearestOpen(p, this.near, groupOf, group) : Infinity;
        if (this.near.length === 0 || open[group] === 0) carry = ws.nearestOpen(p, this.near);
        if (this.near.length === 0) throw new RangeError("the stitches given to the walk are not one connected group");
        q = this.pickJump(this.near);
        total += carry;
        dir = -1;
      }
      ws.worked[q] = 1;
      open[groupOf[q]]--;
      order[k] = q;
      p = q;
    }
    for (let i = 0; i < m; i++) {
      ws.worked[members[i]] = 0;
      open[groupOf[members[i]]]++;
    }
    return { order, carryCm: total };
  }

  private pickJump(near: number[]): number {
    let best = near[0];
    let bestOpen = this.ws.openNeighbours(best);
    for (let i = 1; i < near.length; i++) {
      const open = this.ws.openNeighbours(near[i]);
      if (open < bestOpen) {
        best = near[i];
        bestOpen = open;
      }
    }
    return best;
  }

  private chooseNeighbour(p: number, dir: number): number {
    const ws = this.ws;
    const x = ws.set.xs[p];
    const y = ws.set.ys[p];
    const cand: number[] = [];
    const ring: number[] = [];
    for (let r = 0; r < 8; r++) {
      const v = ws.at(x + RING_DX[r], y + RING_DY[r]);
      if (v >= 0 && ws.worked[v] === 0) {
        cand.push(v);
        ring.push(r);
      }
    }
    if (cand.length <= 1) return cand.length === 1 ? cand[0] : -1;

    // Touching candidates lie in one pocket; separate groups around p may be separate pockets.
    const group = cand.map((_, i) => i);
    const root = (i: number): number => (group[i] === i ? i : (group[i] = root(group[i])));
    for (let i = 0; i < cand.length; i++) {
      for (let j = i + 1; j < cand.length; j++) {
        const ddx = RING_DX[ring[i]] - RING_DX[ring[j]];
        const ddy = RING_DY[ring[i]] - RING_DY[ring[j]];
        if (ddx >= -1 && ddx <= 1 && ddy >= -1 && ddy <= 1) group[root(j)] = root(i);
      }
    }
    let allowed = cand.map(() => true);
    const roots = new Set(cand.map((_, i) => root(i)));
    if (roots.size > 1) {
      const seeds = cand.map((_, i) => root(i));
      const pocket = this.pockets(cand, seeds);
      let smallest = -1;
      for (let i = 0; i < cand.length; i++) {
        if (pocket.size[i] < POCKET_CAP && (smallest < 0 || pocket.size[i] < pocket.size[smallest])) smallest = i;
      }
      const distinct = new Set(pocket.id).size;
      if (smallest >= 0 && distinct > 1) allowed = cand.map((_, i) => pocket.id[i] === pocket.id[smallest]);
    }

    let best = -1;
    let bestScore = Infinity;
    for (let i = 0; i < cand.length; i++) {
      if (!allowed[i]) continue;
      // Fewest open neighbours first; then keep going straight; then orthogonal steps.
      const score = ws.openNeighbours(cand[i]) * 4 + (ring[i] === dir ? 0 : 2) + (ring[i] % 2 === 0 ? 0 : 1);
      if (score < bestScore) {
        bestScore = score;
        best = i;
      }
    }
    return cand[best];
  }

  /** Floods the unworked stitches from each seed group at once; reports pocket id and size per candidate. */
  private pockets(cand: number[], seedRoot: number[]): { id: number[]; size: number[] } {
    const ws = this.ws;
    const epoch = ++this.floodEpoch;
    const k = cand.length;
    const parent = Array.from({ length: k }, (_, i) => i);
    const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i])));
    const count = new Array<number>(k).fill(0);
    let head = 0;
    let tail = 0;
    const push = (v: number, label: number) => {
      if (tail === this.queue.length) {
        const next = new Int32Array(this.queue.length * 2);
        next.set(this.queue);
        this.queue = next;
      }
      this.floodMark[v] = epoch;
      this.floodLabel[v] = label;
      this.queue[tail++] = v;
      count[label]++;
    };
    for (let i = 0; i < k; i++) {
      const v = cand[i];
      if (this.floodMark[v] === epoch) continue;
      push(v, seedRoot[i]);
    }
    const { xs, ys } = ws.set;
    while (head < tail) {
      const u = this.queue[head++];
      const lu = find(this.floodLabel[u]);
      if (count[lu] >= POCKET_CAP) continue;
      for (let dy = -1; dy <= 1; dy++) {
        for (let dx = -1; dx <= 1; dx++) {
          if (dx === 0 && dy === 0) continue;
          const v = ws.at(xs[u] + dx, ys[u] + dy);
          if (v < 0 || ws.worked[v] !== 0) continue;
          if (this.floodMark[v] === epoch) {
            const lv = find(this.floodLabel[v]);
            if (lv !== lu) {
              parent[lv] = lu;
              count[lu] += count[lv];
            }
            continue;
          }
          push(v, lu);
        }
      }
    }
    const id = cand.map((_, i) => find(seedRoot[i]));
    return { id, size: id.map((r) => count[r]) };
  }
}

function ringIndex(dx: number, dy: number): number {
  for (let r = 0; r < 8; r++) if (RING_DX[r] === dx && RING_DY[r] === dy) return r;
  return -1;
}
