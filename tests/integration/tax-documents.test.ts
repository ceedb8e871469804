// Tax categories in settings, a VAT invoice and a deposit receipt with totals per rate, and credit
// notes for refunds with their own gap-free numbers — on the real database and the payments fake.
// Sources: HMRC VAT Notice 700 §16 (what a VAT invoice shows; a deposit is a tax point, from memory)
// and VATREC12010 (tax per rate on the invoice); VAT Notice 714 (young children's clothing zero-rated).
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import Stripe from "stripe";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissions, creditNotes, invoices, payments, studios, yarnLots, yarns } from "@/db/schema";
import type { Quote } from "@/lib/core/pricing/build-quote";
import { quoteDraftSchema, type QuoteDraftBody } from "@/lib/schemas/quotes";
import { readStudioSettings } from "@/lib/schemas/settings";
import { renderCreditNotePdf } from "@/lib/server/credit-notes";
import { refundByPolicy, renderDocumentPdf, requestBalance, startCheckout, type DocumentContent } from "@/lib/server/payments";
import { acceptQuote, renderQuotePdf, saveQuoteDraft, sendQuote } from "@/lib/server/quotes";
import { updateStudioSettings } from "@/lib/server/settings";
import { updateTaxSettings } from "@/lib/server/tax-settings";
import type { PaymentsFake } from "@/scripts/fakes/payments";
import { makeWorld, waitForMail, type World } from "./helpers";
import { paymentsFakeForFile } from "./payments-fake";

const payFake = paymentsFakeForFile();
let fake: PaymentsFake;
beforeAll(() => {
  fake = payFake.fake();
});

const UK = [
  { id: "standard" as const, label: "Standard rate", ratePercent: 20 },
  { id: "reduced" as const, label: "Reduced rate", ratePercent: 5 },
  { id: "zero" as const, label: "Zero-rated (young children's clothing)", ratePercent: 0 },
  { id: "exempt" as const, label: "Exempt", ratePercent: 0 },
];

async function setup(opts: { refundBeforeKnitting?: number } = {}) {
  const w = await makeWorld();
  const [y] = await db
    .insert(yarns)
    .values({ studioId: w.studioId, name: "Test 4-ply", colourName: "Loch blue", hex: "#2E5A7A", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: 850 })
    .returning();
  await db.insert(yarnLots).values({ yarnId: y.id, lotCode: "L1", stockSkeins: 10 });
  const owner = await w.actor(w.owner.id);
  await updateStudioSettings(owner, w.studioId, { hourlyRateMinor: 2000, taxRatePercent: 20, pricesIncludeTax: false, depositPercent: 50, depositRefundBeforeKnittingPercent: opts.refundBeforeKnitting ?? 100 });
  await updateTaxSettings(owner, w.studioId, {
    categories: UK,
    defaults: {},
    seller: { legalName: "Maren Hollin trading as Test Knitworks", address: "The Byre, Hollin Lane, Kendal LA8 0QT", taxNumber: "GB 123 4567 89" },
  });
  return { w, yarnId: y.id, owner };
}

// The child's hat (age 2) as an extra, zero-rated; the adult pullover's labour and yarn standard-rated.
const draft = (yarnId: string): QuoteDraftBody =>
  quoteDraftSchema.parse({
    pieces: [{ label: "Adult pullover body", plainStitches: 1800, strandedStitches: 2600, ends: 6 }],
    materials: [{ yarnId, skeins: 2 }],
    extras: [{ label: "Child's hat (age 2), knitted to order", amountMinor: 3600, taxCategory: "zero" }],
    shippingMinor: 450,
  });

async function acceptedQuote(w: World, yarnId: string) {
  const owner = await w.actor(w.owner.id);
  const v = await saveQuoteDraft(owner, w.commissionA, draft(yarnId));
  await sendQuote(owner, v.id);
  const client = await w.actor(w.clientA.id);
  const r = await acceptQuote(client, { quoteId: v.id, name: "Client A" });
  return { v, client, owner, paymentId: r.paymentId! };
}

async function pay(url: string) {
  await fetch(url, { method: "POST", body: new URLSearchParams({ card: "4242 4242 4242 4242", action: "pay" }), redirect: "manual" });
  await fake.idle();
}

function png(name: string, buf: Buffer) {
  mkdirSync("test-results/pdf", { recursive: true });
  expect(buf.subarray(0, 5).toString()).toBe("%PDF-");
  writeFileSync(`test-results/pdf/tax-${name}.pdf`, buf);
  execFileSync("pdftoppm", ["-png", "-r", "70", "-singlefile", `test-results/pdf/tax-${name}.pdf`, `test-results/pdf/tax-${name}`]);
}

