import "server-only";
// Payments through the Stripe SDK: checkout for the deposit and the balance, verified webhooks
// as the only source of payment state, refunds by the studio's cancellation policy, and the
// invoices and receipts that go with them. With STRIPE_API_URL set the SDK talks to the local
// fake (scripts/fakes/payments.ts); with real keys and no STRIPE_API_URL, to Stripe.
import { createHash, randomUUID } from "node:crypto";
import { and, asc, desc, eq, gte, inArray, lt, sql } from "drizzle-orm";
import { createElement } from "react";
import Stripe from "stripe";
import type { z } from "zod";
import { db, type Executor, type Tx } from "@/db";
import {
  commissionEvents,
  commissions,
  documentCounters,
  invoices,
  payments,
  pieces,
  quoteVersions,
  refunds,
  studioClients,
  studios,
  user,
  webhookEvents,
  type Invoice,
  type Payment,
  type QuoteVersion,
} from "@/db/schema";
import type { Quote } from "@/lib/core/pricing/build-quote";
import { getRefundDue, type CancellationStage } from "@/lib/core/pricing/cancellation";
import { policyFromSettings } from "@/lib/core/pricing/studio-policy";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { fromProviderAmount, providerStepMinor } from "@/lib/core/pricing/provider-currency";
import { formatRatePpm, remainderByRate, splitByRate, taxByRateOf, type TaxRateShare, type TaxRateTotal } from "@/lib/core/pricing/tax";
import { canMove } from "@/lib/core/workflow";
import { env } from "@/lib/env";
import { eventEnvelopeSchema, HANDLED_EVENT_TYPES, handledEventSchema } from "@/lib/schemas/payment-events";
import { documentMessage } from "@/templates/email/money";
import { InvoiceDocument } from "@/templates/pdf/invoice";
import { assertCan, can, type Actor } from "./authz";
import { AppError, conflict, notFound, nullIfNotFound } from "./errors";
import { assertStoredDigits, providerAmountOrThrow } from "./money-guard";
import { notify } from "./notifications";
import { enqueueMail } from "./outbox";
import { renderPdf } from "./pdf";
import { getCommissionFor, getCommissionMailParties } from "./queries/commissions";
import { loadStudioSettings } from "./settings";
import { moveCommission, SYSTEM } from "./workflow";

// --- the SDK ------------------------------------------------------------------------------------

let cachedClient: { key: string; url: string | undefined; client: Stripe } | undefined;

/** The SDK, pointed at the local fake when STRIPE_API_URL is set. */
export function stripe(): Stripe {
  const key = env.STRIPE_SECRET_KEY;
  if (!key) throw new AppError(503, "payments_off", "Online payments are not set up for this studio yet. Please contact the studio to pay.");
  const url = env.STRIPE_API_URL;
  if (cachedClient && cachedClient.key === key && cachedClient.url === url) return cachedClient.client;
  const local = url ? new URL(url) : null;
  const client = new Stripe(key, {
    maxNetworkRetries: 2,
    timeout: 8000,
    ...(local ? { host: local.hostname, port: Number(local.port || 80), protocol: local.protocol === "https:" ? "https" : "http" } : {}),
  });
  cachedClient = { key, url, client };
  return client;
}

/** A provider failure as a message the person can act on; nothing was charged twice. */
function providerError(err: unknown, doing: string): AppError {
  if (err instanceof AppError) return err;
  const e = err as { type?: string; message?: string; statusCode?: number };
  console.error(`payments: ${doing}:`, e.message);
  if (e.type === "StripeConnectionError" || (e.statusCode ?? 0) >= 500) {
    return new AppError(503, "payments_unavailable", `The payment service did not answer while ${doing}. Nothing was charged twice; please try again in a minute.`);
  }
  return new AppError(502, "payments_refused", `The payment service refused ${doing}: ${e.message ?? "unknown reason"}.`);
}

const docNumber = (kind: "invoice" | "receipt", n: number) => `${kind === "invoice" ? "INV" : "RCT"}-${String(n).padStart(4, "0")}`;
const money = (minor: number, currency: string) => formatMoney(minor, currency);
const appUrl = (p: string) => `${env.BETTER_AUTH_URL}${p}`;

// --- opening payments -------------------------------------------------------------------------

/** Called inside the acceptance transaction: the deposit payment row (or, for a zero deposit, booking at once). */
export async function openDepositPayment(tx: Tx, v: QuoteVersion): Promise<Payment | null> {
  assertStoredDigits("This quote's deposit cannot be charged", v);
  // A re-quote after booking asks only for what the deposit paid so far does not cover.
  const held = await tx
    .select({ amount: payments.amountMinor, refunded: payments.refundedMinor })
    .from(payments)
    .where(and(eq(payments.commissionId, v.commissionId), eq(payments.kind, "deposit"), inArray(payments.status, ["paid", "partially_refunded"])));
  const due = v.depositMinor - held.reduce((s, p) => s + p.amount - p.refunded, 0);
  if (due <= 0) {
    await moveCommission(SYSTEM, v.commissionId, "record_deposit", { tx, detail: { note: v.depositMinor === 0 ? "no deposit due" : "deposit already paid" } });
    return null;
  }
  const [p] = await tx
    .insert(payments)
    .values({ studioId: v.studioId, commissionId: v.commissionId, quoteVersionId: v.id, kind: "deposit", amountMinor: due, currency: v.currency, minorDigits: v.minorDigits, idempotencyKey: `checkout-${randomUUID()}` })
    .returning();
  return p;
}

