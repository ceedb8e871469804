// The tax section of the settings form: field errors for what cannot be saved, a warning (not a
// refusal) for a rate over 30 %, and the stored categories it produces.
import { describe, expect, test } from "vitest";
import { taxRateWarning, taxSettingsFormSchema, taxSettingsFromForm } from "@/lib/schemas/tax-settings";

const form = (over: Record<string, string> = {}) => ({
  standardLabel: "Standard rate",
  standardRate: "20",
  reducedLabel: "Reduced rate",
  reducedRate: "5",
  zeroLabel: "Zero-rated (young children's clothing)",
  exemptLabel: "",
  default_labour: "standard",
  default_material: "standard",
  default_design: "standard",
  default_rush: "standard",
  default_fee: "zero",
  default_shipping: "standard",
  legalName: "",
  address: "The Byre",
  taxNumber: "GB 123 4567 89",
  ...over,
});

const errorsOf = (v: Record<string, string>) => {
  const r = taxSettingsFormSchema.safeParse(v);
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("tax settings form", () => {
  test("a valid section becomes categories in order, defaults and seller details", () => {
    const out = taxSettingsFromForm(taxSettingsFormSchema.parse(form()));
    expect(out.categories).toEqual([
      { id: "standard", label: "Standard rate", ratePercent: 20 },
      { id: "reduced", label: "Reduced rate", ratePercent: 5 },
      { id: "zero", label: "Zero-rated (young children's clothing)", ratePercent: 0 },
    ]);
    expect(out.defaults.fee).toBe("zero");
    expect(out.seller.taxNumber).toBe("GB 123 4567 89");
  });
  test("negative rates, a default naming an unlabelled category, an unknown category are field errors", () => {
    expect(errorsOf(form({ standardRate: "-20" }))).toHaveProperty("standardRate", "A rate cannot be negative.");
    expect(errorsOf(form({ reducedRate: "-5" }))).toHaveProperty("reducedRate", "A rate cannot be negative.");
    expect(errorsOf(form({ default_design: "exempt" }))).toHaveProperty("default_design");
    expect(errorsOf(form({ default_fee: "luxury" }))).toHaveProperty("default_fee");
    expect(errorsOf(form({ reducedRate: "" }))).toHaveProperty("reducedRate");
    expect(errorsOf(form({ standardRate: "120" }))).toHaveProperty("standardRate");
  });
  test("over 30 % is accepted with a warning", () => {
    expect(errorsOf(form({ standardRate: "35" }))).toEqual({});
    expect(taxRateWarning("35")).toContain("above 30 %");
    expect(taxRateWarning("30")).toBeNull();
    expect(taxRateWarning("20")).toBeNull();
  });
});
