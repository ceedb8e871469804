// What every garment template returns.
import type { Gauge } from "../chart/model";
import type { Length } from "./units";

export type GarmentKind = "mitten" | "hat" | "pullover";

/** A decorated area and the chart a design for it needs. */
export interface ChartArea {
  area: string;
  /** the piece it sits on (see `pieces`) */
  piece: string;
  /** stitches across (one repeat of a sector for a crown) */
  width: number;
  /** rows (rounds) high */
  height: number;
  /** how many times the chart is worked around one piece (crown sectors), else 1 */
  repeats: number;
  /** stitches the area holds on one piece, shaping included: what yarn estimates subtract */
  stitches: number;
  note: string;
  /** round of its piece (from 0, from the cast-on or pick-up) where the chart's row 1 is worked */
  fromRound?: number;
  /** stitches of one repeat in shape on each chart row, from row 1 (fewer than width where it narrows) */
  rowStitches?: number[];
  /** where a narrower row's stitches sit in the chart: centred (decreases at both edges), at the
   * sector's start (decreases at its end in knitting order), or spread evenly */
  narrowing?: "edges" | "sector end" | "even";
}

/** One knitted piece, for yarn estimates: its stitch count integrates every round's count. */
export interface Piece {
  name: string;
  /** how many are knitted (2 for a pair of mittens, 2 sleeves) */
  quantity: number;
  /** how it starts: long-tail cast-on, stitches picked up, or joined from other pieces */
  start: "long-tail" | "picked-up" | "joined";
  castOn: number;
  castOnWidthCm: number;
  /** stitches bound off at the end (0 when drawn together or grafted) */
  bindOff: number;
  /** every stitch knitted in one piece */
  stitches: number;
  /** stitches of each round after its shaping, from the first round; with `shortRows` they sum to `stitches` */
  rounds?: number[];
  /** rows worked back and forth over part of the round (back-neck short rows): each row's stitches, after which round */
  shortRows?: { afterRound: number; stitches: number[] }[];
}

export interface SizingResult {
  garment: GarmentKind;
  /** the standard size used, when one was picked */
  size: string | null;
  /** hats: beanie | folded-brim | tall; pullovers: yoke | bands (absent for mittens) */
  style?: string;
  /** main circumference count: hand, head or chest */
  castOn: number;
  counts: Record<string, number>;
  rows: Record<string, number>;
  charts: ChartArea[];
  pieces: Piece[];
  /** measurements used after defaults, and where each came from */
  measurements: Record<string, Length & { from: "given" | "standard size" | "derived" }>;
  ease: Length & { percent: number | null; from: string };
  gauge: Gauge & { stitchesPer4in: number; rowsPer4in: number };
  /** finished sizes at the stitch counts chosen */
  finished: Record<string, Length>;
  recipe: { metric: string[]; imperial: string[] };
  warnings: string[];
  /** sources of the tables and rules used */
  sources: string[];
}
