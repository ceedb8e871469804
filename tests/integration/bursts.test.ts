// Bursts on the real database: many copies of one request at once (where exactly one may win) and
// many distinct requests at once (where document numbers must stay gap-free), with the health check
// probed during and after each burst. Timings are printed, never asserted.
import { vi } from "vitest";

// The default pool (10 connections) with a longer wait than production's 5 s: on a loaded shared test
// machine a health probe queued behind 50 requests may be slow, and what is checked is that it is
// answered at all (a deadlocked pool answers 503 after the wait, or never), not how fast.
vi.hoisted(() => {
  process.env.DB_POOL_MAX = "10";
  process.env.DB_CONNECT_TIMEOUT_MS = "15000";
});

import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { randomBytes } from "node:crypto";
import { and, eq, inArray } from "drizzle-orm";
import { afterEach, beforeAll, describe, expect, test } from "vitest";
import { db, getPool } from "@/db";
import {
  commissionEvents,
  commissions,
  designs,
  designVersions,
  invoices,
  outboxMessages,
  payments,
  pieces,
  proofs,
  quoteVersions,
  studioClients,
  studioMembers,
  studios,
  webhookEvents,
  yarnLots,
  yarnReservations,
  yarns,
} from "@/db/schema";
import type { QuoteDraftBody } from "@/lib/schemas/quotes";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { AppError } from "@/lib/server/errors";
import { requestBalance, startCheckout } from "@/lib/server/payments";
import { startProduction } from "@/lib/server/production";
import { renderMailAttachment } from "@/lib/server/mail-attachments";
import { approveProof, sendProof } from "@/lib/server/proofs";
import { acceptQuote, saveQuoteDraft, sendQuote } from "@/lib/server/quotes";
import { updateStudioSettings } from "@/lib/server/settings";
import { GET as healthGET } from "@/app/api/health/route";
import { POST as sendQuotePOST } from "@/app/api/quotes/[id]/send/route";
import type { PaymentsFake } from "@/scripts/fakes/payments";
import { paymentsFakeForFile } from "./payments-fake";
import { makeWorld, requestWith, signIn, uid, type Jar, type World } from "./helpers";

const payFake = paymentsFakeForFile();
const { hook } = payFake;
let fake: PaymentsFake;
beforeAll(() => {
  fake = payFake.fake();
});

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

// Mail queued here renders its PDFs when sent; other test files drive the shared outbox, so what
// these bursts queue is removed once checked rather than left for them to render.
const studiosMade: string[] = [];
const forgetMail = () => db.delete(outboxMessages).where(inArray(outboxMessages.studioId, studiosMade));
afterEach(forgetMail);

/**
 * Runs `n` calls at once while probing the health check every few milliseconds; every probe
 * (during) and one more (after) must answer 200. Prints wall time and the slowest probe.
 */
async function burst<T>(label: string, n: number, call: (i: number) => Promise<T>): Promise<PromiseSettledResult<T>[]> {
  const probes: { status: number; ms: number }[] = [];
  let running = true;
  const t0 = performance.now();
  const calls = Promise.allSettled(Array.from({ length: n }, (_, i) => call(i)));
  const prober = (async () => {
    while (running) {
      const t = performance.now();
      const res = await healthGET();
      probes.push({ status: res.status, ms: performance.now() - t });
      await pause(20);
    }
  })();
  const results = await calls;
  const wall = performance.now() - t0;
  // Out of reach of other files' outbox runs until this test has checked it (afterEach removes it).
  await db.update(outboxMessages).set({ nextAttemptAt: new Date(Date.now() + 3_600_000) }).where(inArray(outboxMessages.studioId, studiosMade));
  running = false;
  await prober;
  const after = await healthGET();
  const slowest = Math.max(...probes.map((p) => p.ms));
  const ok = results.filter((r) => r.status === "fulfilled").length;
  console.log(
    `[burst] ${label}: ${n} at once in ${wall.toFixed(0)} ms (${ok} fulfilled); health: ${probes.length} probes during, slowest ${slowest.toFixed(0)} ms, after ${after.status}`,
  );
  expect(probes.length).toBeGreaterThan(0);
  expect(probes.filter((p) => p.status !== 200)).toEqual([]);
  expect(after.status).toBe(200);
  expect(getPool().waitingCount).toBe(0);
  return results;
}

