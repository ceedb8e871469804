// The provider events Darnwell acts on, checked field by field after the signature verifies: a
// signed event of the wrong shape is refused (400, recorded as rejected) rather than half applied.
// Only the fields lib/server/payments.ts reads are checked; others pass through untouched.
import { z } from "zod";

/** Text PostgreSQL can store and compare: no NUL, no lone UTF-16 surrogate. */
const safeText = (max: number) =>
  z
    .string()
    .max(max)
    .refine((s) => !/\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/.test(s), "contains characters that cannot be stored");

const id = safeText(255).min(1);
/** Minor units that fit the integer columns they are compared with and written to. */
const minor = z.number().int().min(0).max(2_147_483_647);
const currency = z.string().regex(/^[A-Za-z]{3}$/, "a three-letter currency code");
const metadata = z.record(z.string(), safeText(500)).nullish();
const expandable = z.union([id, z.looseObject({ id })]).nullish();

const checkoutSession = z.looseObject({
  id,
  metadata,
  client_reference_id: safeText(255).nullish(),
  payment_status: safeText(64).nullish(),
  payment_intent: expandable,
  amount_total: minor.nullish(),
  currency: currency.nullish(),
});

const paymentIntent = z.looseObject({
  id,
  metadata,
  last_payment_error: z.looseObject({ message: safeText(2000).nullish() }).nullish(),
});

const charge = z.looseObject({
  id: id.optional(),
  metadata,
  payment_intent: expandable,
  amount: minor,
  currency,
  amount_refunded: minor,
  refunds: z
    .looseObject({ data: z.array(z.looseObject({ id, amount: minor, reason: safeText(200).nullish() })).max(1000) })
    .nullish(),
});

const envelope = <T extends z.ZodType>(type: string, object: T) =>
  z.looseObject({ id, type: z.literal(type), data: z.looseObject({ object }) });

/** The event types handled; anything else is acknowledged and recorded as ignored. */
export const HANDLED_EVENT_TYPES = ["checkout.session.completed", "checkout.session.expired", "payment_intent.payment_failed", "charge.refunded"] as const;

export const handledEventSchema = z.discriminatedUnion("type", [
  envelope("checkout.session.completed", checkoutSession),
  envelope("checkout.session.expired", checkoutSession),
  envelope("payment_intent.payment_failed", paymentIntent),
  envelope("charge.refunded", charge),
]);

/** What every event must have, whatever its type. */
export const eventEnvelopeSchema = z.looseObject({ id, type: safeText(255).min(1), data: z.looseObject({ object: z.looseObject({}) }) });

export type HandledEvent = z.output<typeof handledEventSchema>;