const settingsOf = async (studioId: string) => {
  const [s] = await db.select().from(studios).where(eq(studios.id, studioId));
  return { s, settings: readStudioSettings(s.settings) };
};

describe("tax settings", { timeout: 60_000 }, () => {
  test("saved whole; a default naming a missing category or a negative rate is refused and nothing is saved; over 30 % warns", async () => {
    const { w, owner } = await setup();
    const before = await settingsOf(w.studioId);
    expect(before.settings.taxCategories.map((c) => c.id)).toEqual(["standard", "reduced", "zero", "exempt"]);
    expect(before.s).toMatchObject({ legalName: "Maren Hollin trading as Test Knitworks", taxNumber: "GB 123 4567 89" });

    const noZero = UK.filter((c) => c.id !== "zero");
    await expect(updateTaxSettings(owner, w.studioId, { categories: noZero, defaults: { fee: "zero" }, seller: { legalName: "X", address: "Y", taxNumber: "Z" } })).rejects.toMatchObject({
      status: 422,
      fieldErrors: { "defaults.fee": ['"zero" is not one of your categories.'] },
    });
    await expect(updateTaxSettings(owner, w.studioId, { categories: [{ id: "standard", label: "S", ratePercent: -20 }], defaults: {} })).rejects.toMatchObject({
      status: 422,
      fieldErrors: { "categories.0.ratePercent": ["A rate cannot be negative."] },
    });
    await expect(updateTaxSettings(owner, w.studioId, { categories: [{ id: "luxury" as never, label: "L", ratePercent: 25 }], defaults: {} })).rejects.toMatchObject({ status: 422 });
    await expect(updateTaxSettings(owner, w.studioId, { categories: [{ id: "zero", label: "Z", ratePercent: 5 }], defaults: {} })).rejects.toMatchObject({ status: 422 });
    const after = await settingsOf(w.studioId);
    expect(after.s.settings).toEqual(before.s.settings); // nothing saved
    expect(after.s.legalName).toBe(before.s.legalName);

    const assistant = await w.actor(w.assistant.id);
    await expect(updateTaxSettings(assistant, w.studioId, { categories: UK, defaults: {} })).rejects.toMatchObject({ status: 403 });

    const out = await updateTaxSettings(owner, w.studioId, { categories: [{ id: "standard", label: "Standard", ratePercent: 35 }], defaults: {} });
    expect(Object.values(out.warnings)[0]).toContain("above 30 %");
    expect((await settingsOf(w.studioId)).settings.taxRatePercent).toBe(35); // saved all the same, the one-rate setting agrees
  });

  test("a quote line naming a category the studio dropped is refused with its field, nothing saved", async () => {
    const { w, yarnId, owner } = await setup();
    await updateTaxSettings(owner, w.studioId, { categories: UK.filter((c) => c.id !== "zero"), defaults: {} });
    await expect(saveQuoteDraft(owner, w.commissionA, draft(yarnId))).rejects.toMatchObject({ status: 422, code: "invalid_quote", fieldErrors: { "fees[0].taxCategory": [expect.stringContaining('"zero"')] } });
  });
});

