// The colour plan of a two-colour stranded piece: which pair is knitted, which colours are darned
// afterwards, what each darned stitch is knitted in first (its underlay), and the floats and
// catches that result, row by row.
import type { Chart } from "@/lib/core/chart/model";
import { getCarryGeometry } from "./carry-geometry";
import { getColourDifference } from "./ciede2000";
import { chooseRowUnderlay, type UnderlayRow } from "./choose-underlay";
import { resolveColourPlanOptions, type ResolvedOptions } from "./colourwork-options";
import { routeChartColour, type ColourRouting } from "./darn-colour";
import { getDarningMinutes, roundTenth } from "./darning-rates";
import { getCatchStitches, getFloatLimitStitches, getRowFloats, type CatchAvoid } from "./row-floats";

export interface PairCandidate {
  knit: string[];
  darn: string[];
  darnedStitches: number;
  /** absent when the pair was set aside: its darning time alone exceeds the best pair's total */
  catches?: number;
  ends?: number;
  carryCm?: number;
  /** darning, ends, carries and float catches at the labour rates */
  minutes: number;
  /** true when minutes is only a lower bound (the pair was set aside without a full plan) */
  minutesAtLeast?: boolean;
}

export interface FloatMark {
  /** key of the colour carried behind the run */
  carried: string;
  /** first stitch of the float in knitting order (from the right, from 1) */
  fromStitch: number;
  /** last stitch; smaller than fromStitch when the float wraps past the end of the round */
  toStitch: number;
  length: number;
  /** stitches behind which to catch the carried yarn */
  catchStitches: number[];
}

export interface RowFloatReport {
  /** from the bottom, from 1 */
  row: number;
  longestFloat: number;
  catches: number;
  /** floats longer than the limit */
  floats: FloatMark[];
}

export interface UnderlayReport {
  key: string;
  /** knitted colour key → darned stitches knitted in it first */
  onto: Record<string, number>;
}

export interface ColourPlan {
  knit: string[];
  darn: string[];
  darnedStitches: number;
  /** every pair considered, cheapest first */
  candidates: PairCandidate[];
  underlay: UnderlayReport[];
  rows: RowFloatReport[];
  totals: { catches: number; longestFloat: number };
  /** the knitted chart after underlay, top row first, in palette keys */
  knittedRows: string[];
  settings: { inTheRound: boolean; floatLimitStitches: number; carryLimitCm: number };
}

/** Routes per colour, shared between the pair choice and the darning plan. */
export type RoutingCache = Map<number, ColourRouting>;

export function planColours(chart: Chart, options: unknown = {}): ColourPlan {
  const o = resolveColourPlanOptions(chart, options);
  return buildColourPlan(chart, o, new Map()).plan;
}

interface PairEvaluation {
  catches: number;
  knitted: Uint8Array;
}

export function buildColourPlan(chart: Chart, o: ResolvedOptions, cache: RoutingCache): { plan: ColourPlan; darn: number[]; knit: number[] } {
  const limit = getFloatLimitStitches(chart.gauge.stitchesPer10cm, o.floatLimitStitches, o.floatLimitCm);
  const g = getCarryGeometry(chart.gauge, o.carryLimitCm);
  const k = chart.palette.length;
  const counts = new Array<number>(k).fill(0);
  for (const c of chart.cells) counts[c]++;
  const diff = chart.palette.map((p) => chart.palette.map((q) => getColourDifference(p.hex, q.hex)));

  const pairs: number[][] = [];
  if (k === 1) pairs.push([0]);
  for (let a = 0; a < k; a++) for (let b = a + 1; b < k; b++) if (counts[a] > 0 || counts[b] > 0) pairs.push([a, b]);
  if (o.knit && !pairs.some((p) => p[0] === Math.min(...o.knit!) && p[1] === Math.max(...o.knit!))) {
    pairs.push([Math.min(...o.knit), Math.max(...o.knit)]);
  }

  const routing = (c: number) => {
    let r = cache.get(c);
    if (!r) {
      r = routeChartColour(chart, c, g, { inTheRound: o.routeInTheRound });
      cache.set(c, r);
    }
    return r;
  };
  // Darning time alone (plus one strand per darned colour) bounds a pair's minutes from below, so
  // pairs that leave a large area to darn are never routed in full.
  const rough = pairs.map((pair) => {
    const darn = chart.palette.map((_, c) => c).filter((c) => !pair.includes(c) && counts[c] > 0);
    const darnedStitches = darn.reduce((sum, c) => sum + counts[c], 0);
    const floor = getDarningMinutes({ stitches: darnedStitches, ends: 2 * darn.length, carryCm: 0 }, o.rates);
    return { pair, darn, darnedStitches, floor };
  });
  rough.sort((p, q) => p.floor - q.floor || p.pair[0] - q.pair[0] || (p.pair[1] ?? 0) - (q.pair[1] ?? 0));
  const isFixed = (pair: number[]) => o.knit !== null && pair[0] === Math.min(...o.knit) && pair[1] === Math.max(...o.knit);
  let bestMinutes = Infinity;
  const scored = rough.map((r) => {
    if (r.floor > bestMinutes && !isFixed(r.pair)) return { ...r, full: null };
    const evaluation = evaluatePair(chart, r.pair, diff, limit, o.inTheRound);
    let ends = 0;
    let carryCm = 0;
    for (const c of r.darn) {
      const route = routing(c).route;
      ends += route.ends;
      carryCm += route.carryCm;
    }
    const minutes = getDarningMinutes({ stitches: r.darnedStitches, ends, carryCm, catches: evaluation.catches }, o.rates);
    bestMinutes = Math.min(bestMinutes, minutes);
    return { ...r, full: { evaluation, ends, carryCm, minutes } };
  });
  const minutesOf = (s: (typeof scored)[number]) => s.full?.minutes ?? s.floor;
  scored.sort(
    (p, q) =>
      Number(p.full === null) - Number(q.full === null) ||
      minutesOf(p) - minutesOf(q) ||
      p.darnedStitches - q.darnedStitches ||
      p.pair[0] - q.pair[0] ||
      (p.pair[1] ?? 0) - (q.pair[1] ?? 0),
  );

  const keyOf = (c: number) => chart.palette[c].key;
  const chosen = scored.find((s) => (o.knit ? isFixed(s.pair) : s.full !== null))!;
  const full = chosen.full!;
  const knit = o.knit ? [...o.knit] : chosen.pair;
  const candidates: PairCandidate[] = scored.map((s) => {
    const base = { knit: s.pair.map(keyOf), darn: s.darn.map(keyOf), darnedStitches: s.darnedStitches };
    if (!s.full) return { ...base, minutes: roundTenth(s.floor), minutesAtLeast: true };
    return {
      ...base,
      catches: s.full.evaluation.catches,
      ends: s.full.ends,
      carryCm: roundTenth(s.full.carryCm),
      minutes: roundTenth(s.full.minutes),
    };
  });
  const plan = describePlan(chart, knit, chosen.darn, full.evaluation.knitted, limit, o, candidates, chosen.darnedStitches);
  return { plan, darn: chosen.darn, knit };
}

