// Tax categories and tax per rate, in integer minor units (see MONEY.md, "Tax per rate").
// A studio offers up to four categories: standard and reduced carry a rate; zero-rated and exempt
// are both 0 % but are different things on an invoice (a zero-rated supply is taxable at 0 %; an
// exempt one is outside the tax), so they are kept apart and shown with the studio's own labels.
import { PPM_WHOLE, percentToPpm } from "./decimal";
import { PricingInputError } from "./pricing-error";
import { divideRounded, toSafeMinor } from "./rounding";

export const TAX_CATEGORIES = ["standard", "reduced", "zero", "exempt"] as const;
export type TaxCategory = (typeof TAX_CATEGORIES)[number];

/** The kinds of quote line that take a default category (a discount follows the lines it reduces). */
export const TAXABLE_KINDS = ["labour", "material", "design", "rush", "fee", "shipping"] as const;
export type TaxableKind = (typeof TAXABLE_KINDS)[number];

export interface TaxCategoryInput {
  id: TaxCategory;
  /** the studio's own words, e.g. "Zero-rated (young children's clothing)" */
  label?: string;
  /** standard and reduced: 0–100 with up to 4 decimals; zero and exempt: 0 or omitted */
  ratePercent?: number | string;
}

export interface TaxCategoryRate {
  id: TaxCategory;
  label: string;
  ratePpm: number;
}

/** A rate above this is unusual enough to warn about (never refused): no national VAT/GST rate we know of exceeds 27 % (memory). */
export const TAX_RATE_WARNING_PERCENT = 30;

export const DEFAULT_TAX_LABELS: Record<TaxCategory, string> = {
  standard: "Standard rate",
  reduced: "Reduced rate",
  zero: "Zero-rated",
  exempt: "Exempt",
};

/** Totals of one category on a quote; the categories' figures add up exactly to the quote's. */
export interface TaxRateTotal {
  category: TaxCategory;
  label: string;
  ratePpm: number;
  /** the category's lines before the discount */
  linesMinor: number;
  /** the part of the discount allocated to this category (≥ 0) */
  discountMinor: number;
  /** before tax */
  netMinor: number;
  taxMinor: number;
  /** net + tax */
  grossMinor: number;
}

/** A part of a total (a deposit, a refund) split by category, with the tax within each part. */
export interface TaxRateShare {
  category: TaxCategory;
  label: string;
  ratePpm: number;
  grossMinor: number;
  taxMinor: number;
  netMinor: number;
}

/**
 * The studio's categories, checked: each id once, standard and reduced with a rate in 0–100,
 * zero and exempt at 0 %. Errors carry the field.
 */
export function resolveTaxCategories(input: TaxCategoryInput[], field = "taxCategories"): TaxCategoryRate[] {
  const seen = new Set<string>();
  return input.map((c, i) => {
    const f = `${field}[${i}]`;
    if (!(TAX_CATEGORIES as readonly string[]).includes(c.id)) {
      throw new PricingInputError(`${f}.id must be one of ${TAX_CATEGORIES.join(", ")} (got "${String(c.id)}")`, `${f}.id`);
    }
    if (seen.has(c.id)) throw new PricingInputError(`${f}.id: the category "${c.id}" is listed twice`, `${f}.id`);
    seen.add(c.id);
    let ratePpm = 0n;
    if (c.ratePercent !== undefined) {
      const text = String(c.ratePercent).trim();
      if (text.startsWith("-")) throw new PricingInputError(`${f}.ratePercent must not be negative (got ${text})`, `${f}.ratePercent`);
      try {
        ratePpm = percentToPpm(c.ratePercent, `${f}.ratePercent`);
      } catch (err) {
        if (err instanceof PricingInputError) throw new PricingInputError(err.message, `${f}.ratePercent`);
        throw err;
      }
    }
    if ((c.id === "zero" || c.id === "exempt") && ratePpm !== 0n) {
      throw new PricingInputError(`${f}.ratePercent: the ${c.id} category is always 0 % (got ${String(c.ratePercent)})`, `${f}.ratePercent`);
    }
    return { id: c.id, label: c.label?.trim() || DEFAULT_TAX_LABELS[c.id], ratePpm: Number(ratePpm) };
  });
}

/** Settings whose rates deserve a second look (warnings, never refusals). */
export function getTaxRateWarnings(categories: { id: TaxCategory; ratePercent?: number | string }[]): { category: TaxCategory; message: string }[] {
  return categories
    .filter((c) => c.ratePercent !== undefined && Number(c.ratePercent) > TAX_RATE_WARNING_PERCENT)
    .map((c) => ({
      category: c.id,
      message: `A ${c.id} rate of ${String(c.ratePercent)} % is above ${TAX_RATE_WARNING_PERCENT} %, higher than any VAT or GST rate we know of. Check it is a percentage (20 for 20 %).`,
    }));
}

/**
 * Splits `amount` across buckets in proportion to `weights`, in whole minor units, by the largest
 * remainder (Hamilton) rule: each bucket gets the floor of its exact share, then the units left over
 * go one each to the buckets with the largest fractional parts (ties to the earlier bucket). The
 * shares add up to `amount` exactly; a bucket of weight 0 gets 0. Weights must be ≥ 0; amount may be
 * negative (the shares are then the negated shares of −amount).
 */
