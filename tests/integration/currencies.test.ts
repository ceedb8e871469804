// Currencies end to end on the real database and the local payments fake: a HUF deposit (2 digits in
// ISO 4217, 0 in the runtime's locale data) and a KWD deposit (3 digits, the provider takes only
// amounts ending in 0), the exponent stored beside every amount, and the refusals for an unknown code,
// a currency the provider does not take, and stored digits that disagree with the table.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissions, invoices, payments, quoteVersions, refunds, studios, yarnLots, yarns } from "@/db/schema";
import type { Quote } from "@/lib/core/pricing/build-quote";
import type { QuoteDraftBody } from "@/lib/schemas/quotes";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { refundByPolicy, renderDocumentPdf, startCheckout } from "@/lib/server/payments";
import { acceptQuote, saveQuoteDraft, sendQuote } from "@/lib/server/quotes";
import { updateStudioSettings } from "@/lib/server/settings";
import type { PaymentsFake } from "@/scripts/fakes/payments";
import Stripe from "stripe";
import { makeWorld } from "./helpers";
import { paymentsFakeForFile } from "./payments-fake";

const payFake = paymentsFakeForFile();
let fake: PaymentsFake;
beforeAll(() => {
  fake = payFake.fake();
});

async function setup(currency: string, opts: { hourlyRateMinor?: number; unitPriceMinor?: number; refundBeforeKnitting?: number } = {}) {
  const w = await makeWorld();
  await db.update(commissions).set({ currency }).where(eq(commissions.studioId, w.studioId));
  const [y] = await db
    .insert(yarns)
    .values({ studioId: w.studioId, name: "Test 4-ply", colourName: "Loch blue", hex: "#2E5A7A", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: opts.unitPriceMinor ?? 850 })
    .returning();
  await db.insert(yarnLots).values({ yarnId: y.id, lotCode: "L1", stockSkeins: 10 });
  await db.update(studios).set({ address: "The Byre, Hollin" }).where(eq(studios.id, w.studioId));
  const owner = await w.actor(w.owner.id);
  await updateStudioSettings(owner, w.studioId, {
    hourlyRateMinor: opts.hourlyRateMinor ?? 2000,
    taxRatePercent: 0,
    pricesIncludeTax: false,
    depositPercent: 50,
    depositRefundBeforeKnittingPercent: opts.refundBeforeKnitting ?? 100,
  });
  return { w, yarnId: y.id, owner, client: await w.actor(w.clientA.id) };
}

function draft(yarnId: string, giftWrapMinor: number): QuoteDraftBody {
  return quoteDraftSchema.parse({
    pieces: [{ label: "Left mitten", plainStitches: 1800, strandedStitches: 2600, duplicateStitches: 60, ends: 6, thumbs: 1 }],
    materials: [{ yarnId, skeins: 2 }],
    extras: [{ label: "Gift wrap", amountMinor: giftWrapMinor }],
    shippingMinor: 450,
  });
}

async function payOnHostedPage(url: string) {
  const res = await fetch(url, { method: "POST", body: new URLSearchParams({ card: "4242 4242 4242 4242", action: "pay" }), redirect: "manual" });
  await fake.idle();
  return res;
}

const sessionFor = (paymentId: string) => Object.values(fake.state.sessions).find((s) => (s.metadata as Record<string, string>).paymentId === paymentId);
const rowsOf = async (commissionId: string) => ({
  quotes: await db.select().from(quoteVersions).where(eq(quoteVersions.commissionId, commissionId)),
  payments: await db.select().from(payments).where(eq(payments.commissionId, commissionId)),
  documents: await db.select().from(invoices).where(eq(invoices.commissionId, commissionId)),
});

