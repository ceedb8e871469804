// Two colours per round, planned: for every round of one piece (bottom first, each round in knitting
// order from the start of the round), which two yarns are held and knitted, which stitches are
// darned afterwards and over which knitted colour, the floats and catches, and why. The choice
// minimises the studio's minutes over the whole piece (see PLANNING.md, "Pairs round by round").
import { z } from "zod";
import { MAX_PALETTE, type Gauge } from "@/lib/core/chart/model";
import { fieldErrorMap, joinIssues, toFieldIssues } from "@/lib/core/chart/zod-messages";
import { getColourDifference } from "./ciede2000";
import { chooseRowUnderlay, type UnderlayRow } from "./choose-underlay";
import type { FloatMark } from "./colour-plan";
import { ColourworkError } from "./colourwork-error";
import { DEFAULT_CARRY_LIMIT_CM, DEFAULT_FLOAT_LIMIT_CM, DEFAULT_FLOAT_LIMIT_STITCHES, MAX_LENGTH_LIMIT_CM } from "./colourwork-options";
import { defaultDarningRates, getDarningMinutes, roundTenth, type DarningRates } from "./darning-rates";
import { getCarryGeometry } from "./carry-geometry";
import { routeStitchSet } from "./route-colour";
import { getCatchStitches, getFloatLimitStitches, getRowFloats, type CatchAvoid } from "./row-floats";
import { getStitchSet } from "./stitch-set";

/** A colour named by its palette key or its palette index. */
export type RoundColour = string | number;

export interface RoundPaletteColour {
  key: string;
  name?: string;
  /** #RRGGBB, for the CIEDE2000 choice of underlay */
  hex: string;
}

export interface RoundPairsInput {
  /** bottom round first; each round lists its stitches in knitting order from the start of the round */
  rounds: RoundColour[][];
  palette: RoundPaletteColour[];
  gauge: Gauge;
}

export interface RoundPin {
  /** rounds from the bottom, from 1, both included */
  fromRound: number;
  toRound: number;
  /** the two colours knitted in these rounds (palette keys or indices) */
  pair: [RoundColour, RoundColour];
}

export interface RoundPairsOptions {
  /** colours the maker wants darned wherever they appear (never knitted) */
  darn?: RoundColour[];
  pins?: RoundPin[];
  /** default true: the round closes, so the last stitch meets the first */
  inTheRound?: boolean;
  floatLimitStitches?: number;
  floatLimitCm?: number;
  carryLimitCm?: number;
  rates?: Partial<DarningRates>;
}

export interface DarnedStitch {
  /** stitch in knitting order from the start of the round, from 1 */
  stitch: number;
  colour: string;
  /** the knitted colour under it (its underlay) */
  onto: string;
}

export interface RoundPairRound {
  /** from the bottom, from 1 */
  round: number;
  stitches: number;
  /** the yarns held in this round (two, or one when only one colour can be knitted) */
  pair: string[];
  /** colours actually knitted in this round after underlay (at most two) */
  knit: string[];
  darned: DarnedStitch[];
  /** yarns joined at the start of this round / cut before it */
  joined: string[];
  cut: string[];
  longestFloat: number;
  catches: number;
  /** floats longer than the limit, with the stitches to catch them at */
  floats: FloatMark[];
  pinned: boolean;
  /** a short reason a maker can read */
  reason: string;
}

export interface RoundPairsTotals {
  rounds: number;
  stitches: number;
  darnedStitches: number;
  /** yarns joined (each is also cut once: two ends per join) */
  joins: number;
  cuts: number;
  /** ends of knitted yarns: joins + cuts */
  knitEnds: number;
  /** ends of darning strands, from the route of each darned colour over the whole piece */
  darningEnds: number;
  ends: number;
  /** darning carries plus held yarns carried up the inside, cm */
  carryCm: number;
  /** float catches, staggered between rounds */
  catches: number;
  minutes: number;
}

export interface RoundDarning {
  key: string;
  stitches: number;
  strands: number;
  ends: number;
  carryCm: number;
}