async function ensureCustomer(clientId: string): Promise<string> {
  const [row] = await db
    .select({ id: studioClients.id, customer: studioClients.paymentCustomerId, name: studioClients.displayName, email: user.email })
    .from(studioClients)
    .innerJoin(user, eq(user.id, studioClients.userId))
    .where(eq(studioClients.id, clientId));
  if (row.customer) return row.customer;
  let customer: Stripe.Customer;
  try {
    customer = await stripe().customers.create({ email: row.email, name: row.name, metadata: { studioClientId: row.id } }, { idempotencyKey: `customer-${row.id}` });
  } catch (err) {
    throw providerError(err, "setting up your payment details");
  }
  // Two racing checkouts get the same customer (same idempotency key); keep the first written.
  await db.update(studioClients).set({ paymentCustomerId: customer.id }).where(and(eq(studioClients.id, row.id), sql`${studioClients.paymentCustomerId} is null`));
  return customer.id;
}

async function createSession(p: Payment, title: string, clientId: string): Promise<Payment> {
  // The provider's currency rules (zero-/three-decimal, ISK): refused here, before anything is created.
  const charge = providerAmountOrThrow(p.amountMinor, p.currency);
  const customer = await ensureCustomer(clientId);
  const back = appUrl(`/portal/commissions/${p.commissionId}`);
  let session: Stripe.Checkout.Session;
  try {
    session = await stripe().checkout.sessions.create(
      {
        mode: "payment",
        customer,
        client_reference_id: p.id,
        line_items: [{ quantity: 1, price_data: { currency: charge.currency, unit_amount: charge.amount, product_data: { name: `${p.kind === "deposit" ? "Deposit" : "Balance"}: ${title}` } } }],
        metadata: { paymentId: p.id, commissionId: p.commissionId, kind: p.kind },
        payment_intent_data: { metadata: { paymentId: p.id, commissionId: p.commissionId, kind: p.kind } },
        success_url: `${back}?paid=${p.kind}`,
        cancel_url: `${back}?cancelled=${p.kind}`,
      },
      { idempotencyKey: p.idempotencyKey },
    );
  } catch (err) {
    throw providerError(err, "opening the payment page");
  }
  const [updated] = await db.update(payments).set({ checkoutSessionId: session.id, checkoutUrl: session.url }).where(eq(payments.id, p.id)).returning();
  return updated;
}

/**
 * The client (or the owner on their behalf) starts paying: the open checkout is reused, an
 * expired one is replaced with a new payment, and a session that could not be made before is
 * made now with the same idempotency key, so a retry never opens a second charge.
 */
export async function startCheckout(actor: Actor, commissionId: string, kind: "deposit" | "balance"): Promise<{ url: string }> {
  const c = await getCommissionFor(actor, commissionId);
  const member = can(actor, "studio.view", c.studioId);
  if (member) assertCan(actor, "payments.manage", c.studioId);
  const [latest] = await db
    .select()
    .from(payments)
    .where(and(eq(payments.commissionId, c.id), eq(payments.kind, kind)))
    .orderBy(desc(payments.createdAt))
    .limit(1);
  if (!latest) throw conflict(kind === "deposit" ? "There is no deposit to pay: accept the quote first." : "The balance is not due yet.");
  if (["paid", "partially_refunded", "refunded"].includes(latest.status)) throw conflict(`The ${kind} has already been paid. Thank you!`);
  assertStoredDigits(`The ${kind} cannot be charged`, latest);
  const [clientRow] = await db.select({ clientId: commissions.clientId }).from(commissions).where(eq(commissions.id, c.id));
  let p = latest;
  if (p.status === "expired") {
    const [fresh] = await db
      .insert(payments)
      .values({ studioId: p.studioId, commissionId: p.commissionId, quoteVersionId: p.quoteVersionId, kind, amountMinor: p.amountMinor, currency: p.currency, minorDigits: p.minorDigits, idempotencyKey: `checkout-${randomUUID()}` })
      .returning();
    p = fresh;
  }
  if (p.checkoutUrl) return { url: p.checkoutUrl };
  p = await createSession(p, c.title, clientRow.clientId);
  return { url: p.checkoutUrl! };
}

// --- documents ----------------------------------------------------------------------------------

export interface DocumentContent {
  number: string;
  clientName: string;
  clientAddress: string;
  title: string;
  commissionNumber: number;
  quoteVersion: number;
  /** per: the unit the unit price is for ("h" for labour) */
  lines: { label: string; amountMinor: number; quantity?: string; unitPriceMinor?: number; per?: string; taxCategory?: string; ratePpm?: number; rateLabel?: string }[];
  /** the seller as at issue (VAT invoices: name, address, VAT number) */
  seller?: { name: string; legalName: string; address: string; taxNumber: string };
  /** date of supply / tax point: for a receipt the day the payment arrived; for the balance invoice the day it is issued (the piece is ready) */
  supplyDate?: string;
  /** totals per rate of the whole quote */
  taxByRate?: TaxRateTotal[];
  /** for receipts: the amount received split by rate, with the tax within it */
  receivedByRate?: TaxRateShare[] | null;
  quote: Pick<Quote, "subtotalMinor" | "taxMinor" | "totalMinor" | "pricesIncludeTax" | "taxRatePpm" | "depositMinor" | "balanceMinor">;
  depositPaidMinor: number;
  balancePaidMinor: number;
  /** for receipts: what this receipt acknowledges */
  receivedMinor: number | null;
  receivedFor: "deposit" | "balance" | null;
  payUrl: string | null;
}

