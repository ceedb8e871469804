// Clean-up after a photo: at most two knitted colours in each round, plus the colours the plan
// darns as real areas. The round-by-round colour plan (colourwork/round-pairs.ts: a pair held per
// round, every other stitch darned afterwards) is made for the chart; small groups of darned
// stitches (specks of a third or fourth colour that blur or noise left in a round) are each folded
// into the nearer (CIEDE2000) of the pair held in their round. Larger darned groups are kept: they
// are the picture. The plan is made again; folds that together would raise the darned stitches,
// the ends or the minutes are tried again in halves, so the cost never rises. Pure and deterministic.
import { getColourDifference } from "../colourwork/ciede2000";
import type { DarningRates } from "../colourwork/darning-rates";
import { planRoundPairs, type RoundPairsPlan } from "../colourwork/round-pairs";
import { parseChart, serializeChart, type ChartV1 } from "../chart/format";
import type { Chart } from "../chart/model";
import { PhotoError } from "./photo-error";

export interface LimitRoundColoursOptions {
  /** groups of darned stitches of one colour with at most this many stitches are folded (default 3) */
  maxStitches?: number;
  /** default true: the round closes (floats and groups wrap from the last stitch to the first) */
  inTheRound?: boolean;
  floatLimitStitches?: number;
  floatLimitCm?: number;
  carryLimitCm?: number;
  rates?: Partial<DarningRates>;
}

/** What the round-by-round plan of a chart needs (its totals). */
export interface RoundPlanCost {
  darnedStitches: number;
  /** knitted yarns joined and cut, plus darning ends */
  ends: number;
  catches: number;
  /** darned stitches, ends, carries and catches at the labour rates */
  minutes: number;
  /** rounds holding more than two colours */
  roundsOverTwo: number;
}

export interface ChangedStitch {
  /** trade numbering: row from the bottom, stitch from the right, both from 1 */
  row: number;
  stitch: number;
  from: string;
  to: string;
}

export interface LimitRoundColoursResult {
  chart: ChartV1;
  changed: ChangedStitch[];
  before: RoundPlanCost;
  after: RoundPlanCost;
  /** darned groups: folded, kept as real areas (larger than maxStitches), and small ones kept because folding them cost more */
  groups: { folded: number; kept: number; keptDearer: number };
}

export const DEFAULT_MAX_SPECK_STITCHES = 3;
export const MAX_SPECK_STITCHES = 50;
/** Plans made at most while sorting out folds that cost more (each is one planRoundPairs). */
const MAX_PLANS = 24;

interface Fold {
  cells: number[];
  to: number[];
}

