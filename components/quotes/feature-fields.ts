// The labour features a maker types for a piece, with their labels: in the quote builder and on a
// piece after set-up.
import type { PieceFeatures } from "@/lib/core/labour/piece-features";

export const FEATURE_FIELDS: { key: Exclude<keyof PieceFeatures, "label" | "newDesign" | "blocked" | "dryingHours">; label: string; step?: string }[] = [
  { key: "proofRounds", label: "Proof rounds" },
  { key: "plainStitches", label: "Plain stitches" },
  { key: "strandedStitches", label: "Stranded stitches" },
  { key: "floatCatches", label: "Float catches" },
  { key: "shapingRounds", label: "Shaping rounds" },
  { key: "thumbs", label: "Thumbs" },
  { key: "duplicateStitches", label: "Duplicate stitches" },
  { key: "ends", label: "Ends to weave in" },
  { key: "carryCm", label: "Carry (cm)", step: "0.1" },
];