/**
 * Takes the next number for the studio and kind (the counter row stays locked until the
 * transaction ends, so concurrent issues queue and a rolled-back one gives its number back).
 */
export async function allocateDocumentNumber(tx: Tx, studioId: string, kind: "invoice" | "receipt" | "credit_note"): Promise<number> {
  await tx.insert(documentCounters).values({ studioId, kind, next: 1 }).onConflictDoNothing();
  const [row] = await tx
    .update(documentCounters)
    .set({ next: sql`${documentCounters.next} + 1` })
    .where(and(eq(documentCounters.studioId, studioId), eq(documentCounters.kind, kind)))
    .returning({ next: documentCounters.next });
  return row.next - 1;
}

async function paidSoFar(tx: Executor, commissionId: string) {
  const rows = await tx
    .select({ kind: payments.kind, amount: payments.amountMinor, refunded: payments.refundedMinor })
    .from(payments)
    .where(and(eq(payments.commissionId, commissionId), inArray(payments.status, ["paid", "partially_refunded", "refunded"])));
  const sum = (k: string) => rows.filter((r) => r.kind === k).reduce((s, r) => s + r.amount, 0);
  return { deposit: sum("deposit"), balance: sum("balance") };
}

/** Issues an invoice or receipt for a commission's accepted quote, numbered in this transaction. */
export async function issueDocument(
  tx: Tx,
  opts: { commissionId: string; kind: "invoice" | "receipt"; paymentId?: string | null; dueDate?: string | null; payUrl?: string | null; receivedMinor?: number | null; receivedFor?: "deposit" | "balance" | null },
): Promise<Invoice> {
  const [c] = await tx
    .select({ id: commissions.id, studioId: commissions.studioId, title: commissions.title, number: commissions.number, clientName: studioClients.displayName, clientAddress: studioClients.shippingAddress })
    .from(commissions)
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(eq(commissions.id, opts.commissionId));
  const [v] = await tx
    .select()
    .from(quoteVersions)
    .where(and(eq(quoteVersions.commissionId, c.id), eq(quoteVersions.status, "accepted")))
    .orderBy(desc(quoteVersions.number))
    .limit(1);
  if (!v) throw conflict("This commission has no accepted quote to invoice.");
  assertStoredDigits(`This ${opts.kind} cannot be issued`, v);
  const q = v.result as unknown as Quote;
  const paid = await paidSoFar(tx, c.id);
  const [seller] = await tx.select({ name: studios.name, legalName: studios.legalName, address: studios.address, taxNumber: studios.taxNumber }).from(studios).where(eq(studios.id, c.studioId));
  const byRate = taxByRateOf(q);
  const rateOf = new Map(byRate.map((r) => [r.category, r]));
  // What this receipt acknowledges, by rate: a balance is what the deposit left of each rate; any other part is split pro rata.
  const received = opts.receivedMinor ?? null;
  const receivedByRate =
    received === null
      ? null
      : opts.receivedFor === "balance" && received === q.totalMinor - paid.deposit && paid.deposit <= q.totalMinor
        ? remainderByRate(byRate, splitByRate(paid.deposit, byRate))
        : received <= q.totalMinor
          ? splitByRate(received, byRate)
          : null;
  // The studio's counter row stays locked until commit and every issue of the studio queues on it:
  // take it last, so the queue moves as fast as it can.
  const n = await allocateDocumentNumber(tx, c.studioId, opts.kind);
  const content: DocumentContent = {
    number: docNumber(opts.kind, n),
    clientName: c.clientName,
    clientAddress: c.clientAddress,
    title: c.title,
    commissionNumber: c.number,
    quoteVersion: v.number,
    lines: q.lines.map((l) => {
      const r = l.taxCategory ? rateOf.get(l.taxCategory) : byRate.length === 1 && l.kind !== "discount" ? byRate[0] : undefined;
      return { label: l.label, amountMinor: l.amountMinor, quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, per: l.kind === "labour" ? "h" : undefined, taxCategory: l.taxCategory, ratePpm: r?.ratePpm, rateLabel: r?.label };
    }),
    seller,
    supplyDate: new Date().toISOString().slice(0, 10),
    taxByRate: byRate,
    receivedByRate,
    quote: { subtotalMinor: q.subtotalMinor, taxMinor: q.taxMinor, totalMinor: q.totalMinor, pricesIncludeTax: q.pricesIncludeTax, taxRatePpm: q.taxRatePpm, depositMinor: q.depositMinor, balanceMinor: q.balanceMinor },
    depositPaidMinor: paid.deposit,
    balancePaidMinor: paid.balance,
    receivedMinor: opts.receivedMinor ?? null,
    receivedFor: opts.receivedFor ?? null,
    payUrl: opts.payUrl ?? null,
  };
  const [doc] = await tx
    .insert(invoices)
    .values({
      studioId: c.studioId,
      commissionId: c.id,
      kind: opts.kind,
      number: n,
      quoteVersionId: v.id,
      paymentId: opts.paymentId ?? null,
      currency: v.currency,
      minorDigits: v.minorDigits,
      content: content as unknown as Record<string, unknown>,
      totalMinor: opts.kind === "receipt" ? (opts.receivedMinor ?? q.totalMinor) : q.totalMinor - paid.deposit - paid.balance,
      dueDate: opts.dueDate ?? null,
    })
    .returning();
  return doc;
}

