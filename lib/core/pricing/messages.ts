// Messages about amounts, worded for the person typing them: money in money, never in minor units.
import { formatMoney } from "./format-money";

/** "The discount (£500.00) is larger than the work and materials (£210.25) it comes off." */
export function discountTooLargeMessage(discountMinor: number, baseMinor: number, currency: string): string {
  return `The discount (${formatMoney(discountMinor, currency)}) is larger than the work and materials (${formatMoney(baseMinor, currency)}) it comes off. Lower the discount or add the work it applies to.`;
}
