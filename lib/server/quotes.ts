import "server-only";
// Quote versions: the owner drafts one from the labour estimate and the studio's settings, sends
// it (then it never changes), and the client accepts it or asks for changes in the portal.
import { and, asc, desc, eq, inArray, ne } from "drizzle-orm";
import { createElement } from "react";
import { db, type Executor, type Tx } from "@/db";
import { commissions, quoteVersions, studioClients, studios, yarnLots, yarnReservations, yarns, type QuoteVersion } from "@/db/schema";
import { composeQuote, type QuoteDraft, type QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { formatMoney } from "@/lib/core/pricing/format-money";
import type { Quote } from "@/lib/core/pricing/build-quote";
import { PricingInputError } from "@/lib/core/pricing/pricing-error";
import { isProviderCurrency, withProviderDeposit } from "@/lib/core/pricing/provider-currency";
import { formatRatePpm, taxByRateOf } from "@/lib/core/pricing/tax";
import { env } from "@/lib/env";
import type { QuoteDraftBody } from "@/lib/schemas/quotes";
import type { StudioSettings } from "@/lib/schemas/settings";
import { QuoteDocument } from "@/templates/pdf/quote";
import { quoteSentMessage } from "@/templates/email/money";
import { assertCan, can, type Actor } from "./authz";
import { AppError, conflict, notFound, nullIfNotFound } from "./errors";
import { assertStoredDigits } from "./money-guard";
import { labourLevelNote } from "@/lib/core/pricing/labour-level";
import { notify } from "./notifications";
import { renderPdf } from "./pdf";
import { getCommissionFor, getCommissionMailParties } from "./queries/commissions";
import { loadStudioSettings } from "./settings";
import { moveCommission } from "./workflow";
import { getEarliestPromiseDate } from "./schedule";
import { getCommissionYarnEstimate, getPricedDesignVersion } from "./design-yarn";
import { getCommissionGarment, problemsText } from "./garment";

export const todayIso = (d = new Date()) => d.toISOString().slice(0, 10);
const addDays = (iso: string, days: number) => todayIso(new Date(Date.parse(`${iso}T00:00:00Z`) + days * 86_400_000));

export function policyFrom(settings: StudioSettings, currency: string): QuotePolicy {
  return {
    currency,
    hourlyRateMinor: settings.hourlyRateMinor,
    labourPolicy: settings.pricePolicy,
    taxRatePercent: settings.taxRatePercent,
    pricesIncludeTax: settings.pricesIncludeTax,
    depositPercent: settings.depositPercent,
    // The standard category's rate is the studio's tax rate (taxRatePercent), so the two never disagree.
    ...(settings.taxCategories.length
      ? { taxCategories: settings.taxCategories.map((c) => (c.id === "standard" ? { id: c.id, label: c.label } : c)), taxDefaults: settings.taxDefaults }
      : {}),
    rates: settings.rates,
    p80Factors: settings.p80Factors,
  };
}

/** What a stored version was built from (kept whole so the builder can reopen it). */
export interface StoredQuoteInput {
  draft: QuoteDraft;
  policy: QuotePolicy;
  validUntil: string | null;
  estimate: { p50Minutes: number; p80Minutes: number };
}

export const quoteOf = (v: Pick<QuoteVersion, "result">) => v.result as unknown as Quote;
export const storedInputOf = (v: Pick<QuoteVersion, "input">) => v.input as unknown as StoredQuoteInput;

export function quoteTotalsRows(q: Quote) {
  const m = (n: number) => formatMoney(n, q.currency);
  const rate = (q.taxByRate?.length ?? 0) > 1 ? "all rates" : `${q.taxRatePpm / 10_000} %`;
  return [
    ...(q.pricesIncludeTax
      ? [
          { label: "Total", amount: m(q.totalMinor), strong: true },
          { label: `of which tax (${rate})`, amount: m(q.taxMinor) },
        ]
      : [
          { label: "Subtotal", amount: m(q.subtotalMinor) },
          { label: `Tax (${rate})`, amount: m(q.taxMinor) },
          { label: "Total", amount: m(q.totalMinor), strong: true },
        ]),
    { label: "Deposit to book", amount: m(q.depositMinor) },
    { label: "Balance when ready", amount: m(q.balanceMinor) },
  ];
}

export function taxNote(q: Quote): string {
  if (q.taxRatePpm === 0) return "No tax is charged on this quote.";
  const once = (q.taxByRate?.length ?? 0) > 1 ? "it is worked once per rate, on that rate's lines" : "it is worked once on the whole";
  return q.pricesIncludeTax ? `Prices include tax; the tax contained is shown above (${once}).` : `Tax is added to the subtotal; ${once}.`;
}

// --- the builder ------------------------------------------------------------------------------

export async function getQuoteBuilderData(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "commission.price", c.studioId);
  const settings = await loadStudioSettings(c.studioId);
  const yarnRows = await db
    .select({ id: yarns.id, name: yarns.name, colourName: yarns.colourName, hex: yarns.hex, priceMinor: yarns.priceMinor })
    .from(yarns)
    .where(eq(yarns.studioId, c.studioId))
    .orderBy(asc(yarns.colourName));
  const versions = await db.select().from(quoteVersions).where(eq(quoteVersions.commissionId, c.id)).orderBy(desc(quoteVersions.number));
  const priced = await getPricedDesignVersion(c.id);
  // Every stitch of every piece, once: the garment from the sizing with the priced design on it.
  const garment = await getCommissionGarment(c, { settings, priced });
  // A suggestion only: if it cannot be worked out the builder still opens, with the yarn lines to fill in.
  const yarnEstimate = await getCommissionYarnEstimate(actor, c, priced, garment).catch((err: unknown) => {
    console.error("yarn estimate:", (err as Error).message);
    return null;
  });
  const known = new Set(yarnRows.map((y) => y.id));
  const suggested = (yarnEstimate?.lines ?? []).filter((l) => l.yarnId && known.has(l.yarnId) && l.skeins);
  // What the studio's schedule can promise for this garment after everything already booked.
  const promise = await getEarliestPromiseDate(c.studioId, garment.pieces.map((features) => ({ features, label: features.label }))).catch(() => null);
  const latest = versions[0];
  const previous: QuoteDraft | null = latest ? storedInputOf(latest).draft : null;
  const initial: QuoteDraft = previous ?? {
    pieces: garment.pieces,
    // Skeins from the design's yarn estimate where its colours are studio yarns; else two to choose from.
    materials: suggested.length
      ? suggested.map((l) => {
          const y = yarnRows.find((r) => r.id === l.yarnId)!;
          return { yarnId: y.id, label: `${y.name}, ${y.colourName} (skeins)`, skeins: l.skeins!.skeins, unitPriceMinor: y.priceMinor };
        })
      : yarnRows.slice(0, 2).map((y) => ({ yarnId: y.id, label: `${y.name}, ${y.colourName} (skeins)`, skeins: 1, unitPriceMinor: y.priceMinor })),
    extras: [],
    designFeeMinor: settings.designFeeMinor,
    shippingMinor: 0,
    discountMinor: 0,
    requestedDate: c.neededBy,
    earliestDate: promise?.date ?? null,
    rushFeeMinor: null,
  };
  return {
    commission: c,
    settings,
    policy: policyFrom(settings, c.currency),
    yarns: yarnRows,
    versions,
    initial,
    featuresFromDesign: garment.placedCharts.length > 0,
    garment: { sizedFrom: garment.sizedFrom, note: garment.note, problems: problemsText(garment.problems) },
    yarnEstimate,
    scheduleEarliest: promise?.date ?? null,
    sentQuote: versions.find((v) => v.status === "sent" || v.status === "accepted") ?? null,
  };
}

