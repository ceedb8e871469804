// Studio settings: stored as JSON on the studio, always read through this schema so every field
// has a default. Rates are the studio's own (defaults in lib/core/labour are not standards).
import { z } from "zod";
import { defaultRates, type LabourRates } from "@/lib/core/labour/default-rates";
import { p80FactorsSchema } from "@/lib/core/labour/schemas";
import { taxCategoriesSettingSchema, taxDefaultsSchema } from "./tax-settings";

const nonNegative = z.number().min(0, "Use 0 or more.");
const positive = z.number().positive("Use a number above 0.");

export const labourRatesSchema = z.object({
  designBaseMinutes: nonNegative,
  minutesPerProofRound: nonNegative,
  plainStitchesPerMinute: positive,
  strandedStitchesPerMinute: positive,
  minutesPerShapingRound: nonNegative,
  minutesPerThumb: nonNegative,
  secondsPerFloatCatch: nonNegative,
  secondsPerDuplicateStitch: nonNegative,
  minutesPerEnd: nonNegative,
  secondsPerCarryCm: nonNegative,
  blockingMinutesPerPiece: nonNegative,
  dryingHoursPerPiece: nonNegative,
  finishingMinutesPerPiece: nonNegative,
}) satisfies z.ZodType<LabourRates>;

export const studioSettingsSchema = z.object({
  hourlyRateMinor: z.number().int().min(0).default(2200),
  /** which labour figure prices a quote; P80 unless the studio chooses (settings and every quote say which) */
  pricePolicy: z.enum(["p50", "p80"]).default("p80"),
  /** the standard rate (with taxCategories: kept equal to the standard category's rate) */
  taxRatePercent: z.number().min(0).max(100).default(0),
  /** the studio's tax categories; empty: one rate (taxRatePercent) on every line */
  taxCategories: taxCategoriesSettingSchema.default([]),
  /** the category of each kind of quote line unless the line names its own */
  taxDefaults: taxDefaultsSchema.prefault({}),
  pricesIncludeTax: z.boolean().default(true),
  depositPercent: z.number().min(0).max(100).default(50),
  designFeeMinor: z.number().int().min(0).default(0),
  quoteValidDays: z.number().int().min(1).max(365).default(30),
  /** duplicate-stitch carry limit on the wrong side, cm (common practice ~2.5 cm) */
  carryLimitCm: z.number().positive().max(20).default(2.5),
  floatLimitStitches: z.number().int().positive().max(50).default(5),
  floatLimitCm: z.number().positive().max(20).default(2.5),
  rates: labourRatesSchema.default({ ...defaultRates }),
  /** P80 ÷ P50 per stage from an accepted calibration; a stage left out uses the default ×1.25 */
  p80Factors: p80FactorsSchema.default({}),
  /** cancellation: share of the deposit refunded before knitting starts (percent) */
  depositRefundBeforeKnittingPercent: z.number().min(0).max(100).default(100),
});

export type StudioSettings = z.infer<typeof studioSettingsSchema>;

/** Reads stored settings, filling defaults; a stored value that no longer validates falls back to its default. */
export function readStudioSettings(stored: unknown): StudioSettings {
  const parsed = studioSettingsSchema.safeParse(stored ?? {});
  if (parsed.success) return parsed.data;
  const clean: Record<string, unknown> = { ...(stored as Record<string, unknown>) };
  for (const issue of parsed.error.issues) delete clean[String(issue.path[0])];
  return studioSettingsSchema.parse(clean);
}
