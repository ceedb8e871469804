// The studio's tax categories, the default category per kind of quote line, and the seller details
// printed on invoices. Stored categories are checked again by the pricing core when a quote is built.
import { z } from "zod";
import { TAX_CATEGORIES, TAXABLE_KINDS, TAX_RATE_WARNING_PERCENT, type TaxCategory } from "@/lib/core/pricing/tax";
import { safeString } from "./common";

export const taxCategorySchema = z.enum(TAX_CATEGORIES, { error: `Choose one of: ${TAX_CATEGORIES.join(", ")}.` });

export const taxCategoriesSettingSchema = z
  .array(
    z.object({
      id: taxCategorySchema,
      label: z.string().trim().max(120),
      ratePercent: z.number({ error: "Enter a rate." }).min(0, "A rate cannot be negative.").max(100, "A rate is at most 100 %."),
    }),
  )
  .max(4)
  .superRefine((cats, ctx) => {
    const seen = new Set<string>();
    cats.forEach((c, i) => {
      if (seen.has(c.id)) ctx.addIssue({ code: "custom", path: [i, "id"], message: `The ${c.id} category is listed twice.` });
      seen.add(c.id);
      if ((c.id === "zero" || c.id === "exempt") && c.ratePercent !== 0) ctx.addIssue({ code: "custom", path: [i, "ratePercent"], message: `The ${c.id} category is always 0 %.` });
    });
  });

export const taxDefaultsSchema = z.object(Object.fromEntries(TAXABLE_KINDS.map((k) => [k, taxCategorySchema.default("standard")])) as Record<(typeof TAXABLE_KINDS)[number], z.ZodDefault<typeof taxCategorySchema>>);

export type TaxCategoriesSetting = z.infer<typeof taxCategoriesSettingSchema>;
export type TaxDefaults = z.infer<typeof taxDefaultsSchema>;

const rate = (required: boolean) =>
  safeString()
    .trim()
    .refine((v) => (v === "" ? !required : /^-?\d+(\.\d{1,4})?$/.test(v)), "Enter a rate like 20 or 17.5 (at most 4 decimals).")
    .refine((v) => !v.startsWith("-"), "A rate cannot be negative.")
    .refine((v) => v === "" || Number(v) <= 100, "A rate is at most 100 %.");

const label = safeString().trim().max(120, "At most 120 characters.");

/** The form section as typed (all strings); a category is offered when its label is filled in. */
export const taxSettingsFormSchema = z
  .object({
    standardLabel: label,
    standardRate: rate(true),
    reducedLabel: label,
    reducedRate: rate(false),
    zeroLabel: label,
    exemptLabel: label,
    ...(Object.fromEntries(TAXABLE_KINDS.map((k) => [`default_${k}`, taxCategorySchema])) as Record<`default_${(typeof TAXABLE_KINDS)[number]}`, typeof taxCategorySchema>),
    legalName: safeString().trim().max(200, "At most 200 characters."),
    address: safeString().trim().max(500, "At most 500 characters."),
    taxNumber: safeString().trim().max(40, "At most 40 characters."),
  })
  .superRefine((v, ctx) => {
    if (v.reducedLabel && v.reducedRate === "") ctx.addIssue({ code: "custom", path: ["reducedRate"], message: "Enter the reduced rate, or clear its label." });
    const offered = new Set<TaxCategory>(["standard"]);
    if (v.reducedLabel) offered.add("reduced");
    if (v.zeroLabel) offered.add("zero");
    if (v.exemptLabel) offered.add("exempt");
    for (const k of TAXABLE_KINDS) {
      const chosen = v[`default_${k}`];
      if (!offered.has(chosen)) ctx.addIssue({ code: "custom", path: [`default_${k}`], message: `"${chosen}" is not one of your categories: give it a label above, or choose another.` });
    }
  });

export type TaxSettingsForm = z.output<typeof taxSettingsFormSchema>;

/** The stored form of the section: categories in order, defaults, seller details. */
export function taxSettingsFromForm(v: TaxSettingsForm) {
  const categories: TaxCategoriesSetting = [{ id: "standard", label: v.standardLabel || "Standard rate", ratePercent: Number(v.standardRate) }];
  if (v.reducedLabel) categories.push({ id: "reduced", label: v.reducedLabel, ratePercent: Number(v.reducedRate) });
  if (v.zeroLabel) categories.push({ id: "zero", label: v.zeroLabel, ratePercent: 0 });
  if (v.exemptLabel) categories.push({ id: "exempt", label: v.exemptLabel, ratePercent: 0 });
  const defaults = Object.fromEntries(TAXABLE_KINDS.map((k) => [k, v[`default_${k}`]])) as TaxDefaults;
  return { categories, defaults, seller: { legalName: v.legalName, address: v.address, taxNumber: v.taxNumber } };
}

/** Rates worth a second look: warned about, never refused. */
export function taxRateWarning(ratePercent: string | number): string | null {
  const n = Number(ratePercent);
  return Number.isFinite(n) && n > TAX_RATE_WARNING_PERCENT
    ? `${n} % is above ${TAX_RATE_WARNING_PERCENT} %, higher than any VAT or sales tax rate we know of. Check it is a percentage (20 for 20 %). It is saved as typed.`
    : null;
}
