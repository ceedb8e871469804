// Quotes, payments, invoices and receipts against the real database, the local mail service and
// the local payments fake, through the official Stripe SDK. The fake delivers its signed webhooks
// straight into the app's webhook route handler.
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissionEvents, commissions, invoices, payments, quoteVersions, studios, webhookEvents, yarnLots, yarnReservations, yarns } from "@/db/schema";
import type { Quote } from "@/lib/core/pricing/build-quote";
import type { QuoteDraftBody } from "@/lib/schemas/quotes";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { AppError } from "@/lib/server/errors";
import { allocateDocumentNumber, issueDocument, refundByPolicy, renderDocumentPdf, requestBalance, startCheckout } from "@/lib/server/payments";
import { acceptQuote, renderQuotePdf, requestQuoteChanges, saveQuoteDraft, sendQuote } from "@/lib/server/quotes";
import { updateStudioSettings } from "@/lib/server/settings";
import type { PaymentsFake } from "@/scripts/fakes/payments";
import { paymentsFakeForFile } from "./payments-fake";
import Stripe from "stripe";
import { GET as paymentsGET } from "@/app/api/payments/route";
import { GET as exportGET } from "@/app/api/payments/export/route";
import { GET as quotePdfGET } from "@/app/api/quotes/[id]/pdf/route";
import { GET as docPdfGET } from "@/app/api/documents/[id]/pdf/route";
import { POST as quotesPOST } from "@/app/api/commissions/[id]/quotes/route";
import { makeWorld, requestWith, signIn, waitForMail, type World } from "./helpers";

const payFake = paymentsFakeForFile();
const { secret: SECRET, hook } = payFake;
let fake: PaymentsFake;
beforeAll(() => {
  fake = payFake.fake();
});

async function setup(opts: { depositPercent?: number; refundBeforeKnitting?: number } = {}) {
  const w = await makeWorld();
  const [y] = await db
    .insert(yarns)
    .values({ studioId: w.studioId, name: "Test 4-ply", colourName: "Loch blue", hex: "#2E5A7A", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: 850 })
    .returning();
  await db.insert(yarnLots).values({ yarnId: y.id, lotCode: "L1", stockSkeins: 10 });
  await db.update(studios).set({ taxNumber: "GB 123 4567 89", address: "The Byre, Hollin" }).where(eq(studios.id, w.studioId));
  const owner = await w.actor(w.owner.id);
  await updateStudioSettings(owner, w.studioId, {
    hourlyRateMinor: 2000,
    taxRatePercent: 20,
    pricesIncludeTax: false,
    depositPercent: opts.depositPercent ?? 50,
    depositRefundBeforeKnittingPercent: opts.refundBeforeKnitting ?? 100,
  });
  return { w, yarnId: y.id, owner };
}

function draft(yarnId: string, extra: Partial<QuoteDraftBody> = {}): QuoteDraftBody {
  return quoteDraftSchema.parse({
    pieces: [{ label: "Left mitten", plainStitches: 1800, strandedStitches: 2600, duplicateStitches: 60, ends: 6, thumbs: 1 }],
    materials: [{ yarnId, skeins: 2 }],
    extras: [{ label: "Gift wrap", amountMinor: 400 }],
    shippingMinor: 450,
    ...extra,
  });
}

/** A sent and accepted quote on commission A; returns the payment opened for the deposit. */
async function accepted(w: World, yarnId: string) {
  const owner = await w.actor(w.owner.id);
  const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId));
  await sendQuote(owner, v.id);
  const client = await w.actor(w.clientA.id);
  const r = await acceptQuote(client, { quoteId: v.id, name: "Client A" });
  return { v, client, owner, paymentId: r.paymentId! };
}

async function payOnHostedPage(url: string, card = "4242 4242 4242 4242") {
  const res = await fetch(url, { method: "POST", body: new URLSearchParams({ card, action: "pay" }), redirect: "manual" });
  await fake.idle();
  return res;
}

