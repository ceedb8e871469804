// How a commission splits into pieces for production: the garment's own pieces (a mitten pair is
// a left and a right mitten, each with its thumb; a pullover's body, sleeves and yoke), with the
// features the garment reads for each (lib/core/design-garment). No typical figures: the pieces
// and their counts are the ones the quote priced.
import type { LabourRates } from "../labour/default-rates";
import { estimateLabour, type P80Factors } from "../labour/estimate-labour";
import type { PieceFeatures } from "../labour/piece-features";

export type Garment = "mittens" | "hat" | "pullover";

export interface PieceLayout {
  id: string;
  label: string;
  pieces: { name: string; features: PieceFeatures }[];
}

const SUMMED = ["plainStitches", "strandedStitches", "floatCatches", "shapingRounds", "thumbs", "duplicateStitches", "ends", "carryCm", "proofRounds"] as const;

/** Several pieces tracked as one: their counts added, a new design when any is, blocked once. */
export function joinPieces(name: string, pieces: PieceFeatures[]): PieceFeatures {
  const out: PieceFeatures = { label: name, newDesign: pieces.some((p) => p.newDesign ?? true), blocked: true };
  for (const k of SUMMED) out[k] = pieces.reduce((s, p) => s + (p[k] ?? 0), 0);
  return out;
}

/**
 * The ways a commission's garment can be tracked on the board: each of the garment's pieces on its
 * own (always first), and for a pullover also one piece knitted in one (its pieces' counts added).
 */
export function pieceLayouts(garment: Garment, pieces: PieceFeatures[]): PieceLayout[] {
  const named = pieces.map((f, i) => ({ name: capitalise(f.label ?? `Piece ${i + 1}`), features: f }));
  const layouts: PieceLayout[] = [{ id: "pieces", label: `The garment's pieces: ${named.map((p) => p.name.toLowerCase()).join(", ")}`, pieces: named }];
  if (garment === "pullover" && named.length > 1) {
    layouts.push({ id: "one", label: "One piece (knitted in one)", pieces: [{ name: "Pullover", features: joinPieces("Pullover", pieces) }] });
  }
  return layouts;
}

const capitalise = (s: string) => (s ? s.charAt(0).toUpperCase() + s.slice(1) : s);

/** Ids stored or posted before the layouts came from the garment, read as today's. */
const EARLIER_IDS: Record<string, string> = { pair: "pieces", body_sleeves: "pieces" };

export function getPieceLayout(garment: Garment, pieces: PieceFeatures[], layoutId?: string): PieceLayout {
  const layouts = pieceLayouts(garment, pieces);
  const id = layoutId === undefined ? undefined : (EARLIER_IDS[layoutId] ?? (layoutId === "one" && garment !== "pullover" && pieces.length === 1 ? "pieces" : layoutId));
  const found = id ? layouts.find((l) => l.id === id) : layouts[0];
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
  p80Factors?: Partial<P80Factors>,
): { estimate: PieceEstimateMap; dryingHours: number } {
  const e = estimateLabour({ pieces: [features], rates, p80Factors });
  const estimate: PieceEstimateMap = {};
  for (const s of PIECE_WORK_STAGES) estimate[s] = { p50: e.stages[s].p50Minutes, p80: e.stages[s].p80Minutes };
  return { estimate, dryingHours: features.blocked === false ? 0 : Math.round(e.dryingHours) };
}
