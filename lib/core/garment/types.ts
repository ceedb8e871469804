// The garment model: the one description of what is knitted. Every number the studio quotes
// (stitches, yarn, labour, floats, darning route) is read from it. Plain data, no classes.
import type { Chart, PaletteColour } from "../chart/model";
import type { LetteringPlacement } from "../chart/ops/place-lettering";
import type { LabourEstimate } from "../labour/estimate-labour";
import type { PieceFeatures } from "../labour/piece-features";
import type { LabourRates } from "../labour/default-rates";
import type { P80Factors } from "../labour/estimate-labour";
import type { SizingResult } from "../sizing/sizing-result";

/** How an area's in-shape stitches sit in its chart row when the area is narrower than the chart. */
export type Narrowing = "edges" | "sector end" | "even";

/** A named set of stitches on a piece. Chart areas are exactly the size output's `charts[].area`. */
export interface GarmentArea {
  name: string;
  /** the piece's part it lies on ("hand", "thumb", …: a part is one tube knitted in the round) */
  part: string;
  /** true when a chart can be placed on it (named in the size output's charts[]) */
  charted: boolean;
  /** chart size of one repeat: stitches across, rows up (0 for plain areas) */
  width: number;
  height: number;
  /** times the chart is worked around one round (crown sectors), else 1 */
  repeats: number;
  /** round of the part (from 0) where the chart's row 1 is worked */
  fromRound: number;
  /** stitches of one repeat in shape on each chart row, from row 1 */
  rowStitches: number[];
  narrowing: Narrowing;
  /** stitches in shape on one piece, every repeat counted */
  stitches: number;
}

/** A run of one area's stitches inside one round, in knitting order. */
export interface RoundSpan {
  area: string;
  /** which repeat (from 0) */
  repeat: number;
  /** chart row (from 0, from the bottom); -1 for a plain area */
  row: number;
  /** chart column (x from the left, from 0) of each stitch in knitting order; plain areas: -1 each */
  columns: number[];
  /** first column of the part's unrolled frame this span occupies (knitting order, from 0) */
  frameStart: number;
}

export interface GarmentRound {
  /** from 0, in the part */
  index: number;
  /** stitches in the round after its increases or decreases */
  stitches: number;
  /** the count differs from the round before (increases or decreases worked in it) */
  shaping: boolean;
  spans: RoundSpan[];
}

/** One tube knitted in the round: a mitten's hand (cuff to tip), its thumb; a hat; a sleeve … */
export interface GarmentPart {
  name: string;
  /** width of the unrolled frame: every round's stitches laid out on one grid, areas aligned */
  frameWidth: number;
  rounds: GarmentRound[];
}

export interface GarmentPiece {
  /** e.g. "left mitten", "right mitten", "hat", "body", "left sleeve", "yoke" */
  name: string;
  /** always 1: pairs are listed one by one */
  quantity: 1;
  /** the size output's piece(s) it is made of, e.g. ["mitten", "thumb"] */
  from: string[];
  side: "left" | "right" | null;
  /** name of the other piece of its pair */
  pairedWith: string | null;
  /** every stitch knitted in this piece: the sum of its rounds' counts */
  stitches: number;
  thumbs: number;
  castOn: { start: "long-tail" | "picked-up" | "joined"; stitches: number; widthCm: number };
  bindOff: number;
  parts: GarmentPart[];
  areas: GarmentArea[];
}

export interface Garment {
  kind: SizingResult["garment"];
  sizing: SizingResult;
  pieces: GarmentPiece[];
  /** the chart areas (size output's charts[].area) in their order */
  chartAreas: string[];
}

/** A chart placed on an area, as given. */
export interface ChartPlacement {
  area: string;
  chart: Chart;
  /** text layers already set in the chart (as a design stores them), kept readable on a mirrored piece */
  lettering?: LetteringPlacement[];
  /** only this piece (e.g. "right mitten"); by default every piece that has the area */
  piece?: string;
  /** the second piece of a pair knits this chart mirrored left to right (lettering re-set to read forwards) */
  mirror?: boolean;
}

