// A hat, bottom up in the round: ribbed brim, straight body (the colourwork band), crown decreased in
// sectors and drawn together. Decorated areas: band (whole round) and crown (one sector, repeated).
import type { Gauge } from "../chart/model";
import { getCastOn, getRows, lcm, nearestMultiple } from "./cast-on";
import type { TemplateOutput } from "./mitten";
import { IMPERIAL, METRIC, ribFor, type UnitWriter } from "./recipe-text";
import type { ChartArea, Piece } from "./sizing-result";
import { SizingError } from "./sizing-error";
import { Tally } from "./tally";
import { roundTo, toLength } from "./units";

// (memory) common practice in hat patterns, not read from a source; each can be given instead.
export const HAT_PROPORTIONS = {
  /** brim edge to crown, unfolded, as a share of the head circumference (≈ 22 cm on a 56 cm head).
   * Cross-check: a published three-gauge hat pattern (knitbot.com/words) gives finished heights of
   * 0.34–0.41 × the head size each fits, 0.39–0.40 for its adult 22 in size. */
  heightPerHead: 0.39,
  brimPerHead: 0.09,
  /** sector counts the cast-on may divide into: 8 is the usual; near counts keep the crown about as deep
   * (see HAT_CAST_ON_PENALTY_CM); when no count near the target divides, 8 after a few decreases */
  sectorChoices: [8, 7, 9, 10, 6],
  source: "(memory) common practice in hat patterns",
} as const;

export type HatStyle = "beanie" | "folded-brim" | "tall";

export interface HatSpec {
  /** beanie: fitted (height a share of the head); tall: the standard's hat height, some slouch;
   * folded-brim: the standard's height as worn, the brim knitted twice as deep and folded up */
  style: HatStyle;
  /** the standard's hat height for this head (see getHatHeightCm), for the tall and folded styles */
  standardHeightCm: number;
  headCircumferenceCm: number;
  hatHeightCm?: number;
  brimLengthCm?: number;
  easeCm: number;
  gauge: Gauge;
  repeat: number;
}

/** Sectors that divide the round into whole sectors of at least 4 sts, or 8 after a few decreases. */
export function chooseCrownSectors(stitches: number): { sectors: number; start: number } {
  for (const s of HAT_PROPORTIONS.sectorChoices) {
    if (stitches % s === 0 && stitches / s >= 4) return { sectors: s, start: stitches };
  }
  return { sectors: 8, start: stitches - (stitches % 8) };
}

// How far (cm of circumference) we would rather move a hat than give up an 8-sector crown or a k2, p2
// brim (ours: a hat stretches over the head, so a few mm matter less than a crown that divides evenly).
// 7 or 9 sectors make the crown about 1 cm deeper or shallower than 8, 6 or 10 about 2 cm.
export const HAT_CAST_ON_PENALTY_CM = {
  sectors: { 8: 0, 7: 0.3, 9: 0.3, 6: 0.6, 10: 0.6 } as Record<number, number>,
  /** a k1, p1 brim where k2, p2 would not close */
  k1p1Rib: 1,
} as const;

/**
 * The hat's cast-on: a multiple of the repeat and of 2 (the brim rib), divided into whole crown
 * sectors (8 preferred, else 7, 9, 6 or 10), and a multiple of 4 for a k2, p2 brim where that costs
 * little. Among such counts, the one nearest the target once the penalties above are added; a tie goes
 * up (the choice never falls as the target grows). Null when no count within a unit or 6 % of the
 * target divides into sectors.
 */
