// Zod schemas for labour inputs, shared by forms, route handlers and the core CLI.
import { z } from "zod";
import { RATE_KEYS, type LabourRates } from "./default-rates";
import { STAGES, type Stage } from "./stages";

// Messages leave the field name out: describeIssues puts the path in front of each.
const count = () => z.number({ error: "must be a number" }).finite().nonnegative({ error: "must not be negative" });
const wholeCount = () => count().int({ error: "must be a whole number" });

export const pieceFeaturesSchema = z.strictObject({
  label: z.string().max(120).optional(),
  newDesign: z.boolean().optional(),
  proofRounds: wholeCount().optional(),
  plainStitches: wholeCount().optional(),
  strandedStitches: wholeCount().optional(),
  floatCatches: wholeCount().optional(),
  shapingRounds: wholeCount().optional(),
  thumbs: wholeCount().optional(),
  duplicateStitches: wholeCount().optional(),
  ends: wholeCount().optional(),
  carryCm: count().optional(),
  blocked: z.boolean().optional(),
  dryingHours: count().optional(),
});

const rateShape = Object.fromEntries(
  RATE_KEYS.map((key) => [
    key,
    z
      .number({ error: "must be a number" })
      .finite()
      .nonnegative({ error: "a rate must not be negative" })
      .optional(),
  ]),
) as Record<keyof LabourRates, z.ZodOptional<z.ZodNumber>>;

export const partialRatesSchema = z
  .strictObject(rateShape)
  .refine((r) => r.plainStitchesPerMinute !== 0, {
    error: "must be greater than 0 (stitches per minute)",
    path: ["plainStitchesPerMinute"],
  })
  .refine((r) => r.strandedStitchesPerMinute !== 0, {
    error: "must be greater than 0 (stitches per minute)",
    path: ["strandedStitchesPerMinute"],
  });

const stageShape = <T extends z.ZodType>(value: T) =>
  Object.fromEntries(STAGES.map((s) => [s, value.optional()])) as Record<Stage, z.ZodOptional<T>>;

export const p80FactorsSchema = z.strictObject(
  stageShape(z.number().finite().min(1, { error: "a P80 factor must be at least 1 (P80 is never below P50)" })),
);

export const loggedMinutesSchema = z.strictObject(stageShape(count()));

export const estimateInputSchema = z.strictObject({
  pieces: z.array(pieceFeaturesSchema).min(1, { error: "give at least one piece" }),
  rates: partialRatesSchema.optional(),
  p80Factors: p80FactorsSchema.optional(),
});

export const loggedPieceSchema = z.strictObject({
  features: pieceFeaturesSchema,
  loggedMinutes: loggedMinutesSchema,
});

export const calibrateInputSchema = z.strictObject({
  pieces: z.array(loggedPieceSchema).min(1, { error: "give at least one finished piece" }),
  baseRates: partialRatesSchema.optional(),
  weighting: z.enum(["huber", "tukey"]).optional(),
  minPieces: z.number().int().min(1).optional(),
  holdBackEvery: z.number().int().min(2, { error: "must be at least 2" }).optional(),
});
