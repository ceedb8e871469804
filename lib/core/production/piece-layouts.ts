// How a commission splits into pieces for production, with starting features for the labour model.
// The feature figures are our own starting guesses for a typical adult piece at a firm stranded
// gauge (not published values); the maker replaces them when the design gives real counts.
import type { LabourRates } from "../labour/default-rates";
import { estimateLabour } from "../labour/estimate-labour";
import type { PieceFeatures } from "../labour/piece-features";

export type Garment = "mittens" | "hat" | "pullover";

export interface PieceLayout {
  id: string;
  label: string;
  pieces: { name: string; features: PieceFeatures }[];
}

const MITTEN: PieceFeatures = {
  plainStitches: 2500,
  strandedStitches: 3700,
  floatCatches: 300,
  shapingRounds: 15,
  thumbs: 1,
  duplicateStitches: 80,
  ends: 8,
  carryCm: 40,
  blocked: true,
};
const HAT: PieceFeatures = {
  plainStitches: 6500,
  strandedStitches: 3500,
  floatCatches: 280,
  shapingRounds: 12,
  duplicateStitches: 120,
  ends: 10,
  carryCm: 60,
  blocked: true,
};
const BODY: PieceFeatures = {
  plainStitches: 38000,
  strandedStitches: 8000,
  floatCatches: 640,
  shapingRounds: 20,
  duplicateStitches: 150,
  ends: 14,
  carryCm: 80,
  blocked: true,
};
const SLEEVES: PieceFeatures = { plainStitches: 15000, strandedStitches: 1500, floatCatches: 120, shapingRounds: 30, ends: 6, blocked: true };

function sum(a: PieceFeatures, b: PieceFeatures): PieceFeatures {
  const out: PieceFeatures = { blocked: true };
  for (const k of ["plainStitches", "strandedStitches", "floatCatches", "shapingRounds", "thumbs", "duplicateStitches", "ends", "carryCm"] as const) {
    const v = (a[k] ?? 0) + (b[k] ?? 0);
    if (v > 0) out[k] = v;
  }
  return out;
}

export const PIECE_LAYOUTS: Record<Garment, PieceLayout[]> = {
  mittens: [
    {
      id: "pair",
      label: "A pair: left and right mitten",
      pieces: [
        { name: "Left mitten", features: { ...MITTEN, newDesign: true } },
        { name: "Right mitten", features: { ...MITTEN, newDesign: false } },
      ],
    },
    { id: "single", label: "One mitten", pieces: [{ name: "Mitten", features: { ...MITTEN } }] },
  ],
  hat: [{ id: "one", label: "One piece", pieces: [{ name: "Hat", features: { ...HAT } }] }],
  pullover: [
    { id: "body_sleeves", label: "Body and sleeves as two pieces", pieces: [
      { name: "Body and yoke", features: { ...BODY } },
      { name: "Sleeves", features: { ...SLEEVES, newDesign: false } },
    ] },
    { id: "one", label: "One piece (knitted in one)", pieces: [{ name: "Pullover", features: sum(BODY, SLEEVES) }] },
  ],
};

export function getPieceLayout(garment: Garment, layoutId?: string): PieceLayout {
  const layouts = PIECE_LAYOUTS[garment];
  const found = layoutId ? layouts.find((l) => l.id === layoutId) : layouts[0];
  if (!found) throw new RangeError(`"${layoutId}" is not a way to split a ${garment} commission (use ${layouts.map((l) => l.id).join(", ")})`);
  return found;
}

/** Stages a piece's own time is estimated and logged against (design is commission-level work). */
export const PIECE_WORK_STAGES = ["knitting", "embroidery", "blocking", "finishing"] as const;

export type PieceEstimateMap = Record<string, { p50: number; p80: number }>;

/** Per-stage P50/P80 minutes of one piece at the given rates, and its drying hours. */
export function estimatePiece(
  features: PieceFeatures,
  rates?: Partial<LabourRates>,
): { estimate: PieceEstimateMap; dryingHours: number } {
  const e = estimateLabour({ pieces: [features], rates });
  const estimate: PieceEstimateMap = {};
  for (const s of PIECE_WORK_STAGES) estimate[s] = { p50: e.stages[s].p50Minutes, p80: e.stages[s].p80Minutes };
  return { estimate, dryingHours: features.blocked === false ? 0 : Math.round(e.dryingHours) };
}