export async function renderDocumentPdf(doc: Invoice): Promise<Buffer> {
  assertStoredDigits(`${documentLabel(doc)} cannot be shown`, doc);
  const [s] = await db.select().from(studios).where(eq(studios.id, doc.studioId));
  const k = doc.content as unknown as DocumentContent;
  const cur = doc.currency;
  const multi = (k.taxByRate?.length ?? 0) > 1;
  const rate = multi ? "all rates" : `${k.quote.taxRatePpm / 10_000} %`;
  const taxRow = (r: { category: string; label: string; ratePpm: number; netMinor: number; taxMinor: number; grossMinor: number }) => ({
    label: r.category === "zero" || r.category === "exempt" || r.label === "Tax" ? r.label : `${r.label} ${formatRatePpm(r.ratePpm)}`,
    net: money(r.netMinor, cur),
    tax: money(r.taxMinor, cur),
    gross: money(r.grossMinor, cur),
  });
  const balanceLeft = k.quote.totalMinor - k.depositPaidMinor - k.balancePaidMinor;
  const totals = [
    ...(k.quote.pricesIncludeTax
      ? [
          { label: "Total", amount: money(k.quote.totalMinor, cur), strong: true },
          { label: `of which tax (${rate})`, amount: money(k.quote.taxMinor, cur) },
        ]
      : [
          { label: "Subtotal", amount: money(k.quote.subtotalMinor, cur) },
          { label: `Tax (${rate})`, amount: money(k.quote.taxMinor, cur) },
          { label: "Total", amount: money(k.quote.totalMinor, cur), strong: true },
        ]),
    { label: "Deposit paid", amount: money(k.depositPaidMinor, cur) },
    ...(k.balancePaidMinor > 0 ? [{ label: "Balance paid", amount: money(k.balancePaidMinor, cur) }] : []),
    { label: balanceLeft > 0 ? "Balance due" : "Balance", amount: money(Math.max(0, balanceLeft), cur), strong: true },
  ];
  return renderPdf(
    createElement(InvoiceDocument, {
      kind: doc.kind,
      number: k.number,
      // A document shows the seller as it was when issued.
      studio: { name: s.name, legalName: k.seller?.legalName ?? s.legalName, address: k.seller?.address ?? s.address, contactEmail: s.contactEmail, taxNumber: k.seller?.taxNumber ?? s.taxNumber, brandHex: s.brandHex },
      clientName: k.clientName,
      clientAddress: k.clientAddress,
      commissionTitle: k.title,
      commissionNumber: k.commissionNumber,
      quoteVersion: k.quoteVersion,
      issuedOn: doc.issuedAt.toISOString().slice(0, 10),
      dueDate: doc.kind === "invoice" ? doc.dueDate : null,
      lines: k.lines.map((l) => ({
        label: l.label,
        amount: money(l.amountMinor, cur),
        ...(k.taxByRate
          ? {
              quantity: l.quantity ?? (l.amountMinor >= 0 ? "1" : ""),
              unitPrice: `${money(l.unitPriceMinor ?? l.amountMinor, cur)}${l.per ? ` / ${l.per}` : ""}`,
              rate: l.ratePpm !== undefined ? (l.taxCategory === "zero" || l.taxCategory === "exempt" ? (l.rateLabel ?? "") : formatRatePpm(l.ratePpm)) : "spread over the rates",
            }
          : {}),
      })),
      supplyDate: k.supplyDate ?? null,
      taxByRate: k.taxByRate?.map((r) => taxRow(r)),
      receivedByRate: k.receivedByRate?.map((r) => taxRow(r)),
      totals,
      taxNote: k.quote.taxRatePpm === 0 ? "No tax is charged." : k.quote.pricesIncludeTax ? "Prices include tax." : "Tax is added to the subtotal.",
      payUrl: doc.kind === "invoice" && balanceLeft > 0 ? k.payUrl : null,
      paidNote: k.receivedMinor !== null ? `Received with thanks: ${money(k.receivedMinor, cur)} (${k.receivedFor ?? "payment"}).` : null,
    }),
  );
}

/** `row`: the mail parties, read before the document is numbered (see issueDocument). */
async function enqueueDocumentMail(tx: Tx, doc: Invoice, row: Awaited<ReturnType<typeof getCommissionMailParties>>) {
  const k = doc.content as unknown as DocumentContent;
  const mail = documentMessage({
    kind: doc.kind,
    number: k.number,
    clientName: k.clientName,
    studioName: row.studioName,
    title: k.title,
    amount: money(doc.totalMinor, doc.currency),
    url: appUrl(`/portal/commissions/${doc.commissionId}`),
    payUrl: k.payUrl,
    accentHex: row.brandHex,
  });
  await enqueueMail(
    // The PDF is rendered by the outbox worker when it sends, never inside this transaction.
    { to: row.clientEmail, ...mail, studioId: doc.studioId, dedupeKey: `document-${doc.id}`, attachments: [{ filename: `${k.number}.pdf`, contentType: "application/pdf", render: `document:${doc.id}` }] },
    tx,
  );
}

