// The studio's cancellation policy from its settings: the default policy, with the share of the
// deposit that comes back when a commission is cancelled before knitting starts. Exact decimals
// only: the share kept is 100 − the refunded share, written out digit for digit (no floats).
import { defaultCancellationPolicy, MAX_SHARE_DECIMALS, type CancellationPolicy, type CancellationRule } from "./cancellation";
import { parseExactDecimal } from "./decimal";
import { PricingInputError } from "./pricing-error";

function checkPercent(name: string, v: number | string): { units: bigint; scale: number } {
  const d = parseExactDecimal(v, name, MAX_SHARE_DECIMALS);
  if (d.units < 0n || d.units > 100n * 10n ** BigInt(d.scale)) throw new PricingInputError(`${name} must be between 0 and 100 (got ${String(v)})`);
  return d;
}

/** units / 10^scale as a decimal string ("12.5", "0.0001", "40"). */
function decimalText(units: bigint, scale: number): string {
  if (scale === 0) return units.toString();
  const digits = units.toString().padStart(scale + 1, "0");
  return `${digits.slice(0, -scale)}.${digits.slice(-scale)}`.replace(/\.?0+$/, "");
}

/**
 * Before knitting the studio keeps (100 − refund) % of the deposit the client actually paid as the
 * quote's deposit (not of today's deposit setting, which may have changed since). depositPercent is
 * still checked so a broken setting is caught here as before.
 */
export function policyFromSettings(depositPercent: number | string, refundBeforeKnittingPercent: number | string): CancellationPolicy {
  checkPercent("depositPercent", depositPercent);
  const refund = checkPercent("refundBeforeKnittingPercent", refundBeforeKnittingPercent);
  const keepUnits = 100n * 10n ** BigInt(refund.scale) - refund.units;
  const before: CancellationRule = keepUnits === 0n ? { keep: "nothing" } : { keep: "percentOfDeposit", percent: decimalText(keepUnits, refund.scale) };
  return { ...defaultCancellationPolicy, accepted: before, design: before };
}
