import "server-only";
// Credit notes: one per refund, numbered per studio without gaps (counter kind "credit_note", taken
// in the transaction that records the refund), with the amounts credited per tax rate (negative)
// and the receipt or invoice they correct. Both refund paths (the owner's refund by policy and the
// provider's refund event) call issueCreditNote right after inserting the refund row, and only the
// one whose insert succeeded does, so each refund has exactly one credit note.
import { and, asc, desc, eq } from "drizzle-orm";
import { createElement } from "react";
import { db, type Tx } from "@/db";
import { commissions, creditNotes, invoices, payments, quoteVersions, refunds, studioClients, studios, type CreditNote } from "@/db/schema";
import type { Quote } from "@/lib/core/pricing/build-quote";
import { getMinorDigits } from "@/lib/core/pricing/currency";
import { formatMoney } from "@/lib/core/pricing/format-money";
import { formatRatePpm, splitByRate, taxByRateOf, type TaxRateShare } from "@/lib/core/pricing/tax";
import { env } from "@/lib/env";
import { creditNoteMessage } from "@/templates/email/money";
import { CreditNoteDocument } from "@/templates/pdf/credit-note";
import { enqueueMail } from "./outbox";
import type { Actor } from "./authz";
import { notFound, nullIfNotFound } from "./errors";
import { allocateDocumentNumber, type DocumentContent } from "./payments";
import { renderPdf } from "./pdf";
import { getCommissionFor, getCommissionMailParties } from "./queries/commissions";

export interface CreditNoteContent {
  number: string;
  clientName: string;
  clientAddress: string;
  title: string;
  commissionNumber: number;
  /** e.g. "RCT-0004 of 2026-12-03" */
  corrects: string;
  reason: string;
  /** negative amounts per rate; they add up to totalMinor */
  byRate: TaxRateShare[];
  seller: { name: string; legalName: string; address: string; taxNumber: string };
}

export const creditNoteLabel = (n: number) => `CRN-${String(n).padStart(4, "0")}`;

/** Issues the credit note for a refund row inserted in this transaction (or returns the one it has). */
export async function issueCreditNote(tx: Tx, refundId: string): Promise<CreditNote> {
  const [existing] = await tx.select().from(creditNotes).where(eq(creditNotes.refundId, refundId));
  if (existing) return existing;
  const [r] = await tx.select().from(refunds).where(eq(refunds.id, refundId));
  if (!r) throw notFound("That refund");
  const [p] = await tx.select().from(payments).where(eq(payments.id, r.paymentId));
  const [c] = await tx
    .select({ id: commissions.id, studioId: commissions.studioId, title: commissions.title, number: commissions.number, clientName: studioClients.displayName, clientAddress: studioClients.shippingAddress })
    .from(commissions)
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(eq(commissions.id, p.commissionId));
  const [seller] = await tx.select({ name: studios.name, legalName: studios.legalName, address: studios.address, taxNumber: studios.taxNumber }).from(studios).where(eq(studios.id, c.studioId));
  // The document corrected: the receipt for this payment, else the latest invoice of the commission.
  const [receipt] = await tx.select().from(invoices).where(and(eq(invoices.paymentId, p.id), eq(invoices.kind, "receipt"))).orderBy(asc(invoices.issuedAt)).limit(1);
  const [invoice] = receipt ? [receipt] : await tx.select().from(invoices).where(eq(invoices.commissionId, c.id)).orderBy(desc(invoices.issuedAt)).limit(1);
  const corrected = invoice?.content as unknown as DocumentContent | undefined;
  // Split the refund as the payment it reverses was split (the receipt's rates), else as the quote was.
  let base = corrected?.receivedByRate ?? null;
  if (!base) {
    const [v] = p.quoteVersionId ? await tx.select().from(quoteVersions).where(eq(quoteVersions.id, p.quoteVersionId)) : [];
    const q = v?.result as unknown as Quote | undefined;
    base = q ? splitByRate(p.amountMinor, taxByRateOf(q)) : [{ category: "standard", label: "Tax", ratePpm: 0, grossMinor: p.amountMinor, taxMinor: 0, netMinor: p.amountMinor }];
  }
  const byRate = splitByRate(-r.amountMinor, base);
  // Taken last: the counter row stays locked until commit (see allocateDocumentNumber).
  const n = await allocateDocumentNumber(tx, c.studioId, "credit_note");
  const content: CreditNoteContent = {
    number: creditNoteLabel(n),
    clientName: c.clientName,
    clientAddress: c.clientAddress,
    title: c.title,
    commissionNumber: c.number,
    corrects: invoice && corrected ? `${corrected.number} of ${invoice.issuedAt.toISOString().slice(0, 10)}` : `payment of ${formatMoney(p.amountMinor, p.currency)}`,
    reason: r.reason,
    byRate,
    seller,
  };
  const [row] = await tx
    .insert(creditNotes)
    .values({
      studioId: c.studioId,
      commissionId: c.id,
      number: n,
      refundId: r.id,
      paymentId: p.id,
      correctsId: invoice?.id ?? null,
      currency: p.currency,
      minorDigits: getMinorDigits(p.currency),
      content: content as unknown as Record<string, unknown>,
      totalMinor: -r.amountMinor,
    })
    .returning();
  // The PDF is rendered by the outbox worker when it sends, never inside this transaction.
  const parties = await getCommissionMailParties(tx, c.id);
  const mail = creditNoteMessage({
    number: content.number,
    clientName: c.clientName,
    studioName: parties.studioName,
    title: c.title,
    amount: formatMoney(r.amountMinor, p.currency),
    url: `${env.BETTER_AUTH_URL}/portal/commissions/${c.id}`,
    accentHex: parties.brandHex,
  });
  await enqueueMail(
    { to: parties.clientEmail, ...mail, studioId: c.studioId, dedupeKey: `credit-note-${row.id}`, attachments: [{ filename: `${content.number}.pdf`, contentType: "application/pdf", render: `credit-note:${row.id}` }] },
    tx,
  );
  return row;
}