export function getHatCastOn(targetCm: number, perCm: number, repeat: number, minPerSector = 4): { around: number; sectors: number } | null {
  const raw = targetCm * perCm;
  const unit = lcm(2, repeat);
  const pen = HAT_CAST_ON_PENALTY_CM;
  // Counts further than a unit or 6 % from the target are not hats of the size asked (both window ends
  // grow with the target, so the choice still never falls as the target grows).
  const window = Math.max(unit, 0.06 * raw);
  let best: { around: number; sectors: number; score: number } | null = null;
  for (let k = Math.max(1, Math.ceil((raw - window) / unit)); k * unit <= raw + window; k++) {
    const n = k * unit;
    let sectorPenalty = Infinity;
    let sectors = 0;
    for (const s of HAT_PROPORTIONS.sectorChoices) {
      const p = pen.sectors[s] ?? Infinity;
      if (n % s === 0 && n / s >= minPerSector && p < sectorPenalty) {
        sectorPenalty = p;
        sectors = s;
      }
    }
    if (sectors === 0) continue;
    const score = Math.abs(n - raw) / perCm + sectorPenalty + (n % 4 === 0 ? 0 : pen.k1p1Rib);
    if (best === null || score <= best.score + 1e-9) best = { around: n, sectors, score };
  }
  return best && { around: best.around, sectors: best.sectors };
}

const STYLE_WORDS: Record<HatStyle, string> = {
  beanie: "A fitted beanie",
  tall: "A taller hat with some slouch",
  "folded-brim": "A hat with a folded brim",
};

