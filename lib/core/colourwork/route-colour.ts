// Routes the needle through every stitch of one colour: one strand per connected group (the least
// possible number of ends), each group ordered to keep the carried yarn short.
import type { CarryGeometry } from "./carry-geometry";
import { getComponentCarryBounds, getStitchComponents, getTouchingGroups, type StitchComponents } from "./darning-bounds";
import { AllPairsGuide, improveWithinStretch } from "./improve-route";
import { EXACT_ROUTE_LIMIT, getExactOrder } from "./exact-route";
import { RouteWorkspace } from "./route-workspace";
import type { StitchSet } from "./stitch-set";
import { GroupWalker } from "./walk-route";

/** Groups up to this size are searched under all-pairs carries (m² memory and time). */
const ALL_PAIRS_LIMIT = 400;
/** Kicks of the all-pairs search: at most KICKS_MAX, fewer for larger groups. */
const KICKS_MAX = 40;
const KICK_BUDGET = 2000;
/** Walks the guided search starts from. */
const GUIDED_STARTS = 3;

export interface StrandRoute {
  /** stitch numbers of the set, in working order */
  order: Int32Array;
  /** carry before each stitch, cm (0 for the first and for touching steps) */
  carries: Float64Array;
  /** for steps that pass behind worked stitches: step index → those stitches, in order */
  vias: Map<number, Int32Array>;
  carryCm: number;
}

export interface ColourRoute {
  strands: StrandRoute[];
  ends: number;
  carryCm: number;
}

export interface RouteOptions {
  /** groups up to this many stitches are ordered exactly (default 9, at most 12) */
  exactUpTo?: number;
  /** walks tried per group; more gives shorter carries for more time (default 8) */
  maxStarts?: number;
  /** improve walks by 2-opt and or-opt moves (default true) */
  improve?: boolean;
  /**
   * Worked in the round: the first and last stitch of each row are neighbours, so a motif across
   * the start of the round is one strand (read when the stitch set is built from a chart).
   */
  inTheRound?: boolean;
}

export function routeStitchSet(
  set: StitchSet,
  g: CarryGeometry,
  options: RouteOptions = {},
  components: StitchComponents = getStitchComponents(set, g),
): ColourRoute {
  const ws = new RouteWorkspace(set, g);
  const walker = new GroupWalker(ws, getTouchingGroups(set, g));
  const exactUpTo = Math.min(12, options.exactUpTo ?? EXACT_ROUTE_LIMIT);
  const maxStarts = Math.max(1, options.maxStarts ?? 8);
  const improve = options.improve ?? true;
  const bounds = improve ? getComponentCarryBounds(set, g, components) : null;
  const strands: StrandRoute[] = [];
  let carryCm = 0;
  for (let c = 0; c < components.count; c++) {
    const members = components.members.subarray(components.start[c], components.start[c + 1]);
    let strand: StrandRoute;
    if (members.length === 1) strand = traceStrand(ws, Int32Array.from(members));
    else if (members.length <= exactUpTo) strand = traceStrand(ws, getExactOrder(ws, members).order);
    else {
      const walks = bestWalks(ws, walker, members, maxStarts);
      strand = walks[0];
      const bound = bounds ? bounds[c] : Infinity;
      if (strand.carryCm > bound + 1e-6) {
        const m = members.length;
        if (m <= ALL_PAIRS_LIMIT) strand = improveWithGuide(ws, new AllPairsGuide(ws, members), walks, bound, c);
        else {
          const better = repairAndTrace(ws, improveWithinStretch(ws, strand.order, strand.carries));
          if (better.carryCm < strand.carryCm - 1e-9) strand = better;
        }
      }
    }
    strands.push(strand);
    carryCm += strand.carryCm;
  }
  return { strands, ends: 2 * strands.length, carryCm };
}

/** Walks from a few promising starts, traced, cheapest first. */
function bestWalks(ws: RouteWorkspace, walker: GroupWalker, members: Int32Array, maxStarts: number): StrandRoute[] {
  // Larger groups get fewer tries, so time grows about linearly with the stitches.
  const tries = Math.max(1, Math.min(maxStarts, Math.floor(6000 / members.length)));
  const walks = pickStarts(ws, members, tries).map((s) => walker.walk(members, s));
  walks.sort((a, b) => a.carryCm - b.carryCm);
  return walks.map((w) => traceStrand(ws, w.order));
}