export interface PlaceOptions {
  /** palette keys duplicate-stitched afterwards (every stitch of these colours is darned) */
  darn?: string[];
  /** the maker's pairs for ranges of rounds; a pinned round may hold three colours (the rest are darned) */
  pins?: RoundPinInput[];
  /**
   * Paint in cells the shape does not knit: "refuse" (the default: the editor and a saved design must
   * not lose paint) or "ignore" (the cells are marked in `notKnitted` and never counted: a chart drawn
   * over the whole rectangle of an area, as the core CLI accepts it).
   */
  outsideShape?: "refuse" | "ignore";
}

/** Cells of a placed chart that lie outside its area's shape and hold paint (never knitted, never counted). */
export interface NotKnittedCells {
  area: string;
  chartIndex: number;
  /** painted cells outside the shape (any colour but the chart's first) */
  cells: number;
  /** the first of them, as a knitter reads it */
  first: string;
}

/** Two colours the maker wants knitted in a range of rounds of one part. */
export interface RoundPinInput {
  /** default: every piece */
  piece?: string;
  /** default: the piece's first part (a mitten's hand) */
  part?: string;
  /** rounds of the part, from 1, both included */
  fromRound: number;
  toRound: number;
  /** palette keys */
  pair: [string, string];
}

/** One colour of the garment: charts' palettes joined by key; index 0 is the main colour. */
export type GarmentColour = PaletteColour;

/** A garment with colours on every real stitch. */
export interface PlacedGarment {
  garment: Garment;
  palette: GarmentColour[];
  /** palette indices of darned colours */
  darn: number[];
  /** the maker's pinned pairs, checked against the pieces and the palette */
  pins: RoundPinInput[];
  /** per piece, per part, per round: colour of each stitch in knitting order */
  colours: Uint8Array[][][];
  /** which charts went where, for messages and rendering */
  placed: { piece: string; area: string; chartIndex: number; mirrored: boolean }[];
  /** paint outside the shape that was left out (only with outsideShape: "ignore") */
  notKnitted: NotKnittedCells[];
}

export interface FeatureOptions {
  /** proof rounds of the design (counted on the first piece), default 1 */
  proofRounds?: number;
  rates?: Partial<LabourRates>;
  p80Factors?: Partial<P80Factors>;
  floatLimitStitches?: number;
  floatLimitCm?: number;
  carryLimitCm?: number;
  tailCm?: number;
}

export interface GarmentPieceFeatures extends Required<Pick<PieceFeatures,
  "newDesign" | "proofRounds" | "plainStitches" | "strandedStitches" | "floatCatches" | "shapingRounds" | "thumbs" | "duplicateStitches" | "ends" | "carryCm" | "blocked"
>> {
  label: string;
  /** every stitch is knitted first; darned stitches are also counted here over their underlay */
  darnedStitches: number;
}

export interface PieceReading {
  name: string;
  quantity: 1;
  stitches: number;
  features: GarmentPieceFeatures;
}

/** What is knitted in one round and why. */
export interface RoundReading {
  piece: string;
  part: string;
  /** from 1 */
  round: number;
  stitches: number;
  shaping: boolean;
  /** keys of the knitted colours (one or two) */
  knit: string[];
  /** keys of every colour in the round, knitted or darned (palette order) */
  colours?: string[];
  /** darned stitches in the round, and their colours */
  darned: number;
  /** longest float in stitches, and the catches that keep floats within the limit */
  longestFloat: number;
  catches: number;
  /** said when the pair changes or stitches are darned */
  why?: string;
}

export interface ColourYarnReading {
  key: string;
  name: string;
  hex: string;
  roles: ("knitted" | "darned")[];
  knittedStitches: number;
  darnedStitches: number;
  ends: number;
  /** cm for the whole garment, unrounded parts */
  cm: { knitted: number; floats: number; darned: number; tails: number; carries: number; castOn: number; bindOff: number };
  /** rounded up to the cm; no studio margin */
  totalCm: number;
  metres: number;
  yards: number;
}

export interface YarnReading {
  loopLengthCm: number;
  colours: ColourYarnReading[];
  totals: { metres: number; yards: number };
  sources: string[];
}

export interface GarmentReading {
  pieces: PieceReading[];
  rounds: RoundReading[];
  yarn: YarnReading;
  labour: LabourEstimate;
}
