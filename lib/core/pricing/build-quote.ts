// Quote lines, tax, deposit and balance, all in integer minor units (see MONEY.md for the rules).
import { STAGES } from "../labour/stages";
import { getMinorDigits } from "./currency";
import { PPM_WHOLE, parseExactDecimal, percentToPpm } from "./decimal";
import { discountTooLargeMessage } from "./messages";
import { PricingInputError } from "./pricing-error";
import { divideRounded, toSafeMinor } from "./rounding";
import {
  TAX_CATEGORIES,
  TAXABLE_KINDS,
  computeTaxByRate,
  resolveTaxCategories,
  splitByRate,
  type TaxableKind,
  type TaxCategory,
  type TaxCategoryInput,
  type TaxCategoryRate,
  type TaxRateShare,
  type TaxRateTotal,
} from "./tax";

export type QuoteLineKind = "labour" | "design" | "material" | "rush" | "fee" | "shipping" | "discount";

export interface QuoteLine {
  label: string;
  amountMinor: number;
  kind: QuoteLineKind;
  /** the line's tax category (a discount line has none: it is spread over the categories) */
  taxCategory?: TaxCategory;
  /** for invoices: "2.5" skeins, "3 h 20 min"; absent means one */
  quantity?: string;
  /** for invoices: price of one unit (per skein, per hour) */
  unitPriceMinor?: number;
}

/** Which labour figure a quote charges: the typical one, or the one four jobs in five stay within. */
export type LabourPolicy = "p50" | "p80";

/** Minutes for one stage: a number, or an estimate's { p50Minutes, p80Minutes } picked by policy. */
export type StageMinutesInput = number | { p50Minutes: number; p80Minutes: number };

export interface MaterialInput {
  label: string;
  /** skeins, grams, buttons…; up to 3 decimal places, read exactly */
  quantity: number | string;
  unitPriceMinor: number;
  /** overrides the default category for materials */
  taxCategory?: TaxCategory;
}

export interface FeeInput {
  label: string;
  amountMinor: number;
  /** overrides the default category for extras and fees */
  taxCategory?: TaxCategory;
}

/** Rush applies when the requested date is before the earliest date the studio can offer, or on request. */
export type RushInput = { requestedDate: string; earliestDate: string } | { requested: boolean };
export type RushFeeInput = { amountMinor: number } | { percentOfLabour: number | string };
export type DiscountInput = { label?: string; amountMinor: number } | { label?: string; percent: number | string };

export interface QuoteInput {
  currency: string;
  hourlyRateMinor: number;
  /** per-stage hourly rates overriding hourlyRateMinor, e.g. design charged differently */
  hourlyRatesMinor?: Partial<Record<string, number>>;
  labourMinutes?: Record<string, StageMinutesInput>;
  labourPolicy?: LabourPolicy;
  materials?: MaterialInput[];
  designFeeMinor?: number;
  rush?: RushInput;
  rushFee?: RushFeeInput;
  /** extras: gift wrap, a name label, a second proof set… */
  fees?: FeeInput[];
  shippingMinor?: number;
  discount?: DiscountInput;
  /** 0–100, up to 4 decimal places (e.g. 20, 8.875); default 0. With taxCategories: the standard rate. */
  taxRatePercent?: number | string;
  /** the studio's categories (standard, reduced, zero, exempt); absent: one rate, taxRatePercent, for every line */
  taxCategories?: TaxCategoryInput[];
  /** the category of each kind of line unless the line names its own; default "standard" */
  taxDefaults?: Partial<Record<TaxableKind, TaxCategory>>;
  /** per labour line (stage key) overriding taxDefaults.labour */
  labourTaxCategories?: Record<string, TaxCategory>;
  /** true: every line already contains tax; false: tax is added on top. Default false. */
  pricesIncludeTax?: boolean;
  /** 0–100, default 50 */
  depositPercent?: number | string;
}

export interface Quote {
  currency: string;
  minorDigits: number;
  lines: QuoteLine[];
  /** always the sum of the lines */
  subtotalMinor: number;
  /** added on top (prices exclude tax) or contained in the total (prices include tax) */
  taxMinor: number;
  totalMinor: number;
  /** total − tax, the amount before tax in either mode */
  netMinor: number;
  depositMinor: number;
  /** total − deposit, exactly */
  balanceMinor: number;
  pricesIncludeTax: boolean;
  taxRatePpm: number;
  depositPpm: number;
  labourPolicy: LabourPolicy;
  rushApplied: boolean;
  /** per category in use (standard, reduced, zero, exempt order); they add up exactly to the totals */
  taxByRate: TaxRateTotal[];
  /** the deposit split by category, with the tax within it (for a deposit receipt) */
  depositByRate: TaxRateShare[];
}

