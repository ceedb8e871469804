// Pricing: integer money, quote lines, tax, deposit and balance, change notes, cancellation refunds.
export { isCurrencyCode, assertCurrency, getMinorDigits, getCurrencyName, storedDigitsProblem, ISO4217_EDITION } from "./currency";
export { ISO4217, type Iso4217Entry } from "./iso4217";
export { divideRounded } from "./rounding";
export { parseExactDecimal, percentToPpm, PPM_WHOLE, PPM_PER_PERCENT } from "./decimal";
export { formatMoney, minorToDecimalString, decimalStringToMinor } from "./format-money";
export {
  buildQuote,
  getLabourLines,
  getLabourAmountMinor,
  DEFAULT_DEPOSIT_PERCENT,
  DEFAULT_RUSH_PERCENT_OF_LABOUR,
  DEFAULT_LABOUR_POLICY,
  type Quote,
  type QuoteInput,
  type QuoteLine,
  type QuoteLineKind,
  type LabourPolicy,
} from "./build-quote";
export { diffQuotes, type QuoteDiff } from "./diff-quotes";
export { explainChange, type PriceChangeExplanation } from "./explain-change";
export { getRefundDue, defaultCancellationPolicy, CANCELLATION_STAGES, type CancellationPolicy, type CancellationRule } from "./cancellation";
export { PricingInputError } from "./pricing-error";
export {
  TAX_CATEGORIES,
  TAXABLE_KINDS,
  TAX_RATE_WARNING_PERCENT,
  DEFAULT_TAX_LABELS,
  allocateLargestRemainder,
  computeTaxByRate,
  formatRatePpm,
  getTaxRateWarnings,
  resolveTaxCategories,
  splitByRate,
  type TaxCategory,
  type TaxCategoryInput,
  type TaxRateShare,
  type TaxRateTotal,
  type TaxableKind,
} from "./tax";