const state = async (id: string) => (await db.select({ s: commissions.state }).from(commissions).where(eq(commissions.id, id)))[0].s;
const paymentRow = async (id: string) => (await db.select().from(payments).where(eq(payments.id, id)))[0];

describe("quotes", { timeout: 60_000 }, () => {
  test("the owner drafts and sends a version: frozen, mailed with its PDF, commission moved; the assistant may not", async () => {
    const { w, yarnId, owner } = await setup();
    const assistant = await w.actor(w.assistant.id);
    await expect(saveQuoteDraft(assistant, w.commissionA, draft(yarnId))).rejects.toMatchObject({ status: 403 });
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId));
    expect(v.status).toBe("draft");
    const again = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, { discountMinor: 500 }));
    expect(again.id).toBe(v.id); // an unsent draft is replaced, not multiplied
    await expect(sendQuote(assistant, v.id)).rejects.toMatchObject({ status: 403 });
    const sent = await sendQuote(owner, v.id);
    expect(sent.status).toBe("sent");
    expect(sent.validUntil).toBeTruthy();
    expect(await state(w.commissionA)).toBe("quote_sent");
    await expect(sendQuote(owner, v.id)).rejects.toMatchObject({ status: 409 });
    // a new version starts from the sent one, which never changes
    const v2 = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, { shippingMinor: 900 }));
    expect(v2.number).toBe(2);
    const [still] = await db.select().from(quoteVersions).where(eq(quoteVersions.id, v.id));
    expect(still.totalMinor).toBe(sent.totalMinor);
    const mail = await waitForMail(w.clientA.email, (m) => m.subject.startsWith("Your quote from"));
    expect(mail.text).toContain("/portal/commissions/");
    const res = await fetch(`${process.env.LOCAL_MAIL_API}/messages?to=${encodeURIComponent(w.clientA.email)}`);
    const full = (await res.json()) as { attachments: { filename: string; contentType: string }[] }[];
    expect(full.some((m) => m.attachments.some((a) => a.contentType === "application/pdf"))).toBe(true);
  });

  test("bad input is refused with a clear message and nothing saved", async () => {
    const { w, yarnId, owner } = await setup();
    await expect(saveQuoteDraft(owner, w.commissionA, draft(yarnId, { discountMinor: 99_999_999 }))).rejects.toMatchObject({ status: 422, code: "invalid_quote" });
    // The refusal is in money, on the discount field (the builder shows it there).
    const refusal = (await saveQuoteDraft(owner, w.commissionA, draft(yarnId, { discountMinor: 99_999_999 })).then(
      () => ({ message: "saved", fieldErrors: undefined }),
      (e: unknown) => e as { message: string; fieldErrors?: Record<string, string[]> },
    ));
    expect(refusal.message).toMatch(/^The discount \(£999,999\.99\) is larger than the work and materials \(£[\d,]+\.\d\d\)/);
    expect(refusal.fieldErrors?.discountMinor?.[0]).toBe(refusal.message);
    // A message over the limit is refused on its field, in words.
    const long = quoteDraftSchema.safeParse({ ...draft(yarnId), messageToClient: "m".repeat(2001) });
    expect(long.success ? [] : long.error.issues.map((i) => [i.path.join("."), i.message])).toEqual([["messageToClient", "Keep the message to 2,000 characters or fewer."]]);
    await expect(saveQuoteDraft(owner, w.commissionA, draft(yarnId, { validUntil: "2001-01-01" }))).rejects.toMatchObject({ status: 422 });
    expect(await db.select().from(quoteVersions).where(eq(quoteVersions.commissionId, w.commissionA))).toHaveLength(0);
    expect(quoteDraftSchema.safeParse({ ...draft(yarnId), pieces: [{ label: "x", plainStitches: -3 }] }).success).toBe(false);
  });

  test("accepting records name, time and version, reserves yarn and opens the deposit; twice, superseded or expired is refused", async () => {
    const { w, yarnId } = await setup();
    const { v, client, owner, paymentId } = await accepted(w, yarnId);
    const [row] = await db.select().from(quoteVersions).where(eq(quoteVersions.id, v.id));
    expect(row).toMatchObject({ status: "accepted", acceptedName: "Client A", acceptedBy: w.clientA.id });
    expect(row.acceptedAt).toBeInstanceOf(Date);
    const p = await paymentRow(paymentId);
    expect(p).toMatchObject({ kind: "deposit", status: "open", amountMinor: row.depositMinor });
    const res = await db.select().from(yarnReservations).where(eq(yarnReservations.commissionId, w.commissionA));
    expect(res.map((r) => r.skeins)).toEqual([2]);
    await expect(acceptQuote(client, { quoteId: v.id, name: "Client A" })).rejects.toMatchObject({ status: 409, message: expect.stringContaining("accepted") });
    expect(await db.select().from(payments).where(eq(payments.commissionId, w.commissionA))).toHaveLength(1);
    // another client cannot see or accept it
    const b = await w.actor(w.clientB.id);
    await expect(acceptQuote(b, { quoteId: v.id, name: "B" })).rejects.toMatchObject({ status: 404 });
    void owner;
  });

  test("a superseded or expired version cannot be accepted, and nothing changes", async () => {
    const { w, yarnId, owner } = await setup();
    const client = await w.actor(w.clientA.id);
    const v1 = await saveQuoteDraft(owner, w.commissionA, draft(yarnId));
    await sendQuote(owner, v1.id);
    const v2 = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, { shippingMinor: 800 }));
    await sendQuote(owner, v2.id);
    await expect(acceptQuote(client, { quoteId: v1.id, name: "Client A" })).rejects.toMatchObject({ status: 409, message: expect.stringContaining("replaced") });
    await db.update(quoteVersions).set({ validUntil: "2020-01-01" }).where(eq(quoteVersions.id, v2.id));
    await expect(acceptQuote(client, { quoteId: v2.id, name: "Client A" })).rejects.toMatchObject({ status: 409, message: expect.stringContaining("expired") });
    const [after] = await db.select().from(quoteVersions).where(eq(quoteVersions.id, v2.id));
    expect(after.status).toBe("sent");
    expect(await db.select().from(payments).where(eq(payments.commissionId, w.commissionA))).toHaveLength(0);
    // asking for changes moves it back to the studio
    await db.update(quoteVersions).set({ validUntil: "2099-01-01" }).where(eq(quoteVersions.id, v2.id));
    await requestQuoteChanges(client, { quoteId: v2.id, changes: "Could the cuffs be longer?" });
    expect(await state(w.commissionA)).toBe("quoting");
  });

  test("quote money holds on every stored version: lines sum to the subtotal, deposit + balance = total", async () => {
    const { w, yarnId, owner } = await setup();
    for (const extra of [{}, { discountMinor: 333 }, { shippingMinor: 1 }, { requestedDate: "2027-01-01", earliestDate: "2027-02-01" }]) {
      const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, extra));
      const q = v.result as unknown as Quote;
      expect(q.lines.reduce((s, l) => s + l.amountMinor, 0)).toBe(q.subtotalMinor);
      expect(q.subtotalMinor + q.taxMinor).toBe(q.totalMinor);
      expect(v.depositMinor + v.balanceMinor).toBe(v.totalMinor);
      if ("requestedDate" in extra) expect(q.lines.some((l) => l.kind === "rush")).toBe(true);
    }
  });
});