export function limitRoundColours(input: Chart | ChartV1, options: LimitRoundColoursOptions = {}): LimitRoundColoursResult {
  if (!options || typeof options !== "object") throw new PhotoError("limitRounds", "options must be an object");
  const maxStitches = options.maxStitches ?? DEFAULT_MAX_SPECK_STITCHES;
  if (typeof maxStitches !== "number" || !Number.isInteger(maxStitches) || maxStitches < 1 || maxStitches > MAX_SPECK_STITCHES) {
    throw new PhotoError("limitRounds.maxStitches", `must be a whole number from 1 to ${MAX_SPECK_STITCHES} (got ${String(maxStitches)})`);
  }
  const inTheRound = options.inTheRound ?? true;
  if (typeof inTheRound !== "boolean") throw new PhotoError("limitRounds.inTheRound", "must be true or false");
  const chart: Chart = "cells" in input ? input : parseChart(input);
  const { width: W, height: H, palette } = chart;
  const planOptions = {
    inTheRound,
    ...(options.floatLimitStitches !== undefined ? { floatLimitStitches: options.floatLimitStitches } : {}),
    ...(options.floatLimitCm !== undefined ? { floatLimitCm: options.floatLimitCm } : {}),
    ...(options.carryLimitCm !== undefined ? { carryLimitCm: options.carryLimitCm } : {}),
    ...(options.rates ? { rates: options.rates } : {}),
  };
  const plan = (cells: ArrayLike<number>): RoundPairsPlan =>
    planRoundPairs(
      {
        // rounds bottom first, each in knitting order from the right (stitch 1 is the rightmost cell)
        rounds: Array.from({ length: H }, (_, y) => Array.from({ length: W }, (_, k) => cells[y * W + (W - 1 - k)])),
        palette: palette.map((p) => ({ key: p.key, name: p.name, hex: p.hex })),
        gauge: chart.gauge,
      },
      planOptions,
    );
  const costOf = (p: RoundPairsPlan): RoundPlanCost => ({
    darnedStitches: p.totals.darnedStitches,
    ends: p.totals.ends,
    catches: p.totals.catches,
    minutes: p.totals.minutes,
    roundsOverTwo: p.rounds.filter((r) => r.darned.length > 0).length,
  });

  const first = plan(chart.cells);
  const before = costOf(first);
  const keyIndex = new Map(palette.map((p, i) => [p.key, i]));
  const darned = new Uint8Array(W * H);
  const held: number[][] = first.rounds.map((r) => r.pair.map((k) => keyIndex.get(k)!));
  first.rounds.forEach((r, y) => {
    for (const d of r.darned) darned[y * W + (W - d.stitch)] = 1;
  });

  // Groups of one colour, touching (8 neighbours; across the start of the round when it closes).
  const diff = palette.map((p) => palette.map((q) => getColourDifference(p.hex, q.hex)));
  const seen = new Uint8Array(W * H);
  const folds: Fold[] = [];
  let kept = 0;
  for (let start = 0; start < W * H; start++) {
    if (seen[start] || !darned[start]) continue;
    const colour = chart.cells[start];
    const group: number[] = [start];
    seen[start] = 1;
    let allDarned = true;
    for (let g = 0; g < group.length; g++) {
      const i = group[g];
      if (!darned[i]) allDarned = false;
      const x = i % W;
      const y = (i - x) / W;
      for (let dy = -1; dy <= 1; dy++) {
        const yy = y + dy;
        if (yy < 0 || yy >= H) continue;
        for (let dx = -1; dx <= 1; dx++) {
          let xx = x + dx;
          if (inTheRound) xx = (xx + W) % W;
          else if (xx < 0 || xx >= W) continue;
          const j = yy * W + xx;
          if (seen[j] || chart.cells[j] !== colour) continue;
          seen[j] = 1;
          group.push(j);
        }
      }
    }
    // A group partly knitted (its colour held in some of its rounds) belongs to a knitted area.
    if (!allDarned || group.length > maxStitches) {
      kept++;
      continue;
    }
    group.sort((a, b) => a - b);
    const to = group.map((i) => {
      const pair = held[Math.floor(i / W)];
      let best = pair[0];
      for (const c of pair) if (diff[colour][c] < diff[colour][best] - 1e-12 || (Math.abs(diff[colour][c] - diff[colour][best]) <= 1e-12 && c < best)) best = c;
      return best;
    });
    folds.push({ cells: group, to });
  }

  // Fold them all; where that costs more, try each half on its own, down to single groups.
  let cells = Uint8Array.from(chart.cells);
  let cost = before;
  let plans = 0;
  let folded = 0;
  let keptDearer = 0;
  const noDearer = (a: RoundPlanCost, b: RoundPlanCost) => a.darnedStitches <= b.darnedStitches && a.ends <= b.ends && a.minutes <= b.minutes;
  const attempt = (list: Fold[]) => {
    if (list.length === 0) return;
    if (plans >= MAX_PLANS) {
      keptDearer += list.length;
      return;
    }
    const next = cells.slice();
    for (const f of list) f.cells.forEach((i, n) => (next[i] = f.to[n]));
    plans++;
    const c = costOf(plan(next));
    if (noDearer(c, cost)) {
      cells = next;
      cost = c;
      folded += list.length;
      return;
    }
    if (list.length === 1) {
      keptDearer++;
      return;
    }
    const half = Math.ceil(list.length / 2);
    attempt(list.slice(0, half));
    attempt(list.slice(half));
  };
  attempt(folds);

  const changed: ChangedStitch[] = [];
  for (let i = 0; i < cells.length; i++) {
    if (cells[i] === chart.cells[i]) continue;
    const x = i % W;
    changed.push({ row: (i - x) / W + 1, stitch: W - x, from: palette[chart.cells[i]].key, to: palette[cells[i]].key });
  }
  changed.sort((a, b) => a.row - b.row || a.stitch - b.stitch);
  return {
    chart: serializeChart({ ...chart, cells }),
    changed,
    before,
    after: cost,
    groups: { folded, kept, keptDearer },
  };
}