/** A document the actor may see (the client's own, or the studio's), or 404. */
export async function getDocumentFor(actor: Actor, id: string): Promise<Invoice> {
  const [doc] = await db.select().from(invoices).where(eq(invoices.id, id));
  if (!doc) throw notFound("That document");
  if (!(await getCommissionFor(actor, doc.commissionId).catch(nullIfNotFound))) throw notFound("That document");
  return doc;
}

export async function listDocumentsFor(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  return db.select().from(invoices).where(eq(invoices.commissionId, c.id)).orderBy(asc(invoices.issuedAt));
}

export const documentLabel = (doc: Pick<Invoice, "kind" | "number">) => docNumber(doc.kind, doc.number);

// --- the balance ------------------------------------------------------------------------------

/** Owner: the piece is ready; open the balance payment and send the invoice (a zero balance is recorded at once). */
export async function requestBalance(actor: Actor, commissionId: string): Promise<{ invoiceId: string | null; paymentId: string | null }> {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "payments.manage", c.studioId);
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(commissions).where(eq(commissions.id, c.id)).for("update");
    if (row.state !== "ready") throw conflict("The balance is requested once the piece is marked ready.");
    const [v] = await tx.select().from(quoteVersions).where(and(eq(quoteVersions.commissionId, c.id), eq(quoteVersions.status, "accepted"))).orderBy(desc(quoteVersions.number)).limit(1);
    if (!v) throw conflict("This commission has no accepted quote.");
    assertStoredDigits("The balance cannot be charged", v);
    const open = await tx.select().from(payments).where(and(eq(payments.commissionId, c.id), eq(payments.kind, "balance"), inArray(payments.status, ["open", "failed", "paid"]))).limit(1);
    if (open.length) throw conflict("The balance has already been requested.");
    const paid = await paidSoFar(tx, c.id);
    const due = v.totalMinor - paid.deposit;
    if (due <= 0) {
      await moveCommission(SYSTEM, c.id, "record_balance", { tx, detail: { note: "nothing left to pay" } });
      return { invoiceId: null, paymentId: null };
    }
    const [p] = await tx
      .insert(payments)
      .values({ studioId: c.studioId, commissionId: c.id, quoteVersionId: v.id, kind: "balance", amountMinor: due, currency: v.currency, minorDigits: v.minorDigits, idempotencyKey: `checkout-${randomUUID()}` })
      .returning();
    const dueDate = new Date(Date.now() + 14 * 86_400_000).toISOString().slice(0, 10);
    const parties = await getCommissionMailParties(tx, c.id);
    const doc = await issueDocument(tx, { commissionId: c.id, kind: "invoice", paymentId: p.id, dueDate, payUrl: appUrl(`/portal/commissions/${c.id}#payments`) });
    await enqueueDocumentMail(tx, doc, parties);
    return { invoiceId: doc.id, paymentId: p.id };
  });
}

// --- webhooks ---------------------------------------------------------------------------------

type Outcome = { status: number; body: Record<string, unknown> };

/** Provider events are small; anything larger is refused before it is read whole. */
export const MAX_WEBHOOK_BYTES = 1024 * 1024;

/** A copy PostgreSQL's jsonb accepts: NUL and lone surrogates replaced, nesting cut at 32 levels. */
function storable(value: unknown, depth = 0): unknown {
  const clean = (s: string) => s.replace(/\u0000|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, "\uFFFD");
  if (typeof value === "string") return clean(value);
  if (value === null || typeof value !== "object") return value;
  if (depth >= 32) return "[nested too deeply]";
  if (Array.isArray(value)) return value.map((v) => storable(v, depth + 1));
  return Object.fromEntries(Object.entries(value).map(([k, v]) => [clean(k), storable(v, depth + 1)]));
}

function issuesText(error: z.ZodError): string {
  return error.issues
    .slice(0, 8)
    .map((i) => `${i.path.join(".") || "(event)"}: ${i.message}`)
    .join("; ")
    .slice(0, 1000);
}

/** Records a signed event that cannot be applied, once per distinct body; answers 400 so it is seen. */
async function rejectEvent(rawBody: string, parsed: unknown, detail: string): Promise<Outcome> {
  const obj = parsed && typeof parsed === "object" && !Array.isArray(parsed) ? (parsed as Record<string, unknown>) : null;
  const claimedType = typeof obj?.type === "string" ? obj.type : "(none)";
  await db
    .insert(webhookEvents)
    .values({
      id: `rejected_${createHash("sha256").update(rawBody).digest("hex").slice(0, 40)}`,
      type: (storable(claimedType) as string).slice(0, 255),
      payload: (obj ? storable(obj) : { raw: storable(rawBody.slice(0, 4096)) }) as Record<string, unknown>,
      status: "rejected",
      detail,
    })
    .onConflictDoNothing();
  return { status: 400, body: { error: "The event is signed but malformed; it was recorded as rejected and not applied.", detail } };
}

/**
 * Verifies and applies one provider event. The signature is checked on the raw body; then the
 * event's shape is checked field by field (a signed but malformed event is recorded as rejected and
 * answered 400; a type we do not use is recorded and acknowledged). The event id is written in the
 * same transaction as its effects, so a replay (or a racing duplicate, from any app instance) is
 * acknowledged and changes nothing, and a failure part-way leaves no trace and is retried.
 */