describe("payments through the SDK and the fake", { timeout: 60_000 }, () => {
  test("deposit: pay on the hosted page, the signed webhook books the commission and issues a receipt", async () => {
    const { w, yarnId } = await setup();
    const { client, paymentId } = await accepted(w, yarnId);
    const { url } = await startCheckout(client, w.commissionA, "deposit");
    expect(url).toContain(`${fake.url}/pay/cs_test_`);
    const page = await fetch(url);
    expect(await page.text()).toContain("Pay");
    const res = await payOnHostedPage(url);
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toContain(`/portal/commissions/${w.commissionA}`);
    const p = await paymentRow(paymentId);
    expect(p.status).toBe("paid");
    expect(p.paymentIntentId).toMatch(/^pi_/);
    expect(await state(w.commissionA)).toBe("booked");
    const docs = await db.select().from(invoices).where(eq(invoices.commissionId, w.commissionA));
    expect(docs.map((d) => d.kind)).toEqual(["receipt"]);
    await waitForMail(w.clientA.email, (m) => m.subject.startsWith("Receipt RCT-"));

    // the same event delivered three more times records one payment, one receipt
    const ev = fake.state.events.find((e) => e.type === "checkout.session.completed" && e.payload.includes(paymentId))!;
    for (let i = 0; i < 3; i++) {
      const again = await hook(ev.payload, fake.signPayload(ev.payload));
      expect(again.status).toBe(200);
      expect(await again.json()).toMatchObject({ duplicate: true });
    }
    expect(await db.select().from(payments).where(and(eq(payments.commissionId, w.commissionA), eq(payments.status, "paid")))).toHaveLength(1);
    expect(await db.select().from(invoices).where(eq(invoices.commissionId, w.commissionA))).toHaveLength(1);
    await expect(startCheckout(client, w.commissionA, "deposit")).rejects.toMatchObject({ status: 409 });
  });

  test("a tampered signature is refused with 400 and changes nothing", async () => {
    const { w, yarnId } = await setup();
    const { client, paymentId } = await accepted(w, yarnId);
    fake.setAutoDeliver(false);
    try {
      const { url } = await startCheckout(client, w.commissionA, "deposit");
      await payOnHostedPage(url);
      const ev = fake.state.events.find((e) => e.type === "checkout.session.completed" && e.payload.includes(paymentId))!;
      const sig = fake.signPayload(ev.payload);
      const tampered = ev.payload.replace(/"amount_total": \d+/, '"amount_total": 1');
      expect((await hook(tampered, sig)).status).toBe(400);
      expect((await hook(ev.payload, sig.replace(/v1=./, "v1=0"))).status).toBe(400);
      expect((await hook(ev.payload, "")).status).toBe(400);
      expect((await paymentRow(paymentId)).status).toBe("open");
      expect(await db.select().from(webhookEvents).where(eq(webhookEvents.id, ev.id))).toHaveLength(0);
      expect(await state(w.commissionA)).toBe("quote_sent");
      // the genuine one still works afterwards
      expect(await fake.deliverEvent(ev.id)).toBe(200);
      expect((await paymentRow(paymentId)).status).toBe("paid");
    } finally {
      fake.setAutoDeliver(true);
    }
  });

  test("events out of order end in the right state; a declined card and an unknown session are handled", async () => {
    const { w, yarnId } = await setup();
    const { client, paymentId } = await accepted(w, yarnId);
    fake.setAutoDeliver(false);
    try {
      const { url } = await startCheckout(client, w.commissionA, "deposit");
      const declined = await payOnHostedPage(url, "4000 0000 0000 0002");
      expect(declined.status).toBe(402);
      expect(await declined.text()).toContain("declined");
      await payOnHostedPage(url);
      const mine = fake.state.events.filter((e) => e.payload.includes(paymentId));
      const failed = mine.find((e) => e.type === "payment_intent.payment_failed")!;
      const completed = mine.find((e) => e.type === "checkout.session.completed")!;
      // completed first, then the older failure: still paid
      expect(await fake.deliverEvent(completed.id)).toBe(200);
      expect(await fake.deliverEvent(failed.id)).toBe(200);
      expect((await paymentRow(paymentId)).status).toBe("paid");
      expect(await state(w.commissionA)).toBe("booked");
      // an expiry that arrives after the payment changes nothing
      const s = fake.state.sessions[(await paymentRow(paymentId)).checkoutSessionId!];
      const expiredLate = JSON.stringify({ id: `evt_late_${randomBytes(4).toString("hex")}`, object: "event", type: "checkout.session.expired", data: { object: { ...s, status: "expired" } }, created: 1, livemode: false, api_version: "2025-10-29.clover", pending_webhooks: 1, request: null });
      expect((await hook(expiredLate, fake.signPayload(expiredLate))).status).toBe(200);
      expect((await paymentRow(paymentId)).status).toBe("paid");
      const unknown = JSON.stringify({ id: `evt_unknown_${randomBytes(4).toString("hex")}`, object: "event", type: "checkout.session.completed", data: { object: { id: "cs_test_nope", object: "checkout.session", metadata: {}, payment_status: "paid", amount_total: 100, currency: "gbp" } }, created: 1, livemode: false, api_version: "2025-10-29.clover", pending_webhooks: 1, request: null });
      const r = await hook(unknown, fake.signPayload(unknown));
      expect(r.status).toBe(200);
      expect(await r.json()).toMatchObject({ ignored: "unknown session" });
    } finally {
      fake.setAutoDeliver(true);
    }
  });

  test("refunds follow the policy (half the deposit before knitting), never more than paid, and the refund webhook agrees", async () => {
    const { w, yarnId } = await setup({ refundBeforeKnitting: 50 });
    const { client, owner, paymentId } = await accepted(w, yarnId);
    fake.setAutoDeliver(false);
    try {
      const { url } = await startCheckout(client, w.commissionA, "deposit");
      await payOnHostedPage(url);
      const completed = fake.state.events.find((e) => e.type === "checkout.session.completed" && e.payload.includes(paymentId))!;
      expect(await fake.deliverEvent(completed.id)).toBe(200);
      const out = await refundByPolicy(owner, w.commissionA, { cancel: true, reason: "changed their mind" });
      const p = await paymentRow(paymentId);
      expect(out.stage).toBe("accepted");
      // policy: half the deposit comes back before knitting
      expect(out.refundMinor).toBe(Math.round(p.amountMinor / 2));
      expect(p.refundedMinor).toBe(out.refundMinor);
      expect(p.status).toBe("partially_refunded");
      expect(await state(w.commissionA)).toBe("cancelled");
      const refundEv = fake.state.events.find((e) => e.type === "charge.refunded" && e.payload.includes(p.paymentIntentId!))!;
      expect(await fake.deliverEvent(refundEv.id)).toBe(200);
      expect((await paymentRow(paymentId)).refundedMinor).toBe(out.refundMinor);
      // asking again refunds nothing more: never more than the policy, never more than paid
      const again = await refundByPolicy(owner, w.commissionA);
      expect(again.refunds).toEqual([]);
      expect((await paymentRow(paymentId)).refundedMinor).toBe(out.refundMinor);
    } finally {
      fake.setAutoDeliver(true);
    }
  });

  test("the fake answering 500 or losing the answer: a clear message, then one session with the same key", async () => {
    const { w, yarnId } = await setup();
    const { client, paymentId } = await accepted(w, yarnId);
    const before = Object.keys(fake.state.sessions).length;
    await startCheckout(client, w.commissionA, "deposit").catch(() => undefined); // creates the customer
    const [p0] = await db.select().from(payments).where(eq(payments.id, paymentId));
    expect(p0.checkoutSessionId).toBeTruthy();
    // a second commission's checkout with every attempt failing
    const w2 = await setup();
    const a2 = await accepted(w2.w, w2.yarnId);
    fake.injectFault("error", 3); // the SDK tries three times
    const err = await startCheckout(a2.client, w2.w.commissionA, "deposit").catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(503);
    expect((err as AppError).message).toMatch(/did not answer.*try again/);
    expect((await paymentRow(a2.paymentId)).checkoutSessionId).toBeNull();
    // the answer is lost after the session was made: the SDK's retry gets the same session back
    fake.injectFault("error_after", 1);
    const ok = await startCheckout(a2.client, w2.w.commissionA, "deposit");
    const sessionsFor = Object.values(fake.state.sessions).filter((s) => (s.metadata as Record<string, string>).paymentId === a2.paymentId);
    expect(sessionsFor).toHaveLength(1);
    expect(ok.url).toContain(String(sessionsFor[0].id));
    expect(Object.keys(fake.state.sessions).length).toBe(before + 2);
  });

  test("balance: invoice when ready, paid through checkout, commission moves to balance paid", async () => {
    const { w, yarnId } = await setup();
    const { client, owner, paymentId } = await accepted(w, yarnId);
    await payOnHostedPage((await startCheckout(client, w.commissionA, "deposit")).url);
    await expect(requestBalance(owner, w.commissionA)).rejects.toMatchObject({ status: 409 });
    await db.update(commissions).set({ state: "ready" }).where(eq(commissions.id, w.commissionA));
    const assistant = await w.actor(w.assistant.id);
    await expect(requestBalance(assistant, w.commissionA)).rejects.toMatchObject({ status: 403 });
    const { invoiceId, paymentId: balanceId } = await requestBalance(owner, w.commissionA);
    const [inv] = await db.select().from(invoices).where(eq(invoices.id, invoiceId!));
    const deposit = await paymentRow(paymentId);
    const bal = await paymentRow(balanceId!);
    const [v] = await db.select().from(quoteVersions).where(eq(quoteVersions.commissionId, w.commissionA));
    expect(deposit.amountMinor + bal.amountMinor).toBe(v.totalMinor);
    expect(inv.totalMinor).toBe(bal.amountMinor);
    await waitForMail(w.clientA.email, (m) => m.subject.startsWith("Invoice INV-"));
    await payOnHostedPage((await startCheckout(client, w.commissionA, "balance")).url);
    expect((await paymentRow(balanceId!)).status).toBe("paid");
    expect(await state(w.commissionA)).toBe("balance_paid");
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, w.commissionA));
    expect(events.filter((e) => e.toState === "balance_paid")).toHaveLength(1);

    // each document renders to a PDF and a PNG for the test artefacts
    mkdirSync("test-results/pdf", { recursive: true });
    const docs = await db.select().from(invoices).where(eq(invoices.commissionId, w.commissionA));
    const files: [string, Buffer][] = [["quote", await renderQuotePdf(v)]];
    for (const d of docs) files.push([`${d.kind}-${d.number}`, await renderDocumentPdf(d)]);
    for (const [name, buf] of files) {
      expect(buf.subarray(0, 5).toString()).toBe("%PDF-");
      writeFileSync(`test-results/pdf/money-${name}.pdf`, buf);
      execFileSync("pdftoppm", ["-png", "-r", "60", "-singlefile", `test-results/pdf/money-${name}.pdf`, `test-results/pdf/money-${name}`]);
    }
    expect(docs.map((d) => d.kind).sort()).toEqual(["invoice", "receipt", "receipt"]);
  });
});

