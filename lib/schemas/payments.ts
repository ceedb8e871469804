// Filters of the studio's payments table (kept in the URL) and the payment forms.
import { z } from "zod";
import { calendarDate, safeString } from "./common";

export const PAYMENT_STATUSES = ["open", "paid", "failed", "expired", "refunded", "partially_refunded"] as const;

const isoDate = calendarDate("Use a date like 2027-01-31.");

export const paymentFiltersSchema = z
  .object({
    status: z.enum(PAYMENT_STATUSES).optional().or(z.literal("").transform(() => undefined)),
    from: isoDate.optional().or(z.literal("").transform(() => undefined)),
    to: isoDate.optional().or(z.literal("").transform(() => undefined)),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { message: "The start date must be on or before the end date.", path: ["to"] });

export type PaymentFiltersInput = z.input<typeof paymentFiltersSchema>;

export const checkoutFormSchema = z.object({
  commissionId: z.string().uuid(),
  kind: z.enum(["deposit", "balance"]),
});

export const refundFormSchema = z.object({
  commissionId: z.string().uuid(),
  cancel: z.literal("on").optional(),
  reason: safeString().trim().max(500).default(""),
});

export const commissionIdFormSchema = z.object({ commissionId: z.string().uuid() });