export async function handleWebhook(rawBody: string, signature: string | null): Promise<Outcome> {
  const secret = env.STRIPE_WEBHOOK_SECRET;
  if (!secret) return { status: 503, body: { error: "webhooks are not configured" } };
  try {
    stripe().webhooks.signature!.verifyHeader(rawBody, signature ?? "", secret);
  } catch {
    return { status: 400, body: { error: "The signature does not match; the event was not applied." } };
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(rawBody);
  } catch {
    return rejectEvent(rawBody, null, "the body is not JSON");
  }
  const base = eventEnvelopeSchema.safeParse(parsed);
  if (!base.success) return rejectEvent(rawBody, parsed, issuesText(base.error));
  if (!(HANDLED_EVENT_TYPES as readonly string[]).includes(base.data.type)) {
    const [fresh] = await db
      .insert(webhookEvents)
      .values({ id: base.data.id, type: base.data.type, payload: storable(parsed) as Record<string, unknown>, status: "ignored", detail: "not a type Darnwell uses", processedAt: new Date() })
      .onConflictDoNothing()
      .returning({ id: webhookEvents.id });
    return { status: 200, body: { received: true, ...(fresh ? {} : { duplicate: true }), ignored: `event type ${base.data.type} is not used` } };
  }
  const checked = handledEventSchema.safeParse(parsed);
  if (!checked.success) return rejectEvent(rawBody, parsed, issuesText(checked.error));
  // The checked fields are the ones applyEvent reads; the rest of the event passes through as sent.
  const event = checked.data as unknown as Stripe.Event;
  return db.transaction(async (tx) => {
    const [fresh] = await tx
      .insert(webhookEvents)
      .values({ id: event.id, type: event.type, payload: storable(parsed) as Record<string, unknown>, status: "processed" })
      .onConflictDoNothing()
      .returning({ id: webhookEvents.id });
    if (!fresh) return { status: 200, body: { received: true, duplicate: true } };
    const result = await applyEvent(tx, event);
    await tx.update(webhookEvents).set({ processedAt: new Date() }).where(eq(webhookEvents.id, event.id));
    return { status: 200, body: { received: true, ...result } };
  });
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

async function paymentFor(tx: Tx, ref: { paymentId?: string | null; sessionId?: string | null; intentId?: string | null }): Promise<Payment | null> {
  const conds = [];
  if (ref.paymentId && UUID.test(ref.paymentId)) conds.push(eq(payments.id, ref.paymentId));
  if (ref.sessionId) conds.push(eq(payments.checkoutSessionId, ref.sessionId));
  if (ref.intentId) conds.push(eq(payments.paymentIntentId, ref.intentId));
  for (const cond of conds) {
    const [p] = await tx.select().from(payments).where(cond).for("update");
    if (p) return p;
  }
  return null;
}

const SETTLED = new Set(["paid", "partially_refunded", "refunded"]);

async function flag(tx: Tx, commissionId: string, kind: string, detail: Record<string, unknown>) {
  await tx.insert(commissionEvents).values({ commissionId, actorRole: "system", kind, detail });
}

async function markPaid(tx: Tx, p: Payment, info: { sessionId?: string | null; intentId?: string | null; amount: number; currency: string }): Promise<Record<string, unknown>> {
  if (SETTLED.has(p.status)) return { ignored: "already paid" };
  // The provider's amount is in its own units (ISK ×100, MGA whole ariary): back to ISO minor units, exactly.
  const received = info.currency.toUpperCase() === p.currency.toUpperCase() ? fromProviderAmount(info.amount, p.currency) : null;
  if (received !== p.amountMinor) {
    await flag(tx, p.commissionId, "payment_mismatch", { paymentId: p.id, expected: `${p.amountMinor} ${p.currency}`, received: `${info.amount} ${info.currency}` });
    return { ignored: "amount or currency does not match the payment; flagged for the owner" };
  }
  await tx
    .update(payments)
    .set({ status: "paid", paidAt: new Date(), paymentIntentId: info.intentId ?? p.paymentIntentId, checkoutSessionId: info.sessionId ?? p.checkoutSessionId })
    .where(eq(payments.id, p.id));
  const [c] = await tx.select({ state: commissions.state }).from(commissions).where(eq(commissions.id, p.commissionId));
  const move = p.kind === "deposit" ? "record_deposit" : "record_balance";
  const check = canMove(c.state, move, "system", { quoteAccepted: true, depositPaid: true });
  if (check.ok) {
    await moveCommission(SYSTEM, p.commissionId, move, { tx, detail: { paymentId: p.id, amountMinor: p.amountMinor } });
  } else {
    // Money arrived for a commission that has moved on (e.g. cancelled): keep it and tell the owner.
    await flag(tx, p.commissionId, "payment_out_of_state", { paymentId: p.id, state: c.state });
  }
  const parties = await getCommissionMailParties(tx, p.commissionId);
  await notify(tx, { to: "studio", kind: "payment", studioId: p.studioId, commissionId: p.commissionId, key: `paid:${p.id}`, link: `/studio/commissions/${p.commissionId}#quote-and-payments`,
    title: `${parties.clientName} paid the ${p.kind === "deposit" ? "deposit" : "balance"} for ${parties.title}`, body: `${money(p.amountMinor, p.currency)} received; the receipt has been sent to them.` });
  const receipt = await issueDocument(tx, { commissionId: p.commissionId, kind: "receipt", paymentId: p.id, receivedMinor: p.amountMinor, receivedFor: p.kind });
  await enqueueDocumentMail(tx, receipt, parties);
  return { paid: p.id, moved: check.ok ? move : null, receipt: receipt.id };
}

async function applyEvent(tx: Tx, event: Stripe.Event): Promise<Record<string, unknown>> {
  switch (event.type) {
    case "checkout.session.completed": {
      const s = event.data.object;
      const p = await paymentFor(tx, { paymentId: s.metadata?.paymentId ?? s.client_reference_id, sessionId: s.id });
      if (!p) return { ignored: "unknown session" };
      if (s.payment_status !== "paid") return { ignored: "session not paid yet" };
      const intentId = typeof s.payment_intent === "string" ? s.payment_intent : (s.payment_intent?.id ?? null);
      return markPaid(tx, p, { sessionId: s.id, intentId, amount: s.amount_total ?? -1, currency: s.currency ?? "" });
    }
    case "checkout.session.expired": {
      const s = event.data.object;
      const p = await paymentFor(tx, { paymentId: s.metadata?.paymentId ?? s.client_reference_id, sessionId: s.id });
      if (!p) return { ignored: "unknown session" };
      // Only the session we are waiting on; an older one, or one already paid, stays as it is.
      if (SETTLED.has(p.status) || (p.checkoutSessionId && p.checkoutSessionId !== s.id)) return { ignored: "not the current session" };
      await tx.update(payments).set({ status: "expired" }).where(eq(payments.id, p.id));
      return { expired: p.id };
    }
    case "payment_intent.payment_failed": {
      const pi = event.data.object;
      const p = await paymentFor(tx, { paymentId: pi.metadata?.paymentId, intentId: pi.id });
      if (!p) return { ignored: "unknown payment" };
      if (p.status !== "open") return { ignored: `payment is ${p.status}` };
      await tx.update(payments).set({ status: "failed" }).where(eq(payments.id, p.id));
      await flag(tx, p.commissionId, "payment_failed", { paymentId: p.id, reason: pi.last_payment_error?.message ?? "declined" });
      return { failed: p.id };
    }
    case "charge.refunded": {
      const ch = event.data.object;
      const intentId = typeof ch.payment_intent === "string" ? ch.payment_intent : (ch.payment_intent?.id ?? null);
      let p = await paymentFor(tx, { paymentId: ch.metadata?.paymentId, intentId });
      if (!p) return { ignored: "unknown payment" };
      if (!SETTLED.has(p.status)) {
        // The refund overtook the payment's own event: the charge exists, so it was paid.
        await markPaid(tx, p, { intentId, amount: ch.amount, currency: ch.currency });
        [p] = await tx.select().from(payments).where(eq(payments.id, p.id));
        if (!SETTLED.has(p.status)) return { ignored: "payment could not be settled" };
      }
      const { issueCreditNote } = await import("./credit-notes");
      for (const r of ch.refunds?.data ?? []) {
        const amountMinor = fromProviderAmount(r.amount, p.currency);
        if (amountMinor === null) continue;
        const [ins] = await tx
          .insert(refunds)
          .values({ paymentId: p.id, providerRefundId: r.id, amountMinor, minorDigits: p.minorDigits, reason: r.metadata?.reason ?? r.reason ?? "" })
          .onConflictDoNothing()
          .returning({ id: refunds.id });
        // Only the path that recorded the refund issues its credit note: one per refund.
        if (ins) await issueCreditNote(tx, ins.id);
      }
      const refunded = Math.min(p.amountMinor, Math.max(p.refundedMinor, fromProviderAmount(ch.amount_refunded, p.currency) ?? 0));
      await tx
        .update(payments)
        .set({ refundedMinor: refunded, status: refunded >= p.amountMinor ? "refunded" : refunded > 0 ? "partially_refunded" : p.status })
        .where(eq(payments.id, p.id));
      return { refunded: p.id, refundedMinor: refunded };
    }
    default:
      return { ignored: `event type ${event.type} is not used` };
  }
}

// --- refunds ------------------------------------------------------------------------------------

async function stageReached(commissionId: string, state: string): Promise<CancellationStage> {
  if (["ready", "balance_paid"].includes(state)) return "ready";
  if (["designing", "proof_sent", "proof_approved"].includes(state)) return "design";
  if (state === "in_production") {
    const rows = await db.select({ stage: pieces.stage }).from(pieces).where(eq(pieces.commissionId, commissionId));
    const order: CancellationStage[] = ["knitting", "embroidery", "blocking", "finishing"];
    let best = 0;
    for (const r of rows) best = Math.max(best, order.indexOf(r.stage as CancellationStage));
    return order[best] ?? "knitting";
  }
  return "accepted";
}

export async function previewRefund(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "payments.manage", c.studioId);
  const [v] = await db.select().from(quoteVersions).where(and(eq(quoteVersions.commissionId, c.id), eq(quoteVersions.status, "accepted"))).orderBy(desc(quoteVersions.number)).limit(1);
  if (!v) throw conflict("Nothing was paid on this commission.");
  assertStoredDigits("The refund cannot be worked out", v);
  const settings = await loadStudioSettings(c.studioId);
  const settled = await db.select().from(payments).where(and(eq(payments.commissionId, c.id), inArray(payments.status, ["paid", "partially_refunded"])));
  const paidMinor = settled.reduce((s, p) => s + p.amountMinor - p.refundedMinor, 0);
  const alreadyRefunded = settled.reduce((s, p) => s + p.refundedMinor, 0);
  const stage = await stageReached(c.id, c.state);
  const due = getRefundDue({
    currency: v.currency,
    totalMinor: v.totalMinor,
    depositMinor: v.depositMinor,
    paidMinor: paidMinor + alreadyRefunded,
    stageReached: stage,
    policy: policyFromSettings(settings.depositPercent, settings.depositRefundBeforeKnittingPercent),
  });
  // What is still to send back: the policy's refund less what has gone back already, never more than is held.
  const toRefund = Math.max(0, Math.min(paidMinor, due.refundMinor - alreadyRefunded));
  return { commission: c, stage, due, paidMinor, alreadyRefunded, toRefund, settled, currency: v.currency };
}

