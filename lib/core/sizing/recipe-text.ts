// Recipe wording shared by the garment templates: one function writes a piece in either unit system.
import type { Gauge } from "../chart/model";
import { CM_PER_IN, formatCm, formatIn, roundTo } from "./units";

export interface UnitWriter {
  system: "metric" | "imperial";
  len(cm: number): string;
  gauge(g: Gauge): string;
}

function sts(n: number): string {
  return String(roundTo(n, 0.1));
}

export const METRIC: UnitWriter = {
  system: "metric",
  len: formatCm,
  gauge: (g) => `${sts(g.stitchesPer10cm)} sts and ${sts(g.rowsPer10cm)} rnds = 10 cm in stockinette`,
};

// 4 in is 10.16 cm: the per-4-in counts are the per-10-cm ones × 1.016, shown to 0.1 stitch.
export const IMPERIAL: UnitWriter = {
  system: "imperial",
  len: formatIn,
  gauge: (g) =>
    `${sts((g.stitchesPer10cm * 4 * CM_PER_IN) / 10)} sts and ${sts((g.rowsPer10cm * 4 * CM_PER_IN) / 10)} rnds = 4 in in stockinette`,
};

/** A rib that closes neatly in the round on n stitches. */
export function ribFor(n: number): string {
  if (n % 4 === 0) return "k2, p2 rib";
  if (n % 2 === 0) return "k1, p1 rib (a k2, p2 rib needs a multiple of 4 sts to close)";
  return "k1, p1 rib, ending k1 (two knit stitches meet at the start of the round)";
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** "every 3rd rnd": ordinal wording for intervals. */
export function everyNth(n: number): string {
  if (n === 1) return "every rnd";
  if (n === 2) return "every other rnd";
  const suffix = n % 10 === 1 && n % 100 !== 11 ? "st" : n % 10 === 2 && n % 100 !== 12 ? "nd" : n % 10 === 3 && n % 100 !== 13 ? "rd" : "th";
  return `every ${n}${suffix} rnd`;
}