async function draftFromBody(studioId: string, body: QuoteDraftBody): Promise<QuoteDraft> {
  const ids = [...new Set(body.materials.map((m) => m.yarnId))];
  const rows = ids.length ? await db.select().from(yarns).where(and(eq(yarns.studioId, studioId), inArray(yarns.id, ids))) : [];
  const byId = new Map(rows.map((y) => [y.id, y]));
  const materials = body.materials.map((m, i) => {
    const y = byId.get(m.yarnId);
    if (!y) throw new AppError(422, "invalid_input", "Choose a yarn from the studio's list.", { [`materials.${i}.yarnId`]: ["Choose a yarn from the studio's list."] });
    return { yarnId: y.id, label: `${y.name}, ${y.colourName} (skeins)`, skeins: m.skeins, unitPriceMinor: y.priceMinor, taxCategory: m.taxCategory ?? null };
  });
  return {
    pieces: body.pieces,
    materials,
    extras: body.extras,
    labourTaxCategory: body.labourTaxCategory ?? null,
    designFeeMinor: body.designFeeMinor,
    shippingMinor: body.shippingMinor,
    discountMinor: body.discountMinor,
    requestedDate: body.requestedDate ?? null,
    earliestDate: body.earliestDate ?? null,
    rushFeeMinor: body.rushFeeMinor ?? null,
  };
}

