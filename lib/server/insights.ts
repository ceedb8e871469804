import "server-only";
// Studio insights from real rows: hours per stage per month, effective hourly rate per commission,
// estimate accuracy over time, revenue and deposits by month, the busiest stage; and the rate
// calibration report with the owner's accept / reject.
import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { commissions, labourHistory, payments, pieces, quoteVersions, rateProposals, studios, timeEntries } from "@/db/schema";
import { calibrateRates, resolveP80Factors, type LabourRates, type LoggedPiece, type PieceFeatures } from "@/lib/core/labour";
import { p80FactorsSchema } from "@/lib/core/labour/schemas";
import { estimateErrorPercent } from "@/lib/core/production";
import { WORK_STAGES } from "@/lib/schemas/production";
import { assertCan, type Actor } from "./authz";
import { conflict, notFound } from "./errors";
import { recordLabourHistory } from "./production";
import { loadStudioSettings, updateStudioSettings } from "./settings";

async function studioZone(studioId: string) {
  const [s] = await db.select({ tz: studios.timeZone, currency: studios.currency }).from(studios).where(eq(studios.id, studioId));
  if (!s) throw notFound("That studio");
  return s;
}

/** Closed commissions whose pieces have no history yet (closed by another path) get it now. */
async function backfillLabourHistory(studioId: string): Promise<void> {
  const missing = await db
    .select({ id: commissions.id })
    .from(commissions)
    .where(
      and(
        eq(commissions.studioId, studioId),
        eq(commissions.state, "closed"),
        sql`exists (select 1 from ${pieces} p where p.commission_id = ${commissions.id} and not exists (select 1 from ${labourHistory} h where h.piece_id = p.id))`,
      ),
    );
  for (const m of missing) await db.transaction((tx) => recordLabourHistory(tx, m.id));
}

export interface Insights {
  currency: string;
  hoursByMonth: ({ month: string } & Record<(typeof WORK_STAGES)[number], number>)[];
  busiestStage: { stage: string; hours: number }[];
  effectiveRates: { commissionId: string; label: string; hours: number; chargedMinor: number; rateMinor: number; basis: "quote" | "price" }[];
  accuracy: { month: string; pieces: number; meanAbsErrorPercent: number; meanSignedErrorPercent: number }[];
  revenue: { month: string; depositsMinor: number; balancesMinor: number }[];
}

// Two decimals, so a single logged minute shows.
const hours = (m: number) => Math.round((m / 60) * 100) / 100;

export async function getInsights(actor: Actor, studioId: string): Promise<Insights> {
  assertCan(actor, "studio.settings", studioId);
  const { tz, currency } = await studioZone(studioId);
  await backfillLabourHistory(studioId);

  const counted = and(eq(timeEntries.studioId, studioId), isNull(timeEntries.deletedAt), sql`${timeEntries.endedAt} is not null`, isNull(timeEntries.flag));
  const month = sql<string>`to_char(${timeEntries.startedAt} at time zone ${tz}, 'YYYY-MM')`;
  const byMonth = await db
    .select({ month, stage: timeEntries.stage, minutes: sql<number>`sum(${timeEntries.minutes})::int` })
    .from(timeEntries)
    .where(counted)
    // By position: the month expression carries the zone as a parameter each time it is written.
    .groupBy(sql`1`, sql`2`)
    .orderBy(sql`1`);
  const months = [...new Set(byMonth.map((r) => r.month))].sort();
  const hoursByMonth = months.map((m) => {
    const row = { month: m } as Insights["hoursByMonth"][number];
    for (const s of WORK_STAGES) row[s] = hours(byMonth.filter((r) => r.month === m && r.stage === s).reduce((a, r) => a + r.minutes, 0));
    return row;
  });
  const busiestStage = WORK_STAGES.map((s) => ({ stage: s, hours: hours(byMonth.filter((r) => r.stage === s).reduce((a, r) => a + r.minutes, 0)) })).sort(
    (a, b) => b.hours - a.hours,
  );

  // Effective hourly rate: labour charged (accepted quote's labour lines, else the agreed price) ÷ hours logged.
  const perCommission = await db
    .select({ id: commissions.id, number: commissions.number, title: commissions.title, priceMinor: commissions.priceMinor, minutes: sql<number>`sum(${timeEntries.minutes})::int` })
    .from(timeEntries)
    .innerJoin(pieces, eq(pieces.id, timeEntries.pieceId))
    .innerJoin(commissions, eq(commissions.id, pieces.commissionId))
    .where(counted)
    .groupBy(commissions.id, commissions.number, commissions.title, commissions.priceMinor)
    .orderBy(asc(commissions.number));
  const accepted = perCommission.length
    ? await db
        .select({ commissionId: quoteVersions.commissionId, result: quoteVersions.result, number: quoteVersions.number })
        .from(quoteVersions)
        .where(and(inArray(quoteVersions.commissionId, perCommission.map((c) => c.id)), eq(quoteVersions.status, "accepted")))
        .orderBy(desc(quoteVersions.number))
    : [];
  const effectiveRates: Insights["effectiveRates"] = [];
  for (const c of perCommission) {
    if (c.minutes <= 0) continue;
    const q = accepted.find((a) => a.commissionId === c.id);
    const lines = (q?.result as { lines?: { kind?: string; amountMinor?: number }[] } | undefined)?.lines ?? [];
    const labour = lines.filter((l) => l.kind === "labour").reduce((s, l) => s + (l.amountMinor ?? 0), 0);
    const charged = q && labour > 0 ? labour : c.priceMinor;
    if (!charged) continue;
    effectiveRates.push({
      commissionId: c.id,
      label: `${c.number}. ${c.title}`,
      hours: hours(c.minutes),
      chargedMinor: charged,
      rateMinor: Math.round((charged * 60) / c.minutes),
      basis: q && labour > 0 ? "quote" : "price",
    });
  }

  // Estimate accuracy: per month of closing, each piece's P50 total against its logged total.
  const history = await db.select().from(labourHistory).where(eq(labourHistory.studioId, studioId)).orderBy(asc(labourHistory.closedAt));
  const accMap = new Map<string, { abs: number[]; signed: number[] }>();
  for (const h of history) {
    const logged = Object.values(h.loggedMinutes).reduce((s, m) => s + m, 0);
    const est = Object.entries(h.estimatedMinutes)
      .filter(([s]) => (h.loggedMinutes[s] ?? 0) > 0)
      .reduce((s, [, m]) => s + m, 0);
    const e = estimateErrorPercent(est, logged);
    if (e === null) continue;
    const m = h.closedAt.toISOString().slice(0, 7);
    const entry = accMap.get(m) ?? { abs: [], signed: [] };
    entry.abs.push(Math.abs(e));
    entry.signed.push(e);
    accMap.set(m, entry);
  }
  const mean = (xs: number[]) => Math.round((xs.reduce((a, b) => a + b, 0) / xs.length) * 10) / 10;
  const accuracy = [...accMap.entries()]
    .sort(([a], [b]) => a.localeCompare(b))
    .map(([m, v]) => ({ month: m, pieces: v.abs.length, meanAbsErrorPercent: mean(v.abs), meanSignedErrorPercent: mean(v.signed) }));

  const payMonth = sql<string>`to_char(${payments.paidAt} at time zone ${tz}, 'YYYY-MM')`;
  const paid = await db
    .select({ month: payMonth, kind: payments.kind, amount: sql<number>`sum(${payments.amountMinor} - ${payments.refundedMinor})::int` })
    .from(payments)
    .where(and(eq(payments.studioId, studioId), inArray(payments.status, ["paid", "partially_refunded"]), sql`${payments.paidAt} is not null`))
    .groupBy(sql`1`, sql`2`)
    .orderBy(sql`1`);
  const payMonths = [...new Set(paid.map((p) => p.month))].sort();
  const revenue = payMonths.map((m) => ({
    month: m,
    depositsMinor: paid.filter((p) => p.month === m && p.kind === "deposit").reduce((s, p) => s + p.amount, 0),
    balancesMinor: paid.filter((p) => p.month === m && p.kind === "balance").reduce((s, p) => s + p.amount, 0),
  }));

  return { currency, hoursByMonth, busiestStage, effectiveRates, accuracy, revenue };
}

