// A pullover knitted in the round from the bottom up: body and two sleeves to the underarm, joined
// on one needle for a circular yoke with three decrease rounds, neckband. Colourwork either in the
// yoke (a chart per yoke section) or in bands above the hem and the cuffs.
import type { Gauge } from "../chart/model";
import { ceilMultiple, getEvenCastOn, getRows, lcm, nearestEven, nearestMultiple } from "./cast-on";
import type { TemplateOutput } from "./mitten";
import { IMPERIAL, METRIC, everyNth, ribFor, type UnitWriter } from "./recipe-text";
import type { ChartArea, Piece } from "./sizing-result";
import { SizingError } from "./sizing-error";
import { Tally } from "./tally";
import { roundTo, toLength } from "./units";

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

// Stitch proportions of the body count K: Elizabeth Zimmermann's percentage system (Knitting
// Without Tears, 1971), from memory. Lengths not measured: (memory) common practice.
export const PULLOVER_PROPORTIONS = {
  upperArmPerBody: 0.33,
  wristPerBody: 0.2,
  underarmPerBody: 0.08,
  neckPerBody: 0.4,
  /** yoke depth (underarm to neck edge) per finished chest, (memory) */
  yokeDepthPerChest: 0.22,
  /** where the three yoke decrease rounds fall, as fractions of the yoke below the neckband (memory) */
  yokeDecreaseAt: [0.5, 0.75, 0.9] as const,
  hemPerChest: 0.055,
  neckbandPerChest: 0.03,
  bandPerChest: 0.09,
  /** plain rounds at the top of the sleeve after the last increase, per sleeve length */
  sleeveTopStraightPerSleeve: 0.07,
  /** a cuff is about 1–2 in larger than the wrist (memory, common practice): the percentage cuff is
   * held to the wrist plus this much */
  cuffEaseCm: 3.8,
  /** back-neck short rows raise the back about 1 in (memory, common practice) */
  backNeckRaiseCm: 2.5,
  /** a ribbed neckband stretches by about a third (memory): the neck must reach head ÷ this */
  neckStretch: 4 / 3,
  source: "Zimmermann's percentage system (Knitting Without Tears, 1971; from memory) and (memory) common practice",
} as const;

export interface PulloverSpec {
  chestCm: number;
  bodyLengthCm: number;
  sleeveLengthCm: number;
  upperArmCm?: number;
  wristCm?: number;
  /** the wearer's head, so the neck opening can pass over it */
  headCircumferenceCm?: number;
  /** the head the neck is checked against when none is measured (see getAssumedHead) */
  assumedHead: { cm: number; label: string };
  /** a wrist for the size when none is measured (see getWristEstimateCm): caps the percentage cuff */
  wristEstimateCm: number;
  /** the most the yoke may rise for this chest (see getYokeDepthCapCm): caps the percentage depth */
  yokeDepthCapCm: number;
  /** raise the back neck with short rows worked across the back just below the neckband */
  backNeckShortRows: boolean;
  yokeDepthCm?: number;
  hemLengthCm?: number;
  cuffLengthCm?: number;
  neckbandLengthCm?: number;
  bandHeightCm?: number;
  easeCm: number;
  gauge: Gauge;
  repeat: number;
  style: "yoke" | "bands";
}

/** The percentage cuff (a fifth of the body, in sts), held to the wrist plus a cuff's ease. */
export function getPercentCuffTarget(body: number, wristCm: number, stitchesPerCm: number): number {
  const P = PULLOVER_PROPORTIONS;
  return Math.min(P.wristPerBody * body, (wristCm + P.cuffEaseCm) * stitchesPerCm);
}

/** The percentage yoke depth (a share of the finished chest), held to the body's cap. */
export function getPercentYokeDepthCm(finishedChestCm: number, capCm: number): number {
  return Math.min(PULLOVER_PROPORTIONS.yokeDepthPerChest * finishedChestCm, capCm);
}

/**
 * Back-neck short rows on the neck count, centred on the back, the rounds begun at the centre back
 * (stitches slipped there, not knitted). Row by row, from the centre back: knit `half`, turn; purl
 * `first` (= 2 × half, shoulder to shoulder: half the round rounded down to even), turn; then `pairs − 1`
 * times: knit to `step` sts before the last turn, turn; purl to `step` sts before the last turn, turn;
 * then knit back to the centre back. Pair i (1-based, after the first) knits first − (2i − 1) × step
 * and purls first − 2i × step; the last row knits half − (pairs − 1) × step. As many pairs as half the
 * rows that make the raise (at least 2); the last turn still about a third of the back from centre.
 */