function compose(draft: QuoteDraft, policy: QuotePolicy) {
  try {
    return composeQuote(draft, policy);
  } catch (err) {
    if (err instanceof PricingInputError && err.field) throw new AppError(422, "invalid_quote", err.message, { [err.field]: [err.message] });
    if (err instanceof PricingInputError || err instanceof RangeError) throw new AppError(422, "invalid_quote", err.message);
    throw err;
  }
}

/** Owner only: saves the draft version (replacing an unsent draft, or starting a new version). */
export async function saveQuoteDraft(actor: Actor, commissionId: string, body: QuoteDraftBody): Promise<QuoteVersion> {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "commission.price", c.studioId);
  if (["closed", "cancelled", "declined", "shipped", "delivered"].includes(c.state)) throw conflict("This commission has ended; it cannot be quoted again.");
  const settings = await loadStudioSettings(c.studioId);
  const policy = policyFrom(settings, c.currency);
  const draft = await draftFromBody(c.studioId, body);
  const { quote: built, estimate } = compose(draft, policy);
  // The deposit the client pays by card must be an amount the provider can charge (KWD in steps of
  // 0.010, MGA whole ariary): round it here, where the quote is built, so quote, checkout and receipt agree.
  const fitted = withProviderDeposit(built);
  if (fitted.problem && isProviderCurrency(built.currency)) throw new AppError(422, "invalid_quote", fitted.problem);
  const quote = { ...fitted.quote, ...(fitted.note ? { depositNote: fitted.note } : {}) };
  if (body.validUntil && body.validUntil < todayIso()) throw new AppError(422, "invalid_input", "The validity date is in the past.", { validUntil: ["Choose today or a later date."] });
  const design = { designVersionId: (await getPricedDesignVersion(c.id))?.version.id ?? null };
  const input: StoredQuoteInput = { draft, policy, validUntil: body.validUntil ?? null, estimate: { p50Minutes: estimate.totals.p50Minutes, p80Minutes: estimate.totals.p80Minutes } };
  const values = {
    currency: c.currency,
    minorDigits: quote.minorDigits,
    input: input as unknown as Record<string, unknown>,
    result: quote as unknown as Record<string, unknown>,
    totalMinor: quote.totalMinor,
    depositMinor: quote.depositMinor,
    balanceMinor: quote.balanceMinor,
    designVersionId: design.designVersionId,
    validUntil: body.validUntil ?? null,
    messageToClient: body.messageToClient,
  };
  return db.transaction(async (tx) => {
    await tx.select({ id: commissions.id }).from(commissions).where(eq(commissions.id, c.id)).for("update");
    const [latest] = await tx.select().from(quoteVersions).where(eq(quoteVersions.commissionId, c.id)).orderBy(desc(quoteVersions.number)).limit(1);
    if (latest?.status === "draft") {
      const [row] = await tx.update(quoteVersions).set(values).where(and(eq(quoteVersions.id, latest.id), eq(quoteVersions.status, "draft"))).returning();
      return row;
    }
    const [row] = await tx
      .insert(quoteVersions)
      .values({ ...values, studioId: c.studioId, commissionId: c.id, number: (latest?.number ?? 0) + 1, createdBy: actor.userId })
      .returning();
    return row;
  });
}

