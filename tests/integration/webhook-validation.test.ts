// Signed provider events of the wrong shape are refused with 400 and recorded as rejected (never a
// 500 the provider would retry for ever, never a partial write); types Darnwell does not use are
// acknowledged and recorded as ignored; well-formed events are applied as before.
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { eq, like } from "drizzle-orm";
import Stripe from "stripe";
import { beforeAll, describe, expect, test } from "vitest";
import { POST as webhookPOST } from "@/app/api/payments/webhook/route";
import { db } from "@/db";
import { commissionEvents, invoices, payments, webhookEvents } from "@/db/schema";
import { makeWorld, type World } from "./helpers";

// Read lazily by lib/env on first use, which comes after this line.
process.env.STRIPE_SECRET_KEY = `sk_test_${randomBytes(12).toString("hex")}`;
process.env.STRIPE_WEBHOOK_SECRET = `whsec_${randomBytes(12).toString("hex")}`;
const signer = new Stripe("sk_test_signer");
const sign = (payload: string) => signer.webhooks.generateTestHeaderString({ payload, secret: process.env.STRIPE_WEBHOOK_SECRET! });

const deliver = (payload: string, signature = sign(payload)) =>
  webhookPOST(new Request("http://127.0.0.1/api/payments/webhook", { method: "POST", headers: { "stripe-signature": signature, "content-type": "application/json" }, body: payload }));

const evId = () => `evt_${randomBytes(8).toString("hex")}`;
const event = (type: string, object: unknown, extra: Record<string, unknown> = {}) =>
  JSON.stringify({ id: evId(), object: "event", type, data: { object }, created: 1, livemode: false, pending_webhooks: 1, request: null, ...extra });

let w: World;
let paymentId: string;
let sessionId: string;

beforeAll(async () => {
  w = await makeWorld();
  sessionId = `cs_test_${randomBytes(6).toString("hex")}`;
  const [p] = await db
    .insert(payments)
    .values({ studioId: w.studioId, commissionId: w.commissionA, kind: "deposit", amountMinor: 5000, currency: "GBP", minorDigits: 2, checkoutSessionId: sessionId, idempotencyKey: `it-${randomUUID()}` })
    .returning();
  paymentId = p.id;
});

const session = (extra: Record<string, unknown> = {}) => ({
  id: sessionId,
  object: "checkout.session",
  metadata: { paymentId },
  payment_status: "paid",
  payment_intent: "pi_test_1",
  amount_total: 5000,
  currency: "gbp",
  ...extra,
});

async function untouched() {
  const [p] = await db.select().from(payments).where(eq(payments.id, paymentId));
  expect(p.status).toBe("open");
  expect(await db.select().from(invoices).where(eq(invoices.commissionId, w.commissionA))).toHaveLength(0);
  expect(await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, w.commissionA))).toHaveLength(0);
}

