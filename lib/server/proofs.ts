import "server-only";
// Proofs: a frozen design version sent to the client, and the client's answer. Each answer locks
// the commission row and then the proof row (the same order as sending), so two approvals racing
// end with one, and an answer to a proof that a newer one has replaced is refused.
import { createHash } from "node:crypto";
import { and, asc, desc, eq, max, ne } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db";
import { commissions, designs, designVersions, proofComments, proofs, quoteVersions, studios, user, type DesignChartEntry } from "@/db/schema";
import { measureText, parseChart, type Chart, type FontId } from "@/lib/core/chart";
import { diffProofCharts, type ChartDiff } from "@/lib/core/proofs";
import { env } from "@/lib/env";
import type { RequestChangesInput } from "@/lib/schemas/proofs";
import { proofAnsweredMessage, proofReadyMessage } from "@/templates/email/journey";
import { requestClientAddress } from "./client-address";
import { assertCan, memberRole, type Actor } from "./authz";
import { renderPreviewPng } from "./chart-png";
import { AppError, conflict, notFound, nullIfNotFound } from "./errors";
import { notify } from "./notifications";
import { getCommissionFor, getCommissionMailParties } from "./queries/commissions";
import { moveCommission } from "./workflow";

export function proofHash(number: number, designHash: string, quoteVersionId: string | null): string {
  return createHash("sha256").update(`darnwell-proof\n${number}\n${designHash}\n${quoteVersionId ?? ""}`).digest("hex");
}

async function lockCommission(tx: Tx, id: string) {
  const [c] = await tx.select().from(commissions).where(eq(commissions.id, id)).for("update");
  if (!c) throw notFound("That commission");
  return c;
}

/** The design a proof is sent from: the commission's design (newest if several) and its head version. */
async function headVersionFor(q: Executor, commissionId: string) {
  const [d] = await q.select().from(designs).where(eq(designs.commissionId, commissionId)).orderBy(desc(designs.updatedAt)).limit(1);
  if (!d?.headVersionId) return null;
  const [v] = await q.select().from(designVersions).where(eq(designVersions.id, d.headVersionId));
  return v ? { design: d, version: v } : null;
}

const NO_DESIGN = "This commission has no saved design yet; save its charts before sending a proof.";

/** PNG previews of a version's first charts for the proof mail (e-mail clients do not show SVG). */
async function previewPictures(charts: DesignChartEntry[]) {
  const pictures: { name: string; base64: string }[] = [];
  for (const [i, entry] of charts.slice(0, 3).entries()) {
    try {
      // At most 560 px wide, on white.
      const png = await renderPreviewPng(parseChart(entry.chart), { title: entry.label, maxWidthPx: 560 });
      pictures.push({ name: `${i + 1}-${entry.area}.png`, base64: png.toString("base64") });
    } catch (err) {
      console.error("proof preview:", (err as Error).message);
    }
  }
  return pictures;
}