/** Statuses of the refused calls (AppError) and of the responses (Response). */
function refusals<T>(results: PromiseSettledResult<T>[]): number[] {
  return results.filter((r): r is PromiseRejectedResult => r.status === "rejected").map((r) => (r.reason instanceof AppError ? r.reason.status : -1));
}

// People are costly to make (password hashing), studios are not: one owner and one client for the
// file, and each test a studio of its own (its own document numbers) that they own and are client of.
let people: World;
let ownerJar: Jar;
beforeAll(async () => {
  people = await makeWorld();
  ownerJar = await signIn(people.owner.email);
});

async function world() {
  const tag = uid();
  const [studio] = await db.insert(studios).values({ slug: `burst-${tag}`, name: `Burst ${tag}`, contactEmail: `burst-${tag}@it.test` }).returning();
  studiosMade.push(studio.id);
  await db.insert(studioMembers).values({ studioId: studio.id, userId: people.owner.id, role: "owner" });
  const [link] = await db.insert(studioClients).values({ studioId: studio.id, userId: people.clientA.id, displayName: "Client A" }).returning();
  const [c] = await db.insert(commissions).values({ studioId: studio.id, clientId: link.id, number: 1, garment: "mittens", currency: "GBP", title: "Burst mittens" }).returning();
  const owner = await people.actor(people.owner.id);
  const client = await people.actor(people.clientA.id);
  return { studioId: studio.id, clientId: link.id, commissionA: c.id, owner, client };
}
type BurstWorld = Awaited<ReturnType<typeof world>>;

async function setup() {
  const w = await world();
  const { owner, client } = w;
  const [y] = await db
    .insert(yarns)
    .values({ studioId: w.studioId, name: "Burst 4-ply", colourName: "Peat", hex: "#4A3B2C", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: 850 })
    .returning();
  await db.insert(yarnLots).values({ yarnId: y.id, lotCode: "B1", stockSkeins: 500 });
  await updateStudioSettings(owner, w.studioId, { hourlyRateMinor: 2000, taxRatePercent: 20, pricesIncludeTax: false, depositPercent: 50 });
  const draft: QuoteDraftBody = quoteDraftSchema.parse({
    pieces: [{ label: "Left mitten", plainStitches: 1800, strandedStitches: 2600, duplicateStitches: 60, ends: 6, thumbs: 1 }],
    materials: [{ yarnId: y.id, skeins: 2 }],
    extras: [],
    shippingMinor: 450,
  });
  return { w, owner, client, draft };
}

/** More commissions of the client in the test's studio (numbers follow the first). */
async function moreCommissions(w: BurstWorld, count: number): Promise<string[]> {
  const rows = await db
    .insert(commissions)
    .values(Array.from({ length: count }, (_, i) => ({ studioId: w.studioId, clientId: w.clientId, number: 2 + i, garment: "mittens" as const, currency: "GBP", title: `Burst mittens ${i + 2}` })))
    .returning({ id: commissions.id });
  return rows.map((r) => r.id);
}

async function acceptedWithOpenDeposit(s: Awaited<ReturnType<typeof setup>>, commissionId: string) {
  const v = await saveQuoteDraft(s.owner, commissionId, s.draft);
  await sendQuote(s.owner, v.id);
  const r = await acceptQuote(s.client, { quoteId: v.id, name: "Client A" });
  return { quoteId: v.id, paymentId: r.paymentId! };
}

