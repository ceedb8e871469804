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
import { getStitchSet, stepColumn } from "./stitch-set";

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
  /**
   * Default true: route every darned colour over the whole piece for the totals. False skips it
   * (for a caller that routes on its own layout): `darning` is empty and the totals keep the
   * estimated route.
   */
  route?: boolean;
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
/** Stitches in one piece: a pullover body is about 30,000; this bounds the work of one plan. */
export const MAX_PIECE_STITCHES = 250_000;

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
    route: z.boolean().optional(),
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
  /** names to show in reasons (the key when the palette gives none) */
  names: string[];
  hex: string[];
  gauge: Gauge;
  /** colour index → forced to be darned */
  forced: boolean[];
  /** per round: the pinned pair (sorted indices), or null */
  pinned: ([number, number] | null)[];
  inTheRound: boolean;
  /** route the darned colours of the chosen plan for the totals */
  route: boolean;
  floatLimit: number;
  carryLimitCm: number;
  rates: DarningRates;
}

export function resolveRoundPiece(input: unknown, options: unknown = {}): ResolvedRoundPiece {
  const piece = parse(roundPairsInputSchema, input, "piece");
  const o = parse(roundPairsOptionsSchema, options, "options");
  const total = piece.rounds.reduce((sum, round) => sum + round.length, 0);
  if (total > MAX_PIECE_STITCHES) throw new ColourworkError("piece.rounds", `the piece has ${total} stitches; at most ${MAX_PIECE_STITCHES} are planned at once`);
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
    names: piece.palette.map((p) => p.name || p.key),
    hex: piece.palette.map((p) => p.hex),
    gauge: piece.gauge,
    forced,
    pinned,
    inTheRound: o.inTheRound ?? true,
    route: o.route ?? true,
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
export interface RoundWork {
  darned: number;
  catches: number;
  /** knitted colour (palette index) of every stitch after underlay */
  knitted: Uint8Array;
  /** held colours with no stitch of their own in the round: carried up the inside */
  idle: number;
}

/** Route estimate of one colour in one round. */
interface RouteEstimate {
  /** minutes when the colour's stitches below are not darned (its yarn was held there) */
  fresh: number;
  /** minutes when they are darned too, so strands from below may continue */
  continued: number;
  freshEnds: number;
  continuedEnds: number;
  freshCarry: number;
  continuedCarry: number;
}

/**
 * Prices rounds under held pairs; shared by the planner and the exhaustive check. Pairs are
 * numbered (`pairs[i]`) and held as bit masks of colours.
 */
export class RoundPairCosts {
  readonly piece: ResolvedRoundPiece;
  readonly pairs: HeldPair[];
  /** per round: colours present */
  readonly present: boolean[][];
  private readonly diff: number[][];
  private readonly k: number;
  private readonly pairMask: Int32Array;
  private readonly pairOf: Int32Array;
  private readonly forcedMask: number;
  private readonly presentMask: Int32Array;
  private readonly counts: Int32Array[];
  private readonly allowedLists: Int32Array[];
  private readonly work: (RoundWork | undefined)[][];
  /** per round: minutes of the round by pattern of knitted stitches (see roundMinutes) */
  private readonly patternMinutes: Map<string, number>[];
  private readonly route: RouteEstimate[][];
  private readonly h: number;

  constructor(piece: ResolvedRoundPiece) {
    this.piece = piece;
    const k = piece.keys.length;
    this.k = k;
    const free = piece.keys.map((_, c) => c).filter((c) => !piece.forced[c]);
    this.pairs = [];
    if (free.length === 1) this.pairs.push([free[0]]);
    for (let i = 0; i < free.length; i++) for (let j = i + 1; j < free.length; j++) this.pairs.push([free[i], free[j]]);
    this.pairMask = Int32Array.from(this.pairs, (p) => p.reduce((m, c) => m | (1 << c), 0));
    this.pairOf = new Int32Array(k * k).fill(-1);
    this.pairs.forEach((p, i) => (this.pairOf[p[0] * k + (p[1] ?? p[0])] = i));
    this.forcedMask = piece.forced.reduce((m, f, c) => (f ? m | (1 << c) : m), 0);
    this.diff = piece.hex.map((p) => piece.hex.map((q) => getColourDifference(p, q)));
    const R = piece.rounds.length;
    this.counts = piece.rounds.map((round) => {
      const count = new Int32Array(k);
      for (const c of round) count[c]++;
      return count;
    });
    this.present = this.counts.map((count) => Array.from(count, (x) => x > 0));
    this.presentMask = Int32Array.from(this.present, (seen) => seen.reduce((m, s, c) => (s ? m | (1 << c) : m), 0));
    this.h = 10 / piece.gauge.rowsPer10cm;
    this.allowedLists = [];
    for (let r = 0; r < R; r++) {
      const pin = piece.pinned[r];
      if (pin) {
        this.allowedLists.push(Int32Array.of(this.pairOf[pin[0] * k + pin[1]]));
        continue;
      }
      const need = this.presentMask[r] & ~this.forcedMask;
      const list: number[] = [];
      this.pairMask.forEach((m, i) => {
        if (popcount(need) > 2 || (need & ~m) === 0) list.push(i);
      });
      this.allowedLists.push(Int32Array.from(list));
    }
    // Colours each round must knit whatever else is chosen: a pin, or a round of at most two colours.
    const knitsSurely = Int32Array.from(piece.rounds, (_, r) => {
      const pin = piece.pinned[r];
      if (pin) return (1 << pin[0]) | (1 << pin[1]);
      const need = this.presentMask[r] & ~this.forcedMask;
      return popcount(need) <= 2 ? need : 0;
    });
    this.work = piece.rounds.map(() => new Array<RoundWork | undefined>(this.pairs.length));
    this.patternMinutes = piece.rounds.map(() => new Map());
    const g = getCarryGeometry(piece.gauge, piece.carryLimitCm);
    this.route = piece.rounds.map((_, r) =>
      Array.from({ length: k }, (_, c) => {
        if (!this.present[r][c]) return { fresh: 0, continued: 0, freshEnds: 0, continuedEnds: 0, freshCarry: 0, continuedCarry: 0 };
        const est = estimateRoute(piece, g, r, c, knitsSurely);
        const minutes = (ends: number, carry: number) => getDarningMinutes({ stitches: 0, ends, carryCm: carry }, piece.rates);
        return {
          fresh: minutes(est.endsNew, est.carry),
          continued: minutes(est.endsCont, est.carry + est.stepCarry),
          freshEnds: est.endsNew,
          continuedEnds: est.endsCont,
          freshCarry: est.carry,
          continuedCarry: est.carry + est.stepCarry,
        };
      }),
    );
  }

  /** Number of a held pair in `pairs`. */
  indexOf(p: HeldPair): number {
    const i = this.pairOf[p[0] * this.k + (p[1] ?? p[0])];
    if (i < 0) throw new RangeError(`no such pair: ${p.join(",")}`);
    return i;
  }

  /** Bit mask of the colours darned in round r under pair i. */
  darnedMask(r: number, i: number): number {
    return this.presentMask[r] & (this.forcedMask | ~this.pairMask[i]);
  }

  /** Whether colour c is darned in round r under held pair p. */
  isDarned(r: number, c: number, p: HeldPair): boolean {
    return this.present[r][c] && (this.piece.forced[c] || !p.includes(c));
  }

  /** Pairs allowed in round r: the pin, or pairs that knit every colour of a round holding at most two. */
  allowed(r: number): HeldPair[] {
    return Array.from(this.allowedLists[r], (i) => this.pairs[i]);
  }

  allowedIndices(r: number): Int32Array {
    return this.allowedLists[r];
  }

  /** Stitches darned in round r under pair i (cheap: from the colour counts). */
  darnedCount(r: number, i: number): number {
    const m = this.darnedMask(r, i);
    let sum = 0;
    for (let c = 0; c < this.k; c++) if (m & (1 << c)) sum += this.counts[r][c];
    return sum;
  }

  /** A lower bound of roundMinutes(r, pairs[i]) without the underlay: the darned stitches alone. */
  roundMinutesAtLeast(r: number, i: number): number {
    return (this.darnedCount(r, i) * this.piece.rates.secondsPerDuplicateStitch) / 60;
  }

  /** Underlay, darned stitches and catches of round r under held pair p (cached). */
  roundWork(r: number, p: HeldPair): RoundWork {
    const i = this.indexOf(p);
    let work = this.work[r][i];
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
    const idle = p.filter((c) => !this.present[r][c]).length;
    work = { darned, catches, knitted, idle };
    this.work[r][i] = work;
    return work;
  }

  /**
   * Minutes of round r under p that do not depend on the round below: darned stitches, the fewest
   * catches any underlay allows, and held yarns carried up. These depend only on which of the
   * round's own colours p knits (and in which place), so pairs that differ only in a colour absent
   * from the round share one underlay search.
   */
  roundMinutes(r: number, p: HeldPair): number {
    const a = p[0];
    const b = p.length > 1 ? p[1] : -2;
    const own = (c: number) => (c >= 0 && this.present[r][c] && !this.piece.forced[c] ? c : -1);
    const key = `${own(a)}|${own(b)}|${p.length}`;
    let minutes = this.patternMinutes[r].get(key);
    if (minutes === undefined) {
      const w = this.roundWork(r, p);
      minutes = getDarningMinutes({ stitches: w.darned, ends: 0, carryCm: w.idle * this.h, catches: w.catches }, this.piece.rates);
      this.patternMinutes[r].set(key, minutes);
    }
    return minutes;
  }

  /**
   * Whether the strands of colour c in round r may continue from below under the pair q held
   * there: c's yarn was not held below (so its stitches there, if any, were darned). In the rounds
   * further down c is taken as darned too, unless the round surely knits it (a pin, or a round of
   * at most two colours).
   */
  private continuesFromBelow(r: number, c: number, q: HeldPair | null): boolean {
    return q !== null && r > 0 && (this.piece.forced[c] || !q.includes(c));
  }

  /** Minutes of joining yarns and of the darning route of round r under p, given the pair q below (null: first round). */
  linkMinutes(r: number, q: HeldPair | null, p: HeldPair): number {
    let joined = 0;
    for (const c of p) if (!q || !q.includes(c)) joined++;
    let minutes = joined * 2 * this.piece.rates.minutesPerEnd; // joined now, cut later: two ends
    for (let c = 0; c < this.k; c++) {
      if (!this.isDarned(r, c, p)) continue;
      const e = this.route[r][c];
      minutes += this.continuesFromBelow(r, c, q) ? e.continued : e.fresh;
    }
    return minutes;
  }

  /** Estimated darning ends and carry of round r under p given q below. */
  linkRoute(r: number, q: HeldPair | null, p: HeldPair): { ends: number; carryCm: number } {
    let ends = 0;
    let carryCm = 0;
    for (let c = 0; c < this.k; c++) {
      if (!this.isDarned(r, c, p)) continue;
      const e = this.route[r][c];
      const cont = this.continuesFromBelow(r, c, q);
      ends += cont ? e.continuedEnds : e.freshEnds;
      carryCm += cont ? e.continuedCarry : e.freshCarry;
    }
    return { ends, carryCm };
  }

  /** Link tables of round r for the dynamic programme: linkMinutes(r, pairs[j], pairs[i]) = fixed[i] + extra(j, i). */
  linkTable(r: number): { fixed: Float64Array; extra: (j: number, i: number) => number } {
    const n = this.pairs.length;
    const fixed = new Float64Array(n);
    const endPair = 2 * this.piece.rates.minutesPerEnd;
    const route = this.route[r];
    for (let i = 0; i < n; i++) {
      const m = this.darnedMask(r, i);
      let v = 0;
      for (let c = 0; c < this.k; c++) if (m & (1 << c)) v += route[c].continued;
      fixed[i] = v;
    }
    const extra = (j: number, i: number) => {
      const held = this.pairMask[j];
      const p = this.pairs[i];
      let v = 0;
      for (const c of p) if (!(held & (1 << c))) v += endPair;
      const m = this.darnedMask(r, i) & held & ~this.forcedMask;
      if (m !== 0) for (const c of this.pairs[j]) if (m & (1 << c)) v += route[c].fresh - route[c].continued;
      return v;
    };
    return { fixed, extra };
  }

  /** Total minutes of a whole sequence of held pairs (one per round). */
  sequenceMinutes(seq: readonly HeldPair[]): number {
    let total = 0;
    for (let r = 0; r < seq.length; r++) total += this.roundMinutes(r, seq[r]) + this.linkMinutes(r, r > 0 ? seq[r - 1] : null, seq[r]);
    return total;
  }
}

function popcount(m: number): number {
  let n = 0;
  for (let x = m; x !== 0; x &= x - 1) n++;
  return n;
}

/**
 * Route estimate of colour c darned in round r. Its stitches form clusters: stitches joined by
 * touching or by one stretch within the carry limit along the round (wrapping in the round).
 * A cluster is a new strand (2 ends) unless a stitch of it is within one stretch of a stitch of
 * the same colour darned in the rounds below (stitch k of every round in one column); carries are the
 * stretches inside clusters plus, for a cluster that continues a strand from below, the step to it
 * when it does not touch.
 */
function estimateRoute(
  piece: ResolvedRoundPiece,
  g: ReturnType<typeof getCarryGeometry>,
  r: number,
  c: number,
  knitsSurely: Int32Array,
): { endsNew: number; endsCont: number; carry: number; stepCarry: number } {
  const round = piece.rounds[r];
  const n = round.length;
  const w = g.w;
  const pos: number[] = [];
  for (let s = 0; s < n; s++) if (round[s] === c) pos.push(s);
  const reach = Math.max(1, Math.floor(piece.carryLimitCm / w + 1e-9));
  const gapOf = (i: number) => {
    // stitches strictly between pos[i] and the next stitch of the colour along the round
    if (i < pos.length - 1) return pos[i + 1] - pos[i] - 1;
    return piece.inTheRound ? pos[0] + n - pos[i] - 1 : Infinity;
  };
  // Clusters: cut the cyclic list at every gap a single stretch cannot span.
  const joins = pos.map((_, i) => pos.length > 1 && gapOf(i) + 1 <= reach);
  const whole = pos.length > 0 && joins.every((j) => j);
  const clusters: number[][] = [];
  if (whole) clusters.push(pos.map((_, i) => i));
  else {
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
    // a cluster all round the round skips its longest gap; otherwise every inner gap is carried
    const inner = whole ? cl : cl.slice(0, -1);
    let sum = 0;
    let longest = 0;
    for (const i of inner) {
      const gap = gapOf(i);
      const len = gap === 0 ? 0 : (gap + 1) * w;
      sum += len;
      longest = Math.max(longest, len);
    }
    carry += whole ? sum - longest : sum;
  }
  let endsCont = 0;
  let stepCarry = 0;
  for (const cl of clusters) {
    let best = Infinity;
    for (let o = 0; o < g.count && best > 0; o++) {
      const dy = g.dy[o];
      if (dy >= 0 || r + dy < 0) continue;
      if (dy < -1 && knitsSurely[r + dy] & (1 << c)) continue;
      const below = piece.rounds[r + dy];
      const len = g.len[o];
      if (len >= best) continue;
      for (const i of cl) {
        const t = stepColumn({ width: below.length, wrap: piece.inTheRound }, pos[i], g.dx[o]);
        if (t >= 0 && below[t] === c) {
          best = Math.abs(g.dx[o]) <= 1 && dy === -1 ? 0 : len;
          break;
        }
      }
    }
    if (best === Infinity) endsCont += 2;
    else stepCarry += best;
  }
  return { endsNew: 2 * clusters.length, endsCont, carry, stepCarry };
}

// ---------------------------------------------------------------------------------------------
// The plan

/**
 * The cheapest sequence of held pairs: dynamic programming over rounds, the state being the pair
 * held. Exact; states that cannot beat a known sequence (their cost so far, plus the darned
 * stitches they and every later round must at least darn) are dropped before their underlay is
 * worked out, which keeps large palettes fast.
 */
export function chooseRoundPairs(costs: RoundPairCosts): { sequence: HeldPair[]; minutes: number } {
  const R = costs.piece.rounds.length;
  if (R === 0) return { sequence: [], minutes: 0 };
  const P = costs.pairs.length;
  // Least darning each round must do whatever is held, summed from each round to the end.
  const restAtLeast = new Float64Array(R + 1);
  for (let r = R - 1; r >= 0; r--) {
    let least = Infinity;
    for (const i of costs.allowedIndices(r)) least = Math.min(least, costs.roundMinutesAtLeast(r, i));
    restAtLeast[r] = restAtLeast[r + 1] + least;
  }
  const bound = greedyMinutes(costs) + 1e-7;
  let value = new Float64Array(P).fill(Infinity);
  const back: Int32Array[] = [];
  for (let r = 0; r < R; r++) {
    const next = new Float64Array(P).fill(Infinity);
    const from = new Int32Array(P).fill(-1);
    const table = r > 0 ? costs.linkTable(r) : null;
    const live: number[] = [];
    if (r > 0) for (let j = 0; j < P; j++) if (value[j] < Infinity) live.push(j);
    for (const i of costs.allowedIndices(r)) {
      const p = costs.pairs[i];
      let best = Infinity;
      let arg = -1;
      if (r === 0) best = costs.linkMinutes(0, null, p);
      else {
        const fixed = table!.fixed[i];
        for (const j of live) {
          const v = value[j] + fixed + table!.extra(j, i);
          if (v < best - 1e-9) {
            best = v;
            arg = j;
          }
        }
      }
      if (best === Infinity) continue;
      if (best + costs.roundMinutesAtLeast(r, i) + restAtLeast[r + 1] > bound) continue;
      next[i] = best + costs.roundMinutes(r, p);
      from[i] = arg;
    }
    value = next;
    back.push(from);
  }
  let best = -1;
  for (let i = 0; i < P; i++) if (value[i] < Infinity && (best < 0 || value[i] < value[best] - 1e-9)) best = i;
  if (best < 0) throw new RangeError("no sequence of pairs keeps the rules");
  const sequence: HeldPair[] = new Array(R);
  for (let r = R - 1, i = best; r >= 0; r--) {
    sequence[r] = costs.pairs[i];
    i = back[r][i];
  }
  return { sequence, minutes: value[best] };
}

/** Minutes of a quick sequence that keeps the rules: each round the pair cheapest after the last. */
function greedyMinutes(costs: RoundPairCosts): number {
  const R = costs.piece.rounds.length;
  const seq: HeldPair[] = [];
  for (let r = 0; r < R; r++) {
    const q = r > 0 ? seq[r - 1] : null;
    let best: HeldPair | null = null;
    let bestV = Infinity;
    for (const i of costs.allowedIndices(r)) {
      const p = costs.pairs[i];
      const v = costs.roundMinutesAtLeast(r, i) + costs.linkMinutes(r, q, p);
      if (v < bestV) {
        bestV = v;
        best = p;
      }
    }
    seq.push(best!);
  }
  return costs.sequenceMinutes(seq);
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
  const darning = piece.route ? routeDarnedColours(costs, sequence) : [];
  const darningEnds = piece.route ? darning.reduce((sum, d) => sum + d.ends, 0) : t.estEnds;
  const darningCarry = piece.route ? darning.reduce((sum, d) => sum + d.carryCm, 0) : t.estCarry - t.idleCm;
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
  const name = (c: number) => piece.names[c];
  const parts: string[] = [];
  if (piece.pinned[r]) parts.push("pinned by the maker");
  if (q && joined.length > 0) parts.push(`pair changes here: ${joined.map(name).join(" and ")} appear${joined.length > 1 ? "" : "s"}`);
  else if (q && cut.length > 0) parts.push(`pair changes here: ${cut.map(name).join(" and ")} cut`);
  const colours = costs.present[r].filter((x) => x).length;
  const forcedHere = costs.present[r].some((x, c) => x && piece.forced[c]);
  if (darned.length === 0) {
    if (colours <= 1) parts.push("one colour: knitted");
    else parts.push("only two colours: knitted, nothing darned");
  } else {
    const byColour = new Map<string, number>();
    for (const d of darned) byColour.set(d.colour, (byColour.get(d.colour) ?? 0) + 1);
    const list = [...byColour].map(([k, v]) => `${v} ${piece.names[piece.keys.indexOf(k)]}`).join(", ");
    if (forcedHere && [...byColour.keys()].every((k) => piece.forced[piece.keys.indexOf(k)])) parts.push(`darned as the maker asked: ${list}`);
    else if (colours > 2 && !piece.pinned[r]) parts.push(`${colours} colours: ${p.map(name).join(" and ")} knitted, ${list} darned (least work)`);
    else parts.push(`${list} darned`);
  }
  return parts.join("; ");
}