// --- documents --------------------------------------------------------------------------------

async function studioDoc(studioId: string) {
  const [s] = await db.select().from(studios).where(eq(studios.id, studioId));
  if (!s) throw notFound("That studio");
  return { row: s, doc: { name: s.name, legalName: s.legalName, address: s.address, contactEmail: s.contactEmail, taxNumber: s.taxNumber, brandHex: s.brandHex } };
}

export const portalUrl = (commissionId: string) => `${env.BETTER_AUTH_URL}/portal/commissions/${commissionId}`;

export async function renderQuotePdf(v: QuoteVersion): Promise<Buffer> {
  assertStoredDigits("This quote cannot be shown", v);
  const q = quoteOf(v);
  const [c] = await db
    .select({ title: commissions.title, number: commissions.number, clientName: studioClients.displayName })
    .from(commissions)
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(eq(commissions.id, v.commissionId));
  const { doc } = await studioDoc(v.studioId);
  return renderPdf(
    createElement(QuoteDocument, {
      studio: doc,
      clientName: c.clientName,
      commissionTitle: c.title,
      commissionNumber: c.number,
      version: v.number,
      issuedOn: todayIso(v.sentAt ?? v.createdAt),
      validUntil: v.validUntil ?? "",
      lines: q.lines.map((l) => ({ label: l.label, amount: formatMoney(l.amountMinor, q.currency) })),
      totals: quoteTotalsRows(q),
      // Totals per rate whenever there is more than one (they add up to the totals above).
      taxByRate:
        taxByRateOf(q).length > 1
          ? taxByRateOf(q).map((r) => ({
              label: r.category === "zero" || r.category === "exempt" ? r.label : `${r.label} ${formatRatePpm(r.ratePpm)}`,
              net: formatMoney(r.netMinor, q.currency),
              tax: formatMoney(r.taxMinor, q.currency),
              gross: formatMoney(r.grossMinor, q.currency),
            }))
          : undefined,
      taxNote: taxNote(q),
      labourNote: labourLevelNote(q),
      message: v.messageToClient,
      portalUrl: portalUrl(v.commissionId),
    }),
  );
}

/** A quote version the actor may see: the studio sees all, the client only sent ones. */
export async function getQuoteFor(actor: Actor, quoteId: string, q: Executor = db): Promise<QuoteVersion> {
  const [v] = await q.select().from(quoteVersions).where(eq(quoteVersions.id, quoteId));
  if (!v) throw notFound("That quote");
  const c = await getCommissionFor(actor, v.commissionId, q).catch(nullIfNotFound);
  if (!c) throw notFound("That quote");
  if (!can(actor, "studio.view", c.studioId) && v.status === "draft") throw notFound("That quote");
  return v;
}

export async function listQuotesFor(actor: Actor, commissionId: string, opts: { asClient?: boolean } = {}) {
  const c = await getCommissionFor(actor, commissionId);
  const member = !opts.asClient && can(actor, "studio.view", c.studioId);
  return db
    .select()
    .from(quoteVersions)
    .where(member ? eq(quoteVersions.commissionId, c.id) : and(eq(quoteVersions.commissionId, c.id), ne(quoteVersions.status, "draft")))
    .orderBy(desc(quoteVersions.number));
}

// --- sending ---------------------------------------------------------------------------------

