// Guard rails: warnings (never refusals) for settings that are allowed but unusual, so a slip such
// as 1,000 % for 10 % is seen before a client sees it. Thresholds are ours (common sense for a small
// studio, not a trade rule): a rush fee above the labour it speeds up, a deposit above three quarters.
// Integer arithmetic only: percentages are read exactly (lib/core/pricing/decimal.ts).
import { parseExactDecimal } from "./decimal";
import { divideRounded } from "./rounding";

/** Warn when a rush fee is more than this share of the labour (exactly 100 % is not warned). */
export const RUSH_FEE_WARN_ABOVE_PERCENT = 100;
/** Warn when a deposit is more than this share of the total (exactly 75 % is not warned). */
export const DEPOSIT_WARN_ABOVE_PERCENT = 75;

export type GuardRailField = "rushFee" | "depositPercent";

export interface GuardRailWarning {
  field: GuardRailField;
  message: string;
}

export interface GuardRailInput {
  /** the deposit as a percentage of the total, as typed */
  depositPercent?: number | string | null;
  /** or the deposit as a quote carries it, parts per million of the total */
  depositPpm?: number | null;
  /** a rush fee as a percentage of the labour, as typed */
  rushFeePercentOfLabour?: number | string | null;
  /** or a fixed rush fee beside the labour it is charged on (minor units) */
  rushFee?: { feeMinor: number; labourMinor: number } | null;
}

/** An exact decimal read from what was typed, or null when it does not read as one (the form's validation says why). */
function readPercent(value: number | string | null | undefined): { units: bigint; scale: bigint } | null {
  if (value === null || value === undefined || (typeof value === "string" && value.trim() === "")) return null;
  try {
    const d = parseExactDecimal(typeof value === "string" ? value.trim().replace(",", ".") : value, "percent", 12);
    return { units: d.units, scale: 10n ** BigInt(d.scale) };
  } catch {
    return null;
  }
}

/** True when value (units / scale) is strictly above a whole-number limit: units > limit × scale. */
const above = (v: { units: bigint; scale: bigint }, limit: number) => v.units > BigInt(limit) * v.scale;

/** The warnings for these settings; an empty list when nothing is unusual. */
export function getGuardRailWarnings(input: GuardRailInput): GuardRailWarning[] {
  const out: GuardRailWarning[] = [];

  const deposit =
    input.depositPpm !== null && input.depositPpm !== undefined && Number.isSafeInteger(input.depositPpm)
      ? { units: BigInt(input.depositPpm), scale: 10_000n } // ppm ÷ 10 000 = percent
      : readPercent(input.depositPercent);
  if (deposit && above(deposit, DEPOSIT_WARN_ABOVE_PERCENT)) {
    out.push({
      field: "depositPercent",
      message: `A deposit over ${DEPOSIT_WARN_ABOVE_PERCENT} % of the total is unusual: clients may balk at paying almost everything up front. Check that it is meant; you can still save it.`,
    });
  }

  const rushPercent = readPercent(input.rushFeePercentOfLabour);
  if (rushPercent && above(rushPercent, RUSH_FEE_WARN_ABOVE_PERCENT)) {
    out.push({ field: "rushFee", message: rushMessage(null) });
  } else if (input.rushFee && Number.isSafeInteger(input.rushFee.feeMinor) && Number.isSafeInteger(input.rushFee.labourMinor)) {
    const fee = BigInt(input.rushFee.feeMinor);
    const labour = BigInt(input.rushFee.labourMinor);
    // fee / labour > 100 % ⇔ fee × 100 > labour × 100 ⇔ fee > labour (no division, no float).
    if (fee > 0n && fee * 100n > labour * BigInt(RUSH_FEE_WARN_ABOVE_PERCENT)) {
      out.push({ field: "rushFee", message: rushMessage(labour > 0n ? divideRounded(fee * 1000n, labour) : null) });
    }
  }
  return out;
}

/** tenths: the fee as tenths of a percent of the labour (rounded), or null when there is no labour. */
function rushMessage(tenths: bigint | null): string {
  let share = "more than the labour";
  if (tenths !== null) {
    const whole = tenths / 10n;
    const tenth = tenths % 10n;
    share = tenths <= BigInt(RUSH_FEE_WARN_ABOVE_PERCENT) * 10n ? `just over ${RUSH_FEE_WARN_ABOVE_PERCENT} % of the labour` : `${whole.toString()}${tenth ? `.${tenth.toString()}` : ""} % of the labour`;
  }
  return `This rush fee is ${share}; over ${RUSH_FEE_WARN_ABOVE_PERCENT} % is unusual. Check that it is meant; you can still save it.`;
}