/**
 * Searches from the best few walks under the all-pairs guide, repairing each result into a valid
 * route (the guide may pass behind unworked stitches) and searching once more from the repair.
 */
function improveWithGuide(ws: RouteWorkspace, guide: AllPairsGuide, walks: StrandRoute[], bound: number, c: number): StrandRoute {
  const m = guide.m;
  const rounds = Math.min(KICKS_MAX, Math.floor(KICK_BUDGET / m));
  let best = walks[0];
  for (let i = 0; i < Math.min(GUIDED_STARTS, walks.length); i++) {
    let from = walks[i];
    for (let pass = 0; pass < 2 && best.carryCm > bound + 1e-6; pass++) {
      const repaired = repairAndTrace(ws, guide.search(from.order, pass === 0 && i === 0 ? rounds : 0, m * 7919 + c));
      if (repaired.carryCm < best.carryCm - 1e-9) best = repaired;
      if (repaired.carryCm >= from.carryCm - 1e-9) break;
      from = repaired;
    }
  }
  return best;
}

/** Ends of the group first: stitches with the fewest touching neighbours, then the extremes. */
function pickStarts(ws: RouteWorkspace, members: Int32Array, tries: number): number[] {
  const { xs, ys } = ws.set;
  const byDegree = Array.from(members).map((id) => ({ id, degree: ws.openNeighbours(id) }));
  byDegree.sort((a, b) => a.degree - b.degree || a.id - b.id);
  const out: number[] = [];
  const add = (id: number) => {
    if (out.length < tries && !out.includes(id)) out.push(id);
  };
  add(byDegree[0].id);
  let minY = members[0];
  let maxY = members[0];
  let minX = members[0];
  let maxX = members[0];
  for (const id of members) {
    if (ys[id] < ys[minY]) minY = id;
    if (ys[id] > ys[maxY]) maxY = id;
    if (xs[id] < xs[minX]) minX = id;
    if (xs[id] > xs[maxX]) maxX = id;
  }
  for (const id of [maxX, minY, minX, maxY]) add(id);
  for (const d of byDegree) {
    if (out.length >= tries) break;
    add(d.id);
  }
  return out;
}

/**
 * Traces an order found under carries that may pass behind stitches not yet worked. Where a step
 * has no chain through worked stitches, or a shorter one through unworked stitches exists, those
 * unworked stitches are taken on the way (each then within one stretch of worked ones) and dropped
 * from their later place. The result is always a valid route through the same stitches.
 */
export function repairAndTrace(ws: RouteWorkspace, order: Int32Array): StrandRoute {
  const m = order.length;
  const out = new Int32Array(m);
  let n = 0;
  const via: number[] = [];
  const around: number[] = [];
  const place = (q: number) => {
    out[n++] = q;
    ws.worked[q] = 1;
  };
  place(order[0]);
  for (let k = 1; k < m; k++) {
    const q = order[k];
    if (ws.worked[q]) continue;
    const p = out[n - 1];
    const c = ws.carry(p, q, via);
    if (c > ws.g.limitCm) {
      const best = ws.chainThroughAll(p, q, around);
      if (best < c - 1e-9) for (const r of around) if (!ws.worked[r]) place(r);
    }
    place(q);
  }
  for (let k = 0; k < n; k++) ws.worked[out[k]] = 0;
  return traceStrand(ws, out);
}

/** Works the order through, recording each step's exact carry and the stitches it passes behind. */
export function traceStrand(ws: RouteWorkspace, order: Int32Array): StrandRoute {
  const carries = new Float64Array(order.length);
  const vias = new Map<number, Int32Array>();
  const via: number[] = [];
  let total = 0;
  ws.worked[order[0]] = 1;
  for (let k = 1; k < order.length; k++) {
    via.length = 0;
    const c = ws.carry(order[k - 1], order[k], via);
    if (c === Infinity) {
      for (let j = 0; j < k; j++) ws.worked[order[j]] = 0;
      throw new RangeError("a step of the route has no way through worked stitches");
    }
    carries[k] = c;
    total += c;
    if (via.length > 0) vias.set(k, Int32Array.from(via));
    ws.worked[order[k]] = 1;
  }
  for (let k = 0; k < order.length; k++) ws.worked[order[k]] = 0;
  return { order, carries, vias, carryCm: total };
}
