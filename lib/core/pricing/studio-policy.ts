// The studio's cancellation policy from its settings: the default policy, with the share of the
// deposit that comes back when a commission is cancelled before knitting starts.
import { defaultCancellationPolicy, type CancellationPolicy, type CancellationRule } from "./cancellation";
import { PricingInputError } from "./pricing-error";

/**
 * Keeping (100 − refund) % of a deposit that is d % of the total is keeping
 * d × (100 − refund) / 100 % of the total; written with at most 4 decimals, as percentages are read.
 */
export function policyFromSettings(depositPercent: number, refundBeforeKnittingPercent: number): CancellationPolicy {
  for (const [name, v] of [["depositPercent", depositPercent], ["refundBeforeKnittingPercent", refundBeforeKnittingPercent]] as const) {
    if (!Number.isFinite(v) || v < 0 || v > 100) throw new PricingInputError(`${name} must be between 0 and 100 (got ${v})`);
  }
  const keepShare = (depositPercent * (100 - refundBeforeKnittingPercent)) / 100;
  const before: CancellationRule = keepShare <= 0 ? { keep: "nothing" } : { keep: "percentOfTotal", percent: keepShare.toFixed(4).replace(/\.?0+$/, "") };
  return { ...defaultCancellationPolicy, accepted: before, design: before };
}