export interface RoundPairsPlan {
  rounds: RoundPairRound[];
  totals: RoundPairsTotals;
  /** the route of each darned colour over the whole piece (one strand per group within reach) */
  darning: RoundDarning[];
  /**
   * The best single pair held for the whole piece (the old model), priced the same way; null when
   * pins leave none. `keepsRules` is false when it darns in a round holding only two colours (not
   * allowed here), so its minutes may then be below the plan's.
   */
  singlePair: { pair: string[]; minutes: number; keepsRules: boolean } | null;
  /** minutes the planner minimised (darning route estimated per round): compare with singlePair.minutes */
  plannedMinutes: number;
  /** the parts of plannedMinutes that differ from the totals: estimated route, catches before staggering */
  planned: { darningEnds: number; carryCm: number; catches: number };
  /**
   * How the darning route was priced while choosing pairs: per round, from the clusters of each
   * darned colour and whether they continue a strand from the round below (an exact route per
   * candidate sequence would be far too slow). Totals use the real route of the chosen plan.
   */
  routeCost: "estimated per round";
  settings: { inTheRound: boolean; floatLimitStitches: number; carryLimitCm: number; rates: DarningRates };
}

// ---------------------------------------------------------------------------------------------
// Validation

const colourRef = z.union([z.string().min(1), z.number().int().min(0)]);
const positive = () => z.number().refine((v) => Number.isFinite(v) && v > 0, { error: (iss) => `must be more than 0 (got ${String(iss.input)})` });
const nonNegative = () => z.number().refine((v) => Number.isFinite(v) && v >= 0, { error: (iss) => `must be a number ≥ 0 (got ${String(iss.input)})` });
const lengthLimit = () => positive().refine((v) => v <= MAX_LENGTH_LIMIT_CM, { error: `must be at most ${MAX_LENGTH_LIMIT_CM} cm` });

export const MAX_ROUNDS = 2000;
export const MAX_ROUND_STITCHES = 1000;

