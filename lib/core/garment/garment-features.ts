// Everything read from a placed garment, piece by piece: stitches plain / stranded / darned, the
// knitted colours of each round (the round-pairs planner, on the whole round), floats and catches,
// the darning route on the piece's unrolled rounds (wrapping at the start of the round), yarn per
// colour (loop-length model, darned stitches over their real underlay) and the labour estimate.
import { createChart, type Chart } from "../chart/model";
import { planDarning } from "../colourwork/darning-plan";
import { planRoundPairs, type RoundPairsPlan } from "../colourwork/round-pairs";
import { estimateLabour } from "../labour/estimate-labour";
import type { PieceFeatures } from "../labour/piece-features";
import { ALLOWANCE_SOURCES, DEFAULT_COVERAGE_FACTOR, DEFAULT_TAIL_CM, getBindOffCm, getCastOnCm } from "../yarn/allowances";
import { MUNDEN_SOURCE, getLoopLengthCm, getStitchWidthCm } from "../yarn/loop-length";
import { METRES_PER_YARD } from "../yarn/skeins";
import type {
  ColourYarnReading,
  FeatureOptions,
  GarmentPart,
  GarmentPiece,
  GarmentReading,
  PieceReading,
  PlacedGarment,
  RoundReading,
} from "./types";

const ceilTenth = (v: number) => Math.ceil(v * 10 - 1e-9) / 10;
const roundTenth = (v: number) => Math.round(v * 10) / 10;

interface ColourTally {
  knitted: number;
  floats: number;
  darned: number;
  ends: number;
  darnEnds: number;
  carryCm: number;
  castOnCm: number;
  bindOffCm: number;
}

interface PartReading {
  plain: number;
  stranded: number;
  darned: number;
  catches: number;
  shaping: number;
  /** ends of knitted yarns beyond the part's first yarn's join and cut, plus darning ends */
  ends: number;
  carryCm: number;
  rounds: RoundReading[];
}

/**
 * Where each stitch of a round lies on the darning grid: charted stitches only (plain stitches, the
 * thumb gusset for one, are never darned), laid around the round in knitting order, each repeat
 * of each area at its chart's full width so the areas line up from round to round. Returns the
 * column of every stitch (-1 for plain ones) and the width of the round on the grid.
 */
function darningColumns(round: GarmentPart["rounds"][number], areaWidth: (area: string) => number): { cols: number[]; width: number } {
  const cols: number[] = [];
  let offset = 0;
  for (const span of round.spans) {
    if (span.row < 0) {
      for (let j = 0; j < span.columns.length; j++) cols.push(-1);
      continue;
    }
    const w = areaWidth(span.area);
    for (const x of span.columns) cols.push(offset + (w - 1 - x));
    offset += w;
  }
  return { cols, width: offset };
}

