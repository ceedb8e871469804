// Mittens, a pair, bottom up in the round: cuff, hand with a thumb gusset or an afterthought thumb,
// two-band top decreases (back and palm halves), thumb. Decorated areas: cuff, back of hand, palm.
import type { Gauge } from "../chart/model";
import { getCastOn, getRows, nearestEven } from "./cast-on";
import { IMPERIAL, METRIC, everyNth, ribFor, type UnitWriter } from "./recipe-text";
import type { ChartArea, Piece } from "./sizing-result";
import { SizingError } from "./sizing-error";
import { Tally, planBandDecreases } from "./tally";
import { roundTo, toLength, type Length } from "./units";

// Proportions of the hand for what was not measured: (memory) common practice in mitten patterns,
// not read from a source; every one can be given instead.
export const MITTEN_PROPORTIONS = {
  cuffPerHandLength: 0.35,
  /** wrist to thumb crotch */
  thumbCrotchPerHandLength: 0.4,
  /** wrist to the base of an afterthought thumb's opening */
  afterthoughtPerHandLength: 0.25,
  thumbLengthPerHandLength: 0.33,
  /** thumb circumference in stitches, as a share of the hand's */
  thumbStitchesPerHand: 0.36,
  /** the mitten ends this far past the fingertip */
  lengthEaseCm: 1,
  /** top decreases stop at this many stitches (4 on the back, 4 on the palm): grafted 4 to 4 or drawn
   * together (common practice: a mitten top is closed on 6–12 sts) */
  topStitchesLeft: 8,
  source: "(memory) common practice in mitten patterns",
} as const;

export interface MittenSpec {
  handCircumferenceCm: number;
  handLengthCm: number;
  thumbLengthCm?: number;
  cuffLengthCm?: number;
  easeCm: number;
  gauge: Gauge;
  repeat: number;
  thumb: "gusset" | "afterthought";
}

export interface TemplateOutput {
  castOn: number;
  counts: Record<string, number>;
  rows: Record<string, number>;
  charts: ChartArea[];
  pieces: Piece[];
  finished: Record<string, Length>;
  derived: Record<string, number>;
  recipe: { metric: string[]; imperial: string[] };
  warnings: string[];
}

/**
 * The hand's cast-on: back and palm are equal halves, each a whole number of repeats, so the count is
 * a multiple of 2 × repeat (which is also a multiple of lcm(2, repeat)); the nearest such count, a tie up.
 */
export function getMittenCastOn(targetCm: number, perCm: number, repeat: number): number {
  const half = (targetCm * perCm) / 2;
  if (repeat > half + 1e-9) {
    throw new SizingError(
      "repeat",
      `a repeat of ${repeat} stitches is wider than the hand's back or palm (${roundTo(half, 0.1)} stitches each at this gauge; each half holds whole repeats); choose a narrower motif or a finer gauge`,
    );
  }
  return getCastOn(targetCm, perCm, 2 * repeat, "repeat", "hand");
}

/**
 * Top decreases on an even hand: 4 sts a round (2 on each half) every other round while more than half
 * remain, then every round, down to 8–10 sts; from 10 one last round takes 1 st from each half, so the
 * top always ends on a multiple of 4 with back and palm equal (4 + 4, or fewer on a tiny hand).
 */
export function planMittenTop(hand: number) {
  const top = planBandDecreases(hand, 4, MITTEN_PROPORTIONS.topStitchesLeft);
  const last = top.remaining % 4 === 2 && top.remaining >= 6 ? top.remaining - 2 : null;
  const counts = last === null ? top.counts : [...top.counts, last];
  const remaining = last ?? top.remaining;
  return { ...top, counts, rows: counts.length, remaining, lastRound: last !== null };
}

function topSteps(top: ReturnType<typeof planMittenTop>): string {
  const steps: string[] = [];
  if (top.decreases > 0) {
    const when = [top.alternate > 0 ? `every other rnd ${top.alternate} times` : "", top.everyRound > 0 ? `every rnd ${top.everyRound} times` : ""].filter(Boolean);
    steps.push(`decrease 4 sts a decrease rnd (k1, ssk at the start of each half; k2tog, k1 at its end): ${when.join(", then ")} (${top.lastRound ? top.remaining + 2 : top.remaining} sts)`);
  }
  if (top.lastRound) steps.push(`${top.decreases > 0 ? "then " : ""}one rnd of k1, ssk at the start of each half only (${top.remaining} sts)`);
  return steps.length ? steps.join(", ") : "no decreases";
}