describe("deposits in 2- and 3-digit currencies", { timeout: 60_000 }, () => {
  test("HUF: the deposit goes to the provider in hundredths of a forint (30 000 Ft would be 3 000 000), receipt and rows say 2 digits", async () => {
    // 9 000.00 Ft an hour and 3 000.00 Ft a skein: a real-sized forint quote.
    const { w, yarnId, owner, client } = await setup("HUF", { hourlyRateMinor: 900_000, unitPriceMinor: 300_000 });
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, 40_000));
    expect(v.minorDigits).toBe(2);
    expect((v.result as unknown as Quote).minorDigits).toBe(2);
    await sendQuote(owner, v.id);
    const { paymentId } = await acceptQuote(client, { quoteId: v.id, name: "Client A" });
    const { url } = await startCheckout(client, w.commissionA, "deposit");
    const s = sessionFor(paymentId!)!;
    // two-decimal at the provider: amount_total equals the stored minor units, not a hundredth of them
    expect(s.amount_total).toBe(v.depositMinor);
    expect(s.currency).toBe("huf");
    expect((await (await fetch(url)).text()).replace(/\u00a0/g, " ")).toContain(`HUF ${Math.trunc(v.depositMinor / 100).toLocaleString("en-GB")}.${String(v.depositMinor % 100).padStart(2, "0")}`);
    await payOnHostedPage(url);
    const rows = await rowsOf(w.commissionA);
    expect(rows.payments).toMatchObject([{ status: "paid", amountMinor: v.depositMinor, currency: "HUF", minorDigits: 2 }]);
    expect(rows.documents).toMatchObject([{ kind: "receipt", totalMinor: v.depositMinor, currency: "HUF", minorDigits: 2 }]);
    const pdf = await renderDocumentPdf(rows.documents[0]);
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
  });

  test("KWD: a total the provider cannot charge is refused with the nearest totals; a deposit of x.xx5 is rounded to x.xx0 and paid as quoted", async () => {
    const { w, yarnId, owner, client } = await setup("KWD", { hourlyRateMinor: 7_250, unitPriceMinor: 2_416 });
    // Learn the total for a 0.400 KD gift wrap (tax 0 %, so the total moves fil for fil with the wrap).
    let total: number;
    try {
      total = (await saveQuoteDraft(owner, w.commissionA, draft(yarnId, 400))).totalMinor;
    } catch (err) {
      const m = /the total (\d+)\.(\d{3}) KWD/.exec((err as Error).message);
      expect(m).not.toBeNull();
      total = Number(m![1]) * 1000 + Number(m![2]);
    }
    const before = await rowsOf(w.commissionA);
    // a total ending in 5 fils: the balance could not be charged → refused, nothing saved
    const wrapFor = (residue20: number) => 400 + ((((residue20 - total) % 20) + 20) % 20);
    const odd = wrapFor(5);
    const refusal = saveQuoteDraft(owner, w.commissionA, draft(yarnId, odd));
    await expect(refusal).rejects.toMatchObject({ status: 422, code: "invalid_quote" });
    await expect(refusal).rejects.toThrow(/^KWD card payments must be a multiple of 0\.010 KWD, and the total \d+\.\d{2}5 KWD is not, so its balance could not be paid\. Adjust a line/);
    expect(await rowsOf(w.commissionA)).toEqual(before);
    // a total ≡ 10 (mod 20) fils: half of it ends in 5 fils, so the deposit is rounded up to end in 0
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, wrapFor(10)));
    const q = v.result as unknown as Quote & { depositNote?: string };
    expect(v.totalMinor % 20).toBe(10);
    expect(v.minorDigits).toBe(3);
    expect(v.depositMinor).toBe(v.totalMinor / 2 + 5);
    expect(v.depositMinor + v.balanceMinor).toBe(v.totalMinor);
    expect(q.depositMinor).toBe(v.depositMinor);
    expect(q.depositNote).toMatch(/^KWD deposits must be a multiple of 0\.010 KWD for card payment: \d+\.\d{2}5 KWD becomes \d+\.\d{2}0 KWD; the balance is/);
    await sendQuote(owner, v.id);
    const { paymentId } = await acceptQuote(client, { quoteId: v.id, name: "Client A" });
    const { url } = await startCheckout(client, w.commissionA, "deposit");
    expect(sessionFor(paymentId!)!.amount_total).toBe(v.depositMinor);
    await payOnHostedPage(url);
    const rows = await rowsOf(w.commissionA);
    expect(rows.payments).toMatchObject([{ status: "paid", amountMinor: v.depositMinor, currency: "KWD", minorDigits: 3 }]);
    expect(rows.documents).toMatchObject([{ kind: "receipt", totalMinor: v.depositMinor, minorDigits: 3 }]);
    // the client paid exactly what the quote and the receipt say
    expect((rows.documents[0].content as { receivedMinor: number; quote: { depositMinor: number } }).quote.depositMinor).toBe(v.depositMinor);
  });

  test("KWD refunds go back in whole steps of 0.010 (half of x.xx0 rounded down), and the refund row keeps 3 digits", async () => {
    const { w, yarnId, owner, client } = await setup("KWD", { hourlyRateMinor: 7_250, unitPriceMinor: 2_416, refundBeforeKnitting: 50 });
    let total: number;
    try {
      total = (await saveQuoteDraft(owner, w.commissionA, draft(yarnId, 400))).totalMinor;
    } catch (err) {
      const m = /the total (\d+)\.(\d{3}) KWD/.exec((err as Error).message)!;
      total = Number(m[1]) * 1000 + Number(m[2]);
    }
    // a deposit ending in 10 fils so half of it ends in 5: deposit ≡ 10 (mod 20) → total ≡ 20 (mod 40)
    const wrap = 400 + ((((20 - total) % 40) + 40) % 40);
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, wrap));
    expect(v.depositMinor % 20).toBe(10);
    await sendQuote(owner, v.id);
    await acceptQuote(client, { quoteId: v.id, name: "Client A" });
    fake.setAutoDeliver(false);
    try {
      const { url } = await startCheckout(client, w.commissionA, "deposit");
      await payOnHostedPage(url);
      const completed = fake.state.events.find((e) => e.type === "checkout.session.completed" && e.payload.includes(w.commissionA))!;
      expect(await fake.deliverEvent(completed.id)).toBe(200);
      const out = await refundByPolicy(owner, w.commissionA, { cancel: true, reason: "changed their mind" });
      expect(out.refundMinor).toBe(v.depositMinor / 2); // x.xx5: the policy's refund
      expect(out.refunds).toEqual([{ paymentId: expect.any(String), amountMinor: v.depositMinor / 2 - 5 }]); // what the provider can send
      const [r] = await db.select().from(refunds).where(eq(refunds.paymentId, out.refunds[0].paymentId));
      expect(r).toMatchObject({ amountMinor: v.depositMinor / 2 - 5, minorDigits: 3 });
      const refundEv = fake.state.events.find((e) => e.type === "charge.refunded" && e.payload.includes(w.commissionA))!;
      expect(await fake.deliverEvent(refundEv.id)).toBe(200);
      const [p] = await db.select().from(payments).where(eq(payments.commissionId, w.commissionA));
      expect(p.refundedMinor).toBe(v.depositMinor / 2 - 5);
    } finally {
      fake.setAutoDeliver(true);
    }
  });
});