/** Underlay for every row under one pair; `knitted` holds the palette colour knitted in each cell. */
function evaluatePair(chart: Chart, pair: number[], diff: number[][], limit: number, inTheRound: boolean): PairEvaluation {
  const { width, height, cells } = chart;
  const knitted = new Uint8Array(cells.length);
  let catches = 0;
  const a = pair[0];
  const b = pair.length > 1 ? pair[1] : pair[0];
  const row: UnderlayRow = { fixed: new Int8Array(width), cost0: new Float64Array(width), cost1: new Float64Array(width) };
  const colours = new Uint8Array(width);
  // Catches are staggered against the row below's, so they do not line up on the right side.
  let below: CatchAvoid = [new Set(), new Set()];
  for (let y = 0; y < height; y++) {
    let darned = 0;
    for (let k = 0; k < width; k++) {
      // Knitting order runs from the right: k = 0 is stitch 1.
      const c = cells[y * width + (width - 1 - k)];
      if (c === a) row.fixed[k] = 0;
      else if (c === b) row.fixed[k] = 1;
      else {
        row.fixed[k] = -1;
        row.cost0[k] = diff[c][a];
        row.cost1[k] = diff[c][b];
        darned++;
      }
    }
    const choice = darned > 0 ? chooseRowUnderlay(row, limit, inTheRound) : fixedColours(row.fixed, colours);
    const floats = getRowFloats(choice, limit, inTheRound, below);
    catches += floats.catches;
    below = getCatchStitches(floats);
    for (let k = 0; k < width; k++) knitted[y * width + (width - 1 - k)] = choice[k] === 0 ? a : b;
  }
  return { catches, knitted };
}

function fixedColours(fixed: Int8Array, out: Uint8Array): Uint8Array {
  for (let i = 0; i < fixed.length; i++) out[i] = fixed[i];
  return out;
}

function describePlan(
  chart: Chart,
  knit: number[],
  darn: number[],
  knitted: Uint8Array,
  limit: number,
  o: ResolvedOptions,
  candidates: PairCandidate[],
  darnedStitches: number,
): ColourPlan {
  const { width, height, cells, palette } = chart;
  const pair = [Math.min(...knit), Math.max(...knit)];
  const rows: RowFloatReport[] = [];
  let catches = 0;
  let longest = 0;
  const colours = new Uint8Array(width);
  let below: CatchAvoid = [new Set(), new Set()];
  for (let y = 0; y < height; y++) {
    for (let k = 0; k < width; k++) colours[k] = knitted[y * width + (width - 1 - k)] === pair[0] ? 0 : 1;
    const f = getRowFloats(colours, limit, o.inTheRound, below);
    below = getCatchStitches(f);
    catches += f.catches;
    longest = Math.max(longest, f.longest);
    rows.push({
      row: y + 1,
      longestFloat: f.longest,
      catches: f.catches,
      floats: f.long.map((fl) => ({
        carried: palette[pair[fl.carried] ?? pair[0]].key,
        fromStitch: fl.start + 1,
        toStitch: ((fl.start + fl.length - 1) % width) + 1,
        length: fl.length,
        catchStitches: fl.catchAt.map((s) => s + 1),
      })),
    });
  }
  const underlay: UnderlayReport[] = darn.map((c) => {
    const onto: Record<string, number> = {};
    for (const p of knit) onto[palette[p].key] = 0;
    for (let i = 0; i < cells.length; i++) if (cells[i] === c) onto[palette[knitted[i]].key]++;
    return { key: palette[c].key, onto };
  });
  const knittedRows: string[] = [];
  for (let y = height - 1; y >= 0; y--) {
    let text = "";
    for (let x = 0; x < width; x++) text += palette[knitted[y * width + x]].key;
    knittedRows.push(text);
  }
  return {
    knit: knit.map((c) => palette[c].key),
    darn: darn.map((c) => palette[c].key),
    darnedStitches,
    candidates,
    underlay,
    rows,
    totals: { catches, longestFloat: longest },
    knittedRows,
    settings: { inTheRound: o.inTheRound, floatLimitStitches: limit, carryLimitCm: o.carryLimitCm },
  };
}

