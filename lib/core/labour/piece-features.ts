// The narrow, plain-number description of one piece that the labour model needs.
// The chart, colourwork and sizing parts of the app map their own outputs onto these fields.

export interface PieceFeatures {
  /** shown in per-piece breakdowns, e.g. "left mitten" */
  label?: string;
  /** false for a piece that reuses another piece's design (the second mitten of a pair) */
  newDesign?: boolean;
  /** proof rounds sent to the client for this piece's design */
  proofRounds?: number;
  /** stitches knitted in one colour */
  plainStitches?: number;
  /** stitches knitted in two-colour stranded work */
  strandedStitches?: number;
  /** floats caught (trapped) on the wrong side while knitting */
  floatCatches?: number;
  /** rounds or rows with increases or decreases */
  shapingRounds?: number;
  /** thumbs (or thumb gussets) knitted */
  thumbs?: number;
  /** stitches embroidered afterwards by duplicate stitch */
  duplicateStitches?: number;
  /** ends woven in after embroidery */
  ends?: number;
  /** embroidery yarn carried through the wrong side between areas, in cm */
  carryCm?: number;
  /** false when the piece is not wet-blocked */
  blocked?: boolean;
  /** calendar hours this piece needs to dry, overriding the studio default */
  dryingHours?: number;
}

/** Every field filled in, so the model never meets an undefined. */
export type FilledPieceFeatures = Required<Omit<PieceFeatures, "label" | "dryingHours">> &
  Pick<PieceFeatures, "label" | "dryingHours">;

/** The numeric count fields, in the order explanations list them. */
export const COUNT_FEATURES = [
  "proofRounds",
  "plainStitches",
  "strandedStitches",
  "floatCatches",
  "shapingRounds",
  "thumbs",
  "duplicateStitches",
  "ends",
  "carryCm",
] as const;

export type CountFeature = (typeof COUNT_FEATURES)[number];

export function fillPieceFeatures(piece: PieceFeatures): FilledPieceFeatures {
  return {
    label: piece.label,
    newDesign: piece.newDesign ?? true,
    proofRounds: piece.proofRounds ?? 0,
    plainStitches: piece.plainStitches ?? 0,
    strandedStitches: piece.strandedStitches ?? 0,
    floatCatches: piece.floatCatches ?? 0,
    shapingRounds: piece.shapingRounds ?? 0,
    thumbs: piece.thumbs ?? 0,
    duplicateStitches: piece.duplicateStitches ?? 0,
    ends: piece.ends ?? 0,
    carryCm: piece.carryCm ?? 0,
    blocked: piece.blocked ?? true,
    dryingHours: piece.dryingHours,
  };
}

/** Reject negative or non-finite counts with a message naming the field. */
export function assertPieceFeatures(piece: PieceFeatures, path: string): void {
  for (const key of [...COUNT_FEATURES, "dryingHours"] as const) {
    const v = piece[key];
    if (v === undefined) continue;
    if (typeof v !== "number" || !Number.isFinite(v) || v < 0) {
      throw new RangeError(`${path}.${key} must be a number ≥ 0 (got ${String(v)})`);
    }
  }
}