/**
 * Owner: refund what the cancellation policy says (partial where it says so), never more than
 * was paid; optionally cancel the commission first. Each refund has its own idempotency key, so a
 * retry after a provider fault never refunds twice.
 */
export async function refundByPolicy(actor: Actor, commissionId: string, opts: { cancel?: boolean; reason?: string } = {}) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "payments.manage", c.studioId);
  if (opts.cancel && c.state !== "cancelled") await moveCommission(actor, c.id, "cancel", { reason: opts.reason ?? "cancelled by the studio" });
  const preview = await previewRefund(actor, c.id);
  let left = preview.toRefund;
  const done: { paymentId: string; amountMinor: number }[] = [];
  // The balance goes back first, then the deposit.
  const order = [...preview.settled].sort((a, b) => (a.kind === b.kind ? 0 : a.kind === "balance" ? -1 : 1));
  for (const p of order) {
    if (left <= 0) break;
    assertStoredDigits("This payment cannot be refunded", p);
    // What the provider can send back is a multiple of its step (KWD 0.010, MGA 1.00): a remainder below
    // one step stays with the studio (the provider's documented workaround: round the refund down).
    const step = providerStepMinor(p.currency) ?? 1;
    const wanted = Math.min(left, p.amountMinor - p.refundedMinor);
    const amount = wanted - (wanted % step);
    if (amount <= 0 || !p.paymentIntentId) continue;
    const back = providerAmountOrThrow(amount, p.currency);
    let r: Stripe.Refund;
    try {
      r = await stripe().refunds.create(
        { payment_intent: p.paymentIntentId, amount: back.amount, reason: "requested_by_customer", metadata: { paymentId: p.id, reason: (opts.reason ?? "cancellation policy").slice(0, 500) } },
        { idempotencyKey: `refund-${p.id}-${p.refundedMinor}-${amount}` },
      );
    } catch (err) {
      throw providerError(err, "sending the refund");
    }
    const sentBack = fromProviderAmount(r.amount, p.currency) ?? amount;
    await db.transaction(async (tx) => {
      const [row] = await tx.select().from(payments).where(eq(payments.id, p.id)).for("update");
      const [ins] = await tx
        .insert(refunds)
        .values({ paymentId: p.id, providerRefundId: r.id, amountMinor: sentBack, minorDigits: p.minorDigits, reason: opts.reason ?? "cancellation policy" })
        .onConflictDoNothing()
        .returning();
      if (ins) {
        const refunded = Math.min(row.amountMinor, row.refundedMinor + sentBack);
        await tx.update(payments).set({ refundedMinor: refunded, status: refunded >= row.amountMinor ? "refunded" : "partially_refunded" }).where(eq(payments.id, p.id));
        const { issueCreditNote } = await import("./credit-notes");
        await issueCreditNote(tx, ins.id);
      }
      await tx.insert(commissionEvents).values({ commissionId: c.id, actorUserId: actor.userId, actorRole: "owner", kind: "refund", detail: { paymentId: p.id, amountMinor: sentBack, stage: preview.stage } });
    });
    done.push({ paymentId: p.id, amountMinor: sentBack });
    left -= sentBack;
  }
  return { stage: preview.stage, refundMinor: preview.toRefund, refunds: done, retainedMinor: preview.due.retainedMinor, currency: preview.currency };
}

