import "server-only";
// The studio's tax categories, defaults per kind of line and seller details (owner only). Saved in
// one transaction: either all of it, or nothing when anything is wrong.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { studios } from "@/db/schema";
import { PricingInputError } from "@/lib/core/pricing/pricing-error";
import { resolveTaxCategories } from "@/lib/core/pricing/tax";
import { readStudioSettings, studioSettingsSchema } from "@/lib/schemas/settings";
import { taxCategoriesSettingSchema, taxDefaultsSchema, taxRateWarning, type TaxCategoriesSetting, type TaxDefaults } from "@/lib/schemas/tax-settings";
import { assertCan, type Actor } from "./authz";
import { AppError, fieldErrorsOf, notFound } from "./errors";

export interface TaxSettingsInput {
  categories: TaxCategoriesSetting;
  defaults: Partial<TaxDefaults>;
  seller?: { legalName: string; address: string; taxNumber: string };
}

export interface TaxSettingsView {
  categories: TaxCategoriesSetting;
  defaults: TaxDefaults;
  standardRatePercent: number;
  seller: { name: string; legalName: string; address: string; taxNumber: string };
}

export async function getTaxSettings(actor: Actor, studioId: string): Promise<TaxSettingsView> {
  assertCan(actor, "studio.settings", studioId);
  const [s] = await db.select().from(studios).where(eq(studios.id, studioId));
  if (!s) throw notFound("That studio");
  const settings = readStudioSettings(s.settings);
  return {
    categories: settings.taxCategories,
    defaults: settings.taxDefaults,
    standardRatePercent: settings.taxRatePercent,
    seller: { name: s.name, legalName: s.legalName, address: s.address, taxNumber: s.taxNumber },
  };
}

/**
 * Owner: replaces the categories and defaults (and the seller details when given). A category a
 * default points at must exist; rates are 0–100 and never negative; zero and exempt are 0 %. The
 * standard rate is also written to taxRatePercent so every reader of the one-rate setting agrees.
 * Returns warnings (a rate over 30 %) — saved all the same.
 */
export async function updateTaxSettings(actor: Actor, studioId: string, input: TaxSettingsInput): Promise<{ warnings: Record<string, string> }> {
  assertCan(actor, "studio.settings", studioId);
  const cats = taxCategoriesSettingSchema.safeParse(input.categories);
  if (!cats.success) throw new AppError(422, "invalid_input", "Some tax categories need attention.", prefix("categories", fieldErrorsOf(cats.error)));
  const defs = taxDefaultsSchema.safeParse(input.defaults);
  if (!defs.success) throw new AppError(422, "invalid_input", "Some default categories need attention.", prefix("defaults", fieldErrorsOf(defs.error)));
  try {
    resolveTaxCategories(cats.data);
  } catch (err) {
    if (err instanceof PricingInputError) throw new AppError(422, "invalid_input", err.message, { [err.field ?? "categories"]: [err.message] });
    throw err;
  }
  const offered = new Set(cats.data.map((c) => c.id));
  const missing = Object.entries(defs.data).filter(([, id]) => !offered.has(id));
  if (missing.length) {
    throw new AppError(
      422,
      "invalid_input",
      `A default names a category you do not have: ${missing.map(([k, id]) => `${k} → ${id}`).join(", ")}.`,
      Object.fromEntries(missing.map(([k, id]) => [`defaults.${k}`, [`"${id}" is not one of your categories.`]])),
    );
  }
  const standard = cats.data.find((c) => c.id === "standard");
  await db.transaction(async (tx) => {
    const [s] = await tx.select({ settings: studios.settings }).from(studios).where(eq(studios.id, studioId)).for("update");
    if (!s) throw notFound("That studio");
    const current = readStudioSettings(s.settings);
    const next = studioSettingsSchema.parse({ ...current, taxCategories: cats.data, taxDefaults: defs.data, ...(standard ? { taxRatePercent: standard.ratePercent } : {}) });
    const seller = input.seller ? { legalName: input.seller.legalName.trim(), address: input.seller.address.trim(), taxNumber: input.seller.taxNumber.trim() } : {};
    await tx.update(studios).set({ settings: next, ...seller }).where(eq(studios.id, studioId));
  });
  const warnings: Record<string, string> = {};
  cats.data.forEach((c, i) => {
    const w = taxRateWarning(c.ratePercent);
    if (w) warnings[`categories.${i}.ratePercent`] = w;
  });
  return { warnings };
}

function prefix(p: string, errors: Record<string, string[]>): Record<string, string[]> {
  return Object.fromEntries(Object.entries(errors).map(([k, v]) => [k === "_form" ? p : `${p}.${k}`, v]));
}