function readPart(
  placed: PlacedGarment,
  piece: GarmentPiece,
  pi: number,
  qi: number,
  opts: FeatureOptions,
  tally: ColourTally[],
): PartReading {
  const { palette, garment } = placed;
  const part = piece.parts[qi];
  const rows = placed.colours[pi][qi];
  const gauge = { stitchesPer10cm: garment.sizing.gauge.stitchesPer10cm, rowsPer10cm: garment.sizing.gauge.rowsPer10cm };
  const stitchW = getStitchWidthCm(gauge.stitchesPer10cm);

  // The planner sees only the colours this part uses (a yarn never used here is never held here).
  const pins = placed.pins.filter((p) => (p.piece ?? piece.name) === piece.name && (p.part ?? piece.parts[0].name) === part.name);
  const used = new Set<number>();
  for (const row of rows) for (const c of row) used.add(c);
  for (const p of pins) for (const key of p.pair) used.add(palette.findIndex((q) => q.key === key));
  const local = [...used].sort((a, b) => a - b);
  const toLocal = new Map(local.map((c, i) => [c, i]));
  const darnedHere = placed.darn.filter((c) => used.has(c));
  const plan: RoundPairsPlan = planRoundPairs(
    { rounds: rows.map((row) => Array.from(row, (c) => toLocal.get(c)!)), palette: local.map((c) => ({ key: palette[c].key, name: palette[c].name, hex: palette[c].hex })), gauge },
    {
      darn: darnedHere.map((c) => palette[c].key),
      // the darning route is made below on the garment's own layout (areas aligned round to round)
      route: false,
      ...(pins.length > 0 ? { pins: pins.map((p) => ({ fromRound: p.fromRound, toRound: p.toRound, pair: p.pair })) } : {}),
      ...(opts.floatLimitStitches !== undefined ? { floatLimitStitches: opts.floatLimitStitches } : {}),
      ...(opts.floatLimitCm !== undefined ? { floatLimitCm: opts.floatLimitCm } : {}),
      ...(opts.carryLimitCm !== undefined ? { carryLimitCm: opts.carryLimitCm } : {}),
      ...(opts.rates ? { rates: pickDarningRates(opts.rates) } : {}),
    },
  );
  const keyIndex = new Map(palette.map((p, i) => [p.key, i]));
  const out: PartReading = { plain: 0, stranded: 0, darned: 0, catches: 0, shaping: 0, ends: 0, carryCm: 0, rounds: [] };
  let knitEnds = 0;
  // Stitches the plan darns: every stitch of a `darn` colour, and in pinned rounds any colour
  // beside the pinned pair.
  const darnedMask = plan.rounds.map((pr, r) => {
    const m = new Uint8Array(rows[r].length);
    for (const d of pr.darned) m[d.stitch - 1] = 1;
    return m;
  });
  const darnedColours = [...new Set(plan.rounds.flatMap((pr) => pr.darned.map((d) => keyIndex.get(d.colour)!)))].sort((a, b) => a - b);
  plan.rounds.forEach((pr, r) => {
    const row = rows[r];
    const round = part.rounds[r];
    const isDarned = darnedMask[r];
    const knitted = Uint8Array.from(row);
    for (const d of pr.darned) knitted[d.stitch - 1] = keyIndex.get(d.onto)!;
    // Plain or stranded by area: a run of one area's stitches (one chart row, one repeat) whose
    // knitted colours are two is stranded. Darned stitches do not count either way: what goes
    // under them is the planner's choice, not the chart's.
    let k = 0;
    for (const span of round.spans) {
      const n = span.columns.length;
      let first = -1;
      let two = false;
      for (let j = k; j < k + n; j++) {
        if (isDarned[j]) continue;
        if (first < 0) first = row[j];
        else if (row[j] !== first) two = true;
      }
      if (two) out.stranded += n;
      else out.plain += n;
      k += n;
    }
    const counts = new Map<number, number>();
    for (const c of knitted) counts.set(c, (counts.get(c) ?? 0) + 1);
    for (const [c, n] of counts) {
      tally[c].knitted += n;
      if (counts.size === 2) tally[c].floats += (row.length - n) * stitchW;
    }
    for (const d of pr.darned) tally[keyIndex.get(d.colour)!].darned += 1;
    for (const key of [...pr.joined, ...pr.cut]) tally[keyIndex.get(key)!].ends += 1;
    knitEnds += pr.joined.length + pr.cut.length;
    if (r === plan.rounds.length - 1) {
      for (const key of pr.pair) tally[keyIndex.get(key)!].ends += 1; // cut after the last round
      knitEnds += pr.pair.length;
    }
    out.darned += pr.darned.length;
    out.catches += pr.catches;
    if (round.shaping) out.shaping += 1;
    const reading: RoundReading = {
      piece: piece.name,
      part: part.name,
      round: r + 1,
      stitches: round.stitches,
      shaping: round.shaping,
      knit: pr.knit,
      colours: roundColourKeys(rows[r], palette),
      darned: pr.darned.length,
      longestFloat: pr.longestFloat,
      catches: pr.catches,
    };
    if (pr.darned.length > 0 || pr.joined.length > 0 || pr.cut.length > 0 || r === 0) reading.why = pr.reason;
    out.rounds.push(reading);
  });
  out.ends += Math.max(0, knitEnds - 2);

  // The darning route on the unrolled rounds, cut open where the fewest darned stitches lie: each
  // round is turned about that column on its own width, so a motif across the start of the round
  // is one strand, as worked.
  if (darnedColours.length > 0) {
    const H = part.rounds.length;
    const widthOf = (area: string) => garment.sizing.charts.find((a) => a.area === area)?.width ?? 0;
    const layout = part.rounds.map((round) => darningColumns(round, widthOf));
    const D = Math.max(1, ...layout.map((l) => l.width));
    const perColumn = new Array<number>(D).fill(0);
    rows.forEach((row, r) => {
      for (let s2 = 0; s2 < row.length; s2++) if (darnedMask[r][s2]) perColumn[layout[r].cols[s2]] += 1;
    });
    let cut = 0;
    for (let f = 1; f < D; f++) if (perColumn[f] < perColumn[cut]) cut = f;
    const chart: Chart = createChart(D, H, gauge, palette, 0);
    rows.forEach((row, y) => {
      const { cols, width } = layout[y];
      for (let s2 = 0; s2 < row.length; s2++) {
        if (!darnedMask[y][s2]) continue;
        const rotated = (((cols[s2] - cut) % width) + width) % width;
        chart.cells[y * D + (D - 1 - rotated)] = row[s2];
      }
    });
    // Where every round with darned stitches spans the whole grid, its first and last columns meet.
    const full = layout.every((l, r) => l.width === D || !darnedMask[r].includes(1));
    const darning = planDarning(chart, {
      darn: darnedColours.map((c) => palette[c].key),
      ...(full ? { routeInTheRound: true } : {}),
      ...(opts.carryLimitCm !== undefined ? { carryLimitCm: opts.carryLimitCm } : {}),
      ...(opts.tailCm !== undefined ? { tailCm: opts.tailCm } : {}),
      ...(opts.rates ? { rates: pickDarningRates(opts.rates) } : {}),
    });
    for (const c of darning.colours) {
      const t = tally[keyIndex.get(c.key)!];
      t.darnEnds += c.ends;
      t.carryCm += c.carryCm;
    }
    out.ends += darning.totals.ends;
    out.carryCm += darning.totals.carryCm;
  }
  return out;
}