export function allocateLargestRemainder(amount: bigint, weights: bigint[]): bigint[] {
  if (amount < 0n) return allocateLargestRemainder(-amount, weights).map((x) => -x);
  if (weights.some((w) => w < 0n)) throw new RangeError("allocateLargestRemainder: weights must not be negative");
  const total = weights.reduce((s, w) => s + w, 0n);
  if (amount === 0n) return weights.map(() => 0n);
  if (total === 0n) throw new RangeError("allocateLargestRemainder: nothing to allocate against");
  const shares = weights.map((w) => (amount * w) / total);
  const remainders = weights.map((w, i) => ({ i, r: (amount * w) % total }));
  let left = amount - shares.reduce((s, x) => s + x, 0n);
  remainders.sort((a, b) => (a.r === b.r ? a.i - b.i : a.r > b.r ? -1 : 1));
  for (const { i } of remainders) {
    if (left === 0n) break;
    shares[i] += 1n;
    left -= 1n;
  }
  return shares;
}

/**
 * Tax per category: one rounding per category, on the sum of that category's lines after its share
 * of the discount. Prices excluding tax: tax = round(net × rate). Prices including tax: tax =
 * round(gross × rate ÷ (1 + rate)). Half away from zero, as every rounding here.
 */
export function computeTaxByRate(
  groups: { category: TaxCategoryRate; linesMinor: bigint; discountableMinor: bigint }[],
  discountMinor: bigint,
  pricesIncludeTax: boolean,
): TaxRateTotal[] {
  const discounts = discountMinor === 0n ? groups.map(() => 0n) : allocateLargestRemainder(discountMinor, groups.map((g) => g.discountableMinor));
  return groups.map((g, i) => {
    const rate = BigInt(g.category.ratePpm);
    const after = g.linesMinor - discounts[i];
    const tax = pricesIncludeTax ? divideRounded(after * rate, PPM_WHOLE + rate) : divideRounded(after * rate, PPM_WHOLE);
    const net = pricesIncludeTax ? after - tax : after;
    const what = `tax for ${g.category.id}`;
    return {
      category: g.category.id,
      label: g.category.label,
      ratePpm: g.category.ratePpm,
      linesMinor: toSafeMinor(g.linesMinor, what),
      discountMinor: toSafeMinor(discounts[i], what),
      netMinor: toSafeMinor(net, what),
      taxMinor: toSafeMinor(tax, what),
      grossMinor: toSafeMinor(net + tax, what),
    };
  });
}

/**
 * The tax within a part of the total (a deposit, a refund): the part is split across categories in
 * proportion to their gross by the largest remainder rule, and each category's share carries the
 * same fraction of that category's tax, rounded once (half away from zero). A negative part (a
 * credit) gives the negated split of its magnitude, so a refund of the whole reverses every figure.
 */
export function splitByRate(partMinor: number, byRate: readonly Pick<TaxRateTotal, "category" | "label" | "ratePpm" | "grossMinor" | "taxMinor">[]): TaxRateShare[] {
  const part = BigInt(partMinor);
  const magnitude = part < 0n ? -part : part;
  const sign = part < 0n ? -1n : 1n;
  const live = byRate.filter((r) => r.grossMinor > 0);
  const gross = live.reduce((s, r) => s + BigInt(r.grossMinor), 0n);
  if (magnitude > gross) throw new PricingInputError(`the part (${magnitude}) is larger than the total it is part of (${gross})`);
  if (live.length === 0) return [];
  const shares = allocateLargestRemainder(magnitude, live.map((r) => BigInt(r.grossMinor)));
  return live.map((r, i) => {
    const tax = divideRounded(shares[i] * BigInt(r.taxMinor), BigInt(r.grossMinor));
    return {
      category: r.category,
      label: r.label,
      ratePpm: r.ratePpm,
      grossMinor: toSafeMinor(sign * shares[i]),
      taxMinor: toSafeMinor(sign * tax),
      netMinor: toSafeMinor(sign * (shares[i] - tax)),
    };
  });
}

/** "20 %", "17.5 %", "0 %" */
export const formatRatePpm = (ppm: number) => `${ppm / 10_000} %`;

/**
 * Totals per rate of a stored quote. Quotes made before tax categories have none: they had one rate
 * on the whole, so their one row is exactly their totals.
 */
export function taxByRateOf(q: { taxByRate?: TaxRateTotal[]; subtotalMinor: number; taxMinor: number; totalMinor: number; taxRatePpm: number; pricesIncludeTax: boolean; lines: { amountMinor: number; kind: string }[] }): TaxRateTotal[] {
  if (q.taxByRate) return q.taxByRate;
  const discount = -q.lines.filter((l) => l.kind === "discount").reduce((s, l) => s + l.amountMinor, 0);
  return [
    {
      category: "standard",
      label: "Tax",
      ratePpm: q.taxRatePpm,
      linesMinor: q.subtotalMinor + discount,
      discountMinor: discount,
      netMinor: q.totalMinor - q.taxMinor,
      taxMinor: q.taxMinor,
      grossMinor: q.totalMinor,
    },
  ];
}

/** What is left of each rate after parts of it were paid (e.g. the balance after the deposit). */
export function remainderByRate(whole: readonly TaxRateTotal[], parts: readonly TaxRateShare[]): TaxRateShare[] {
  return whole.map((r) => {
    const p = parts.find((x) => x.category === r.category);
    const gross = r.grossMinor - (p?.grossMinor ?? 0);
    const tax = r.taxMinor - (p?.taxMinor ?? 0);
    return { category: r.category, label: r.label, ratePpm: r.ratePpm, grossMinor: gross, taxMinor: tax, netMinor: gross - tax };
  });
}