/** Owner (the workflow allows only the owner to send a proof): freezes the design's head version as the next proof. */
export async function sendProof(actor: Actor, commissionId: string, note: string) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "commission.work", c.studioId);
  // The pictures are drawn before the transaction (versions never change); the transaction checks
  // that the head is still the version drawn.
  const drawn = await headVersionFor(db, c.id);
  if (!drawn) throw new AppError(422, "no_design", NO_DESIGN);
  const pictures = await previewPictures(drawn.version.charts);
  const out = await db.transaction(async (tx) => {
    await lockCommission(tx, c.id);
    const head = await headVersionFor(tx, c.id);
    if (!head) throw new AppError(422, "no_design", NO_DESIGN);
    if (head.version.id !== drawn.version.id) throw conflict("The design was saved again while the proof was being sent; please send it again.");
    const [q] = await tx
      .select({ id: quoteVersions.id, number: quoteVersions.number })
      .from(quoteVersions)
      .where(and(eq(quoteVersions.commissionId, c.id), ne(quoteVersions.status, "draft")))
      .orderBy(desc(quoteVersions.number))
      .limit(1);
    const [{ last }] = await tx.select({ last: max(proofs.number) }).from(proofs).where(eq(proofs.commissionId, c.id));
    const number = (last ?? 0) + 1;
    await moveCommission(actor, c.id, "send_proof", { tx, detail: { proofNumber: number } });
    await tx.update(proofs).set({ status: "superseded" }).where(and(eq(proofs.commissionId, c.id), eq(proofs.status, "sent")));
    const [p] = await tx
      .insert(proofs)
      .values({
        commissionId: c.id,
        number,
        designVersionId: head.version.id,
        quoteVersionId: q?.id ?? null,
        contentHash: proofHash(number, head.version.contentHash, q?.id ?? null),
        noteToClient: note,
        sentBy: actor.userId,
      })
      .returning();
    const who = await getCommissionMailParties(tx, c.id);
    const [s] = await tx.select().from(studios).where(eq(studios.id, c.studioId));
    const attachments = pictures.map((pic) => ({ filename: `proof-${number}-${pic.name}`, contentType: "image/png", base64: pic.base64 }));
    await notify(tx, {
      to: "client", kind: "proof_sent", studioId: c.studioId, commissionId: c.id, key: `proof-sent:${p.id}`, actorUserId: actor.userId, link: `/portal/commissions/${c.id}/proofs/${p.id}`,
      title: `${s.name} sent proof ${number} of ${c.title} for you to check`, body: note || "Approve it when it is right, or ask for changes on the stitches you mean.",
      mail: { replyTo: s.contactEmail, dedupeKey: `proof-sent:${p.id}`, attachments, ...proofReadyMessage(s, { clientName: who.clientName, number, title: c.title, note, url: `${env.BETTER_AUTH_URL}/portal/commissions/${c.id}/proofs/${p.id}` }) },
    });
    return p;
  });
  return out;
}

async function proofRowFor(actor: Actor, proofId: string) {
  const [p] = await db.select().from(proofs).where(eq(proofs.id, proofId));
  if (!p) throw notFound("That proof");
  const c = await getCommissionFor(actor, p.commissionId).catch(nullIfNotFound);
  if (!c) throw notFound("That proof");
  return { p, c };
}

/** Locks and re-reads the proof; refuses a proof that is not the newest or already answered. */
async function lockOpenProof(tx: Tx, proofId: string, commissionId: string, seenHash: string) {
  await lockCommission(tx, commissionId);
  const [cur] = await tx.select().from(proofs).where(eq(proofs.id, proofId)).for("update");
  if (!cur) throw notFound("That proof");
  const [{ last }] = await tx.select({ last: max(proofs.number) }).from(proofs).where(eq(proofs.commissionId, commissionId));
  if ((last ?? 0) > cur.number) throw new AppError(409, "stale_proof", `There is a newer proof (proof ${last}); please look at that one.`);
  if (cur.status === "approved") throw new AppError(409, "already_approved", "This proof is already approved; there is nothing more to do.");
  if (cur.status !== "sent") throw new AppError(409, "already_answered", "You have asked for changes to this proof; the studio will send a new one.");
  if (cur.contentHash !== seenHash) throw new AppError(409, "stale_proof", "This proof has changed since you opened it; please reload the page.");
  return cur;
}

/** Recorded with a decision: the one address helper (a client cannot choose it), not X-Forwarded-For as sent. */
function clientIpFrom(h: Headers | null): string | null {
  const a = h ? requestClientAddress(h) : "unknown";
  return a === "unknown" ? null : a;
}

