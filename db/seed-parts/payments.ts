// Demo payments and documents: paid deposits (with receipts) for elias-hat and priya-pullover;
// deposit, balance, the balance invoice and both receipts for elias-reindeer. Document content has
// the same shape lib/server/payments.ts issues (that module is server-only), numbered per kind.
import { and, eq } from "drizzle-orm";
import type { Quote } from "../../lib/core/pricing/build-quote";
import { commissions, documentCounters, invoices, payments, quoteVersions, studioClients } from "../schema";
import type { SeedContext, SeedPart } from "./context";

const DAY = 86_400_000;

export const seedPayments: SeedPart = async (tx, ctx: SeedContext) => {
  const counters = { invoice: 0, receipt: 0 };
  const number = (kind: "invoice" | "receipt") => ++counters[kind];
  const label = (kind: "invoice" | "receipt", n: number) => `${kind === "invoice" ? "INV" : "RCT"}-${String(n).padStart(4, "0")}`;

  for (const key of ["elias-reindeer", "elias-hat", "priya-pullover"]) {
    const commissionId = ctx.commissionIds[key];
    const [c] = await tx
      .select({ title: commissions.title, number: commissions.number, clientName: studioClients.displayName, clientAddress: studioClients.shippingAddress })
      .from(commissions)
      .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
      .where(eq(commissions.id, commissionId));
    const [v] = await tx.select().from(quoteVersions).where(and(eq(quoteVersions.commissionId, commissionId), eq(quoteVersions.status, "accepted")));
    if (!v) continue;
    const q = v.result as unknown as Quote;
    const acceptedAt = (v.acceptedAt ?? new Date()).getTime();
    const kinds: ("deposit" | "balance")[] = key === "elias-reindeer" ? ["deposit", "balance"] : ["deposit"];
    const paid = { deposit: 0, balance: 0 };
    for (const kind of kinds) {
      const amount = kind === "deposit" ? v.depositMinor : v.balanceMinor;
      const paidAt = new Date(acceptedAt + (kind === "deposit" ? 1 : 60) * DAY);
      const [p] = await tx
        .insert(payments)
        .values({
          studioId: ctx.studioId,
          commissionId,
          quoteVersionId: v.id,
          kind,
          status: "paid",
          amountMinor: amount,
          currency: v.currency,
          minorDigits: v.minorDigits,
          paymentIntentId: `pi_demo_${key.replace(/-/g, "_")}_${kind}`,
          idempotencyKey: `demo-${key}-${kind}`,
          createdAt: new Date(paidAt.getTime() - DAY),
          paidAt,
        })
        .returning();
      const content = (docKind: "invoice" | "receipt", n: number) => ({
        number: label(docKind, n),
        clientName: c.clientName,
        clientAddress: c.clientAddress,
        title: c.title,
        commissionNumber: c.number,
        quoteVersion: v.number,
        lines: q.lines.map((l) => ({ label: l.label, amountMinor: l.amountMinor })),
        quote: { subtotalMinor: q.subtotalMinor, taxMinor: q.taxMinor, totalMinor: q.totalMinor, pricesIncludeTax: q.pricesIncludeTax, taxRatePpm: q.taxRatePpm, depositMinor: q.depositMinor, balanceMinor: q.balanceMinor },
        depositPaidMinor: paid.deposit,
        balancePaidMinor: paid.balance,
        receivedMinor: docKind === "receipt" ? amount : null,
        receivedFor: docKind === "receipt" ? kind : null,
        payUrl: null,
      });
      if (kind === "balance") {
        const n = number("invoice");
        await tx.insert(invoices).values({
          studioId: ctx.studioId,
          commissionId,
          kind: "invoice",
          number: n,
          quoteVersionId: v.id,
          paymentId: p.id,
          currency: v.currency,
          minorDigits: v.minorDigits,
          content: content("invoice", n),
          totalMinor: amount,
          dueDate: new Date(paidAt.getTime() + 13 * DAY).toISOString().slice(0, 10),
          issuedAt: new Date(paidAt.getTime() - DAY),
        });
      }
      paid[kind] += amount;
      const n = number("receipt");
      await tx.insert(invoices).values({
        studioId: ctx.studioId,
        commissionId,
        kind: "receipt",
        number: n,
        quoteVersionId: v.id,
        paymentId: p.id,
        currency: v.currency,
        minorDigits: v.minorDigits,
        content: content("receipt", n),
        totalMinor: amount,
        issuedAt: paidAt,
      });
    }
  }
  await tx.insert(documentCounters).values([
    { studioId: ctx.studioId, kind: "invoice", next: counters.invoice + 1 },
    { studioId: ctx.studioId, kind: "receipt", next: counters.receipt + 1 },
  ]);
};