function pickDarningRates(rates: NonNullable<FeatureOptions["rates"]>) {
  const out: Record<string, number> = {};
  for (const k of ["secondsPerDuplicateStitch", "minutesPerEnd", "secondsPerCarryCm", "secondsPerFloatCatch"] as const) {
    if (rates[k] !== undefined) out[k] = rates[k];
  }
  return out;
}

export function garmentFeatures(placed: PlacedGarment, opts: FeatureOptions = {}): GarmentReading {
  const { garment, palette } = placed;
  const spc = garment.sizing.gauge.stitchesPer10cm;
  const loop = getLoopLengthCm(spc);
  const stitchW = getStitchWidthCm(spc);
  const tailCm = opts.tailCm ?? DEFAULT_TAIL_CM;
  const tally: ColourTally[] = palette.map(() => ({ knitted: 0, floats: 0, darned: 0, ends: 0, darnEnds: 0, carryCm: 0, castOnCm: 0, bindOffCm: 0 }));
  const rounds: RoundReading[] = [];

  const pieces: PieceReading[] = garment.pieces.map((piece, pi) => {
    let plain = 0;
    let stranded = 0;
    let darned = 0;
    let catches = 0;
    let shaping = 0;
    let ends = 0;
    let carryCm = 0;
    piece.parts.forEach((_, qi) => {
      const r = readPart(placed, piece, pi, qi, opts, tally);
      plain += r.plain;
      stranded += r.stranded;
      darned += r.darned;
      catches += r.catches;
      shaping += r.shaping;
      ends += r.ends;
      carryCm += r.carryCm;
      rounds.push(...r.rounds);
    });
    // Cast-on and bind-off yarn in the colour of the first and last round's first stitch.
    const firstRound = placed.colours[pi][0][0];
    if (piece.castOn.start === "long-tail") tally[firstRound?.[0] ?? 0].castOnCm += getCastOnCm(piece.castOn.widthCm);
    if (piece.bindOff > 0) {
      const main = placed.colours[pi][0];
      tally[main[main.length - 1]?.[0] ?? 0].bindOffCm += getBindOffCm(piece.bindOff * stitchW);
    }
    const first = pi === 0;
    const joinedIntoAnother = piece.castOn.start !== "joined" && garment.pieces.some((g) => g.castOn.start === "joined");
    return {
      name: piece.name,
      quantity: 1,
      stitches: piece.stitches,
      features: {
        label: piece.name,
        // One garment is one design: charted and proofed once, on its first piece.
        newDesign: first,
        proofRounds: first ? (opts.proofRounds ?? 1) : 0,
        plainStitches: plain,
        strandedStitches: stranded,
        floatCatches: catches,
        shapingRounds: shaping,
        thumbs: piece.thumbs,
        duplicateStitches: darned,
        ends,
        carryCm: roundTenth(carryCm),
        // pieces joined into another (a pullover's body and sleeves into its yoke) are blocked with
        // it, once (finishing is still counted per piece: the labour model has no switch for it)
        blocked: !joinedIntoAnother,
        darnedStitches: darned,
      },
    };
  });

  const colours: ColourYarnReading[] = [];
  palette.forEach((p, c) => {
    const t = tally[c];
    if (t.knitted === 0 && t.darned === 0) return;
    const cm = {
      knitted: t.knitted * loop,
      floats: t.floats,
      darned: t.darned * loop * DEFAULT_COVERAGE_FACTOR,
      tails: (t.ends + t.darnEnds) * tailCm,
      carries: t.carryCm,
      castOn: t.castOnCm,
      bindOff: t.bindOffCm,
    };
    const totalCm = Math.ceil(Object.values(cm).reduce((s, v) => s + v, 0) - 1e-9);
    const roles: ColourYarnReading["roles"] = [];
    if (t.knitted > 0) roles.push("knitted");
    if (t.darned > 0) roles.push("darned");
    colours.push({
      key: p.key,
      name: p.name,
      hex: p.hex,
      roles,
      knittedStitches: t.knitted,
      darnedStitches: t.darned,
      ends: t.ends + t.darnEnds,
      cm,
      totalCm,
      metres: ceilTenth(totalCm / 100),
      yards: ceilTenth(totalCm / 100 / METRES_PER_YARD),
    });
  });
  const totalCm = colours.reduce((s, c) => s + c.totalCm, 0);

  const labourPieces: PieceFeatures[] = pieces.map((p) => {
    const { darnedStitches: _darned, ...features } = p.features;
    return features;
  });
  const labour = estimateLabour({ pieces: labourPieces, ...(opts.rates ? { rates: opts.rates } : {}), ...(opts.p80Factors ? { p80Factors: opts.p80Factors } : {}) });

  return {
    pieces,
    rounds,
    yarn: {
      loopLengthCm: Math.round(loop * 100) / 100,
      colours,
      totals: { metres: ceilTenth(totalCm / 100), yards: ceilTenth(totalCm / 100 / METRES_PER_YARD) },
      sources: [MUNDEN_SOURCE, ALLOWANCE_SOURCES.longTail, ALLOWANCE_SOURCES.bindOff, ALLOWANCE_SOURCES.coverage, ALLOWANCE_SOURCES.tail],
    },
    labour: {
      stages: labour.stages,
      totals: labour.totals,
      dryingHours: labour.dryingHours,
      pieces: labour.pieces,
      p80Factors: labour.p80Factors,
      rates: labour.rates,
    },
  };
}

/** Keys of every colour a round holds (knitted or darned), in palette order. */
function roundColourKeys(row: ArrayLike<number>, palette: { key: string }[]): string[] {
  const seen = new Set<number>();
  for (let k = 0; k < row.length; k++) seen.add(row[k]);
  return [...seen].sort((a, b) => a - b).map((c) => palette[c].key);
}