describe("bad input: clear errors, nothing saved", { timeout: 60_000 }, () => {
  test("the payments fake answers 400 in the provider's style for an amount or a currency its rules refuse", async () => {
    const local = new URL(fake.url);
    const sdk = new Stripe(payFake.secret, { host: local.hostname, port: Number(local.port), protocol: "http", maxNetworkRetries: 0 });
    const session = (currency: string, unit_amount: number) =>
      sdk.checkout.sessions.create({ mode: "payment", success_url: "http://127.0.0.1/ok", line_items: [{ quantity: 1, price_data: { currency, unit_amount, product_data: { name: "Deposit" } } }] });
    const before = Object.keys(fake.state.sessions).length;
    await expect(session("kwd", 12_345)).rejects.toMatchObject({ statusCode: 400, type: "StripeInvalidRequestError", message: expect.stringContaining("least-significant digit of 0") });
    await expect(session("isk", 550)).rejects.toMatchObject({ statusCode: 400, code: "invalid_charge_amount_no_decimal_compatible" });
    await expect(session("xyz", 1000)).rejects.toMatchObject({ statusCode: 400, message: expect.stringMatching(/^Invalid currency: xyz/) });
    await expect(session("iqd", 1000)).rejects.toMatchObject({ statusCode: 400 });
    expect(Object.keys(fake.state.sessions)).toHaveLength(before);
    await expect(session("kwd", 12_350)).resolves.toMatchObject({ amount_total: 12_350, currency: "kwd" });
  });

  test("an unknown currency code is refused when the quote is built", async () => {
    const { w, yarnId, owner } = await setup("XYZ");
    await expect(saveQuoteDraft(owner, w.commissionA, draft(yarnId, 400))).rejects.toMatchObject({
      status: 422,
      message: expect.stringContaining('"XYZ" is not an ISO 4217 currency code'),
    });
    expect(await db.select().from(quoteVersions).where(eq(quoteVersions.commissionId, w.commissionA))).toHaveLength(0);
  });

  test("a currency the provider does not take (IQD): the quote stands, checkout says so and opens nothing", async () => {
    const { w, yarnId, owner, client } = await setup("IQD");
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, 400));
    expect(v.minorDigits).toBe(3);
    await sendQuote(owner, v.id);
    await acceptQuote(client, { quoteId: v.id, name: "Client A" });
    const sessions = Object.keys(fake.state.sessions).length;
    await expect(startCheckout(client, w.commissionA, "deposit")).rejects.toMatchObject({ status: 422, code: "currency_not_offered", message: expect.stringContaining("Card payments in IQD are not offered") });
    expect(Object.keys(fake.state.sessions)).toHaveLength(sessions);
    const [p] = await db.select().from(payments).where(eq(payments.commissionId, w.commissionA));
    expect(p.checkoutSessionId).toBeNull();
  });

  test("a quote stored with other digits than the table is not charged: acceptance refused, nothing saved", async () => {
    const { w, yarnId, owner, client } = await setup("HUF");
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, 400));
    await sendQuote(owner, v.id);
    // as an older version of Darnwell stored HUF (0 digits from the runtime's locale data)
    await db.update(quoteVersions).set({ minorDigits: 0 }).where(eq(quoteVersions.id, v.id));
    const [stateBefore] = await db.select({ s: commissions.state }).from(commissions).where(eq(commissions.id, w.commissionA));
    await expect(acceptQuote(client, { quoteId: v.id, name: "Client A" })).rejects.toMatchObject({
      status: 409,
      code: "currency_exponent_mismatch",
      message: expect.stringContaining("this amount was stored with 0 decimal places but HUF has 2"),
    });
    const [after] = await db.select().from(quoteVersions).where(eq(quoteVersions.id, v.id));
    expect(after.status).toBe("sent");
    expect(await db.select().from(payments).where(eq(payments.commissionId, w.commissionA))).toHaveLength(0);
    const [stateAfter] = await db.select({ s: commissions.state }).from(commissions).where(eq(commissions.id, w.commissionA));
    expect(stateAfter.s).toBe(stateBefore.s);
  });

  test("a payment or a document stored with other digits is neither charged nor printed", async () => {
    const { w, yarnId, owner, client } = await setup("HUF");
    const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId, 400));
    await sendQuote(owner, v.id);
    const { paymentId } = await acceptQuote(client, { quoteId: v.id, name: "Client A" });
    await db.update(payments).set({ minorDigits: 0 }).where(eq(payments.id, paymentId!));
    const sessions = Object.keys(fake.state.sessions).length;
    await expect(startCheckout(client, w.commissionA, "deposit")).rejects.toMatchObject({ status: 409, message: expect.stringContaining("stored with 0 decimal places but HUF has 2") });
    expect(Object.keys(fake.state.sessions)).toHaveLength(sessions);
    // paid as stored correctly, then its receipt's digits altered: the PDF is refused, not misprinted
    await db.update(payments).set({ minorDigits: 2 }).where(eq(payments.id, paymentId!));
    const { url } = await startCheckout(client, w.commissionA, "deposit");
    await payOnHostedPage(url);
    const [doc] = await db.select().from(invoices).where(and(eq(invoices.commissionId, w.commissionA), eq(invoices.kind, "receipt")));
    await db.update(invoices).set({ minorDigits: 3 }).where(eq(invoices.id, doc.id));
    await expect(renderDocumentPdf({ ...doc, minorDigits: 3 })).rejects.toMatchObject({ status: 409, message: expect.stringContaining("stored with 3 decimal places but HUF has 2") });
  });
});
