// Floats of one knitted row. After underlay every stitch is one of the knitted pair (0 or 1); each
// run of one colour is a float of the other on the wrong side. Rules, decided here:
// - a colour that does not appear in the row is not carried there, so a row all in one colour has
//   no float at all (the other strand waits at the row's start);
// - flat, runs stop at the row's edges (a run from an edge still counts: the other strand is
//   carried from the edge to where it is next used);
// - in the round the row wraps: the run at the end of the round joins the run at its start.
// A float of n stitches with limit L needs ceil(n / L) - 1 catches, spread evenly. Catches of one
// carried colour on the same stitch round after round line up and show on the right side, so a
// row may be given the row below's catch stitches to keep off (see getStaggeredOffsets).

export interface RowFloat {
  /** 0 or 1: the colour carried behind the run */
  carried: number;
  /** first stitch of the float in knitting order, from 0 (trade stitch - 1) */
  start: number;
  /** stitches spanned */
  length: number;
  /** stitches (from 0, knitting order, wrapped) at which the carried yarn is caught */
  catchAt: number[];
}

export interface RowFloatSummary {
  longest: number;
  catches: number;
  /** floats longer than the limit, with where to catch them */
  long: RowFloat[];
}

/** Catches a float of `length` stitches needs under a limit of `limit` stitches. */
export function getCatchCount(length: number, limit: number): number {
  return length > limit ? Math.ceil(length / limit) - 1 : 0;
}

/** Splits a float into catches + 1 pieces of at most `limit` stitches; returns the offsets of the catches. */
export function getCatchOffsets(length: number, limit: number): number[] {
  const k = getCatchCount(length, limit);
  const out: number[] = [];
  for (let i = 1; i <= k; i++) out.push(Math.round((i * length) / (k + 1)));
  return out;
}

/**
 * Catch stitches of the row below, per colour carried (0 or 1), in knitting order from 0: a row
 * keeps its own catches of that colour off them.
 */
export type CatchAvoid = readonly [ReadonlySet<number>, ReadonlySet<number>];

/**
 * Catch offsets for a float starting at stitch `start` of a row of `rowLength` stitches, none on a
 * stitch in `avoid` (the row below's catches of the same colour), every piece still at most
 * `limit`. The even spread is kept when it already misses them (and has no two catches side by
 * side); otherwise the fewest catches that
 * miss them, as evenly spread as possible (least sum of squared pieces; a piece of one stitch
 * between two catches counts extra, as it blocks the next row). An extra catch is sometimes the
 * price: a float of exactly 2L has one place to catch, so the next row catches it twice. When no
 * placement misses them (a limit of 1), the even spread is returned.
 */
export function getStaggeredOffsets(start: number, length: number, limit: number, rowLength: number, avoid: ReadonlySet<number>): number[] {
  const even = getCatchOffsets(length, limit);
  const at = (o: number) => (start + o) % rowLength;
  const n = length;
  const L = Math.max(1, limit);
  // Two catches side by side leave the next row no way round them when the limit is 2.
  const adjacent = L >= 2 && even.some((o, i) => i > 0 && o - even[i - 1] === 1);
  if (!adjacent && even.every((o) => !avoid.has(at(o)))) return even;
  const count = new Float64Array(n + 1).fill(Infinity);
  const cost = new Float64Array(n + 1).fill(Infinity);
  const from = new Int32Array(n + 1).fill(-1);
  count[0] = 0;
  cost[0] = 0;
  for (let o = 1; o <= n; o++) {
    if (o < n && avoid.has(at(o))) continue;
    for (let p = Math.max(0, o - L); p < o; p++) {
      if (count[p] === Infinity) continue;
      const piece = o - p;
      const c = count[p] + (o < n ? 1 : 0);
      const v = cost[p] + piece * piece + (piece === 1 && p > 0 && o < n ? n * n : 0);
      if (c < count[o] || (c === count[o] && v < cost[o])) {
        count[o] = c;
        cost[o] = v;
        from[o] = p;
      }
    }
  }
  if (count[n] === Infinity) return even;
  const out: number[] = [];
  for (let o = from[n]; o > 0; o = from[o]) out.push(o);
  return out.reverse();
}

/**
 * `row` lists the knitted colour (0 or 1) of each stitch in knitting order. With `avoid` (the row
 * below's catch stitches per carried colour) catches are staggered against them.
 */
export function getRowFloats(row: ArrayLike<number>, limit: number, inTheRound: boolean, avoid?: CatchAvoid): RowFloatSummary {
  const n = row.length;
  const summary: RowFloatSummary = { longest: 0, catches: 0, long: [] };
  if (n === 0) return summary;
  let first = 0;
  while (first < n && row[first] === row[0]) first++;
  if (first === n) return summary; // one colour only: the other is not carried
  // In the round, start counting at a colour change so the wrapped run is seen whole.
  const origin = inTheRound ? first : 0;
  let i = 0;
  while (i < n) {
    const colour = row[(origin + i) % n];
    let j = i;
    while (j < n && row[(origin + j) % n] === colour) j++;
    const length = j - i;
    if (length > summary.longest) summary.longest = length;
    if (getCatchCount(length, limit) > 0) {
      const start = (origin + i) % n;
      const carried = 1 - colour;
      const offsets = avoid ? getStaggeredOffsets(start, length, limit, n, avoid[carried]) : getCatchOffsets(length, limit);
      summary.catches += offsets.length;
      summary.long.push({ carried, start, length, catchAt: offsets.map((o) => (start + o) % n) });
    }
    i = j;
  }
  return summary;
}

/** Longest float allowed, in stitches: the stitch limit or the length limit at this gauge, whichever is fewer. */
export function getFloatLimitStitches(stitchesPer10cm: number, limitStitches: number, limitCm: number): number {
  const byLength = Math.floor((limitCm * stitchesPer10cm) / 10 + 1e-9);
  return Math.max(1, Math.min(limitStitches, byLength));
}

/** The catch stitches of a row's floats per carried colour, to stagger the next row against. */
export function getCatchStitches(summary: RowFloatSummary): CatchAvoid {
  const out: [Set<number>, Set<number>] = [new Set(), new Set()];
  for (const f of summary.long) for (const s of f.catchAt) out[f.carried].add(s);
  return out;
}