export async function renderCreditNotePdf(cn: CreditNote): Promise<Buffer> {
  const [s] = await db.select().from(studios).where(eq(studios.id, cn.studioId));
  const k = cn.content as unknown as CreditNoteContent;
  const m = (n: number) => formatMoney(n, cn.currency);
  const tax = k.byRate.reduce((t, r) => t + r.taxMinor, 0);
  return renderPdf(
    createElement(CreditNoteDocument, {
      number: k.number,
      studio: { name: s.name, legalName: k.seller.legalName, address: k.seller.address, contactEmail: s.contactEmail, taxNumber: k.seller.taxNumber, brandHex: s.brandHex },
      clientName: k.clientName,
      clientAddress: k.clientAddress,
      commissionTitle: k.title,
      commissionNumber: k.commissionNumber,
      issuedOn: cn.issuedAt.toISOString().slice(0, 10),
      corrects: k.corrects,
      reason: k.reason,
      byRate: k.byRate.map((r) => ({
        label: r.category === "zero" || r.category === "exempt" || r.label === "Tax" ? r.label : `${r.label} ${formatRatePpm(r.ratePpm)}`,
        net: m(r.netMinor),
        tax: m(r.taxMinor),
        gross: m(r.grossMinor),
      })),
      totals: [
        { label: "Net credited", amount: m(cn.totalMinor - tax) },
        { label: "Tax credited", amount: m(tax) },
        { label: "Total credited", amount: m(cn.totalMinor), strong: true },
      ],
    }),
  );
}

/** A credit note the actor may see (the client's own commission, or the studio's), or 404. */
export async function getCreditNoteFor(actor: Actor, id: string): Promise<CreditNote> {
  const [cn] = await db.select().from(creditNotes).where(eq(creditNotes.id, id));
  if (!cn) throw notFound("That credit note");
  if (!(await getCommissionFor(actor, cn.commissionId).catch(nullIfNotFound))) throw notFound("That credit note");
  return cn;
}

export async function listCreditNotesFor(actor: Actor, commissionId: string): Promise<CreditNote[]> {
  const c = await getCommissionFor(actor, commissionId);
  return db.select().from(creditNotes).where(eq(creditNotes.commissionId, c.id)).orderBy(asc(creditNotes.number));
}