export async function approveProof(actor: Actor, proofId: string, seenHash: string, requestHeaders: Headers | null) {
  const { p, c } = await proofRowFor(actor, proofId);
  const ip = clientIpFrom(requestHeaders);
  return db.transaction(async (tx) => {
    const cur = await lockOpenProof(tx, p.id, c.id, seenHash);
    await moveCommission(actor, c.id, "approve_proof", { tx, detail: { proofId: cur.id, proofNumber: cur.number, contentHash: cur.contentHash } });
    const [done] = await tx
      .update(proofs)
      .set({ status: "approved", decidedBy: actor.userId, decidedAt: new Date(), decisionIp: ip })
      .where(and(eq(proofs.id, cur.id), eq(proofs.status, "sent")))
      .returning();
    if (!done) throw conflict("This proof has just been answered elsewhere.");
    const [v] = await tx.select({ designId: designVersions.designId }).from(designVersions).where(eq(designVersions.id, cur.designVersionId));
    await tx.update(designs).set({ lockedVersionId: cur.designVersionId, updatedAt: new Date() }).where(eq(designs.id, v.designId));
    const [s] = await tx.select().from(studios).where(eq(studios.id, c.studioId));
    await notify(tx, {
      to: "studio", kind: "proof_approved", studioId: s.id, commissionId: c.id, key: `proof-approved:${cur.id}`, actorUserId: actor.userId, link: `/studio/commissions/${c.id}/proofs/${cur.id}`,
      title: `${c.clientName} approved proof ${cur.number} of ${c.title}`, body: "The chart is locked at this version; the piece can go into production.",
      mail: { replyTo: actor.email, dedupeKey: `proof-approved:${cur.id}`, ...proofAnsweredMessage(s, { clientName: c.clientName, proofNumber: cur.number, title: c.title, approved: true, note: "", pinned: 0, url: `${env.BETTER_AUTH_URL}/studio/commissions/${c.id}` }) },
    });
    return done;
  });
}

export async function requestProofChanges(
  actor: Actor,
  proofId: string,
  input: Pick<RequestChangesInput, "contentHash" | "note" | "comments">,
  requestHeaders: Headers | null,
) {
  const { p, c } = await proofRowFor(actor, proofId);
  if (memberRole(actor, c.studioId)) throw new AppError(403, "forbidden", "Clients ask for changes on their proof; log a change asked by phone in the messages.");
  return db.transaction(async (tx) => {
    const cur = await lockOpenProof(tx, p.id, c.id, input.contentHash);
    const [v] = await tx.select().from(designVersions).where(eq(designVersions.id, cur.designVersionId));
    for (const cm of input.comments) {
      const entry = v.charts[cm.chartIndex];
      const chart = entry ? parseChart(entry.chart) : null;
      if (!chart || cm.row > chart.height || cm.stitch > chart.width) {
        throw new AppError(422, "invalid_input", "A pinned comment points outside the chart; reload and try again.");
      }
    }
    await moveCommission(actor, c.id, "request_changes", { tx, reason: input.note || undefined, detail: { proofId: cur.id, proofNumber: cur.number, pinned: input.comments.length } });
    await tx
      .update(proofs)
      .set({ status: "changes_requested", decidedBy: actor.userId, decidedAt: new Date(), decisionIp: clientIpFrom(requestHeaders), decisionNote: input.note })
      .where(eq(proofs.id, cur.id));
    if (input.comments.length) {
      await tx.insert(proofComments).values(input.comments.map((cm) => ({ proofId: cur.id, authorUserId: actor.userId, chartIndex: cm.chartIndex, row: cm.row, stitch: cm.stitch, body: cm.body })));
    }
    if (input.note) await tx.insert(proofComments).values({ proofId: cur.id, authorUserId: actor.userId, body: input.note });
    const [s] = await tx.select().from(studios).where(eq(studios.id, c.studioId));
    await notify(tx, {
      to: "studio", kind: "proof_changes", studioId: s.id, commissionId: c.id, key: `proof-changes:${cur.id}`, actorUserId: actor.userId, link: `/studio/commissions/${c.id}/proofs/${cur.id}`,
      title: `${c.clientName} asked for changes to proof ${cur.number} of ${c.title}`,
      body: [input.note, input.comments.length ? `${input.comments.length} comment${input.comments.length === 1 ? "" : "s"} pinned to stitches.` : ""].filter(Boolean).join(" ").slice(0, 400) || "Open the proof to see what they asked.",
      mail: { replyTo: actor.email, dedupeKey: `proof-changes:${cur.id}`, ...proofAnsweredMessage(s, { clientName: c.clientName, proofNumber: cur.number, title: c.title, approved: false, note: input.note, pinned: input.comments.length, url: `${env.BETTER_AUTH_URL}/studio/commissions/${c.id}` }) },
    });
    return { id: cur.id };
  });
}

export interface LetteringSize {
  text: string;
  widthCm: number;
  heightCm: number;
  stitches: number;
  rows: number;
}

export interface ProofChartView {
  index: number;
  area: string;
  label: string;
  chart: Chart;
  lettering: LetteringSize[];
}

