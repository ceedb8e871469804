// The studio settings form (owner): typed text in, validated settings out. Shared by the form
// (react-hook-form + zod in the browser) and its server action.
import { z } from "zod";
import { safeString } from "./common";
import { RATE_KEYS } from "@/lib/core/labour/default-rates";
import { majorToMinor } from "./money";

const num = (min: number, max: number, msg: string) =>
  safeString()
    .trim()
    .min(1, "Enter a number.")
    .refine((v) => /^\d+(\.\d+)?$/.test(v) && Number(v) >= min && Number(v) <= max, msg)
    .transform(Number);

const rateFields = Object.fromEntries(
  RATE_KEYS.map((k) => [`rate_${k}`, k === "plainStitchesPerMinute" || k === "strandedStitchesPerMinute" ? num(0.01, 1000, "Use a number above 0.") : num(0, 100_000, "Use 0 or more.")]),
) as Record<`rate_${(typeof RATE_KEYS)[number]}`, ReturnType<typeof num>>;

export function settingsFormSchema(currency: string) {
  const money = (label: string) =>
    safeString()
      .trim()
      .min(1, `Enter the ${label}.`)
      .transform((v, ctx) => {
        const m = majorToMinor(v, currency);
        if (m === null) {
          ctx.addIssue({ code: "custom", message: `Enter the ${label} like 22 or 22.50.` });
          return z.NEVER;
        }
        return m;
      });
  return z.object({
    hourlyRate: money("hourly rate"),
    pricePolicy: z.enum(["p50", "p80"], { error: "Choose which labour figure prices a quote." }),
    taxRatePercent: num(0, 100, "A tax rate is between 0 and 100 %."),
    pricesIncludeTax: z.enum(["yes", "no"], { error: "Say whether prices include tax." }),
    depositPercent: num(0, 100, "A deposit is between 0 and 100 % of the total."),
    designFee: money("design fee"),
    quoteValidDays: num(1, 365, "Between 1 and 365 days.").refine(Number.isInteger, "Whole days."),
    depositRefundBeforeKnittingPercent: num(0, 100, "Between 0 and 100 %."),
    ...rateFields,
  });
}

export type SettingsFormInput = z.input<ReturnType<typeof settingsFormSchema>>;
