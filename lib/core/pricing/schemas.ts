// Zod schemas for quote inputs, shared by the quote form, its server action and the core CLI.
import { z } from "zod";
import { isCurrencyCode } from "./currency";
import { TAX_CATEGORIES, TAXABLE_KINDS } from "./tax";

// Messages leave the field name out: describeIssues puts the path in front of each.
const minor = () =>
  z
    .number({ error: "must be a number of minor units" })
    .int({ error: "must be a whole number of minor units (e.g. pence, not pounds)" })
    .nonnegative({ error: "must not be negative" });

const percent = (max = 100) =>
  z.union([z.number().finite(), z.string()], { error: "must be a number" }).refine(
    (v) => {
      const n = typeof v === "number" ? v : Number(v);
      return Number.isFinite(n) && n >= 0 && n <= max;
    },
    { error: `must be between 0 and ${max} (a percentage)` },
  );

export const currencySchema = z
  .string({ error: "currency must be a three-letter ISO 4217 code such as GBP" })
  .refine(isCurrencyCode, { error: (issue) => `"${String(issue.input)}" is not an ISO 4217 currency code known here (e.g. GBP, EUR, JPY)` });

const wholeMinutes = z.number().int({ error: "minutes must be whole" }).nonnegative({ error: "minutes must not be negative" });

export const stageMinutesSchema = z.union([wholeMinutes, z.looseObject({ p50Minutes: wholeMinutes, p80Minutes: wholeMinutes })], {
  error: "give minutes as a whole number, or as { p50Minutes, p80Minutes } from an estimate",
});

const taxCategory = z.enum(TAX_CATEGORIES, { error: `must be one of ${TAX_CATEGORIES.join(", ")}` });

export const taxCategoriesSchema = z.array(
  z.strictObject({
    id: taxCategory,
    label: z.string().max(120).optional(),
    ratePercent: z
      .union([z.number().finite(), z.string()], { error: "must be a number" })
      .refine((v) => Number(v) >= 0, { error: "must not be negative" })
      .optional(),
  }),
);

const isoDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, { error: "must be a date as YYYY-MM-DD" });

export const quoteInputSchema = z.strictObject({
  currency: currencySchema,
  hourlyRateMinor: minor(),
  hourlyRatesMinor: z.record(z.string(), minor()).optional(),
  labourMinutes: z.record(z.string(), stageMinutesSchema).optional(),
  labourPolicy: z.enum(["p50", "p80"]).optional(),
  materials: z
    .array(
      z.strictObject({
        label: z.string().min(1, { error: "a material needs a label" }),
        quantity: z.union([z.number().finite().nonnegative({ error: "must not be negative" }), z.string()]),
        unitPriceMinor: minor(),
        taxCategory: taxCategory.optional(),
      }),
    )
    .optional(),
  designFeeMinor: minor().optional(),
  rush: z.union([z.strictObject({ requestedDate: isoDate, earliestDate: isoDate }), z.strictObject({ requested: z.boolean() })]).optional(),
  rushFee: z.union([z.strictObject({ amountMinor: minor() }), z.strictObject({ percentOfLabour: percent(1000) })]).optional(),
  fees: z.array(z.strictObject({ label: z.string().min(1, { error: "a fee needs a label" }), amountMinor: minor(), taxCategory: taxCategory.optional() })).optional(),
  shippingMinor: minor().optional(),
  discount: z
    .union([
      z.strictObject({ label: z.string().optional(), amountMinor: minor() }),
      z.strictObject({ label: z.string().optional(), percent: percent() }),
    ])
    .optional(),
  taxRatePercent: percent().optional(),
  taxCategories: taxCategoriesSchema.optional(),
  taxDefaults: z.partialRecord(z.enum(TAXABLE_KINDS), taxCategory).optional(),
  labourTaxCategories: z.record(z.string(), taxCategory).optional(),
  pricesIncludeTax: z.boolean({ error: "must be true or false" }).optional(),
  depositPercent: percent().optional(),
});

export type QuoteInputParsed = z.infer<typeof quoteInputSchema>;
