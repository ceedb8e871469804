// Quote drafts (the builder's JSON body), acceptance and change requests from the portal.
import { z } from "zod";
import { calendarDate, safeString } from "./common";
import { taxCategorySchema } from "./tax-settings";

const count = (max = 1_000_000) => z.number({ error: "Enter a number." }).finite().min(0, "Use 0 or more.").max(max, `At most ${max}.`);
const minor = z.number({ error: "Enter an amount." }).int("Whole minor units only.").min(0, "Use 0 or more.").max(100_000_000, "That amount is too large.");
const isoDate = calendarDate("Use a date like 2027-01-31.");
export const MAX_QUOTE_MESSAGE = 2000;

/** zod issues → { "field.path": ["message", …] }, the same keys the server answers with (browser-safe). */
export function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_form";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export const pieceFeaturesSchema = z.object({
  label: safeString().trim().min(1, "Name the piece.").max(80),
  newDesign: z.boolean().default(true),
  proofRounds: count(20).default(1),
  plainStitches: count().default(0),
  strandedStitches: count().default(0),
  floatCatches: count().default(0),
  shapingRounds: count(2000).default(0),
  thumbs: count(4).default(0),
  duplicateStitches: count().default(0),
  ends: count(2000).default(0),
  carryCm: count(100_000).default(0),
  blocked: z.boolean().default(true),
});

export const quoteDraftSchema = z.object({
  pieces: z.array(pieceFeaturesSchema).min(1, "Add at least one piece.").max(12),
  materials: z
    .array(z.object({ yarnId: z.string().uuid("Choose a yarn."), skeins: z.number().int("Whole skeins.").min(0).max(200), taxCategory: taxCategorySchema.nullable().optional() }))
    .max(16),
  extras: z
    .array(z.object({ label: safeString().trim().min(1, "Name the extra.").max(80), amountMinor: minor, taxCategory: taxCategorySchema.nullable().optional() }))
    .max(10)
    .default([]),
  /** one tax category for all the labour, overriding the studio's default */
  labourTaxCategory: taxCategorySchema.nullable().optional(),
  designFeeMinor: minor.default(0),
  shippingMinor: minor.default(0),
  discountMinor: minor.default(0),
  requestedDate: isoDate.nullable().optional(),
  earliestDate: isoDate.nullable().optional(),
  rushFeeMinor: minor.nullable().optional(),
  validUntil: isoDate.nullable().optional(),
  messageToClient: safeString().trim().max(MAX_QUOTE_MESSAGE, "Keep the message to 2,000 characters or fewer.").default(""),
});

export type QuoteDraftInput = z.input<typeof quoteDraftSchema>;
export type QuoteDraftBody = z.output<typeof quoteDraftSchema>;

export const acceptQuoteSchema = z.object({
  quoteId: z.string().uuid(),
  name: safeString().trim().min(2, "Type your full name to accept.").max(120),
  agree: z.literal("on", { error: "Tick the box to accept the quote and its terms." }),
});

export const requestQuoteChangesSchema = z.object({
  quoteId: z.string().uuid(),
  changes: safeString().trim().min(5, "Tell the studio what you would like changed.").max(2000),
});