function letteringSizes(entry: DesignChartEntry, chart: Chart): LetteringSize[] {
  const out: LetteringSize[] = [];
  for (const raw of entry.lettering ?? []) {
    const l = raw as { text?: unknown; font?: unknown; box?: { width?: number; height?: number } };
    if (typeof l.text !== "string") continue;
    let size = { width: l.box?.width ?? 0, height: l.box?.height ?? 0 };
    try {
      size = measureText(l.text, l.font as FontId);
    } catch {
      // an unknown font: fall back to the box the maker drew
    }
    out.push({
      text: l.text,
      stitches: size.width,
      rows: size.height,
      widthCm: Math.round((size.width * 100) / chart.gauge.stitchesPer10cm) / 10,
      heightCm: Math.round((size.height * 100) / chart.gauge.rowsPer10cm) / 10,
    });
  }
  return out;
}

function chartsOf(entries: DesignChartEntry[]): ProofChartView[] {
  return entries.map((entry, index) => {
    const chart = parseChart(entry.chart);
    return { index, area: entry.area, label: entry.label, chart, lettering: letteringSizes(entry, chart) };
  });
}

/** A commission's proofs, newest first, for the person (404 when the commission is not theirs). */
export async function listProofs(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  return db
    .select({ id: proofs.id, number: proofs.number, status: proofs.status, sentAt: proofs.sentAt, decidedAt: proofs.decidedAt, contentHash: proofs.contentHash })
    .from(proofs)
    .where(eq(proofs.commissionId, c.id))
    .orderBy(desc(proofs.number));
}

/** Everything the proof page shows, with the differences from the proof before it. */
export async function getProofView(actor: Actor, commissionId: string, proofId: string) {
  const { p, c } = await proofRowFor(actor, proofId);
  if (c.id !== commissionId) throw notFound("That proof");
  const [v] = await db.select().from(designVersions).where(eq(designVersions.id, p.designVersionId));
  const charts = chartsOf(v.charts);
  const [quote] = p.quoteVersionId
    ? await db.select({ number: quoteVersions.number, totalMinor: quoteVersions.totalMinor, currency: quoteVersions.currency, status: quoteVersions.status }).from(quoteVersions).where(eq(quoteVersions.id, p.quoteVersionId))
    : [];
  const comments = await db
    .select({ id: proofComments.id, chartIndex: proofComments.chartIndex, row: proofComments.row, stitch: proofComments.stitch, body: proofComments.body, createdAt: proofComments.createdAt, author: user.name })
    .from(proofComments)
    .leftJoin(user, eq(user.id, proofComments.authorUserId))
    .where(eq(proofComments.proofId, p.id))
    .orderBy(asc(proofComments.createdAt));
  const all = await db.select({ id: proofs.id, number: proofs.number, status: proofs.status, designVersionId: proofs.designVersionId, sentAt: proofs.sentAt }).from(proofs).where(eq(proofs.commissionId, c.id)).orderBy(asc(proofs.number));
  const prev = all.filter((x) => x.number < p.number).at(-1);
  let diff: ChartDiff[] | null = null;
  if (prev) {
    const [pv] = await db.select().from(designVersions).where(eq(designVersions.id, prev.designVersionId));
    diff = diffProofCharts(
      chartsOf(pv.charts).map((x) => ({ area: x.area, label: x.label, chart: x.chart })),
      charts.map((x) => ({ area: x.area, label: x.label, chart: x.chart })),
    );
  }
  const latestNumber = all.at(-1)?.number ?? p.number;
  const [decider] = p.decidedBy ? await db.select({ name: user.name }).from(user).where(eq(user.id, p.decidedBy)) : [];
  return { proof: p, commission: c, charts, quote: quote ?? null, comments, proofs: all, previousNumber: prev?.number ?? null, diff, isLatest: latestNumber === p.number, decidedByName: decider?.name ?? null };
}

/** For the studio page: the design the next proof would be sent from (or null). */
export async function getProofSource(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  assertCan(actor, "studio.view", c.studioId);
  const head = await headVersionFor(db, c.id);
  if (!head) return null;
  return { designId: head.design.id, title: head.design.title, versionNumber: head.version.number, lockedVersionId: head.design.lockedVersionId, charts: head.version.charts.length };
}