/** Owner only: sends the draft (it is frozen from now on), supersedes older versions, moves the commission. */
export async function sendQuote(actor: Actor, quoteId: string): Promise<QuoteVersion> {
  const v0 = await getQuoteFor(actor, quoteId);
  assertCan(actor, "commission.price", v0.studioId);
  const settings = await loadStudioSettings(v0.studioId);
  return db.transaction(async (tx) => {
    const [c] = await tx.select().from(commissions).where(eq(commissions.id, v0.commissionId)).for("update");
    const [v] = await tx.select().from(quoteVersions).where(eq(quoteVersions.id, quoteId)).for("update");
    if (v.status !== "draft") throw conflict("This version has already been sent; make a new version to change it.");
    assertStoredDigits("This quote cannot be sent", v);
    const [latest] = await tx.select({ id: quoteVersions.id }).from(quoteVersions).where(eq(quoteVersions.commissionId, c.id)).orderBy(desc(quoteVersions.number)).limit(1);
    if (latest.id !== v.id) throw conflict("A newer version exists; send that one.");
    if (c.state === "enquiry") await moveCommission(actor, c.id, "start_quote", { tx });
    else if (c.state === "quote_sent") await moveCommission(actor, c.id, "revise_quote", { tx, reason: "new quote version" });
    else if (c.state !== "quoting") throw conflict("Reopen the quote on this commission before sending a new version.");
    await moveCommission(actor, c.id, "send_quote", { tx, detail: { quoteVersion: v.number, totalMinor: v.totalMinor } });
    const validUntil = v.validUntil ?? addDays(todayIso(), settings.quoteValidDays);
    await tx
      .update(quoteVersions)
      .set({ status: "superseded" })
      .where(and(eq(quoteVersions.commissionId, c.id), inArray(quoteVersions.status, ["sent", "changes_requested"]), ne(quoteVersions.id, v.id)));
    const [sent] = await tx.update(quoteVersions).set({ status: "sent", sentAt: new Date(), validUntil }).where(eq(quoteVersions.id, v.id)).returning();
    await tx.update(commissions).set({ priceMinor: sent.totalMinor }).where(eq(commissions.id, c.id));
    await enqueueQuoteMail(tx, sent);
    return sent;
  });
}

async function enqueueQuoteMail(tx: Tx, v: QuoteVersion) {
  const q = quoteOf(v);
  const row = await getCommissionMailParties(tx, v.commissionId);
  const mail = quoteSentMessage({
    clientName: row.clientName,
    studioName: row.studioName,
    title: row.title,
    total: formatMoney(q.totalMinor, q.currency),
    deposit: formatMoney(q.depositMinor, q.currency),
    validUntil: v.validUntil ?? "",
    url: `${portalUrl(v.commissionId)}#quote`,
    message: v.messageToClient,
    accentHex: row.brandHex,
  });
  await notify(tx, {
    to: "client", kind: "quote_sent", studioId: v.studioId, commissionId: v.commissionId, key: `quote-sent:${v.id}`, link: `/portal/commissions/${v.commissionId}#quote`,
    title: `${row.studioName} sent you a quote for ${row.title}`, body: `Total ${formatMoney(q.totalMinor, q.currency)}; read it and accept it, or ask for changes.`,
    // The PDF is rendered by the outbox worker when it sends, never inside this transaction.
    mail: { ...mail, dedupeKey: `quote-sent-${v.id}`, attachments: [{ filename: `quote-${row.number}-${v.number}.pdf`, contentType: "application/pdf", render: `quote:${v.id}` }] },
  });
}

// --- the client's answer ------------------------------------------------------------------------

function refuseUnlessOpen(v: QuoteVersion, latestId: string) {
  if (v.status === "accepted") throw conflict(`You accepted this quote on ${todayIso(v.acceptedAt ?? new Date())}; there is nothing more to do.`);
  if (v.status === "superseded" || v.id !== latestId) throw conflict("This version has been replaced by a newer quote; please look at the latest one.");
  if (v.status === "changes_requested") throw conflict("You asked for changes to this version; the studio will send a new one.");
  if (v.status === "expired" || (v.validUntil && v.validUntil < todayIso())) throw conflict(`This quote expired on ${v.validUntil}; ask the studio for a fresh one.`);
  if (v.status !== "sent") throw conflict("This quote is not open for an answer.");
}

