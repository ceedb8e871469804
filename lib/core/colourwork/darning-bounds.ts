// Lower bounds for darning one colour. Two stitches are joined when they touch (8 neighbours) or a
// single carry between them is within the limit; each connected group needs at least one strand
// (2 ends), and its carry is at least the weight of its minimum spanning tree, in which touching
// stitches cost nothing and others cost their straight distance (every step of any route adds at
// least one such edge that joins the new stitch to the worked ones).
import type { CarryGeometry } from "./carry-geometry";
import { stepColumn, type StitchSet } from "./stitch-set";

export interface StitchComponents {
  count: number;
  /** component of each stitch, numbered in the order of their first stitch */
  of: Int32Array;
  /** stitches grouped by component: members[start[c] .. start[c + 1]) */
  start: Int32Array;
  members: Int32Array;
}

export interface DarningBounds {
  ends: number;
  carryCm: number;
}

function find(parent: Int32Array, i: number): number {
  while (parent[i] !== i) {
    parent[i] = parent[parent[i]];
    i = parent[i];
  }
  return i;
}

function unite(parent: Int32Array, a: number, b: number): boolean {
  const ra = find(parent, a);
  const rb = find(parent, b);
  if (ra === rb) return false;
  if (ra < rb) parent[rb] = ra;
  else parent[ra] = rb;
  return true;
}

/** Union-find over the stitches using offsets [from, to) of the geometry (half of them suffice). */
function joinByOffsets(set: StitchSet, g: CarryGeometry, neighboursOnly: boolean): Int32Array {
  const parent = new Int32Array(set.n);
  for (let i = 0; i < set.n; i++) parent[i] = i;
  const { xs, ys, idAt, width, height } = set;
  for (let i = 0; i < set.n; i++) {
    const x = xs[i];
    const y = ys[i];
    for (let o = 0; o < g.count; o++) {
      const dx = g.dx[o];
      const dy = g.dy[o];
      if (dy < 0 || (dy === 0 && dx < 0)) continue;
      if (neighboursOnly && (dx < -1 || dx > 1 || dy > 1)) continue;
      const nx = stepColumn(set, x, dx);
      const ny = y + dy;
      if (nx < 0 || ny >= height) continue;
      const j = idAt[ny * width + nx];
      if (j >= 0) unite(parent, i, j);
    }
  }
  return parent;
}

function groupBy(parent: Int32Array): StitchComponents {
  const n = parent.length;
  const of = new Int32Array(n);
  const label = new Int32Array(n).fill(-1);
  let count = 0;
  for (let i = 0; i < n; i++) {
    const r = find(parent, i);
    if (label[r] < 0) label[r] = count++;
    of[i] = label[r];
  }
  const start = new Int32Array(count + 1);
  for (let i = 0; i < n; i++) start[of[i] + 1]++;
  for (let c = 0; c < count; c++) start[c + 1] += start[c];
  const fill = start.slice(0, count);
  const members = new Int32Array(n);
  for (let i = 0; i < n; i++) members[fill[of[i]]++] = i;
  return { count, of, start, members };
}

/** Groups of stitches one strand can join (touching, or a carry within the limit). */
export function getStitchComponents(set: StitchSet, g: CarryGeometry): StitchComponents {
  return groupBy(joinByOffsets(set, g, false));
}

/** Groups of touching stitches (8 neighbours): inside one, moves can be free. */
export function getTouchingGroups(set: StitchSet, g: CarryGeometry): StitchComponents {
  return groupBy(joinByOffsets(set, g, true));
}

/** Total minimum-spanning-tree carry over all components, cm. */
export function getCarryBoundCm(set: StitchSet, g: CarryGeometry): number {
  let total = 0;
  for (const w of getComponentCarryBounds(set, g)) total += w;
  return total;
}

/** Minimum-spanning-tree carry of each component, cm (components numbered as getStitchComponents). */
export function getComponentCarryBounds(set: StitchSet, g: CarryGeometry, components?: StitchComponents): Float64Array {
  const comps = components ?? getStitchComponents(set, g);
  const out = new Float64Array(comps.count);
  if (set.n === 0) return out;
  const blobs = getTouchingGroups(set, g);
  const nb = blobs.count;
  if (nb === 1) return out;
  // Shortest carry between each pair of touching groups; only these can be in the tree.
  const best = new Map<number, number>();
  const { xs, ys, idAt, width, height } = set;
  for (let i = 0; i < set.n; i++) {
    const bi = blobs.of[i];
    const x = xs[i];
    const y = ys[i];
    for (let o = 0; o < g.count; o++) {
      const dx = g.dx[o];
      const dy = g.dy[o];
      if (dy < 0 || (dy === 0 && dx < 0)) continue;
      const nx = stepColumn(set, x, dx);
      const ny = y + dy;
      if (nx < 0 || ny >= height) continue;
      const j = idAt[ny * width + nx];
      if (j < 0) continue;
      const bj = blobs.of[j];
      if (bj === bi) continue;
      const key = bi < bj ? bi * nb + bj : bj * nb + bi;
      const len = g.len[o];
      const seen = best.get(key);
      if (seen === undefined || len < seen) best.set(key, len);
    }
  }
  const edges = Array.from(best, ([key, len]) => ({ a: Math.floor(key / nb), b: key % nb, len }));
  edges.sort((p, q) => p.len - q.len);
  const parent = new Int32Array(nb);
  for (let i = 0; i < nb; i++) parent[i] = i;
  // A blob's first stitch tells which component the blob (and so each tree edge) belongs to.
  const blobComponent = new Int32Array(nb);
  for (let b = 0; b < nb; b++) blobComponent[b] = comps.of[blobs.members[blobs.start[b]]];
  for (const e of edges) if (unite(parent, e.a, e.b)) out[blobComponent[e.a]] += e.len;
  return out;
}

export function getDarningBounds(set: StitchSet, g: CarryGeometry, components?: StitchComponents): DarningBounds {
  const comps = components ?? getStitchComponents(set, g);
  let carryCm = 0;
  for (const w of getComponentCarryBounds(set, g, comps)) carryCm += w;
  return { ends: 2 * comps.count, carryCm };
}