describe("out of order and through the routes", { timeout: 60_000 }, () => {
  test("a refund event that overtakes the payment's own event: paid, then partly refunded, commission booked", async () => {
    const { w, yarnId } = await setup();
    const { client, paymentId } = await accepted(w, yarnId);
    fake.setAutoDeliver(false);
    try {
      const { url } = await startCheckout(client, w.commissionA, "deposit");
      await payOnHostedPage(url);
      const p0 = await paymentRow(paymentId);
      const session = fake.state.sessions[p0.checkoutSessionId!];
      const u = new URL(fake.url);
      const sdk = new Stripe(SECRET, { host: u.hostname, port: Number(u.port), protocol: "http" });
      await sdk.refunds.create({ payment_intent: String(session.payment_intent), amount: 100 });
      const mine = fake.state.events.filter((e) => e.payload.includes(String(session.payment_intent)) || e.payload.includes(paymentId));
      const refunded = mine.find((e) => e.type === "charge.refunded")!;
      const completed = mine.find((e) => e.type === "checkout.session.completed")!;
      expect(await fake.deliverEvent(refunded.id)).toBe(200);
      expect(await fake.deliverEvent(completed.id)).toBe(200);
      const p = await paymentRow(paymentId);
      expect(p).toMatchObject({ status: "partially_refunded", refundedMinor: 100 });
      expect(await state(w.commissionA)).toBe("booked");
      expect(await db.select().from(invoices).where(eq(invoices.commissionId, w.commissionA))).toHaveLength(1);
    } finally {
      fake.setAutoDeliver(true);
    }
  });

  test("routes: the owner lists and exports payments and builds quotes; the assistant may not; documents only for their own client", async () => {
    const { w, yarnId } = await setup();
    const { client, v } = await accepted(w, yarnId);
    await payOnHostedPage((await startCheckout(client, w.commissionA, "deposit")).url);
    const owner = await signIn(w.owner.email);
    const assistant = await signIn(w.assistant.email);
    const a = await signIn(w.clientA.email);
    const b = await signIn(w.clientB.email);
    const noParams = { params: Promise.resolve({}) };
    const list = await paymentsGET(requestWith(owner, "/api/payments?status=paid"), noParams);
    expect(list.status).toBe(200);
    const body = (await list.json()) as { payments: { status: string }[] };
    expect(body.payments.map((x) => x.status)).toEqual(["paid"]);
    expect((await paymentsGET(requestWith(assistant, "/api/payments"), noParams)).status).toBe(403);
    expect((await paymentsGET(requestWith(owner, "/api/payments?from=2027-02-01&to=2027-01-01"), noParams)).status).toBe(422);
    const csv = await exportGET(requestWith(owner, "/api/payments/export"), noParams);
    expect(csv.headers.get("content-type")).toContain("text/csv");
    const text = await csv.text();
    expect(text.split("\r\n")[0]).toBe("created,paid,commission,client,kind,status,currency,amount,refunded");
    expect(text).toContain(",deposit,paid,GBP,");
    const post = await quotesPOST(
      requestWith(assistant, `/api/commissions/${w.commissionB}/quotes`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(draft(yarnId)) }),
      { params: Promise.resolve({ id: w.commissionB }) },
    );
    expect(post.status).toBe(403);
    const bad = await quotesPOST(
      requestWith(owner, `/api/commissions/${w.commissionB}/quotes`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ ...draft(yarnId), pieces: [] }) }),
      { params: Promise.resolve({ id: w.commissionB }) },
    );
    expect(bad.status).toBe(422);
    expect(((await bad.json()) as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors.pieces).toBeTruthy();
    const pdf = await quotePdfGET(requestWith(a, `/api/quotes/${v.id}/pdf`), { params: Promise.resolve({ id: v.id }) });
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("content-type")).toBe("application/pdf");
    expect((await quotePdfGET(requestWith(b, `/api/quotes/${v.id}/pdf`), { params: Promise.resolve({ id: v.id }) })).status).toBe(404);
    const [doc] = await db.select().from(invoices).where(eq(invoices.commissionId, w.commissionA));
    expect((await docPdfGET(requestWith(a, `/api/documents/${doc.id}/pdf`), { params: Promise.resolve({ id: doc.id }) })).status).toBe(200);
    expect((await docPdfGET(requestWith(b, `/api/documents/${doc.id}/pdf`), { params: Promise.resolve({ id: doc.id }) })).status).toBe(404);
  });
});

describe("document numbers", { timeout: 60_000 }, () => {
  test("20 invoices issued at once for one studio get 20 distinct consecutive numbers", async () => {
    const { w, yarnId } = await setup();
    await accepted(w, yarnId);
    const results = await Promise.all(Array.from({ length: 20 }, () => db.transaction((tx) => issueDocument(tx, { commissionId: w.commissionA, kind: "invoice" }))));
    const numbers = results.map((r) => r.number).sort((a, b) => a - b);
    expect(numbers).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    // a rolled-back issue gives its number back: no gap
    await db.transaction(async (tx) => {
      await allocateDocumentNumber(tx, w.studioId, "invoice");
      tx.rollback();
    }).catch(() => undefined);
    const next = await db.transaction((tx) => issueDocument(tx, { commissionId: w.commissionA, kind: "invoice" }));
    expect(next.number).toBe(21);
  });
});
