// Ease: how much larger (or, negative, smaller) the finished garment is than the body.
import { SizingError } from "./sizing-error";
import { inToCm, roundTo } from "./units";

export type EaseCategoryKey = "very-close" | "close" | "standard" | "loose" | "oversized";

export interface EaseCategory {
  key: EaseCategoryKey;
  label: string;
  /** range added to the body measurement; max null = "or more" */
  rangeCm: { min: number | null; max: number | null };
  rangeIn: { min: number | null; max: number | null };
  /** what sizing uses when a person picks the category: the middle, or the bound given */
  defaultCm: number;
}

// Source: Craft Yarn Council, "Standards & Guidelines for Crochet and Knitting", body measurements
// and ease (wording from memory). The council's ranges are for body garments (chest/bust).
// Our default for a category is the middle of its range; the open-ended ones use their one bound.
export const EASE_CATEGORIES = {
  source: "Craft Yarn Council, Standards & Guidelines: ease allowances for body garments (wording from memory)",
  categories: [
    { key: "very-close", label: "Very close-fitting", rangeCm: { min: null, max: 0 }, rangeIn: { min: null, max: 0 }, defaultCm: 0 },
    { key: "close", label: "Close-fitting", rangeCm: { min: 2.5, max: 5 }, rangeIn: { min: 1, max: 2 }, defaultCm: 3.8 },
    { key: "standard", label: "Standard-fitting", rangeCm: { min: 5, max: 10 }, rangeIn: { min: 2, max: 4 }, defaultCm: 7.5 },
    { key: "loose", label: "Loose-fitting", rangeCm: { min: 10, max: 15 }, rangeIn: { min: 4, max: 6 }, defaultCm: 12.5 },
    { key: "oversized", label: "Oversized", rangeCm: { min: 15, max: null }, rangeIn: { min: 6, max: null }, defaultCm: 15 },
  ] satisfies readonly EaseCategory[],
} as const;

export const EASE_CATEGORY_KEYS = EASE_CATEGORIES.categories.map((c) => c.key) as EaseCategoryKey[];

export function getEaseCategory(key: EaseCategoryKey): EaseCategory {
  const found = EASE_CATEGORIES.categories.find((c) => c.key === key);
  if (!found) throw new Error(`unknown ease category ${key}`);
  return found;
}

// Defaults per garment when no ease is given.
export const DEFAULT_EASE = {
  // Hats: about 10 % negative ease (common practice; a knitting-technique author's article:
  // a 56 cm / 22 in head → a 50.5 cm / 19.8 in hat).
  hat: { percent: -10, source: "common practice: hats are knitted about 10 % smaller than the head" },
  // Mittens: a little positive ease over the knuckles so the hand can close (memory, common practice).
  mitten: { cm: 1.5, source: "common practice (memory): mittens about 1–2 cm larger than the hand around the knuckles" },
  // Pullovers: the council's standard fit.
  pullover: { category: "standard" as EaseCategoryKey, source: EASE_CATEGORIES.source },
} as const;

export interface EaseInput {
  easeCm?: number;
  easeIn?: number;
  easePercent?: number;
  easeCategory?: EaseCategoryKey;
}

export interface ResolvedEase {
  /** cm added to the body measurement (negative: smaller) */
  cm: number;
  percent: number | null;
  from: string;
  warnings: string[];
}

/** Finished size must stay within these fractions of the body (our own bounds: beyond is a slip). */
const FIT_LIMITS = { min: 0.6, max: 2 };

/** Ease for one garment from whichever form was given (one at most), or the garment's default. */
export function resolveEase(input: EaseInput, garment: "mitten" | "hat" | "pullover", bodyCm: number): ResolvedEase {
  const given = (["easeCm", "easeIn", "easePercent", "easeCategory"] as const).filter((k) => input[k] !== undefined);
  if (given.length > 1) throw new SizingError(given[1], `give the ease one way only (got ${given.join(" and ")})`);
  const warnings: string[] = [];
  let cm: number;
  let percent: number | null = null;
  let from: string;
  if (input.easeCm !== undefined) {
    cm = input.easeCm;
    from = "given";
  } else if (input.easeIn !== undefined) {
    cm = inToCm(input.easeIn);
    from = "given";
  } else if (input.easePercent !== undefined) {
    percent = input.easePercent;
    cm = (bodyCm * percent) / 100;
    from = "given";
  } else if (input.easeCategory !== undefined) {
    const cat = getEaseCategory(input.easeCategory);
    cm = cat.defaultCm;
    from = `${cat.label} (${EASE_CATEGORIES.source})`;
    if (garment !== "pullover") {
      warnings.push(
        `ease categories are defined for body garments; ${garment === "hat" ? "hats are usually knitted about 10 % smaller than the head" : "mittens usually take 1–2 cm of ease"}`,
      );
    }
  } else if (garment === "hat") {
    percent = DEFAULT_EASE.hat.percent;
    cm = (bodyCm * percent) / 100;
    from = DEFAULT_EASE.hat.source;
  } else if (garment === "mitten") {
    cm = DEFAULT_EASE.mitten.cm;
    from = DEFAULT_EASE.mitten.source;
  } else {
    const cat = getEaseCategory(DEFAULT_EASE.pullover.category);
    cm = cat.defaultCm;
    from = `${cat.label} (${EASE_CATEGORIES.source})`;
  }
  if (!Number.isFinite(cm)) throw new SizingError(given[0] ?? "ease", "must be a number");
  const fit = (bodyCm + cm) / bodyCm;
  if (fit < FIT_LIMITS.min || fit > FIT_LIMITS.max) {
    const field = given[0] ?? "ease";
    throw new SizingError(
      field,
      `${roundTo(cm, 0.1)} cm of ease on a ${roundTo(bodyCm, 0.1)} cm measurement gives a ${roundTo(bodyCm + cm, 0.1)} cm garment; keep the finished size between ${FIT_LIMITS.min * 100} % and ${FIT_LIMITS.max * 100} % of the body`,
    );
  }
  return { cm, percent, from, warnings };
}