async function lockForAnswer(tx: Tx, actor: Actor, quoteId: string) {
  const v0 = await getQuoteFor(actor, quoteId, tx);
  const [c] = await tx.select().from(commissions).where(eq(commissions.id, v0.commissionId)).for("update");
  if (!actor.clientOf.some((x) => x.clientId === c.clientId)) throw notFound("That quote");
  const [v] = await tx.select().from(quoteVersions).where(eq(quoteVersions.id, quoteId)).for("update");
  const [latest] = await tx.select({ id: quoteVersions.id }).from(quoteVersions).where(eq(quoteVersions.commissionId, c.id)).orderBy(desc(quoteVersions.number)).limit(1);
  refuseUnlessOpen(v, latest.id);
  return { c, v };
}

/** Reserves the quote's skeins from the lots with the most stock (one lot per yarn when it can). */
async function reserveYarn(tx: Tx, commissionId: string, draft: QuoteDraft) {
  for (const m of draft.materials) {
    if (m.skeins <= 0) continue;
    const lots = await tx.select().from(yarnLots).where(eq(yarnLots.yarnId, m.yarnId)).orderBy(desc(yarnLots.stockSkeins)).limit(1);
    const lot = lots[0];
    await tx.insert(yarnReservations).values({
      commissionId,
      yarnId: m.yarnId,
      lotId: lot?.id ?? null,
      skeins: m.skeins,
      needsSecondLot: !lot || lot.stockSkeins < m.skeins,
    });
  }
}

/**
 * The client accepts a sent, current, unexpired version: name typed, time and version recorded,
 * yarn reserved and the deposit payment opened, all in one transaction. The checkout session is
 * made afterwards (lib/server/payments), so a payments outage never undoes the acceptance.
 */
export async function acceptQuote(actor: Actor, input: { quoteId: string; name: string }) {
  const { openDepositPayment } = await import("./payments");
  return db.transaction(async (tx) => {
    const { c, v } = await lockForAnswer(tx, actor, input.quoteId);
    const [accepted] = await tx
      .update(quoteVersions)
      .set({ status: "accepted", acceptedAt: new Date(), acceptedName: input.name, acceptedBy: actor.userId })
      .where(and(eq(quoteVersions.id, v.id), eq(quoteVersions.status, "sent")))
      .returning();
    if (!accepted) throw conflict("This quote has just been answered; reload the page.");
    await moveCommission(actor, c.id, "accept_quote", { tx, detail: { quoteVersion: v.number, acceptedName: input.name } });
    await notify(tx, { to: "studio", kind: "quote_accepted", studioId: c.studioId, commissionId: c.id, key: `quote-accepted:${v.id}`, actorUserId: actor.userId, replyTo: actor.email, link: `/studio/commissions/${c.id}#quote-and-payments`,
      title: `${actor.name} accepted the quote for ${c.title}`, body: `Quote version ${v.number} was accepted, signed "${input.name}". The deposit can now be paid.` });
    await reserveYarn(tx, c.id, storedInputOf(v).draft);
    const payment = await openDepositPayment(tx, accepted);
    return { quote: accepted, paymentId: payment?.id ?? null };
  });
}

export async function requestQuoteChanges(actor: Actor, input: { quoteId: string; changes: string }) {
  return db.transaction(async (tx) => {
    const { c, v } = await lockForAnswer(tx, actor, input.quoteId);
    await tx.update(quoteVersions).set({ status: "changes_requested", changeRequest: input.changes }).where(eq(quoteVersions.id, v.id));
    await moveCommission(actor, c.id, "revise_quote", { tx, reason: input.changes, detail: { quoteVersion: v.number } });
    await notify(tx, { to: "studio", kind: "quote_changes", studioId: c.studioId, commissionId: c.id, key: `quote-changes:${v.id}`, actorUserId: actor.userId, replyTo: actor.email, link: `/studio/commissions/${c.id}#quote-and-payments`,
      title: `${actor.name} asked for changes to the quote for ${c.title}`, body: input.changes.length > 300 ? `${input.changes.slice(0, 300)}…` : input.changes });
    return { quoteId: v.id };
  });
}
