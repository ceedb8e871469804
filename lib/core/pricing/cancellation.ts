// What a client gets back when a commission is cancelled, by the furthest stage work reached.
// Integer arithmetic only (bigint minor units, percentages read exactly, parts per million where a
// percentage has at most 4 decimals), rounded once by the money rule of rounding.ts.
import { getMinorDigits } from "./currency";
import { PPM_WHOLE, parseExactDecimal, percentToPpm } from "./decimal";
import { assertMinorAmount } from "./build-quote";
import { PricingInputError } from "./pricing-error";
import { divideRounded, toSafeMinor } from "./rounding";

export const CANCELLATION_STAGES = ["accepted", "design", "knitting", "embroidery", "blocking", "finishing", "ready"] as const;
export type CancellationStage = (typeof CANCELLATION_STAGES)[number];

/** What the studio keeps: nothing, the deposit, a share of the deposit, or a share of the quote total. */
export type CancellationRule =
  | { keep: "nothing" }
  | { keep: "deposit" }
  | { keep: "percentOfDeposit"; percent: number | string }
  | { keep: "percentOfTotal"; percent: number | string };

/** Most decimals a share of the deposit may have: a settings value typed as a plain decimal fits. */
export const MAX_SHARE_DECIMALS = 20;

/** round(amount × percent / 100) exactly, for a percent between 0 and 100 with up to MAX_SHARE_DECIMALS decimals. */
export function shareOfAmount(amountMinor: bigint, percent: number | string, field: string): bigint {
  const d = parseExactDecimal(percent, field, MAX_SHARE_DECIMALS);
  const scale = 10n ** BigInt(d.scale);
  if (d.units < 0n || d.units > 100n * scale) throw new PricingInputError(`${field} must be between 0 and 100 (got ${String(percent)})`);
  return divideRounded(amountMinor * d.units, 100n * scale);
}

export type CancellationPolicy = Record<CancellationStage, CancellationRule>;

/**
 * Our default, for a studio to change: the deposit comes back until knitting starts, is kept once
 * yarn is being knitted, and a personalised piece that is blocked or later is charged in full.
 */
export const defaultCancellationPolicy: Readonly<CancellationPolicy> = Object.freeze({
  accepted: { keep: "nothing" },
  design: { keep: "nothing" },
  knitting: { keep: "deposit" },
  embroidery: { keep: "deposit" },
  blocking: { keep: "percentOfTotal", percent: 100 },
  finishing: { keep: "percentOfTotal", percent: 100 },
  ready: { keep: "percentOfTotal", percent: 100 },
});

export interface RefundInput {
  currency: string;
  totalMinor: number;
  depositMinor: number;
  paidMinor: number;
  stageReached: CancellationStage;
  policy?: Partial<CancellationPolicy>;
}

export interface RefundDue {
  /** what the policy lets the studio keep in full */
  entitledMinor: number;
  /** kept from what was paid */
  retainedMinor: number;
  /** paid − retained */
  refundMinor: number;
  /** entitlement not covered by payments so far (the studio may invoice it, or waive it) */
  unpaidEntitlementMinor: number;
  rule: CancellationRule;
}

export function getRefundDue(input: RefundInput): RefundDue {
  getMinorDigits(input.currency);
  assertMinorAmount(input.totalMinor, "totalMinor");
  assertMinorAmount(input.depositMinor, "depositMinor");
  assertMinorAmount(input.paidMinor, "paidMinor");
  if (input.depositMinor > input.totalMinor) throw new PricingInputError("depositMinor must not exceed totalMinor");
  if (!(CANCELLATION_STAGES as readonly string[]).includes(input.stageReached)) {
    throw new PricingInputError(`stageReached must be one of ${CANCELLATION_STAGES.join(", ")} (got "${input.stageReached}")`);
  }
  const rule = input.policy?.[input.stageReached] ?? defaultCancellationPolicy[input.stageReached];
  let entitled: bigint;
  if (rule.keep === "nothing") entitled = 0n;
  else if (rule.keep === "deposit") entitled = BigInt(input.depositMinor);
  else if (rule.keep === "percentOfDeposit") entitled = shareOfAmount(BigInt(input.depositMinor), rule.percent, `policy.${input.stageReached}.percent`);
  else entitled = divideRounded(BigInt(input.totalMinor) * percentToPpm(rule.percent, `policy.${input.stageReached}.percent`), PPM_WHOLE);
  const paid = BigInt(input.paidMinor);
  const retained = entitled < paid ? entitled : paid;
  return {
    entitledMinor: toSafeMinor(entitled),
    retainedMinor: toSafeMinor(retained),
    refundMinor: toSafeMinor(paid - retained),
    unpaidEntitlementMinor: toSafeMinor(entitled > paid ? entitled - paid : 0n),
    rule,
  };
}
