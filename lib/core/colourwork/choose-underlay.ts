// Chooses, for one row, which of the knitted pair goes under each darned stitch. The aim is, first,
// the fewest float catches in the row; then, among choices that tie, the knitted colour closest to
// the darning colour (the sum of CIEDE2000 differences), so any show-through is least visible.
// Exact, by dynamic programming over (colour of the current run, its length modulo the limit).
import { getCatchCount } from "./row-floats";

/** Weight of one catch against colour differences (a row's total ΔE00 stays far below it). */
const CATCH_WEIGHT = 1e6;

export interface UnderlayRow {
  /** per stitch in knitting order: 0 or 1 for a knitted stitch, -1 for a darned one */
  fixed: Int8Array;
  /** colour difference of putting knitted colour 0 / 1 under each darned stitch */
  cost0: Float64Array;
  cost1: Float64Array;
}

/** The knitted colour (0 or 1) of every stitch after underlay, in knitting order. */
export function chooseRowUnderlay(row: UnderlayRow, limit: number, inTheRound: boolean): Uint8Array {
  const n = row.fixed.length;
  const L = Math.max(1, limit);
  let best: { value: number; colours: Uint8Array } | null = null;
  const consider = (value: number, colours: Uint8Array | null) => {
    if (colours && (!best || value < best.value - 1e-9)) best = { value, colours };
  };

  if (!inTheRound) consider(...linearPlan(row, L, 0, null));
  else {
    let cut = -1;
    let anyFixed = -1;
    for (let i = 0; i < n; i++) {
      const a = row.fixed[i];
      const b = row.fixed[(i + 1) % n];
      if (a >= 0 && anyFixed < 0) anyFixed = i;
      if (a >= 0 && b >= 0 && a !== b) {
        cut = (i + 1) % n;
        break;
      }
    }
    if (cut >= 0) {
      // Two knitted stitches of different colours meet here: no run crosses, so cut the round open.
      consider(...linearPlan(row, L, cut, null));
    } else {
      const start = anyFixed >= 0 ? anyFixed : 0;
      const colours = anyFixed >= 0 ? [row.fixed[anyFixed]] : [0, 1];
      for (const c0 of colours) for (let r0 = 0; r0 < L; r0++) consider(...linearPlan(row, L, start, { c0, r0 }));
    }
  }
  // One colour for the whole row: the other strand is not carried, so no catches at all.
  for (const c of [0, 1]) {
    let ok = true;
    let value = 0;
    for (let i = 0; i < n && ok; i++) {
      const f = row.fixed[i];
      if (f >= 0) ok = f === c;
      else value += c === 0 ? row.cost0[i] : row.cost1[i];
    }
    if (ok && (!best || value <= (best as { value: number }).value + 1e-9)) best = { value, colours: new Uint8Array(n).fill(c) };
  }
  if (!best) throw new RangeError("a row has no valid underlay");
  return (best as { colours: Uint8Array }).colours;
}

/**
 * Run-length DP over the row read from `start` (wrapping). With `wrap`, the run through the start
 * is treated as already `r0` stitches long (the part at the end of the round, modulo L) in colour c0,
 * and only endings consistent with that are accepted, so the wrapped run is priced whole.
 */
function linearPlan(
  row: UnderlayRow,
  L: number,
  start: number,
  wrap: { c0: number; r0: number } | null,
): [number, Uint8Array | null] {
  const n = row.fixed.length;
  const S = 2 * L;
  let cur = new Float64Array(S).fill(Infinity);
  let next = new Float64Array(S);
  const back = new Int16Array(n * S).fill(-1);
  const at = (i: number) => (start + i) % n;
  const stitchCost = (i: number, c: number) => {
    const k = at(i);
    const f = row.fixed[k];
    if (f >= 0) return f === c ? 0 : Infinity;
    return c === 0 ? row.cost0[k] : row.cost1[k];
  };
  for (let c = 0; c < 2; c++) {
    if (wrap && c !== wrap.c0) continue;
    const r = wrap ? wrap.r0 + 1 : 1;
    cur[c * L + r - 1] = stitchCost(0, c);
  }
  for (let i = 1; i < n; i++) {
    next.fill(Infinity);
    const add0 = stitchCost(i, 0);
    const add1 = stitchCost(i, 1);
    for (let s = 0; s < S; s++) {
      const v = cur[s];
      if (v === Infinity) continue;
      const c = s < L ? 0 : 1;
      const r = s - c * L + 1;
      for (let nc = 0; nc < 2; nc++) {
        const add = nc === 0 ? add0 : add1;
        if (add === Infinity) continue;
        let ns: number;
        let nv = v + add;
        if (nc === c) {
          if (r < L) ns = s + 1;
          else {
            ns = c * L; // the run passes a multiple of L: one more catch
            nv += CATCH_WEIGHT;
          }
        } else ns = nc * L;
        if (nv < next[ns]) {
          next[ns] = nv;
          back[i * S + ns] = s;
        }
      }
    }
    const t = cur;
    cur = next;
    next = t;
  }
  let bestS = -1;
  let bestV = Infinity;
  for (let s = 0; s < S; s++) {
    let v = cur[s];
    if (v === Infinity) continue;
    if (wrap) {
      const c = s < L ? 0 : 1;
      const r = s - c * L + 1;
      if (c !== wrap.c0) {
        if (wrap.r0 !== 0) continue;
      } else {
        if (r % L !== wrap.r0) continue;
        if (r === L) v += CATCH_WEIGHT;
      }
    }
    if (v < bestV) {
      bestV = v;
      bestS = s;
    }
  }
  if (bestS < 0) return [Infinity, null];
  const colours = new Uint8Array(n);
  for (let i = n - 1, s = bestS; i >= 0; i--) {
    colours[at(i)] = s < L ? 0 : 1;
    s = back[i * S + s];
  }
  return [bestV, colours];
}

/** Catches and colour cost of a finished row (for checks): the same value the DP minimises. */
export function getUnderlayValue(row: UnderlayRow, colours: Uint8Array, limit: number, inTheRound: boolean): { catches: number; colourCost: number } {
  const n = colours.length;
  let colourCost = 0;
  for (let i = 0; i < n; i++) if (row.fixed[i] < 0) colourCost += colours[i] === 0 ? row.cost0[i] : row.cost1[i];
  let first = 0;
  while (first < n && colours[first] === colours[0]) first++;
  if (first === n) return { catches: 0, colourCost };
  const origin = inTheRound ? first : 0;
  let catches = 0;
  for (let i = 0; i < n; ) {
    let j = i;
    while (j < n && colours[(origin + j) % n] === colours[(origin + i) % n]) j++;
    catches += getCatchCount(j - i, limit);
    i = j;
  }
  return { catches, colourCost };
}