export function sizeMitten(spec: MittenSpec): TemplateOutput {
  const P = MITTEN_PROPORTIONS;
  const spc = spec.gauge.stitchesPer10cm / 10;
  const rpc = spec.gauge.rowsPer10cm / 10;
  const warnings: string[] = [];
  const derived: Record<string, number> = {};

  const hand = getMittenCastOn(spec.handCircumferenceCm + spec.easeCm, spc, spec.repeat);
  const back = hand / 2;
  const palm = back;

  const cuffCm = spec.cuffLengthCm ?? roundTo(P.cuffPerHandLength * spec.handLengthCm, 0.1);
  if (spec.cuffLengthCm === undefined) derived.cuffLengthCm = cuffCm;
  const thumbCm = spec.thumbLengthCm ?? roundTo(P.thumbLengthPerHandLength * spec.handLengthCm, 0.1);
  if (spec.thumbLengthCm === undefined) derived.thumbLengthCm = thumbCm;
  const crotchCm = roundTo(P.thumbCrotchPerHandLength * spec.handLengthCm, 0.1);
  const openingCm = roundTo(P.afterthoughtPerHandLength * spec.handLengthCm, 0.1);

  const cuffRows = getRows(cuffCm, rpc);
  const handRows = getRows(spec.handLengthCm + P.lengthEaseCm, rpc); // wrist to tip
  const top = planMittenTop(hand);
  const straightRows = handRows - top.rows; // wrist to the first top decrease
  const crotchRows = getRows(crotchCm, rpc);
  if (straightRows <= crotchRows) {
    throw new SizingError(
      "gauge.rowsPer10cm",
      `at ${spec.gauge.rowsPer10cm} rows per 10 cm the top shaping (${top.rows} rnds) and thumb leave no plain hand: check the row gauge`,
    );
  }

  const thumbSts = nearestEven(P.thumbStitchesPerHand * hand, 6);
  const t = new Tally(hand);
  t.plain(cuffRows);

  const counts: Record<string, number> = { hand, back, palm, thumb: thumbSts, top: top.remaining, topPerHalf: top.remaining / 2 };
  const rows: Record<string, number> = { cuff: cuffRows, wristToTip: handRows, wristToTopDecreases: straightRows, top: top.rows };

  let thumbStartRows: number; // rounds of thumb before its decreases
  let gusset: { held: number; increases: number; every: number; rows: number; afterRows: number } | null = null;
  let openingAt = 0;
  let openingWidth = 0;
  if (spec.thumb === "gusset") {
    const held = thumbSts - 1; // one more stitch is picked up in the gap
    const increases = (held - 1) / 2;
    const every = Math.max(2, Math.floor((crotchRows - 1) / increases));
    const incRows = 1 + increases * every;
    // A round or two past the target is rounding; warn when the gusset is clearly too tall.
    if (incRows > Math.ceil(crotchRows * 1.15)) {
      warnings.push(`the thumb gusset (${incRows} rnds) rises above the thumb crotch (${crotchRows} rnds) at this row gauge`);
    }
    const gussetRows = Math.max(crotchRows, incRows);
    gusset = { held, increases, every, rows: gussetRows, afterRows: gussetRows - incRows };
    t.shape(hand + 1);
    for (let i = 0; i < increases; i++) {
      t.plain(every - 1);
      t.shape(t.current + 2);
    }
    t.plain(gusset.afterRows);
    t.set(hand);
    t.plain(straightRows - gussetRows);
    counts.gussetHeld = held;
    rows.gusset = gussetRows;
    rows.gussetIncreaseEvery = every;
    thumbStartRows = getRows(thumbCm, rpc);
  } else {
    openingAt = getRows(openingCm, rpc);
    openingWidth = thumbSts / 2 - 1;
    t.plain(straightRows);
    counts.thumbOpening = openingWidth;
    rows.thumbOpening = openingAt;
    // The thumb is knitted from the opening: its length is measured from there, not from the crotch
    // (the hand's rounds between the opening and the crotch are not part of the thumb).
    thumbStartRows = getRows(thumbCm, rpc);
  }
  for (const c of top.counts) t.shape(c);

  const thumbTally = new Tally(thumbSts);
  const thumbPlain = Math.max(1, thumbStartRows - 3);
  if (thumbStartRows - 3 < 1) warnings.push("the thumb is shorter than its decreases at this row gauge; it gets one plain round");
  thumbTally.plain(thumbPlain);
  const afterFirst = Math.ceil(thumbSts / 2);
  const afterSecond = Math.ceil(afterFirst / 2);
  thumbTally.shape(afterFirst);
  thumbTally.plain(1);
  thumbTally.shape(afterSecond);
  rows.thumb = thumbTally.rows;
  counts.thumbTop = afterSecond;

  const halfTop = (pick: (c: number) => number) => top.counts.reduce((s, c) => s + pick(c), 0);
  // Stitches of each half on every hand round: whole until the top, then each decrease round's half.
  const halfRows = (whole: number, pick: (c: number) => number) => [...Array<number>(straightRows).fill(whole), ...top.counts.map(pick)];
  const charts: ChartArea[] = [
    {
      area: "cuff",
      piece: "mitten",
      width: hand,
      height: cuffRows,
      repeats: 1,
      stitches: hand * cuffRows,
      note: "the whole round of the cuff",
      fromRound: 0,
      rowStitches: Array<number>(cuffRows).fill(hand),
      narrowing: "edges",
    },
    {
      area: "back of hand",
      piece: "mitten",
      width: back,
      height: handRows,
      repeats: 1,
      stitches: back * straightRows + halfTop((c) => Math.ceil(c / 2)),
      note: `wrist to tip; the top ${top.rows} rows narrow by 2 sts on each decrease round`,
      fromRound: cuffRows,
      rowStitches: halfRows(back, (c) => Math.ceil(c / 2)),
      narrowing: "edges",
    },
    {
      area: "palm",
      piece: "mitten",
      width: palm,
      height: handRows,
      repeats: 1,
      stitches: palm * straightRows + halfTop((c) => Math.floor(c / 2)),
      note:
        spec.thumb === "gusset"
          ? `wrist to tip; the thumb gusset stitches sit outside this chart at its edge; the top ${top.rows} rows narrow`
          : `wrist to tip; the thumb opening (${openingWidth} sts of waste yarn) is at row ${openingAt + 1}; the top ${top.rows} rows narrow`,
      fromRound: cuffRows,
      rowStitches: halfRows(palm, (c) => Math.floor(c / 2)),
      narrowing: "edges",
    },
  ];

  const cuffWidthCm = roundTo(hand / spc, 0.1);
  const pieces: Piece[] = [
    { name: "mitten", quantity: 2, start: "long-tail", castOn: hand, castOnWidthCm: cuffWidthCm, bindOff: 0, stitches: t.total, rounds: t.counts },
    { name: "thumb", quantity: 2, start: "picked-up", castOn: thumbSts, castOnWidthCm: 0, bindOff: 0, stitches: thumbTally.total, rounds: thumbTally.counts },
  ];

  const finished = {
    handCircumference: toLength(hand / spc),
    mittenLength: toLength((cuffRows + handRows) / rpc),
    thumbCircumference: toLength(thumbSts / spc),
  };

  const write = (u: UnitWriter): string[] => {
    const lines = [
      `Gauge: ${u.gauge(spec.gauge)}. Mittens are usually knitted firmly for warmth and wear.`,
      `Make two; on the second mitten place the thumb at the other edge of the palm, so the pair is a left and a right.`,
      `Cast on ${hand} sts and join to work in the round (finished hand ${u.len(hand / spc)} around).`,
      `Cuff: work ${cuffRows} rnds (${u.len(cuffRows / rpc)}) of ${ribFor(hand)}. The back of the hand is the first ${back} sts, the palm the last ${palm}${spec.repeat > 1 ? ` (${back / spec.repeat} repeats of ${spec.repeat} sts on each)` : ""}.`,
    ];
    if (gusset) {
      lines.push(
        `Thumb gusset: next rnd, at the edge of the palm place 2 markers and make 1 st between them. Make 1 st after the first marker and before the second ${everyNth(gusset.every)} ${gusset.increases} times (${gusset.held} gusset sts)${gusset.afterRows > 0 ? `, then work ${gusset.afterRows} rnds plain` : ""}: ${gusset.rows} rnds (${u.len(gusset.rows / rpc)}) above the cuff.`,
        `Place the ${gusset.held} gusset sts on waste yarn, cast on 1 st over the gap and work it together with its neighbour on the next rnd (${hand} sts).`,
        `Hand: work plain until ${straightRows} rnds (${u.len(straightRows / rpc)}) above the cuff, about the tip of the little finger.`,
      );
    } else {
      lines.push(
        `Hand: work ${openingAt} rnds (${u.len(openingAt / rpc)}) above the cuff. Thumb opening: at the edge of the palm knit ${openingWidth} sts with waste yarn, slip them back and knit them again with the working yarn.`,
        `Continue plain until ${straightRows} rnds (${u.len(straightRows / rpc)}) above the cuff, about the tip of the little finger.`,
      );
    }
    lines.push(
      `Top: ${topSteps(top)}, ${top.rows} rnds (${u.len(top.rows / rpc)}). ${top.remaining / 2} sts remain on the back and ${top.remaining / 2} on the palm: graft them together (Kitchener stitch, back to palm), or draw the yarn through all ${top.remaining} and pull tight.`,
    );
    const pick =
      spec.thumb === "gusset"
        ? `Thumb: put the ${thumbSts - 1} held sts on needles and pick up 1 st in the gap (${thumbSts} sts)`
        : `Thumb: remove the waste yarn, put the ${openingWidth} sts below and ${openingWidth} above on needles and pick up 1 st at each corner (${thumbSts} sts)`;
    lines.push(
      `${pick}; work ${thumbPlain} rnds (${u.len(thumbPlain / rpc)}), k2tog around (${afterFirst} sts), knit 1 rnd, k2tog around (${afterSecond} sts); draw the yarn through the last sts${spec.thumb === "afterthought" ? ` (the thumb is ${thumbTally.rows} rnds, ${u.len(thumbTally.rows / rpc)}, from the opening)` : ""}.`,
      `Weave in the ends and block.`,
    );
    return lines;
  };

  return {
    castOn: hand,
    counts,
    rows,
    charts,
    pieces,
    finished,
    derived,
    recipe: { metric: write(METRIC), imperial: write(IMPERIAL) },
    warnings,
  };
}