export function planBackNeckShortRows(neck: number, raiseRows: number) {
  const half = Math.max(1, Math.floor(neck / 4));
  const first = 2 * half;
  let pairs = Math.max(2, Math.round(raiseRows / 2));
  const step = Math.max(1, Math.floor((first - Math.ceil(first / 3)) / (2 * (pairs - 1))));
  pairs = Math.min(pairs, Math.floor((half - 1) / step) + 1); // every turn at least 1 st from the centre
  const rowLengths = [half, first];
  for (let i = 1; i < pairs; i++) rowLengths.push(first - (2 * i - 1) * step, first - 2 * i * step);
  rowLengths.push(half - (pairs - 1) * step);
  const stitches = rowLengths.reduce((a, b) => a + b, 0);
  return { pairs, rows: 2 * pairs, half, first, step, rowLengths, stitches };
}

export function sizePullover(spec: PulloverSpec): TemplateOutput {
  const P = PULLOVER_PROPORTIONS;
  const spc = spec.gauge.stitchesPer10cm / 10;
  const rpc = spec.gauge.rowsPer10cm / 10;
  const warnings: string[] = [];
  const derived: Record<string, number> = {};
  const pick = (name: keyof PulloverSpec & string, given: number | undefined, fallback: number) => {
    if (given !== undefined) return given;
    const v = roundTo(fallback, 0.1);
    derived[name] = v;
    return v;
  };

  // Even, so back and front split evenly and the hem rib closes (a multiple of lcm(2, repeat)).
  const body = getEvenCastOn(spec.chestCm + spec.easeCm, spc, spec.repeat, "repeat", "body");
  const chestFinishedCm = body / spc;
  const fit = chestFinishedCm / spec.chestCm; // the body's ease, carried to measured arms
  const upperTarget = spec.upperArmCm !== undefined ? spec.upperArmCm * fit * spc : P.upperArmPerBody * body;
  // The percentage cuff (a fifth of the body) grows with the chest; a wrist does not: hold it to the
  // wrist plus a cuff's ease at large sizes.
  const wristTarget = spec.wristCm !== undefined ? spec.wristCm * fit * spc : getPercentCuffTarget(body, spec.wristEstimateCm, spc);
  if (spec.wristCm === undefined && wristTarget < P.wristPerBody * body) derived.wristCm = roundTo(spec.wristEstimateCm, 0.1);

  const cuff =
    spec.style === "bands" ? getEvenCastOn(wristTarget / spc, spc, spec.repeat, "repeat", "sleeve cuff") : nearestEven(wristTarget, 4);
  const upper = Math.max(cuff, cuff + 2 * Math.round((upperTarget - cuff) / 2));
  const underarm = Math.min(nearestEven(P.underarmPerBody * body, 2), upper - 2);
  const join = body - 2 * underarm + 2 * (upper - underarm);
  const unit = spec.style === "yoke" ? spec.repeat : 2;
  // the neckband's rib closes on an even count
  const neckUnit = lcm(2, unit);
  const yokeStart = nearestMultiple(join, unit);
  // The neck follows the percentage system unless the wearer's head would not pass through it.
  const neckMinSts = spec.headCircumferenceCm !== undefined ? (spec.headCircumferenceCm / P.neckStretch) * spc : 0;
  // At large sizes 40 % of the body is wider than the head itself and only gapes: hold it to the head.
  const neckPercent = Math.min(P.neckPerBody * body, (spec.headCircumferenceCm ?? spec.assumedHead.cm) * spc);
  const neckTarget = Math.max(neckPercent, neckMinSts);
  const q = Math.cbrt(neckTarget / yokeStart);
  const y1 = nearestMultiple(yokeStart * q, unit);
  const y2 = nearestMultiple(yokeStart * q * q, unit);
  // A measured head sets a minimum: round up to the repeat, never below it.
  const neck =
    neckMinSts > 0 ? Math.max(nearestMultiple(neckPercent, neckUnit), ceilMultiple(neckMinSts, neckUnit)) : nearestMultiple(neckTarget, neckUnit);
  const yokeCounts = [yokeStart, Math.min(y1, yokeStart), Math.min(y2, y1, yokeStart), Math.min(neck, y2, y1, yokeStart)];
  if (yokeCounts[1] === yokeCounts[0] || yokeCounts[2] === yokeCounts[1] || yokeCounts[3] === yokeCounts[2]) {
    warnings.push(`a repeat of ${spec.repeat} sts is too wide for three yoke decreases: some yoke sections keep the same count`);
  }

  const hemCm = pick("hemLengthCm", spec.hemLengthCm, clamp(P.hemPerChest * spec.chestCm, 2, 7));
  const cuffCm = pick("cuffLengthCm", spec.cuffLengthCm, clamp(P.hemPerChest * spec.chestCm, 2, 7));
  const neckbandCm = pick("neckbandLengthCm", spec.neckbandLengthCm, clamp(P.neckbandPerChest * spec.chestCm, 1.5, 4));
  const yokeCm = pick("yokeDepthCm", spec.yokeDepthCm, getPercentYokeDepthCm(chestFinishedCm, spec.yokeDepthCapCm));
  const bandCm = spec.style === "bands" ? pick("bandHeightCm", spec.bandHeightCm, clamp(P.bandPerChest * spec.chestCm, 3, 12)) : 0;

  const hemRows = getRows(hemCm, rpc);
  const bodyRows = getRows(spec.bodyLengthCm, rpc);
  const bandRows = getRows(bandCm, rpc);
  if (hemRows + bandRows >= bodyRows) {
    throw new SizingError(
      "measurements.bodyLengthCm",
      `a ${roundTo(spec.bodyLengthCm, 0.1)} cm body (underarm to hem) is shorter than its hem${bandRows ? " and band" : ""}`,
    );
  }

  // Sleeve: cuff, band, increases 2 sts at a time to the upper arm, a few plain rounds.
  const sleeveRows = getRows(spec.sleeveLengthCm, rpc);
  const cuffRows = getRows(cuffCm, rpc);
  const increases = (upper - cuff) / 2;
  const topStraight = getRows(P.sleeveTopStraightPerSleeve * spec.sleeveLengthCm, rpc);
  const room = sleeveRows - cuffRows - bandRows - topStraight;
  let every = 0;
  if (increases > 0) {
    every = Math.floor(room / increases);
    if (every < 1) {
      throw new SizingError(
        "measurements.sleeveLengthCm",
        `a ${roundTo(spec.sleeveLengthCm, 0.1)} cm sleeve has no room for ${increases} increase rounds from the cuff (${cuff} sts) to the upper arm (${upper} sts) at this row gauge`,
      );
    }
    if (every === 1) warnings.push("the sleeve increases fall on every round: the sleeve is short for the arm's shaping");
  } else if (room < 0) {
    throw new SizingError("measurements.sleeveLengthCm", `a ${roundTo(spec.sleeveLengthCm, 0.1)} cm sleeve is shorter than its cuff`);
  }
  const sleeveAfter = sleeveRows - cuffRows - bandRows - every * increases;

  const yokeRows = getRows(yokeCm, rpc);
  const neckRows = getRows(neckbandCm, rpc);
  const shaped = yokeRows - neckRows; // the neckband sits above the last decrease section
  const bounds = P.yokeDecreaseAt.map((f) => Math.round(f * shaped));
  const sectionRows = [bounds[0], bounds[1] - bounds[0], bounds[2] - bounds[1], yokeRows - neckRows - bounds[2]];
  if (sectionRows.some((r) => r < 1)) {
    throw new SizingError(
      "options.yokeDepthCm",
      `a ${roundTo(yokeCm, 0.1)} cm yoke is too shallow for three decrease rounds and a ${roundTo(neckbandCm, 0.1)} cm neckband at this row gauge`,
    );
  }

  const bodyT = new Tally(body);
  bodyT.plain(bodyRows);
  const sleeveT = new Tally(cuff);
  sleeveT.plain(cuffRows + bandRows);
  for (let i = 0; i < increases; i++) {
    sleeveT.plain(every - 1);
    sleeveT.shape(sleeveT.current + 2);
  }
  sleeveT.plain(sleeveAfter);
  const yokeT = new Tally(join);
  yokeCounts.forEach((count, i) => {
    yokeT.shape(count);
    yokeT.plain(sectionRows[i] - 1);
  });
  const neckSts = yokeCounts[3];
  const shortRows = spec.backNeckShortRows ? planBackNeckShortRows(neckSts, getRows(P.backNeckRaiseCm, rpc)) : null;
  if (shortRows) yokeT.partial(shortRows.stitches, shortRows.rowLengths);
  yokeT.plain(neckRows);
  const headCheckCm = spec.headCircumferenceCm ?? spec.assumedHead.cm;
  if ((neckSts / spc) * P.neckStretch < headCheckCm - 1e-9) {
    warnings.push(
      `the neck opening is ${roundTo(neckSts / spc, 0.1)} cm around; a rib stretches about a third, which may not pass over a ${roundTo(headCheckCm, 0.1)} cm head${spec.headCircumferenceCm === undefined ? ` (a typical ${spec.assumedHead.label} head, Typical Head Sizes table; give headCircumferenceCm to size the neck for the wearer)` : ""}`,
    );
  }

  const charts: ChartArea[] = [];
  if (spec.style === "yoke") {
    let from = 1;
    yokeCounts.forEach((count, i) => {
      charts.push({
        area: `yoke ${i + 1}`,
        piece: "yoke",
        width: count,
        height: sectionRows[i],
        repeats: 1,
        stitches: count * sectionRows[i],
        note: `yoke rounds ${from}–${from + sectionRows[i] - 1}${i > 0 ? `; its first round decreases to ${count} sts` : ""}`,
        fromRound: from - 1,
        rowStitches: Array<number>(sectionRows[i]).fill(count),
        narrowing: "even",
      });
      from += sectionRows[i];
    });
  } else {
    charts.push(
      {
        area: "body band",
        piece: "body",
        width: body,
        height: bandRows,
        repeats: 1,
        stitches: body * bandRows,
        note: "the whole round just above the hem rib",
        fromRound: hemRows,
        rowStitches: Array<number>(bandRows).fill(body),
        narrowing: "even",
      },
      {
        area: "sleeve band",
        piece: "sleeve",
        width: cuff,
        height: bandRows,
        repeats: 1,
        stitches: cuff * bandRows,
        note: "the whole round just above the cuff rib, on each sleeve",
        fromRound: cuffRows,
        rowStitches: Array<number>(bandRows).fill(cuff),
        narrowing: "even",
      },
    );
  }

  const pieces: Piece[] = [
    { name: "body", quantity: 1, start: "long-tail", castOn: body, castOnWidthCm: roundTo(body / spc, 0.1), bindOff: 0, stitches: bodyT.total, rounds: bodyT.counts },
    { name: "sleeve", quantity: 2, start: "long-tail", castOn: cuff, castOnWidthCm: roundTo(cuff / spc, 0.1), bindOff: 0, stitches: sleeveT.total, rounds: sleeveT.counts },
    { name: "yoke", quantity: 1, start: "joined", castOn: 0, castOnWidthCm: 0, bindOff: neckSts, stitches: yokeT.total, rounds: yokeT.counts, ...(yokeT.shortRows.length ? { shortRows: yokeT.shortRows } : {}) },
  ];

  const write = (u: UnitWriter): string[] => {
    const lines = [
      `Gauge: ${u.gauge(spec.gauge)}.`,
      `Body: cast on ${body} sts and join to work in the round (finished chest ${u.len(chestFinishedCm)}). Work ${hemRows} rnds (${u.len(hemRows / rpc)}) of ${ribFor(body)}.`,
    ];
    if (spec.style === "bands") lines.push(`Work the body band chart (${body} sts × ${bandRows} rnds, ${u.len(bandRows / rpc)}).`);
    lines.push(
      `Work plain until the body measures ${u.len(bodyRows / rpc)} from the cast-on edge (${bodyRows} rnds in all). Set aside.`,
      `Sleeves (make two): cast on ${cuff} sts and join to work in the round. Work ${cuffRows} rnds (${u.len(cuffRows / rpc)}) of ${ribFor(cuff)}.`,
    );
    if (spec.style === "bands") lines.push(`Work the sleeve band chart (${cuff} sts × ${bandRows} rnds).`);
    if (increases > 0) {
      lines.push(
        `Increase 1 st on each side of the underarm marker ${everyNth(every)} ${increases} times (${upper} sts), then work ${sleeveAfter} rnds plain: ${sleeveRows} rnds, ${u.len(sleeveRows / rpc)} from the cast-on edge.`,
      );
    } else {
      lines.push(`Work plain to ${u.len(sleeveRows / rpc)} from the cast-on edge (${sleeveRows} rnds in all; ${upper} sts).`);
    }
    lines.push(
      `Join: place ${underarm} sts at each underarm of the body and of each sleeve on hold. Knit across back, one sleeve, front and the other sleeve (${join} sts)${yokeStart !== join ? `, ${yokeStart > join ? "increasing" : "decreasing"} ${Math.abs(yokeStart - join)} sts evenly on the first yoke rnd (${yokeStart} sts)` : ""}.`,
    );
    const parts = yokeCounts.slice(1).map((count, i) => {
      const at = bounds[i] + 1;
      return `on yoke rnd ${at} (${u.len(bounds[i] / rpc)} above the join) decrease evenly to ${count} sts`;
    });
    lines.push(
      `Yoke${spec.style === "yoke" ? ", following the yoke charts" : ""}: ${parts.join("; ")}. Work to ${u.len((yokeRows - neckRows) / rpc)} above the join (${yokeRows - neckRows} rnds).`,
    );
    if (shortRows) {
      lines.push(
        `Back-neck short rows (raise the back neck about ${u.len(P.backNeckRaiseCm)}): slip sts without knitting them to the centre back and begin the rnds there. Knit ${shortRows.half}, turn; purl ${shortRows.first}, turn.${shortRows.pairs > 1 ? ` Then ${shortRows.pairs - 1} times: knit to ${shortRows.step} sts before the last turn, turn; purl to ${shortRows.step} sts before the last turn, turn.` : ""} Knit to the centre back (${shortRows.half - (shortRows.pairs - 1) * shortRows.step} sts): ${shortRows.rows} short rows and ${shortRows.stitches} sts in all. Close the gap at each turn on the first neckband rnd.`,
      );
    }
    lines.push(
      `Neckband: work ${neckRows} rnds (${u.len(neckRows / rpc)}) of ${ribFor(neckSts)} on ${neckSts} sts and bind off loosely. Graft the underarm stitches, weave in the ends and block.`,
    );
    return lines;
  };

  const counts: Record<string, number> = {
    body,
    underarmHold: underarm,
    sleeveCastOn: cuff,
    upperArm: upper,
    yokeJoin: join,
    yokeStart,
    yokeDecrease1: yokeCounts[1],
    yokeDecrease2: yokeCounts[2],
    neck: neckSts,
  };
  if (shortRows) {
    counts.backNeckShortRowPairs = shortRows.pairs;
    counts.backNeckShortRowFirst = shortRows.first;
    counts.backNeckShortRowHalf = shortRows.half;
    counts.backNeckShortRowStep = shortRows.step;
    counts.backNeckShortRowStitches = shortRows.stitches;
  }
  const rows: Record<string, number> = {
    hem: hemRows,
    body: bodyRows,
    sleeveCuff: cuffRows,
    sleeveIncreases: increases,
    sleeveIncreaseEvery: every,
    sleeve: sleeveRows,
    yoke: yokeRows,
    yokeDecrease1At: bounds[0] + 1,
    yokeDecrease2At: bounds[1] + 1,
    yokeDecrease3At: bounds[2] + 1,
    neckband: neckRows,
  };
  if (spec.style === "bands") rows.band = bandRows;
  if (shortRows) rows.backNeckShortRows = shortRows.rows;

  return {
    castOn: body,
    counts,
    rows,
    charts,
    pieces,
    finished: {
      chest: toLength(chestFinishedCm),
      upperArm: toLength(upper / spc),
      cuff: toLength(cuff / spc),
      neck: toLength(neckSts / spc),
      bodyLength: toLength(bodyRows / rpc),
      sleeveLength: toLength(sleeveRows / rpc),
      yokeDepth: toLength(yokeRows / rpc),
    },
    derived,
    recipe: { metric: write(METRIC), imperial: write(IMPERIAL) },
    warnings,
  };
}
