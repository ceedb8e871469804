// A quote draft as the builder edits it (pieces' features, skeins, fees) → the buildQuote input,
// the labour estimate and the quote. Pure, so the browser's live price and the server agree.
import type { LabourRates } from "../labour/default-rates";
import { estimateLabour, type LabourEstimate, type P80Factors } from "../labour/estimate-labour";
import type { PieceFeatures } from "../labour/piece-features";
import { buildQuote, type LabourPolicy, type Quote, type QuoteInput } from "./build-quote";
import type { TaxableKind, TaxCategory, TaxCategoryInput } from "./tax";

export interface DraftMaterial {
  yarnId: string;
  /** e.g. "Skerry 4-ply, Loch blue (skeins)"; filled from the yarn list */
  label: string;
  skeins: number;
  unitPriceMinor: number;
  /** overrides the studio's default category for materials */
  taxCategory?: TaxCategory | null;
}

export interface QuoteDraft {
  pieces: PieceFeatures[];
  materials: DraftMaterial[];
  extras: { label: string; amountMinor: number; taxCategory?: TaxCategory | null }[];
  /** one category for every labour line, overriding the studio's default for labour */
  labourTaxCategory?: TaxCategory | null;
  designFeeMinor: number;
  shippingMinor: number;
  discountMinor: number;
  /** the date the client asked for; with earliestDate, decides whether a rush fee applies */
  requestedDate?: string | null;
  /** the earliest date the studio can offer (the schedule supplies it; typed until then) */
  earliestDate?: string | null;
  /** a fixed rush fee; when absent the core's default share of labour applies */
  rushFeeMinor?: number | null;
}

export interface QuotePolicy {
  currency: string;
  hourlyRateMinor: number;
  labourPolicy: LabourPolicy;
  taxRatePercent: number | string;
  pricesIncludeTax: boolean;
  depositPercent: number | string;
  /** the studio's categories (standard's rate is taxRatePercent); absent or empty: one rate */
  taxCategories?: TaxCategoryInput[];
  taxDefaults?: Partial<Record<TaxableKind, TaxCategory>>;
  rates?: Partial<LabourRates>;
  p80Factors?: Partial<P80Factors>;
}

export interface ComposedQuote {
  input: QuoteInput;
  estimate: LabourEstimate;
  quote: Quote;
}

export function composeQuote(draft: QuoteDraft, policy: QuotePolicy): ComposedQuote {
  const estimate = estimateLabour({ pieces: draft.pieces, rates: policy.rates, p80Factors: policy.p80Factors });
  const input: QuoteInput = {
    currency: policy.currency,
    hourlyRateMinor: policy.hourlyRateMinor,
    labourPolicy: policy.labourPolicy,
    labourMinutes: Object.fromEntries(Object.entries(estimate.stages).map(([k, v]) => [k, { p50Minutes: v.p50Minutes, p80Minutes: v.p80Minutes }])),
    materials: draft.materials
      .filter((m) => m.skeins > 0)
      .map((m) => ({ label: m.label, quantity: m.skeins, unitPriceMinor: m.unitPriceMinor, ...(m.taxCategory ? { taxCategory: m.taxCategory } : {}) })),
    designFeeMinor: draft.designFeeMinor,
    fees: draft.extras
      .filter((e) => e.label.trim() && e.amountMinor > 0)
      .map((e) => ({ label: e.label, amountMinor: e.amountMinor, ...(e.taxCategory ? { taxCategory: e.taxCategory } : {}) })),
    shippingMinor: draft.shippingMinor,
    discount: draft.discountMinor > 0 ? { label: "Discount", amountMinor: draft.discountMinor } : undefined,
    taxRatePercent: policy.taxRatePercent,
    pricesIncludeTax: policy.pricesIncludeTax,
    depositPercent: policy.depositPercent,
  };
  if (policy.taxCategories?.length) {
    input.taxCategories = policy.taxCategories;
    input.taxDefaults = policy.taxDefaults;
    if (draft.labourTaxCategory) input.labourTaxCategories = Object.fromEntries(Object.keys(estimate.stages).map((k) => [k, draft.labourTaxCategory!]));
  }
  if (draft.requestedDate && draft.earliestDate) {
    input.rush = { requestedDate: draft.requestedDate, earliestDate: draft.earliestDate };
    if (draft.rushFeeMinor !== undefined && draft.rushFeeMinor !== null) input.rushFee = { amountMinor: draft.rushFeeMinor };
  }
  return { input, estimate, quote: buildQuote(input) };
}