export function sizeHat(spec: HatSpec): TemplateOutput {
  const P = HAT_PROPORTIONS;
  const spc = spec.gauge.stitchesPer10cm / 10;
  const rpc = spec.gauge.rowsPer10cm / 10;
  const warnings: string[] = [];
  const derived: Record<string, number> = {};

  const targetCm = spec.headCircumferenceCm + spec.easeCm;
  // Refuses a repeat wider than the hat, in the same words as every garment.
  getCastOn(targetCm, spc, spec.repeat, "repeat", "hat");
  const chosen = getHatCastOn(targetCm, spc, spec.repeat) ?? getHatCastOn(targetCm, spc, spec.repeat, 2);
  const around = chosen?.around ?? nearestMultiple(targetCm * spc, lcm(2, spec.repeat));
  const folded = spec.style === "folded-brim";
  // brimCm is the brim as worn; a folded brim is knitted twice as deep and turned up over itself.
  const brimCm = spec.brimLengthCm ?? roundTo(P.brimPerHead * spec.headCircumferenceCm, 0.1);
  if (spec.brimLengthCm === undefined) derived.brimLengthCm = brimCm;
  // hatHeightCm is the knitted height, brim edge to crown, unfolded (a folded brim adds its turn-up).
  const styleHeight =
    spec.style === "beanie" ? P.heightPerHead * spec.headCircumferenceCm : spec.standardHeightCm + (folded ? brimCm : 0);
  const heightCm = spec.hatHeightCm ?? roundTo(styleHeight, 0.1);
  if (spec.hatHeightCm === undefined) derived.hatHeightCm = heightCm;

  if (around < 16) {
    throw new SizingError("gauge.stitchesPer10cm", `only ${around} sts around a hat at this gauge: too few to shape a crown`);
  }
  const { sectors, start } = chosen ? { sectors: chosen.sectors, start: around } : chooseCrownSectors(around);
  if (start !== around) {
    warnings.push(
      `no count near ${around} sts suits both the ${spec.repeat}-st repeat and a crown of 6–10 equal sectors: the crown starts with a decrease round to ${start} sts`,
    );
  }
  const perSector = start / sectors;
  if (perSector < 4) warnings.push(`only ${perSector} sts a crown sector: the crown is drawn together after few decreases`);
  const crownCounts: number[] = [];
  let cur = start;
  for (let left = perSector; left > 1; left--) {
    const slow = cur > start / 2;
    cur -= sectors;
    crownCounts.push(cur);
    if (slow) crownCounts.push(cur);
  }
  const crownRows = crownCounts.length;
  const alternate = crownCounts.length - (perSector - 1);
  const everyRound = perSector - 1 - alternate;

  const totalRows = getRows(heightCm, rpc);
  const brimRows = getRows(folded ? 2 * brimCm : brimCm, rpc);
  const foldRows = folded ? Math.floor(brimRows / 2) : 0;
  const bodyRows = totalRows - brimRows - crownRows;
  if (bodyRows < 1) {
    throw new SizingError(
      "options.hatHeightCm",
      `a ${roundTo(heightCm, 0.1)} cm hat is too short: the brim (${roundTo(brimRows / rpc, 0.1)} cm) and crown (${roundTo(crownRows / rpc, 0.1)} cm) need more at this gauge`,
    );
  }

  const t = new Tally(around);
  t.plain(brimRows);
  t.plain(bodyRows - (start === around ? 0 : 1));
  if (start !== around) t.shape(start);
  for (const c of crownCounts) t.shape(c);

  const crownStitches = crownCounts.reduce((s, c) => s + c, 0);
  const charts: ChartArea[] = [
    {
      area: "band",
      piece: "hat",
      width: around,
      height: bodyRows,
      repeats: 1,
      stitches: around * bodyRows,
      note: "the whole round between the brim and the crown",
      fromRound: brimRows,
      // when the crown starts on fewer stitches, the last body round decreases evenly to them
      rowStitches: Array.from({ length: bodyRows }, (_, i) => (i === bodyRows - 1 ? start : around)),
      narrowing: "even",
    },
    {
      area: "crown",
      piece: "hat",
      width: perSector,
      height: crownRows,
      repeats: sectors,
      stitches: crownStitches,
      note: `one of ${sectors} sectors; each decrease round takes 1 st from the end of every sector`,
      fromRound: brimRows + bodyRows,
      rowStitches: crownCounts.map((c) => c / sectors),
      narrowing: "sector end",
    },
  ];
  const pieces: Piece[] = [
    { name: "hat", quantity: 1, start: "long-tail", castOn: around, castOnWidthCm: roundTo(around / spc, 0.1), bindOff: 0, stitches: t.total, rounds: t.counts },
  ];

  const write = (u: UnitWriter): string[] => {
    const lines = [
      `Gauge: ${u.gauge(spec.gauge)}. ${STYLE_WORDS[spec.style]}, ${u.len((brimRows + bodyRows + crownRows - foldRows) / rpc)} from the brim to the crown as worn.`,
      `Cast on ${around} sts and join to work in the round (finished ${u.len(around / spc)} around).`,
      folded
        ? `Brim: work ${brimRows} rnds (${u.len(brimRows / rpc)}) of ${ribFor(around)}; it is folded up in half when worn (${u.len(foldRows / rpc)} deep).`
        : `Brim: work ${brimRows} rnds (${u.len(brimRows / rpc)}) of ${ribFor(around)}.`,
      `Body: work ${bodyRows} rnds (${u.len(bodyRows / rpc)}) in stockinette or the band chart, to ${u.len((brimRows + bodyRows) / rpc)} from the cast-on edge.`,
    ];
    if (start !== around) {
      lines.push(`On the last body rnd decrease ${around - start} sts evenly (${start} sts).`);
    }
    lines.push(
      `Crown: place a marker every ${perSector} sts (${sectors} sectors). Knit to 2 sts before each marker, k2tog: every other rnd ${alternate} times, then every rnd ${everyRound} times (${cur} sts), ${crownRows} rnds (${u.len(crownRows / rpc)}).`,
      `Cut the yarn, draw it through the remaining ${cur} sts and pull tight. Weave in the ends and block.`,
    );
    return lines;
  };

  return {
    castOn: around,
    counts: { around, crownStart: start, crownSectors: sectors, perSector, crownTop: cur },
    rows: { brim: brimRows, body: bodyRows, crown: crownRows, total: brimRows + bodyRows + crownRows, ...(folded ? { brimFold: foldRows } : {}) },
    charts,
    pieces,
    finished: {
      circumference: toLength(around / spc),
      height: toLength((brimRows + bodyRows + crownRows) / rpc),
      wornHeight: toLength((brimRows + bodyRows + crownRows - foldRows) / rpc),
    },
    derived,
    recipe: { metric: write(METRIC), imperial: write(IMPERIAL) },
    warnings,
  };
}