export const DEFAULT_DEPOSIT_PERCENT = 50;
/** Our default rush fee when none is set: a quarter of the labour (an assumption, not a trade figure). */
export const DEFAULT_RUSH_PERCENT_OF_LABOUR = 25;
export const DEFAULT_LABOUR_POLICY: LabourPolicy = "p80";

export function assertMinorAmount(value: number, field: string): void {
  if (typeof value !== "number" || !Number.isSafeInteger(value)) {
    throw new PricingInputError(`${field} must be a whole number of minor units (got ${String(value)})`);
  }
  if (value < 0) throw new PricingInputError(`${field} must not be negative (got ${value})`);
}

/** minutes × hourly rate ÷ 60, rounded half away from zero to the minor unit. */
export function getLabourAmountMinor(minutes: number, hourlyRateMinor: number): number {
  return toSafeMinor(divideRounded(BigInt(minutes) * BigInt(hourlyRateMinor), 60n), "labour amount");
}

export function pickStageMinutes(value: StageMinutesInput, policy: LabourPolicy): number {
  return typeof value === "number" ? value : policy === "p50" ? value.p50Minutes : value.p80Minutes;
}

function formatDuration(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Stages in working order first, then any other labour the studio lists, in the order given. */
function orderLabourKeys(keys: string[]): string[] {
  const known = STAGES.filter((s) => keys.includes(s));
  return [...known, ...keys.filter((k) => !(STAGES as readonly string[]).includes(k))];
}

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

function isRush(rush: RushInput | undefined): boolean {
  if (!rush) return false;
  if ("requested" in rush) return rush.requested;
  for (const [field, value] of [["rush.requestedDate", rush.requestedDate], ["rush.earliestDate", rush.earliestDate]] as const) {
    if (!ISO_DATE.test(value)) throw new PricingInputError(`${field} must be a date as YYYY-MM-DD (got "${value}")`);
  }
  // ISO dates compare correctly as text.
  return rush.requestedDate < rush.earliestDate;
}

export function getLabourLines(input: Pick<QuoteInput, "hourlyRateMinor" | "hourlyRatesMinor" | "labourMinutes" | "labourPolicy">): QuoteLine[] {
  return getKeyedLabourLines(input).map((x) => x.line);
}

function getKeyedLabourLines(input: Pick<QuoteInput, "hourlyRateMinor" | "hourlyRatesMinor" | "labourMinutes" | "labourPolicy">): { key: string; line: QuoteLine }[] {
  assertMinorAmount(input.hourlyRateMinor, "hourlyRateMinor");
  const policy = input.labourPolicy ?? DEFAULT_LABOUR_POLICY;
  const labour = input.labourMinutes ?? {};
  const lines: { key: string; line: QuoteLine }[] = [];
  for (const key of orderLabourKeys(Object.keys(labour))) {
    const minutes = pickStageMinutes(labour[key], policy);
    if (!Number.isSafeInteger(minutes) || minutes < 0) {
      throw new PricingInputError(`labourMinutes.${key} must be a whole number of minutes ≥ 0 (got ${String(minutes)})`);
    }
    if (minutes === 0) continue;
    const rate = input.hourlyRatesMinor?.[key] ?? input.hourlyRateMinor;
    assertMinorAmount(rate, `hourlyRatesMinor.${key}`);
    lines.push({
      key,
      line: {
        label: `${capitalise(key)} labour (${formatDuration(minutes)})`,
        amountMinor: getLabourAmountMinor(minutes, rate),
        kind: "labour",
        quantity: formatDuration(minutes),
        unitPriceMinor: rate,
      },
    });
  }
  return lines;
}

function sum(lines: QuoteLine[]): bigint {
  return lines.reduce((s, l) => s + BigInt(l.amountMinor), 0n);
}

export function buildQuote(input: QuoteInput): Quote {
  const currency = input.currency;
  const minorDigits = getMinorDigits(currency); // also rejects unknown codes
  const labourPolicy = input.labourPolicy ?? DEFAULT_LABOUR_POLICY;
  const taxRatePpm = percentToPpm(input.taxRatePercent ?? 0, "taxRatePercent");
  const depositPpm = percentToPpm(input.depositPercent ?? DEFAULT_DEPOSIT_PERCENT, "depositPercent");
  const pricesIncludeTax = input.pricesIncludeTax ?? false;

  const keyedLabour = getKeyedLabourLines(input);
  const labourKeys = new Map(keyedLabour.map((x) => [x.line, x.key]));
  const lines: QuoteLine[] = keyedLabour.map((x) => x.line);
  const labourTotal = sum(lines);

  if (input.designFeeMinor !== undefined && input.designFeeMinor !== 0) {
    assertMinorAmount(input.designFeeMinor, "designFeeMinor");
    lines.push({ label: "Design fee", amountMinor: input.designFeeMinor, kind: "design" });
  }

  (input.materials ?? []).forEach((m, i) => {
    assertMinorAmount(m.unitPriceMinor, `materials[${i}].unitPriceMinor`);
    const q = parseExactDecimal(m.quantity, `materials[${i}].quantity`, 3);
    if (q.units < 0n) throw new PricingInputError(`materials[${i}].quantity must not be negative (got ${String(m.quantity)})`);
    const amount = divideRounded(q.units * BigInt(m.unitPriceMinor), 10n ** BigInt(q.scale));
    const label = String(m.quantity) === "1" ? m.label : `${m.label} × ${String(m.quantity)}`;
    lines.push({ label, amountMinor: toSafeMinor(amount, `materials[${i}]`), kind: "material", quantity: String(m.quantity), unitPriceMinor: m.unitPriceMinor });
  });

  const rushApplied = isRush(input.rush);
  if (rushApplied) {
    const fee = input.rushFee ?? { percentOfLabour: DEFAULT_RUSH_PERCENT_OF_LABOUR };
    let amount: bigint;
    if ("amountMinor" in fee) {
      assertMinorAmount(fee.amountMinor, "rushFee.amountMinor");
      amount = BigInt(fee.amountMinor);
    } else {
      const ppm = percentToPpm(fee.percentOfLabour, "rushFee.percentOfLabour", 1000);
      amount = divideRounded(labourTotal * ppm, PPM_WHOLE);
    }
    if (amount > 0n) lines.push({ label: "Rush fee", amountMinor: toSafeMinor(amount, "rush fee"), kind: "rush" });
  }

  (input.fees ?? []).forEach((f, i) => {
    assertMinorAmount(f.amountMinor, `fees[${i}].amountMinor`);
    lines.push({ label: f.label, amountMinor: f.amountMinor, kind: "fee" });
  });

  // A discount applies to the work and materials, not to postage.
  const discountBase = sum(lines);
  if (input.shippingMinor !== undefined && input.shippingMinor !== 0) {
    assertMinorAmount(input.shippingMinor, "shippingMinor");
    lines.push({ label: "Shipping", amountMinor: input.shippingMinor, kind: "shipping" });
  }
  if (input.discount) {
    const d = input.discount;
    let amount: bigint;
    if ("amountMinor" in d) {
      assertMinorAmount(d.amountMinor, "discount.amountMinor");
      amount = BigInt(d.amountMinor);
    } else {
      amount = divideRounded(discountBase * percentToPpm(d.percent, "discount.percent"), PPM_WHOLE);
    }
    if (amount > discountBase) {
      throw new PricingInputError(discountTooLargeMessage(toSafeMinor(amount, "discount"), toSafeMinor(discountBase, "subtotal"), currency), "discountMinor");
    }
    if (amount > 0n) lines.push({ label: d.label ?? "Discount", amountMinor: -toSafeMinor(amount, "discount"), kind: "discount" });
  }

  const subtotal = sum(lines);
  // Tax is worked once per category on the sum of its lines (one category: once on the whole), so
  // lines never pick up separate roundings. The discount is spread over the categories first.
  const categories = getCategories(input, taxRatePpm);
  assignCategories(lines, labourKeys, input, categories);
  const groups = categories
    .map((category) => {
      const own = lines.filter((l) => l.taxCategory === category.id);
      return { category, linesMinor: sum(own), discountableMinor: sum(own.filter((l) => l.kind !== "shipping")), used: own.length > 0 };
    })
    .filter((g) => g.used || (categories.length === 1 && g.category.id === "standard"));
  const discountMinor = -sum(lines.filter((l) => l.kind === "discount"));
  const taxByRate = computeTaxByRate(groups, discountMinor, pricesIncludeTax);
  const tax = taxByRate.reduce((s, r) => s + BigInt(r.taxMinor), 0n);
  const total = pricesIncludeTax ? subtotal : subtotal + tax;
  const deposit = divideRounded(total * depositPpm, PPM_WHOLE);

  return {
    currency,
    minorDigits,
    lines,
    subtotalMinor: toSafeMinor(subtotal, "subtotal"),
    taxMinor: toSafeMinor(tax, "tax"),
    totalMinor: toSafeMinor(total, "total"),
    netMinor: toSafeMinor(total - tax, "net"),
    depositMinor: toSafeMinor(deposit, "deposit"),
    balanceMinor: toSafeMinor(total - deposit, "balance"),
    pricesIncludeTax,
    taxRatePpm: categories.find((c) => c.id === "standard")?.ratePpm ?? Number(taxRatePpm),
    depositPpm: Number(depositPpm),
    labourPolicy,
    rushApplied,
    taxByRate,
    depositByRate: splitByRate(toSafeMinor(deposit, "deposit"), taxByRate),
  };
}

/** The categories in force: the studio's, or one standard category at taxRatePercent. */
function getCategories(input: QuoteInput, taxRatePpm: bigint): TaxCategoryRate[] {
  if (!input.taxCategories) return [{ id: "standard", label: "Tax", ratePpm: Number(taxRatePpm) }];
  const resolved = resolveTaxCategories(input.taxCategories);
  const standard = resolved.find((c) => c.id === "standard");
  const standardInput = input.taxCategories.find((c) => c.id === "standard");
  if (standard && standardInput?.ratePercent === undefined) standard.ratePpm = Number(taxRatePpm);
  else if (standard && input.taxRatePercent !== undefined && BigInt(standard.ratePpm) !== taxRatePpm) {
    throw new PricingInputError("taxRatePercent and the standard category's ratePercent differ; give one of them", "taxRatePercent");
  }
  // Always in the same order, so per-rate totals read the same on every document.
  return [...resolved].sort((a, b) => TAX_CATEGORIES.indexOf(a.id) - TAX_CATEGORIES.indexOf(b.id));
}

function assignCategories(lines: QuoteLine[], labourKeys: Map<QuoteLine, string>, input: QuoteInput, categories: TaxCategoryRate[]): void {
  const offered = new Set(categories.map((c) => c.id));
  const check = (id: TaxCategory, field: string): TaxCategory => {
    if (!offered.has(id)) {
      const names = [...offered].join(", ");
      throw new PricingInputError(`${field}: "${String(id)}" is not one of the tax categories in use (${names})`, field);
    }
    return id;
  };
  for (const [kind, id] of Object.entries(input.taxDefaults ?? {})) {
    if (!(TAXABLE_KINDS as readonly string[]).includes(kind)) throw new PricingInputError(`taxDefaults.${kind}: not a kind of line (${TAXABLE_KINDS.join(", ")})`, `taxDefaults.${kind}`);
    if (id !== undefined) check(id, `taxDefaults.${kind}`);
  }
  const byKind = (kind: TaxableKind): TaxCategory => input.taxDefaults?.[kind] ?? (offered.has("standard") || !input.taxCategories ? "standard" : check("standard", `taxDefaults.${kind}`));
  // Materials and fees make one line each, in the order given.
  let material = 0;
  let fee = 0;
  for (const line of lines) {
    if (line.kind === "discount") continue;
    if (!input.taxCategories) {
      line.taxCategory = "standard";
      continue;
    }
    if (line.kind === "labour") {
      const key = labourKeys.get(line);
      const own = key !== undefined ? input.labourTaxCategories?.[key] : undefined;
      line.taxCategory = own !== undefined ? check(own, `labourTaxCategories.${key}`) : byKind("labour");
    } else if (line.kind === "material") {
      const i = material++;
      const own = input.materials?.[i]?.taxCategory;
      line.taxCategory = own !== undefined ? check(own, `materials[${i}].taxCategory`) : byKind("material");
    } else if (line.kind === "fee") {
      const i = fee++;
      const own = input.fees?.[i]?.taxCategory;
      line.taxCategory = own !== undefined ? check(own, `fees[${i}].taxCategory`) : byKind("fee");
    } else {
      line.taxCategory = byKind(line.kind);
    }
  }
  for (const key of Object.keys(input.labourTaxCategories ?? {})) check(input.labourTaxCategories![key], `labourTaxCategories.${key}`);
}
