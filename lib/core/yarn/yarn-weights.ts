// The Standard Yarn Weight System: categories 0–7 with their stockinette gauge and needle ranges.

export interface YarnWeight {
  category: number;
  name: string;
  typicalYarns: string[];
  /** stitches per 10 cm; the council publishes the same numbers per 4 in ("4 in / 10 cm"), so a gauge
   * counted per 4 in is compared with them as they stand, not converted; null = open end */
  stitchesPer10cm: { min: number | null; max: number | null };
  needleMm: { min: number | null; max: number | null };
  needleUs: { min: string | null; max: string | null };
}

// Source: Craft Yarn Council, "Standard Yarn Weight System", the edition with category 7 (Jumbo,
// added 2015). Older editions had category 6 at 6–11 sts and no category 7; this table pins the
// current one. The council marks the table "guidelines only".
export const YARN_WEIGHTS = {
  source: "Craft Yarn Council, Standard Yarn Weight System (edition with category 7 Jumbo, added 2015); guidelines only",
  categories: [
    { category: 0, name: "Lace", typicalYarns: ["fingering", "10-count crochet thread"], stitchesPer10cm: { min: 33, max: 40 }, needleMm: { min: 1.5, max: 2.25 }, needleUs: { min: "000", max: "1" } },
    { category: 1, name: "Super Fine", typicalYarns: ["sock", "fingering", "baby"], stitchesPer10cm: { min: 27, max: 32 }, needleMm: { min: 2.25, max: 3.25 }, needleUs: { min: "1", max: "3" } },
    { category: 2, name: "Fine", typicalYarns: ["sport", "baby"], stitchesPer10cm: { min: 23, max: 26 }, needleMm: { min: 3.25, max: 3.75 }, needleUs: { min: "3", max: "5" } },
    { category: 3, name: "Light", typicalYarns: ["DK", "light worsted"], stitchesPer10cm: { min: 21, max: 24 }, needleMm: { min: 3.75, max: 4.5 }, needleUs: { min: "5", max: "7" } },
    { category: 4, name: "Medium", typicalYarns: ["worsted", "afghan", "aran"], stitchesPer10cm: { min: 16, max: 20 }, needleMm: { min: 4.5, max: 5.5 }, needleUs: { min: "7", max: "9" } },
    { category: 5, name: "Bulky", typicalYarns: ["chunky", "craft", "rug"], stitchesPer10cm: { min: 12, max: 15 }, needleMm: { min: 5.5, max: 8 }, needleUs: { min: "9", max: "11" } },
    { category: 6, name: "Super Bulky", typicalYarns: ["super bulky", "roving"], stitchesPer10cm: { min: 7, max: 11 }, needleMm: { min: 8, max: 12.75 }, needleUs: { min: "11", max: "17" } },
    { category: 7, name: "Jumbo", typicalYarns: ["jumbo", "roving"], stitchesPer10cm: { min: null, max: 6 }, needleMm: { min: 12.75, max: null }, needleUs: { min: "17", max: null } },
  ] satisfies readonly YarnWeight[],
} as const;

export function getYarnWeight(category: number): YarnWeight {
  const found = YARN_WEIGHTS.categories.find((w) => w.category === category);
  if (!found) throw new Error(`yarn weight category must be 0–7 (got ${category})`);
  return found;
}

/** The middle of a category's gauge range, used as its typical gauge (open ends use their bound). */
export function getTypicalStitchesPer10cm(category: number): number {
  const { min, max } = getYarnWeight(category).stitchesPer10cm;
  if (min !== null && max !== null) return (min + max) / 2;
  return (min ?? max) as number;
}

function rangeText(r: { min: number | null; max: number | null }): string {
  if (r.min === null) return `${r.max} or fewer`;
  if (r.max === null) return `${r.min} or more`;
  return `${r.min}–${r.max}`;
}

export interface GaugeCheck {
  category: number;
  name: string;
  rangeText: string;
  within: boolean;
  /** "firmer": more stitches per 10 cm than the range; "looser": fewer */
  direction: "firmer" | "looser" | null;
  /** a note for the person, never a refusal; null when within the range */
  message: string | null;
}

/**
 * Compares a gauge with its yarn category's range. Outside the range is a note, not an error:
 * a firm gauge for mittens is normal (common practice: knitted firmly for warmth and wear).
 * The council publishes each range "per 4 in / 10 cm" with one set of numbers, so a gauge counted
 * per 4 in is compared with the range in its own unit (`per` "4in"): converting it first (16 per 4 in
 * = 15.75 per 10 cm) would put a gauge at the published bound outside it. Bounds are inclusive.
 */
export function checkGauge(
  category: number,
  stitches: number,
  garment?: "mitten" | "hat" | "pullover",
  per: "10cm" | "4in" = "10cm",
): GaugeCheck {
  const w = getYarnWeight(category);
  if (!Number.isFinite(stitches) || stitches <= 0) {
    throw new Error(`stitches per ${per === "4in" ? "4 in" : "10 cm"} must be more than 0 (got ${String(stitches)})`);
  }
  const unit = per === "4in" ? "4 in" : "10 cm";
  const range = rangeText(w.stitchesPer10cm);
  const { min, max } = w.stitchesPer10cm;
  const base = { category, name: w.name, rangeText: range };
  const label = `${Math.round(stitches * 100) / 100} sts per ${unit}`;
  const usual = `the usual range for category ${category} ${w.name} (${range} sts per ${unit}; ${YARN_WEIGHTS.source})`;
  // A hair of tolerance so a count given as a fraction (a swatch, per inch × 4) is not tripped by binary arithmetic.
  const EPS = 1e-9;
  if (max !== null && stitches > max + EPS) {
    const message =
      garment === "mitten"
        ? `${label} is firmer than ${usual}. That is normal for mittens, which are knitted firmly for warmth and wear; check the fabric still bends easily.`
        : `${label} is firmer than ${usual}: the fabric will be dense and stiff and take more yarn; a thinner yarn or larger needles would be usual.`;
    return { ...base, within: false, direction: "firmer", message };
  }
  if (min !== null && stitches < min - EPS) {
    return {
      ...base,
      within: false,
      direction: "looser",
      message: `${label} is looser than ${usual}: the fabric will be open, wear faster, and floats snag more easily; smaller needles would be usual.`,
    };
  }
  return { ...base, within: true, direction: null, message: null };
}
