import { z } from "zod";
import { safeString } from "./common";
import { getMinorDigits } from "@/lib/core/pricing/currency";

/** "88.50" in a currency's major unit → integer minor units, by string (never float) arithmetic. */
export function majorToMinor(text: string, currency: string): number | null {
  const digits = getMinorDigits(currency);
  const m = text.trim().replace(/,/g, "").match(digits > 0 ? new RegExp(`^(\\d{1,9})(?:\\.(\\d{1,${digits}}))?$`) : /^(\d{1,9})$/);
  if (!m) return null;
  const frac = (m[2] ?? "").padEnd(digits, "0");
  return Number(m[1]) * 10 ** digits + (frac ? Number(frac) : 0);
}

export function priceFormSchema(currency: string) {
  const digits = getMinorDigits(currency);
  return z.object({
    commissionId: z.string().uuid(),
    price: safeString()
      .trim()
      .min(1, "Enter the agreed price.")
      .transform((v, ctx) => {
        const minor = majorToMinor(v, currency);
        if (minor === null) {
          ctx.addIssue({
            code: "custom",
            message: digits > 0 ? `Enter an amount like 88 or 88.50 (at most ${digits} decimals).` : "Enter a whole amount like 8800.",
          });
          return z.NEVER;
        }
        return minor;
      }),
  });
}

/** JSON body of PUT /api/commissions/[id]/price */
export const priceBodySchema = z.object({
  priceMinor: z.number().int("priceMinor must be a whole number of minor units").min(0).max(100_000_000),
});