describe("documents with totals per rate", { timeout: 90_000 }, () => {
  test("deposit receipt shows the tax within it; the balance invoice carries the VAT invoice fields", async () => {
    const { w, yarnId } = await setup();
    const { v, client, owner, paymentId } = await acceptedQuote(w, yarnId);
    const q = v.result as unknown as Quote;
    expect(q.taxByRate.map((r) => r.category)).toEqual(["standard", "zero"]);
    expect(q.taxByRate.find((r) => r.category === "zero")).toMatchObject({ grossMinor: 3600, taxMinor: 0 });
    await pay((await startCheckout(client, w.commissionA, "deposit")).url);
    const [receipt] = await db.select().from(invoices).where(eq(invoices.paymentId, paymentId));
    const rk = receipt.content as unknown as DocumentContent;
    expect(rk.receivedByRate!.reduce((s, r) => s + r.grossMinor, 0)).toBe(q.depositMinor);
    expect(rk.receivedByRate).toEqual(q.depositByRate);
    expect(rk.receivedByRate!.find((r) => r.category === "standard")!.taxMinor).toBeGreaterThan(0);
    png("deposit-receipt", await renderDocumentPdf(receipt));

    await db.update(commissions).set({ state: "ready" }).where(eq(commissions.id, w.commissionA));
    const { invoiceId } = await requestBalance(owner, w.commissionA);
    const [inv] = await db.select().from(invoices).where(eq(invoices.id, invoiceId!));
    const k = inv.content as unknown as DocumentContent;
    expect(k.seller).toMatchObject({ legalName: "Maren Hollin trading as Test Knitworks", address: expect.stringContaining("Kendal"), taxNumber: "GB 123 4567 89" });
    expect(k.supplyDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect(k.lines.find((l) => l.label.startsWith("Child's hat"))).toMatchObject({ taxCategory: "zero", ratePpm: 0, rateLabel: "Zero-rated (young children's clothing)" });
    expect(k.lines.find((l) => l.label.includes("skeins"))).toMatchObject({ taxCategory: "standard", ratePpm: 200_000, quantity: "2", unitPriceMinor: 850 });
    expect(k.taxByRate!.reduce((s, r) => s + r.taxMinor, 0)).toBe(q.taxMinor);
    png("invoice", await renderDocumentPdf(inv));
    png("quote", await renderQuotePdf(v));
  });
});

describe("credit notes", { timeout: 90_000 }, () => {
  test("a refund by policy issues one credit note (the refund event and a second call add none), negative per rate, correcting the receipt", async () => {
    const { w, yarnId } = await setup({ refundBeforeKnitting: 50 });
    const { client, owner, paymentId } = await acceptedQuote(w, yarnId);
    await pay((await startCheckout(client, w.commissionA, "deposit")).url);
    // two owners' clicks at once: one refund at the provider (same idempotency key), one credit note
    const outs = await Promise.allSettled([refundByPolicy(owner, w.commissionA, { cancel: true, reason: "changed their mind" }), refundByPolicy(owner, w.commissionA, { reason: "changed their mind" })]);
    expect(outs.some((o) => o.status === "fulfilled")).toBe(true);
    await fake.idle();
    await refundByPolicy(owner, w.commissionA).catch(() => undefined);
    const notes = await db.select().from(creditNotes).where(eq(creditNotes.commissionId, w.commissionA));
    expect(notes).toHaveLength(1);
    const p = (await db.select().from(payments).where(eq(payments.id, paymentId)))[0];
    expect(notes[0]).toMatchObject({ number: 1, totalMinor: -p.refundedMinor, currency: "GBP", minorDigits: 2 });
    const [receipt] = await db.select().from(invoices).where(eq(invoices.paymentId, paymentId));
    expect(notes[0].correctsId).toBe(receipt.id);
    const content = notes[0].content as { byRate: { grossMinor: number; taxMinor: number; category: string }[]; corrects: string };
    expect(content.byRate.reduce((s, r) => s + r.grossMinor, 0)).toBe(-p.refundedMinor);
    expect(content.byRate.every((r) => r.grossMinor <= 0 && r.taxMinor <= 0)).toBe(true);
    expect(content.corrects).toMatch(/^RCT-\d{4} of /);
    expect(notes[0].content).toMatchObject({ reason: "changed their mind" });
    await waitForMail(w.clientA.email, (m) => m.subject.startsWith("Credit note CRN-0001"));
    png("credit-note", await renderCreditNotePdf(notes[0]));
  });

  test("two refunds recorded in parallel get consecutive credit note numbers, no gaps; replayed events add none", async () => {
    const { w, yarnId } = await setup();
    const { client, paymentId } = await acceptedQuote(w, yarnId);
    await pay((await startCheckout(client, w.commissionA, "deposit")).url);
    const p0 = (await db.select().from(payments).where(eq(payments.id, paymentId)))[0];
    fake.setAutoDeliver(false);
    try {
      const u = new URL(fake.url);
      const sdk = new Stripe(payFake.secret, { host: u.hostname, port: Number(u.port), protocol: "http" });
      await sdk.refunds.create({ payment_intent: p0.paymentIntentId!, amount: 100 });
      await sdk.refunds.create({ payment_intent: p0.paymentIntentId!, amount: 250 });
      const evs = fake.state.events.filter((e) => e.type === "charge.refunded" && e.payload.includes(p0.paymentIntentId!));
      expect(evs.length).toBeGreaterThanOrEqual(2);
      const codes = await Promise.all(evs.map((e) => fake.deliverEvent(e.id)));
      expect(codes.every((c) => c === 200)).toBe(true);
      for (const e of evs) await payFake.hook(e.payload, fake.signPayload(e.payload));
    } finally {
      fake.setAutoDeliver(true);
    }
    const notes = await db.select().from(creditNotes).where(eq(creditNotes.studioId, w.studioId));
    expect(notes.map((n) => n.number).sort()).toEqual([1, 2]);
    expect(notes.map((n) => n.totalMinor).sort((a, b) => a - b)).toEqual([-250, -100]);
  });
});