describe("webhook events: shape checked after the signature", { timeout: 60_000 }, () => {
  const malformed: [string, string][] = [
    ["an amount as text", event("checkout.session.completed", session({ amount_total: "5000" }))],
    ["an amount past the integer range", event("checkout.session.completed", session({ amount_total: 2 ** 40 }))],
    ["a negative amount", event("checkout.session.completed", session({ amount_total: -1 }))],
    ["no data object", JSON.stringify({ id: evId(), type: "checkout.session.completed" })],
    ["no session id", event("checkout.session.expired", session({ id: undefined }))],
    ["a NUL in the session id", event("checkout.session.completed", session({ id: `${sessionId}\u0000` }))],
    ["a lone surrogate in metadata", event("checkout.session.completed", session({ metadata: { paymentId: "\ud800x" } }))],
    ["no event id", JSON.stringify({ type: "checkout.session.completed", data: { object: session() } })],
    ["an event id that is a number", event("checkout.session.completed", session(), { id: 42 })],
    ["a refund list that is not a list", event("charge.refunded", { payment_intent: "pi_x", amount: 5000, currency: "gbp", amount_refunded: 10, refunds: { data: "all" } })],
    ["a currency that is not a code", event("checkout.session.completed", session({ currency: "pounds" }))],
    ["an array for the event", JSON.stringify([1, 2, 3])],
    ["not JSON at all", "{ this is not json"],
    ["JSON null", "null"],
  ];

  test.each(malformed)("signed but %s: 400, recorded as rejected, nothing applied", async (_what, payload) => {
    const res = await deliver(payload);
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: string; detail: string };
    expect(body.error).toMatch(/malformed/);
    expect(body.detail.length).toBeGreaterThan(0);
    await untouched();
    // the same body again is refused again, and recorded once (keyed by the body's hash)
    expect((await deliver(payload)).status).toBe(400);
    const rows = await db.select().from(webhookEvents).where(eq(webhookEvents.id, `rejected_${createHash("sha256").update(payload).digest("hex").slice(0, 40)}`));
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ status: "rejected", detail: body.detail, processedAt: null });
  });

  test("a rejected row keeps the claimed type and why; no processed row is written", async () => {
    const id = evId();
    const payload = JSON.stringify({ id, object: "event", type: "checkout.session.completed", data: { object: session({ amount_total: "lots" }) } });
    expect((await deliver(payload)).status).toBe(400);
    const rejected = await db.select().from(webhookEvents).where(like(webhookEvents.id, "rejected_%"));
    const mine = rejected.find((r) => (r.payload as { id?: string }).id === id)!;
    expect(mine).toMatchObject({ status: "rejected", type: "checkout.session.completed", processedAt: null });
    expect(mine.detail).toMatch(/amount_total/);
    expect(await db.select().from(webhookEvents).where(eq(webhookEvents.id, id))).toHaveLength(0);
  });

  test("a bad signature is still 400 and not recorded at all", async () => {
    const payload = event("checkout.session.completed", session({ amount_total: "x" }));
    const before = (await db.select().from(webhookEvents)).length;
    expect((await deliver(payload, "t=1,v1=00")).status).toBe(400);
    expect((await db.select().from(webhookEvents)).length).toBe(before);
  });

  test("a type Darnwell does not use is acknowledged and recorded once as ignored", async () => {
    const payload = event("customer.created", { id: "cus_1", object: "customer", email: "x@example.test" });
    const id = (JSON.parse(payload) as { id: string }).id;
    const res = await deliver(payload);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ received: true, ignored: expect.stringContaining("customer.created") });
    const again = await deliver(payload);
    expect(again.status).toBe(200);
    expect(await again.json()).toMatchObject({ duplicate: true });
    const rows = await db.select().from(webhookEvents).where(eq(webhookEvents.id, id));
    expect(rows).toHaveLength(1);
    expect(rows[0].status).toBe("ignored");
    await untouched();
  });

  test("a payment id that only looks like a uuid is an unknown payment, not a crash", async () => {
    const payload = event("payment_intent.payment_failed", { id: "pi_nobody", metadata: { paymentId: "-".repeat(36) } });
    const res = await deliver(payload);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ ignored: "unknown payment" });
  });

  test("a body over 1 MB is 413 and not recorded", async () => {
    const payload = event("customer.created", { id: "cus_big", note: "x".repeat(1024 * 1024) });
    const res = await deliver(payload);
    expect(res.status).toBe(413);
    expect(await db.select().from(webhookEvents).where(eq(webhookEvents.id, (JSON.parse(payload) as { id: string }).id))).toHaveLength(0);
  });

  test("a well-formed event with extra fields is applied and recorded as processed", async () => {
    const payload = event("checkout.session.expired", session({ status: "expired", payment_status: "unpaid", something_new: { deep: [1, "two\u0000"] } }));
    const id = (JSON.parse(payload) as { id: string }).id;
    const res = await deliver(payload);
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ expired: paymentId });
    const [row] = await db.select().from(webhookEvents).where(eq(webhookEvents.id, id));
    expect(row.status).toBe("processed");
    expect(row.processedAt).not.toBeNull();
    expect((await db.select().from(payments).where(eq(payments.id, paymentId)))[0].status).toBe("expired");
  });
});