// --- the studio's payments table ------------------------------------------------------------------

export interface PaymentFilters {
  status?: string;
  from?: string;
  to?: string;
}

export async function listPaymentsFor(actor: Actor, studioId: string, f: PaymentFilters = {}) {
  assertCan(actor, "payments.manage", studioId);
  const conds = [eq(payments.studioId, studioId)];
  if (f.status) conds.push(eq(payments.status, f.status as Payment["status"]));
  if (f.from) conds.push(gte(payments.createdAt, new Date(`${f.from}T00:00:00Z`)));
  if (f.to) conds.push(lt(payments.createdAt, new Date(Date.parse(`${f.to}T00:00:00Z`) + 86_400_000)));
  return db
    .select({
      id: payments.id,
      createdAt: payments.createdAt,
      paidAt: payments.paidAt,
      kind: payments.kind,
      status: payments.status,
      amountMinor: payments.amountMinor,
      refundedMinor: payments.refundedMinor,
      currency: payments.currency,
      commissionId: commissions.id,
      commissionNumber: commissions.number,
      commissionTitle: commissions.title,
      clientName: studioClients.displayName,
    })
    .from(payments)
    .innerJoin(commissions, eq(commissions.id, payments.commissionId))
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(and(...conds))
    .orderBy(desc(payments.createdAt));
}

export type PaymentRow = Awaited<ReturnType<typeof listPaymentsFor>>[number];

/** The payments a client sees on their commission page. */
export async function listCommissionPayments(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  return db.select().from(payments).where(eq(payments.commissionId, c.id)).orderBy(asc(payments.createdAt));
}
