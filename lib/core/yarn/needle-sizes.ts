// Needle sizes: metric with US and old UK equivalents where the published conversion tables agree.

export interface NeedleSize {
  mm: number;
  /** US size, or null where no agreed equivalent exists */
  us: string | null;
  /** old UK (imperial) size, or null where none exists */
  ukOld: string | null;
}

// Source: published needle conversion tables, where they agree. 2.5 mm and 3.0 mm have no agreed
// US size; 2.5 mm and 3.5 mm have no old UK size; above 10 mm the tables disagree, so none is given.
export const NEEDLE_SIZES = {
  source: "published knitting needle conversion tables (values on which they agree)",
  sizes: [
    { mm: 2, us: "0", ukOld: "14" },
    { mm: 2.25, us: "1", ukOld: "13" },
    { mm: 2.5, us: null, ukOld: null },
    { mm: 2.75, us: "2", ukOld: "12" },
    { mm: 3, us: null, ukOld: "11" },
    { mm: 3.25, us: "3", ukOld: "10" },
    { mm: 3.5, us: "4", ukOld: null },
    { mm: 3.75, us: "5", ukOld: "9" },
    { mm: 4, us: "6", ukOld: "8" },
    { mm: 4.5, us: "7", ukOld: "7" },
    { mm: 5, us: "8", ukOld: "6" },
    { mm: 5.5, us: "9", ukOld: "5" },
    { mm: 6, us: "10", ukOld: "4" },
    { mm: 6.5, us: "10½", ukOld: "3" },
    { mm: 7, us: null, ukOld: "2" },
    { mm: 7.5, us: null, ukOld: "1" },
    { mm: 8, us: "11", ukOld: "0" },
    { mm: 9, us: "13", ukOld: "00" },
    { mm: 10, us: "15", ukOld: "000" },
  ] satisfies readonly NeedleSize[],
} as const;

export const NO_EQUIVALENT = "no equivalent";

export interface NeedleLookup {
  mm: number;
  us: string;
  ukOld: string;
  /** false when the size is not in the table at all */
  known: boolean;
  note: string | null;
}

/** A needle size in mm with its US and old UK names, or "no equivalent" where none is agreed. */
export function getNeedleSize(mm: number): NeedleLookup {
  if (!Number.isFinite(mm) || mm <= 0) throw new Error(`needle size must be more than 0 mm (got ${String(mm)})`);
  const found = NEEDLE_SIZES.sizes.find((s) => Math.abs(s.mm - mm) < 0.001);
  if (found) {
    const missing = [found.us === null ? "US" : null, found.ukOld === null ? "old UK" : null].filter(Boolean);
    return {
      mm,
      us: found.us ?? NO_EQUIVALENT,
      ukOld: found.ukOld ?? NO_EQUIVALENT,
      known: true,
      note: missing.length ? `no agreed ${missing.join(" or ")} size for ${mm} mm` : null,
    };
  }
  const note =
    mm > 10
      ? `conversion tables disagree above 10 mm; use the metric size`
      : `${mm} mm is not a size in the conversion tables; use the metric size`;
  return { mm, us: NO_EQUIVALENT, ukOld: NO_EQUIVALENT, known: false, note };
}

/** The metric size for a US size name ("8", "10½" or "10.5"), or null where none is agreed. */
export function getNeedleMmFromUs(us: string): number | null {
  const name = us.trim().replace(/\.5$/, "½").replace(/^US\s*/i, "");
  return NEEDLE_SIZES.sizes.find((s) => s.us === name)?.mm ?? null;
}