/** Pays the deposit on the fake's hosted page with delivery off; returns the signed-able event payload. */
async function paidEventFor(s: Awaited<ReturnType<typeof setup>>, commissionId: string, paymentId: string): Promise<string> {
  const { url } = await startCheckout(s.client, commissionId, "deposit");
  const res = await fetch(url, { method: "POST", body: new URLSearchParams({ card: "4242 4242 4242 4242", action: "pay" }), redirect: "manual" });
  expect(res.status).toBe(303);
  const ev = fake.state.events.find((e) => e.type === "checkout.session.completed" && e.payload.includes(paymentId));
  expect(ev).toBeDefined();
  return ev!.payload;
}

const band = JSON.parse(readFileSync("tests/fixtures/charts/peerie-band.json", "utf8")) as { rows: string[] } & Record<string, unknown>;

describe("bursts", { timeout: 60_000 }, () => {
  test("50 sends of one quote (route handler), then 50 acceptances of it: one winner each, the rest 409", async () => {
    const s = await setup();
    const jar = ownerJar;
    const v = await saveQuoteDraft(s.owner, s.w.commissionA, s.draft);
    const sends = await burst("send one quote (POST /api/quotes/:id/send)", 50, () =>
      sendQuotePOST(requestWith(jar, `/api/quotes/${v.id}/send`, { method: "POST" }), { params: Promise.resolve({ id: v.id }) }),
    );
    const statuses = sends.map((r) => (r.status === "fulfilled" ? r.value.status : -1));
    expect(statuses.filter((x) => x === 200)).toHaveLength(1);
    expect(statuses.filter((x) => x === 409)).toHaveLength(49);
    expect(await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, `quote-sent-${v.id}`))).toHaveLength(1);
    await forgetMail();

    const accepts = await burst("accept one quote", 50, () => acceptQuote(s.client, { quoteId: v.id, name: "Client A" }));
    expect(accepts.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(refusals(accepts)).toEqual(Array(49).fill(409));
    const deposits = await db.select().from(payments).where(and(eq(payments.commissionId, s.w.commissionA), eq(payments.kind, "deposit")));
    expect(deposits).toHaveLength(1);
    expect(await db.select().from(yarnReservations).where(eq(yarnReservations.commissionId, s.w.commissionA))).toHaveLength(1);
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, s.w.commissionA));
    expect(events.filter((e) => e.detail.move === "accept_quote")).toHaveLength(1);
    expect((await db.select().from(quoteVersions).where(eq(quoteVersions.id, v.id)))[0].status).toBe("accepted");
  });

  test("50 deliveries of the same signed event: all acknowledged, applied once (one payment, one receipt, one mail)", async () => {
    const s = await setup();
    fake.setAutoDeliver(false);
    try {
      const { paymentId } = await acceptedWithOpenDeposit(s, s.w.commissionA);
      const payload = await paidEventFor(s, s.w.commissionA, paymentId);
      const signature = fake.signPayload(payload);
      const results = await burst("deliver one webhook event", 50, () => hook(payload, signature));
      const bodies = await Promise.all(results.map(async (r) => (r.status === "fulfilled" ? { status: r.value.status, body: (await r.value.json()) as Record<string, unknown> } : null)));
      expect(bodies.every((b) => b?.status === 200)).toBe(true);
      expect(bodies.filter((b) => !b!.body.duplicate)).toHaveLength(1);
      const [p] = await db.select().from(payments).where(eq(payments.id, paymentId));
      expect(p.status).toBe("paid");
      const receipts = await db.select().from(invoices).where(eq(invoices.commissionId, s.w.commissionA));
      expect(receipts.map((d) => [d.kind, d.number])).toEqual([["receipt", 1]]);
      const [mail] = await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, `document-${receipts[0].id}`));
      expect(mail.attachments).toEqual([{ filename: "RCT-0001.pdf", contentType: "application/pdf", render: `document:${receipts[0].id}` }]);
      expect((await renderMailAttachment(mail.attachments[0].render)).subarray(0, 5).toString()).toBe("%PDF-"); // what the worker attaches
      const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, s.w.commissionA));
      expect(events.filter((e) => e.toState === "booked")).toHaveLength(1);
    } finally {
      fake.setAutoDeliver(true);
    }
  });

  test("50 distinct events at once (50 deposits of one studio): all applied, receipts 1…50 without a gap; then 20 balance invoices at once: 1…20", async () => {
    const s = await setup();
    const tSetup = performance.now();
    // One deposit goes the whole way (quote sent and accepted, checkout on the fake, paid on its page);
    // its signed event is the model for 49 more commissions whose accepted quote and open deposit are
    // written directly, each paid by an event of its own (new event, session and intent ids).
    fake.setAutoDeliver(false);
    let model: string;
    let first: { paymentId: string };
    try {
      first = await acceptedWithOpenDeposit(s, s.w.commissionA);
      model = await paidEventFor(s, s.w.commissionA, first.paymentId);
    } finally {
      fake.setAutoDeliver(true);
    }
    const [v] = await db.select().from(quoteVersions).where(eq(quoteVersions.commissionId, s.w.commissionA));
    const [{ state: acceptedState }] = await db.select({ state: commissions.state }).from(commissions).where(eq(commissions.id, s.w.commissionA));
    const others = await moreCommissions(s.w, 49);
    await db.update(commissions).set({ state: acceptedState }).where(inArray(commissions.id, others));
    const quotes = await db
      .insert(quoteVersions)
      .values(others.map((commissionId) => ({ ...v, id: undefined, commissionId })))
      .returning({ id: quoteVersions.id, commissionId: quoteVersions.commissionId });
    const opened = await db
      .insert(payments)
      .values(quotes.map((q) => ({ studioId: s.w.studioId, commissionId: q.commissionId, quoteVersionId: q.id, kind: "deposit" as const, amountMinor: v.depositMinor, currency: v.currency, minorDigits: v.minorDigits, idempotencyKey: `burst-${randomBytes(8).toString("hex")}` })))
      .returning({ id: payments.id, commissionId: payments.commissionId });
    const payloads = [
      model,
      ...opened.map((p) => {
        const ev = JSON.parse(model) as { id: string; data: { object: { id: string; client_reference_id: string; payment_intent: string; metadata: Record<string, string> } } };
        const o = ev.data.object;
        const tag = randomBytes(8).toString("hex");
        ev.id = `evt_burst_${tag}`;
        o.id = `cs_burst_${tag}`;
        o.payment_intent = `pi_burst_${tag}`;
        o.client_reference_id = p.id;
        o.metadata = { ...o.metadata, paymentId: p.id, commissionId: p.commissionId };
        return JSON.stringify(ev);
      }),
    ];
    const ids = [s.w.commissionA, ...others];
    const paymentIds = [first.paymentId, ...opened.map((p) => p.id)];
    console.log(`[setup] 50 accepted quotes with open deposits and their paid events in ${(performance.now() - tSetup).toFixed(0)} ms`);
    await forgetMail();
    expect(new Set(payloads.map((p) => (JSON.parse(p) as { id: string }).id)).size).toBe(50);

    const results = await burst("deliver 50 distinct webhook events", 50, (i) => hook(payloads[i], fake.signPayload(payloads[i])));
    expect(results.map((r) => (r.status === "fulfilled" ? r.value.status : -1))).toEqual(Array(50).fill(200));
    const paid = await db.select().from(payments).where(inArray(payments.id, paymentIds));
    expect(paid.filter((p) => p.status === "paid")).toHaveLength(50);
    const receipts = await db.select().from(invoices).where(and(eq(invoices.studioId, s.w.studioId), eq(invoices.kind, "receipt")));
    expect(receipts.map((d) => d.number).sort((a, b) => a - b)).toEqual(Array.from({ length: 50 }, (_, i) => i + 1));
    expect(await db.select().from(webhookEvents).where(inArray(webhookEvents.id, payloads.map((p) => (JSON.parse(p) as { id: string }).id)))).toHaveLength(50);
    const states = await db.select({ s: commissions.state }).from(commissions).where(inArray(commissions.id, ids));
    expect(states.every((r) => r.s === "booked")).toBe(true);
    const mails = await forgetMail().returning({ key: outboxMessages.dedupeKey });
    expect(mails.filter((m) => m.key?.startsWith("document-"))).toHaveLength(50); // one receipt mail each
    expect(mails.filter((m) => m.key?.startsWith("notify:paid:"))).toHaveLength(50); // and the studio told once of each

    // 20 of them ready at once: 20 balance invoices in parallel, numbered 1…20.
    const ready = ids.slice(0, 20);
    await db.update(commissions).set({ state: "ready" }).where(inArray(commissions.id, ready));
    const invoiced = await burst("request 20 balances (20 invoices)", 20, (i) => requestBalance(s.owner, ready[i]));
    expect(invoiced.filter((r) => r.status === "fulfilled")).toHaveLength(20);
    const invs = await db.select().from(invoices).where(and(eq(invoices.studioId, s.w.studioId), eq(invoices.kind, "invoice")));
    expect(invs.map((d) => d.number).sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, i) => i + 1));
    expect(new Set(invs.map((d) => d.commissionId)).size).toBe(20);
  });

  test("50 balance requests for one ready commission: one invoice and one balance payment, the rest 409", async () => {
    const s = await setup();
    const { paymentId } = await acceptedWithOpenDeposit(s, s.w.commissionA);
    await paidEventFor(s, s.w.commissionA, paymentId); // delivered by the fake
    await fake.idle();
    expect((await db.select().from(payments).where(eq(payments.id, paymentId)))[0].status).toBe("paid");
    await db.update(commissions).set({ state: "ready" }).where(eq(commissions.id, s.w.commissionA));
    const results = await burst("request the balance of one commission", 50, () => requestBalance(s.owner, s.w.commissionA));
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(refusals(results)).toEqual(Array(49).fill(409));
    const balance = await db.select().from(payments).where(and(eq(payments.commissionId, s.w.commissionA), eq(payments.kind, "balance")));
    expect(balance).toHaveLength(1);
    const invs = await db.select().from(invoices).where(and(eq(invoices.commissionId, s.w.commissionA), eq(invoices.kind, "invoice")));
    expect(invs.map((d) => d.number)).toEqual([1]);
  });

  test("50 approvals of one proof: one approval, one lock, one audit row, the rest 409", async () => {
    const w = await world();
    const { owner, client } = w;
    await db.update(commissions).set({ state: "designing" }).where(eq(commissions.id, w.commissionA));
    const [d] = await db.insert(designs).values({ studioId: w.studioId, commissionId: w.commissionA, title: "Band" }).returning();
    const charts = [{ area: "cuff-band", label: "Cuff band", chart: band }];
    const [v] = await db
      .insert(designVersions)
      .values({ designId: d.id, number: 1, charts, contentHash: createHash("sha256").update(JSON.stringify(charts)).digest("hex") })
      .returning();
    await db.update(designs).set({ headVersionId: v.id }).where(eq(designs.id, d.id));
    const p = await sendProof(owner, w.commissionA, "");
    const results = await burst("approve one proof", 50, (i) => approveProof(client, p.id, p.contentHash, new Headers({ "x-forwarded-for": `198.51.100.${i + 1}` })));
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(refusals(results)).toEqual(Array(49).fill(409));
    expect((await db.select().from(proofs).where(eq(proofs.id, p.id)))[0].status).toBe("approved");
    expect((await db.select().from(designs).where(eq(designs.id, d.id)))[0].lockedVersionId).toBe(v.id);
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, w.commissionA));
    expect(events.filter((e) => e.detail.move === "approve_proof")).toHaveLength(1);
  });

  test("50 production set-ups of one commission: one set of pieces, the rest 409", async () => {
    const w = await world();
    const { owner } = w;
    await db.update(commissions).set({ state: "proof_approved" }).where(eq(commissions.id, w.commissionA));
    const results = await burst("start production of one commission", 50, () => startProduction(owner, w.commissionA, "pair"));
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(refusals(results)).toEqual(Array(49).fill(409));
    expect(await db.select().from(pieces).where(eq(pieces.commissionId, w.commissionA))).toHaveLength(2);
  });
});