// ——— calibration (issue 6) ———

async function loggedPieces(studioId: string): Promise<LoggedPiece[]> {
  const rows = await db.select().from(labourHistory).where(eq(labourHistory.studioId, studioId)).orderBy(asc(labourHistory.closedAt), asc(labourHistory.id));
  return rows.map((r) => ({ features: r.features as PieceFeatures, loggedMinutes: r.loggedMinutes }));
}

export async function getCalibration(actor: Actor, studioId: string) {
  assertCan(actor, "studio.settings", studioId);
  await backfillLabourHistory(studioId);
  const settings = await loadStudioSettings(studioId);
  const history = await loggedPieces(studioId);
  const result = history.length ? calibrateRates(history, { baseRates: settings.rates }) : null;
  const proposals = await db.select().from(rateProposals).where(eq(rateProposals.studioId, studioId)).orderBy(desc(rateProposals.createdAt)).limit(10);
  return { current: settings.rates, currentP80Factors: resolveP80Factors(settings.p80Factors), pieces: history.length, result, proposals };
}

/** Owner: turn the current calibration into a proposal to accept or reject. */
export async function proposeRates(actor: Actor, studioId: string) {
  assertCan(actor, "studio.settings", studioId);
  const { result, current } = await getCalibration(actor, studioId);
  if (!result) throw conflict("There is no closed work with logged hours yet, so there is nothing to calibrate from.");
  const [row] = await db
    .insert(rateProposals)
    .values({
      studioId,
      rates: result.rates as unknown as Record<string, unknown>,
      report: { accuracy: result.accuracy, stages: result.stages, p80Factors: result.p80Factors, notes: result.notes, before: current } as Record<string, unknown>,
    })
    .returning();
  return row;
}

/** Owner: accept (rates written into the studio settings) or reject a proposal; decided once. */
export async function decideProposal(actor: Actor, studioId: string, proposalId: string, decision: "accepted" | "rejected") {
  assertCan(actor, "studio.settings", studioId);
  return db.transaction(async (tx) => {
    const [p] = await tx.select().from(rateProposals).where(and(eq(rateProposals.id, proposalId), eq(rateProposals.studioId, studioId))).for("update");
    if (!p) throw notFound("That proposal");
    if (p.status !== "proposed") throw conflict(`This proposal was already ${p.status}.`);
    const [updated] = await tx
      .update(rateProposals)
      .set({ status: decision, decidedAt: new Date(), decidedBy: actor.userId })
      .where(eq(rateProposals.id, p.id))
      .returning();
    if (decision === "accepted") {
      // The P80 margins measured with these rates go with them (older proposals carry none: keep the current ones).
      const factors = p80FactorsSchema.safeParse((p.report as { p80Factors?: unknown } | null)?.p80Factors);
      await updateStudioSettings(actor, studioId, { rates: p.rates as unknown as LabourRates, ...(factors.success ? { p80Factors: factors.data } : {}) }, tx);
    }
    return updated;
  });
}