export const roundPairsInputSchema = z
  .object({
    rounds: z.array(z.array(colourRef).max(MAX_ROUND_STITCHES)).max(MAX_ROUNDS),
    palette: z
      .array(
        z.object({
          key: z.string().min(1),
          name: z.string().optional(),
          hex: z.string().regex(/^#[0-9a-fA-F]{6}$/, { error: "must be a colour like #1F2A44" }),
        }),
      )
      .min(1)
      .max(MAX_PALETTE),
    gauge: z.object({ stitchesPer10cm: positive(), rowsPer10cm: positive() }),
  })
  .strict();

export const roundPairsOptionsSchema = z
  .object({
    darn: z.array(colourRef).max(MAX_PALETTE).optional(),
    pins: z
      .array(
        z
          .object({
            fromRound: z.number().int().min(1),
            toRound: z.number().int().min(1),
            pair: z.tuple([colourRef, colourRef]),
          })
          .strict(),
      )
      .max(MAX_ROUNDS)
      .optional(),
    inTheRound: z.boolean().optional(),
    floatLimitStitches: z.number().int().min(1).max(400).optional(),
    floatLimitCm: lengthLimit().optional(),
    carryLimitCm: lengthLimit().optional(),
    rates: z
      .object({
        secondsPerDuplicateStitch: nonNegative().optional(),
        minutesPerEnd: nonNegative().optional(),
        secondsPerCarryCm: nonNegative().optional(),
        secondsPerFloatCatch: nonNegative().optional(),
      })
      .strict()
      .optional(),
  })
  .strict();

function parse<S extends z.ZodType>(schema: S, value: unknown, prefix: string): z.output<S> {
  const result = schema.safeParse(value ?? {}, { error: fieldErrorMap(prefix) });
  if (result.success) return result.data;
  const issues = toFieldIssues(result.error.issues, prefix);
  const named = issues.map((i) => ({ message: i.message.startsWith(i.path) ? i.message : `${i.path}: ${i.message}` }));
  throw new ColourworkError(issues[0]?.path || prefix, joinIssues(named));
}

/** A piece resolved to palette indices, with its settings. */
export interface ResolvedRoundPiece {
  rounds: Uint8Array[];
  keys: string[];
  hex: string[];
  gauge: Gauge;
  /** colour index → forced to be darned */
  forced: boolean[];
  /** per round: the pinned pair (sorted indices), or null */
  pinned: ([number, number] | null)[];
  inTheRound: boolean;
  floatLimit: number;
  carryLimitCm: number;
  rates: DarningRates;
}

export function resolveRoundPiece(input: unknown, options: unknown = {}): ResolvedRoundPiece {
  const piece = parse(roundPairsInputSchema, input, "piece");
  const o = parse(roundPairsOptionsSchema, options, "options");
  const keys = piece.palette.map((p) => p.key);
  const dupKey = keys.findIndex((k, i) => keys.indexOf(k) !== i);
  if (dupKey >= 0) throw new ColourworkError(`piece.palette[${dupKey}].key`, `colour '${keys[dupKey]}' is named twice`);
  const index = (ref: RoundColour, field: string): number => {
    const i = typeof ref === "number" ? (ref < keys.length ? ref : -1) : keys.indexOf(ref);
    if (i < 0) throw new ColourworkError(field, `colour ${JSON.stringify(ref)} is not in the palette (${keys.join(", ")})`);
    return i;
  };
  const rounds = piece.rounds.map((round, r) => Uint8Array.from(round, (ref, s) => index(ref, `piece.rounds[${r}][${s}] (round ${r + 1}, stitch ${s + 1})`)));
  const forced = keys.map(() => false);
  (o.darn ?? []).forEach((ref, i) => {
    const c = index(ref, `options.darn[${i}]`);
    if (forced[c]) throw new ColourworkError(`options.darn[${i}]`, `colour '${keys[c]}' is named twice`);
    forced[c] = true;
  });
  if (forced.every((f) => f)) throw new ColourworkError("options.darn", "at least one colour must be knitted");
  const pinned: ([number, number] | null)[] = rounds.map(() => null);
  (o.pins ?? []).forEach((pin, i) => {
    const field = `options.pins[${i}]`;
    if (pin.toRound < pin.fromRound) throw new ColourworkError(`${field}.toRound`, `round ${pin.toRound} is below fromRound ${pin.fromRound}`);
    if (pin.toRound > rounds.length) throw new ColourworkError(`${field}.toRound`, `the piece has ${rounds.length} rounds (got ${pin.toRound})`);
    const a = index(pin.pair[0], `${field}.pair[0]`);
    const b = index(pin.pair[1], `${field}.pair[1]`);
    if (a === b) throw new ColourworkError(`${field}.pair`, "must name two different colours");
    for (const c of [a, b]) if (forced[c]) throw new ColourworkError(`${field}.pair`, `colour '${keys[c]}' is also to be darned`);
    const pair: [number, number] = [Math.min(a, b), Math.max(a, b)];
    for (let r = pin.fromRound - 1; r < pin.toRound; r++) {
      const was = pinned[r];
      if (was && (was[0] !== pair[0] || was[1] !== pair[1])) {
        throw new ColourworkError(field, `round ${r + 1} is already pinned to ${keys[was[0]]} and ${keys[was[1]]}`);
      }
      pinned[r] = pair;
    }
  });
  const rates: DarningRates = { ...defaultDarningRates };
  for (const [k, v] of Object.entries(o.rates ?? {})) if (v !== undefined) rates[k as keyof DarningRates] = v;
  return {
    rounds,
    keys,
    hex: piece.palette.map((p) => p.hex),
    gauge: piece.gauge,
    forced,
    pinned,
    inTheRound: o.inTheRound ?? true,
    floatLimit: getFloatLimitStitches(piece.gauge.stitchesPer10cm, o.floatLimitStitches ?? DEFAULT_FLOAT_LIMIT_STITCHES, o.floatLimitCm ?? DEFAULT_FLOAT_LIMIT_CM),
    carryLimitCm: o.carryLimitCm ?? DEFAULT_CARRY_LIMIT_CM,
    rates,
  };
}

// ---------------------------------------------------------------------------------------------
// Costs

/** A held pair of yarns: sorted palette indices; one index when only one colour can be knitted. */
export type HeldPair = readonly number[];

/** Work of one round under one held pair, before the links to the round below. */
interface RoundWork {
  darned: number;
  catches: number;
  /** knitted colour (palette index) of every stitch after underlay */
  knitted: Uint8Array;
  /** held colours not knitted in the round: carried up the inside */
  idle: number;
}

/** Prices and evaluates rounds under held pairs; shared by the planner and the exhaustive check. */
export class RoundPairCosts {
  readonly piece: ResolvedRoundPiece;
  readonly pairs: HeldPair[];
  private readonly diff: number[][];
  private readonly work = new Map<string, RoundWork>();
  /** per round, per colour: darning route estimate when the colour is (not) darned in the round below */
  private readonly routeNew: Float64Array[];
  private readonly routeCont: Float64Array[];
  private readonly routeEndsNew: Int32Array[];
  private readonly routeEndsCont: Int32Array[];
  private readonly routeCarryNew: Float64Array[];
  private readonly routeCarryCont: Float64Array[];
  /** per round: colours present */
  readonly present: boolean[][];
  private readonly w: number;
  private readonly h: number;

  constructor(piece: ResolvedRoundPiece) {
    this.piece = piece;
    const k = piece.keys.length;
    const free = piece.keys.map((_, c) => c).filter((c) => !piece.forced[c]);
    this.pairs = [];
    if (free.length === 1) this.pairs.push([free[0]]);
    for (let i = 0; i < free.length; i++) for (let j = i + 1; j < free.length; j++) this.pairs.push([free[i], free[j]]);
    this.diff = piece.hex.map((p) => piece.hex.map((q) => getColourDifference(p, q)));
    this.present = piece.rounds.map((round) => {
      const seen = new Array<boolean>(k).fill(false);
      for (const c of round) seen[c] = true;
      return seen;
    });
    this.w = 10 / piece.gauge.stitchesPer10cm;
    this.h = 10 / piece.gauge.rowsPer10cm;
    const R = piece.rounds.length;
    this.routeNew = [];
    this.routeCont = [];
    this.routeEndsNew = [];
    this.routeEndsCont = [];
    this.routeCarryNew = [];
    this.routeCarryCont = [];
    for (let r = 0; r < R; r++) {
      const en = new Int32Array(k);
      const ec = new Int32Array(k);
      const cn = new Float64Array(k);
      const cc = new Float64Array(k);
      for (let c = 0; c < k; c++) {
        if (!this.present[r][c]) continue;
        const est = this.estimateRoute(r, c);
        en[c] = est.endsNew;
        ec[c] = est.endsCont;
        cn[c] = est.carry;
        cc[c] = est.carry + est.stepCarry;
      }
      this.routeEndsNew.push(en);
      this.routeEndsCont.push(ec);
      this.routeCarryNew.push(cn);
      this.routeCarryCont.push(cc);
      this.routeNew.push(Float64Array.from(en, (e, c) => getDarningMinutes({ stitches: 0, ends: e, carryCm: cn[c] }, piece.rates)));
      this.routeCont.push(Float64Array.from(ec, (e, c) => getDarningMinutes({ stitches: 0, ends: e, carryCm: cc[c] }, piece.rates)));
    }
  }

  /** Whether colour c is darned in round r under held pair p. */
  isDarned(r: number, c: number, p: HeldPair): boolean {
    return this.present[r][c] && (this.piece.forced[c] || !p.includes(c));
  }

  /** Pairs allowed in round r: the pin, or pairs that knit every colour of a round holding at most two. */
  allowed(r: number): HeldPair[] {
    const pin = this.piece.pinned[r];
    if (pin) return [pin];
    const need: number[] = [];
    this.present[r].forEach((p, c) => {
      if (p && !this.piece.forced[c]) need.push(c);
    });
    if (need.length > 2) return this.pairs;
    return this.pairs.filter((p) => need.every((c) => p.includes(c)));
  }

  /** Underlay, darned stitches and catches of round r under held pair p (cached). */
  roundWork(r: number, p: HeldPair): RoundWork {
    const id = `${r}:${p.join(",")}`;
    let work = this.work.get(id);
    if (work) return work;
    const round = this.piece.rounds[r];
    const n = round.length;
    const a = p[0];
    const b = p.length > 1 ? p[1] : p[0];
    const row: UnderlayRow = { fixed: new Int8Array(n), cost0: new Float64Array(n), cost1: new Float64Array(n) };
    let darned = 0;
    for (let s = 0; s < n; s++) {
      const c = round[s];
      if (!this.piece.forced[c] && c === a) row.fixed[s] = 0;
      else if (!this.piece.forced[c] && c === b) row.fixed[s] = 1;
      else {
        row.fixed[s] = -1;
        row.cost0[s] = this.diff[c][a];
        row.cost1[s] = this.diff[c][b];
        darned++;
      }
    }
    let colours: Uint8Array;
    if (n === 0) colours = new Uint8Array(0);
    else if (darned > 0) colours = chooseRowUnderlay(row, this.piece.floatLimit, this.piece.inTheRound);
    else colours = Uint8Array.from(row.fixed);
    const catches = getRowFloats(colours, this.piece.floatLimit, this.piece.inTheRound).catches;
    const knitted = Uint8Array.from(colours, (x) => (x === 0 ? a : b));
    const used = new Set(knitted);
    const idle = p.filter((c) => !used.has(c)).length;
    work = { darned, catches, knitted, idle };
    this.work.set(id, work);
    return work;
  }

  /** Minutes of round r under p that do not depend on the round below. */
  roundMinutes(r: number, p: HeldPair): number {
    const w = this.roundWork(r, p);
    return getDarningMinutes({ stitches: w.darned, ends: 0, carryCm: w.idle * this.h, catches: w.catches }, this.piece.rates);
  }

  /** Minutes of joining yarns and of the darning route of round r under p, given the pair q below (null: first round). */
  linkMinutes(r: number, q: HeldPair | null, p: HeldPair): number {
    let joined = 0;
    for (const c of p) if (!q || !q.includes(c)) joined++;
    let minutes = joined * 2 * this.piece.rates.minutesPerEnd; // joined now, cut later: two ends
    const k = this.piece.keys.length;
    for (let c = 0; c < k; c++) {
      if (!this.isDarned(r, c, p)) continue;
      const below = q !== null && r > 0 && this.isDarned(r - 1, c, q);
      minutes += below ? this.routeCont[r][c] : this.routeNew[r][c];
    }
    return minutes;
  }

  /** Estimated darning ends and carry of round r under p given q below. */
  linkRoute(r: number, q: HeldPair | null, p: HeldPair): { ends: number; carryCm: number } {
    let ends = 0;
    let carryCm = 0;
    for (let c = 0; c < this.piece.keys.length; c++) {
      if (!this.isDarned(r, c, p)) continue;
      const below = q !== null && r > 0 && this.isDarned(r - 1, c, q);
      ends += below ? this.routeEndsCont[r][c] : this.routeEndsNew[r][c];
      carryCm += below ? this.routeCarryCont[r][c] : this.routeCarryNew[r][c];
    }
    return { ends, carryCm };
  }

  /** Total minutes of a whole sequence of held pairs (one per round). */
  sequenceMinutes(seq: readonly HeldPair[]): number {
    let total = 0;
    for (let r = 0; r < seq.length; r++) total += this.roundMinutes(r, seq[r]) + this.linkMinutes(r, r > 0 ? seq[r - 1] : null, seq[r]);
    return total;
  }

  /**
   * Route estimate of colour c darned in round r. Its stitches form clusters: stitches joined by
   * touching or by one stretch within the carry limit along the round (wrapping in the round).
   * A cluster is a new strand (2 ends) unless a stitch of it is within one stretch of a stitch of
   * the same colour darned in the round below; carries are the stretches inside clusters plus,
   * for a cluster that continues a strand from below, the step up when it does not touch.
   */
  private estimateRoute(r: number, c: number): { endsNew: number; endsCont: number; carry: number; stepCarry: number } {
    const round = this.piece.rounds[r];
    const n = round.length;
    const pos: number[] = [];
    for (let s = 0; s < n; s++) if (round[s] === c) pos.push(s);
    const reach = Math.max(1, Math.floor(this.piece.carryLimitCm / this.w + 1e-9));
    const gapOf = (i: number) => {
      // stitches strictly between pos[i] and the next stitch of the colour along the round
      if (i < pos.length - 1) return pos[i + 1] - pos[i] - 1;
      return this.piece.inTheRound ? pos[0] + n - pos[i] - 1 : Infinity;
    };
    // Clusters: cut the cyclic list at every gap a single stretch cannot span.
    const joins = pos.map((_, i) => pos.length > 1 && gapOf(i) + 1 <= reach);
    const clusters: number[][] = [];
    if (joins.every((j) => j) && pos.length > 0) {
      clusters.push(pos.map((_, i) => i));
    } else {
      let startAt = joins.findIndex((j) => !j) + 1;
      if (startAt >= pos.length) startAt = 0;
      let current: number[] = [];
      for (let t = 0; t < pos.length; t++) {
        const i = (startAt + t) % pos.length;
        current.push(i);
        if (!joins[i]) {
          clusters.push(current);
          current = [];
        }
      }
      if (current.length) clusters.push(current);
    }
    let carry = 0;
    for (const cl of clusters) {
      // a cyclic cluster skips its longest inner gap; otherwise every inner gap is carried
      const inner = cl.length === pos.length && joins.every((j) => j) ? cl : cl.slice(0, -1);
      let sum = 0;
      let longest = 0;
      for (const i of inner) {
        const g = gapOf(i);
        const len = g === 0 ? 0 : (g + 1) * this.w;
        sum += len;
        longest = Math.max(longest, len);
      }
      carry += cl.length === pos.length && joins.every((j) => j) ? sum - longest : sum;
    }
    let endsCont = 0;
    let stepCarry = 0;
    const below = r > 0 ? this.piece.rounds[r - 1] : null;
    for (const cl of clusters) {
      let best = Infinity;
      if (below) {
        for (const i of cl) {
          const s = pos[i];
          for (let d = -reach; d <= reach; d++) {
            let t = s + d;
            if (this.piece.inTheRound && below.length > 0) t = ((t % below.length) + below.length) % below.length;
            if (t < 0 || t >= below.length || below[t] !== c) continue;
            const len = Math.abs(d) <= 1 ? 0 : Math.hypot(d * this.w, this.h);
            if (len <= this.piece.carryLimitCm + 1e-9 || Math.abs(d) <= 1) best = Math.min(best, len);
          }
        }
      }
      if (best === Infinity) endsCont += 2;
      else stepCarry += best;
    }
    return { endsNew: 2 * clusters.length, endsCont, carry, stepCarry };
  }
}

// ---------------------------------------------------------------------------------------------
// The plan

/** The cheapest sequence of held pairs (dynamic programming over rounds; state = the pair held). */
export function chooseRoundPairs(costs: RoundPairCosts): { sequence: HeldPair[]; minutes: number } {
  const R = costs.piece.rounds.length;
  if (R === 0) return { sequence: [], minutes: 0 };
  let states = costs.allowed(0);
  let value = states.map((p) => costs.roundMinutes(0, p) + costs.linkMinutes(0, null, p));
  const back: Int32Array[] = [new Int32Array(states.length).fill(-1)];
  const stateList: HeldPair[][] = [states];
  for (let r = 1; r < R; r++) {
    const next = costs.allowed(r);
    const nextValue = new Array<number>(next.length).fill(Infinity);
    const from = new Int32Array(next.length).fill(-1);
    next.forEach((p, j) => {
      const own = costs.roundMinutes(r, p);
      states.forEach((q, i) => {
        const v = value[i] + own + costs.linkMinutes(r, q, p);
        if (v < nextValue[j] - 1e-9) {
          nextValue[j] = v;
          from[j] = i;
        }
      });
    });
    states = next;
    value = nextValue;
    back.push(from);
    stateList.push(states);
  }
  let best = 0;
  for (let j = 1; j < value.length; j++) if (value[j] < value[best] - 1e-9) best = j;
  const sequence: HeldPair[] = new Array(R);
  for (let r = R - 1, j = best; r >= 0; r--) {
    sequence[r] = stateList[r][j];
    j = back[r][j];
  }
  return { sequence, minutes: value[best] };
}

/**
 * The best single pair held for every round (the old model), respecting pins and forced darning.
 * `keepsRules` is false when that pair darns stitches in a round that holds only two colours,
 * which the planner does not allow; `bestKeepingRules` is the best single pair that does not.
 */
export function chooseSinglePair(
  costs: RoundPairCosts,
): { pair: HeldPair; minutes: number; keepsRules: boolean; bestKeepingRules: { pair: HeldPair; minutes: number } | null } | null {
  let best: { pair: HeldPair; minutes: number; keepsRules: boolean } | null = null;
  let keeping: { pair: HeldPair; minutes: number } | null = null;
  const R = costs.piece.rounds.length;
  const allowedSets = Array.from({ length: R }, (_, r) => new Set(costs.allowed(r).map((p) => p.join(","))));
  for (const p of costs.pairs) {
    if (costs.piece.pinned.some((pin) => pin && (pin[0] !== p[0] || pin[1] !== p[1]))) continue;
    const minutes = costs.sequenceMinutes(new Array<HeldPair>(R).fill(p));
    const keepsRules = allowedSets.every((set) => set.has(p.join(",")));
    if (!best || minutes < best.minutes - 1e-9) best = { pair: p, minutes, keepsRules };
    if (keepsRules && (!keeping || minutes < keeping.minutes - 1e-9)) keeping = { pair: p, minutes };
  }
  return best ? { ...best, bestKeepingRules: keeping } : null;
}

export function planRoundPairs(input: RoundPairsInput | unknown, options: RoundPairsOptions | unknown = {}): RoundPairsPlan {
  const piece = resolveRoundPiece(input, options);
  const costs = new RoundPairCosts(piece);
  const { sequence } = chooseRoundPairs(costs);
  return describeRoundPairs(costs, sequence);
}

function describeRoundPairs(costs: RoundPairCosts, sequence: HeldPair[]): RoundPairsPlan {
  const { piece } = costs;
  const key = (c: number) => piece.keys[c];
  const rounds: RoundPairRound[] = [];
  const t = { stitches: 0, darned: 0, joins: 0, cuts: 0, idleCm: 0, catches: 0, estEnds: 0, estCarry: 0, estCatches: 0 };
  const h = 10 / piece.gauge.rowsPer10cm;
  // catch stitches of the round below, per carried colour (palette index)
  let below = new Map<number, Set<number>>();
  const none = new Set<number>();
  sequence.forEach((p, r) => {
    const q = r > 0 ? sequence[r - 1] : null;
    const work = costs.roundWork(r, p);
    const round = piece.rounds[r];
    const n = round.length;
    const joined = p.filter((c) => !q || !q.includes(c));
    const cut = q ? q.filter((c) => !p.includes(c)) : [];
    const colours = Uint8Array.from(work.knitted, (c) => (c === p[0] ? 0 : 1));
    const avoid: CatchAvoid = [below.get(p[0]) ?? none, below.get(p[1] ?? p[0]) ?? none];
    const floats = getRowFloats(colours, piece.floatLimit, piece.inTheRound, avoid);
    const caught = getCatchStitches(floats);
    below = new Map([[p[0], caught[0] as Set<number>]]);
    if (p.length > 1) below.set(p[1], caught[1] as Set<number>);
    const darned: DarnedStitch[] = [];
    for (let s = 0; s < n; s++) {
      if (costs.isDarned(r, round[s], p)) darned.push({ stitch: s + 1, colour: key(round[s]), onto: key(work.knitted[s]) });
    }
    const knit = p.filter((c) => work.knitted.includes(c)).map(key);
    const pinned = piece.pinned[r] !== null;
    t.stitches += n;
    t.darned += work.darned;
    t.joins += joined.length;
    t.cuts += cut.length;
    t.idleCm += work.idle * h;
    t.catches += floats.catches;
    const estimate = costs.linkRoute(r, q, p);
    t.estEnds += estimate.ends;
    t.estCarry += estimate.carryCm + work.idle * h;
    t.estCatches += work.catches;
    rounds.push({
      round: r + 1,
      stitches: n,
      pair: p.map(key),
      knit,
      darned,
      joined: joined.map(key),
      cut: cut.map(key),
      longestFloat: floats.longest,
      catches: floats.catches,
      floats: floats.long.map((fl) => ({
        carried: key(p[fl.carried] ?? p[0]),
        fromStitch: fl.start + 1,
        toStitch: ((fl.start + fl.length - 1) % n) + 1,
        length: fl.length,
        catchStitches: fl.catchAt.map((s) => s + 1),
      })),
      pinned,
      reason: describeReason(costs, r, p, q, darned, joined, cut),
    });
  });
  // every yarn still held after the last round is cut
  if (sequence.length > 0) t.cuts += sequence[sequence.length - 1].length;
  const darning = routeDarnedColours(costs, sequence);
  const darningEnds = darning.reduce((sum, d) => sum + d.ends, 0);
  const darningCarry = darning.reduce((sum, d) => sum + d.carryCm, 0);
  const knitEnds = t.joins + t.cuts;
  const ends = knitEnds + darningEnds;
  const carryCm = darningCarry + t.idleCm;
  const minutes = getDarningMinutes({ stitches: t.darned, ends, carryCm, catches: t.catches }, piece.rates);
  const single = chooseSinglePair(costs);
  return {
    rounds,
    totals: {
      rounds: sequence.length,
      stitches: t.stitches,
      darnedStitches: t.darned,
      joins: t.joins,
      cuts: t.cuts,
      knitEnds,
      darningEnds,
      ends,
      carryCm: roundTenth(carryCm),
      catches: t.catches,
      minutes: roundTenth(minutes),
    },
    darning: darning.map((d) => ({ ...d, carryCm: roundTenth(d.carryCm) })),
    singlePair: single ? { pair: single.pair.map(key), minutes: roundTenth(single.minutes), keepsRules: single.keepsRules } : null,
    plannedMinutes: roundTenth(costs.sequenceMinutes(sequence)),
    planned: { darningEnds: t.estEnds, carryCm: roundTenth(t.estCarry), catches: t.estCatches },
    routeCost: "estimated per round",
    settings: { inTheRound: piece.inTheRound, floatLimitStitches: piece.floatLimit, carryLimitCm: piece.carryLimitCm, rates: piece.rates },
  };
}

/**
 * Routes every darned colour over the whole piece. Rounds are laid on a grid as wide as the widest
 * round, stitch 1 of every round in the same column (in the round, the first and last column meet;
 * a shorter round's own last stitch is then placed as if the round were full width).
 */
function routeDarnedColours(costs: RoundPairCosts, sequence: HeldPair[]): RoundDarning[] {
  const { piece } = costs;
  const R = sequence.length;
  const width = piece.rounds.reduce((m, round) => Math.max(m, round.length), 0);
  if (R === 0 || width === 0) return [];
  const k = piece.keys.length;
  const NONE = k; // a cell not darned (or outside the round)
  const cells = new Uint8Array(width * R).fill(NONE);
  const counts = new Array<number>(k).fill(0);
  sequence.forEach((p, r) => {
    const round = piece.rounds[r];
    for (let s = 0; s < round.length; s++) {
      if (!costs.isDarned(r, round[s], p)) continue;
      // knitting order runs from the right, as on a chart: stitch 1 is the rightmost column
      cells[r * width + (width - 1 - s)] = round[s];
      counts[round[s]]++;
    }
  });
  const g = getCarryGeometry(piece.gauge, piece.carryLimitCm);
  const out: RoundDarning[] = [];
  for (let c = 0; c < k; c++) {
    if (counts[c] === 0) continue;
    const set = getStitchSet({ width, height: R, cells }, c, piece.inTheRound);
    const route = routeStitchSet(set, g);
    out.push({ key: piece.keys[c], stitches: set.n, strands: route.strands.length, ends: route.ends, carryCm: route.carryCm });
  }
  return out;
}

function describeReason(
  costs: RoundPairCosts,
  r: number,
  p: HeldPair,
  q: HeldPair | null,
  darned: DarnedStitch[],
  joined: number[],
  cut: number[],
): string {
  const { piece } = costs;
  const key = (c: number) => piece.keys[c];
  const parts: string[] = [];
  if (piece.pinned[r]) parts.push("pinned by the maker");
  if (q && joined.length > 0) parts.push(`pair changes here: ${joined.map(key).join(" and ")} appear${joined.length > 1 ? "" : "s"}`);
  else if (q && cut.length > 0) parts.push(`pair changes here: ${cut.map(key).join(" and ")} cut`);
  const colours = costs.present[r].filter((x) => x).length;
  const forcedHere = costs.present[r].some((x, c) => x && piece.forced[c]);
  if (darned.length === 0) {
    if (colours <= 1) parts.push("one colour: knitted");
    else parts.push("only two colours: knitted, nothing darned");
  } else {
    const byColour = new Map<string, number>();
    for (const d of darned) byColour.set(d.colour, (byColour.get(d.colour) ?? 0) + 1);
    const list = [...byColour].map(([k, v]) => `${v} ${k}`).join(", ");
    if (forcedHere && [...byColour.keys()].every((k) => piece.forced[piece.keys.indexOf(k)])) parts.push(`darned as the maker asked: ${list}`);
    else if (colours > 2 && !piece.pinned[r]) parts.push(`${colours} colours: ${p.map(key).join(" and ")} knitted, ${list} darned (least work)`);
    else parts.push(`${list} darned`);
  }
  return parts.join("; ");
}
