import "server-only";
// Commission requests: drafts kept server-side under a random cookie token (signed in or not),
// and the submitted request written as a commission with its number, audit row and mails.
import { createHash, randomBytes } from "node:crypto";
import { and, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { commissionEvents, commissions, requestDrafts, studioClients, studios, uploads, yarns, type Studio } from "@/db/schema";
import { getMotif } from "@/lib/core/chart/motifs";
import { env } from "@/lib/env";
import { GARMENT_LABELS } from "@/lib/format";
import { majorToMinor } from "@/lib/schemas/money";
import { MAX_REFERENCE_PHOTOS, parseDraftLeniently, requestSchema, type DraftFieldErrors, type RequestDraft } from "@/lib/schemas/request";
import { requestToClientMessage, requestToStudioMessage } from "@/templates/email/journey";
import type { Actor } from "./authz";
import { AppError, validationError } from "./errors";
import { notify } from "./notifications";
import { enqueueMail } from "./outbox";

export const draftCookieName = (slug: string) => `dw-request-${slug}`;
export const newDraftToken = () => randomBytes(32).toString("base64url");
const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export interface DraftRow {
  id: string;
  studioId: string;
  data: RequestDraft;
  uploadIds: string[];
  userId: string | null;
}

export async function loadDraft(studioId: string, token: string | undefined | null): Promise<DraftRow | null> {
  if (!token || token.length < 20) return null;
  const [row] = await db
    .select()
    .from(requestDrafts)
    .where(and(eq(requestDrafts.tokenHash, hashToken(token)), eq(requestDrafts.studioId, studioId)));
  if (!row) return null;
  // Field by field, so a value that has gone stale (a "needed by" date now past) loses only itself.
  const { data } = parseDraftLeniently(row.data);
  return { id: row.id, studioId: row.studioId, data, uploadIds: row.uploadIds, userId: row.userId };
}

/**
 * Saves what the form holds now, field by field: each valid field is kept, each invalid one keeps
 * what was saved before (if anything) and is reported, so one mistyped field never loses the rest.
 */
export async function saveDraft(
  studioId: string,
  token: string,
  data: unknown,
  userId: string | null,
): Promise<DraftRow & { invalid: DraftFieldErrors }> {
  const { data: valid, invalid } = parseDraftLeniently(data);
  let merged: RequestDraft = valid;
  if (Object.keys(invalid).length) {
    const previous = await loadDraft(studioId, token);
    const keep: Record<string, unknown> = {};
    for (const path of Object.keys(invalid)) {
      const [top, sub] = path.split(".");
      const before = (previous?.data as Record<string, unknown> | undefined)?.[top!];
      if (sub && top === "measurements") {
        const old = (before as Record<string, string> | undefined)?.[sub];
        if (old !== undefined) keep.measurements = { ...(merged.measurements ?? {}), ...(keep.measurements as object), [sub]: old };
      } else if (before !== undefined) keep[top!] = before;
    }
    merged = { ...valid, ...keep } as RequestDraft;
  }
  const [row] = await db
    .insert(requestDrafts)
    .values({ studioId, tokenHash: hashToken(token), data: merged, userId })
    .onConflictDoUpdate({
      target: requestDrafts.tokenHash,
      set: { data: merged, updatedAt: new Date(), ...(userId ? { userId } : {}) },
      setWhere: eq(requestDrafts.studioId, studioId),
    })
    .returning();
  if (!row) throw new AppError(409, "draft_conflict", "That draft belongs to another studio.");
  return { id: row.id, studioId, data: merged, uploadIds: row.uploadIds, userId: row.userId, invalid };
}

/** Adds a stored photo to a draft (creating the draft when the first photo comes before any typing). */
export async function addDraftPhoto(studioId: string, token: string, uploadId: string): Promise<void> {
  const tokenHash = hashToken(token);
  // Never overwrite what an autosave may be writing at the same moment: insert-if-missing, then append.
  await db.insert(requestDrafts).values({ studioId, tokenHash, data: {} }).onConflictDoNothing({ target: requestDrafts.tokenHash });
  const [row] = await db
    .update(requestDrafts)
    .set({ uploadIds: sql`array_append(${requestDrafts.uploadIds}, ${uploadId}::uuid)`, updatedAt: new Date() })
    .where(and(eq(requestDrafts.tokenHash, tokenHash), eq(requestDrafts.studioId, studioId), sql`cardinality(${requestDrafts.uploadIds}) < ${MAX_REFERENCE_PHOTOS * 2}`))
    .returning({ id: requestDrafts.id });
  if (!row) throw new AppError(422, "too_many_photos", `Add at most ${MAX_REFERENCE_PHOTOS} photos.`);
}

export async function draftOwnsUpload(studioId: string, token: string | undefined, uploadId: string): Promise<boolean> {
  const d = await loadDraft(studioId, token);
  return Boolean(d?.uploadIds.includes(uploadId));
}

function titleFor(garment: string, lettering: string, motifIds: string[]): string {
  const g = GARMENT_LABELS[garment] ?? garment;
  if (lettering) return `${g} with ${lettering}`;
  if (motifIds.length) return `${g} with ${getMotif(motifIds[0]).name.toLowerCase()}`;
  return `${g} request`;
}

/**
 * Writes a request as a commission: number from the studio's counter (row locked, same
 * transaction), the client link if new, the audit row, the draft's photos, and both mails.
 */
export async function createCommissionFromRequest(
  actor: Actor,
  studio: Pick<Studio, "id">,
  raw: unknown,
  opts: { draftId?: string; draftUploadIds?: string[] } = {},
): Promise<{ id: string; number: number; title: string }> {
  const parsed = requestSchema.safeParse(raw);
  if (!parsed.success) throw validationError(parsed.error);
  const input = parsed.data;
  return db.transaction(async (tx) => {
    const [s] = await tx.select().from(studios).where(eq(studios.id, studio.id)).for("update");
    if (!s) throw new AppError(404, "not_found", "That studio was not found.");
    if (!s.makes.includes(input.garment)) {
      throw new AppError(422, "invalid_input", "Some fields need attention.", { garment: [`${s.name} does not make that garment.`] });
    }
    if (actor.memberships.some((m) => m.studioId === s.id)) {
      throw new AppError(422, "own_studio", "You work at this studio; requests come from clients.");
    }
    const budgetMinor = input.budget ? majorToMinor(input.budget, s.currency) : null;
    const chosenYarns = input.yarnIds.length
      ? await tx.select({ id: yarns.id, colourName: yarns.colourName }).from(yarns).where(and(eq(yarns.studioId, s.id), inArray(yarns.id, input.yarnIds)))
      : [];
    if (chosenYarns.length !== new Set(input.yarnIds).size) {
      throw new AppError(422, "invalid_input", "Some fields need attention.", { yarnIds: ["Choose colours from this studio's yarns."] });
    }
    const colourWishes = [chosenYarns.map((y) => y.colourName).join(", "), input.colourNotes].filter(Boolean).join("; ");

    const [client] = await tx
      .insert(studioClients)
      .values({ studioId: s.id, userId: actor.userId, displayName: actor.name })
      .onConflictDoUpdate({ target: [studioClients.studioId, studioClients.userId], set: { userId: actor.userId } })
      .returning({ id: studioClients.id, displayName: studioClients.displayName });
    const number = s.nextCommissionNo;
    await tx.update(studios).set({ nextCommissionNo: number + 1 }).where(eq(studios.id, s.id));
    const title = titleFor(input.garment, input.lettering, input.motifIds);
    const [c] = await tx
      .insert(commissions)
      .values({
        studioId: s.id,
        clientId: client.id,
        number,
        title,
        garment: input.garment,
        wearer: input.wearer,
        state: "enquiry",
        neededBy: input.neededBy || null,
        currency: s.currency,
        budgetMinor,
        brief: {
          ...(input.sizeLabel ? { sizeLabel: input.sizeLabel } : {}),
          ...(Object.keys(input.measurementsCm).length ? { measurements: input.measurementsCm } : {}),
          ...(colourWishes ? { colourWishes } : {}),
          ...(input.lettering ? { lettering: input.lettering } : {}),
          ...(input.motifIds.length ? { motifWishes: input.motifIds.map((id) => getMotif(id).name) } : {}),
          ...(input.notes ? { notes: input.notes } : {}),
        },
      })
      .returning();
    await tx.insert(commissionEvents).values({
      commissionId: c.id,
      actorUserId: actor.userId,
      actorRole: "client",
      kind: "requested",
      toState: "enquiry",
      detail: { units: input.units, photos: input.uploadIds.length },
    });
    // Only photos this visitor's draft uploaded, and only ones not attached to anything yet.
    const allowed = new Set(opts.draftUploadIds ?? []);
    const photoIds = input.uploadIds.filter((id) => allowed.has(id));
    if (photoIds.length) {
      await tx
        .update(uploads)
        .set({ commissionId: c.id, uploadedBy: actor.userId })
        .where(and(inArray(uploads.id, photoIds), eq(uploads.studioId, s.id), isNull(uploads.commissionId)));
    }
    if (opts.draftId) await tx.delete(requestDrafts).where(eq(requestDrafts.id, opts.draftId));

    const base = env.BETTER_AUTH_URL;
    await notify(tx, {
      to: "studio", kind: "request", studioId: s.id, commissionId: c.id, key: `request:${c.id}`, actorUserId: actor.userId, link: `/studio/commissions/${c.id}`,
      title: `New request from ${client.displayName}: ${title}`, body: `Request no. ${number}. Read the brief and start a quote.`,
      mail: { replyTo: actor.email, dedupeKey: `request-studio:${c.id}`, ...requestToStudioMessage(s, { clientName: client.displayName, number, title, url: `${base}/studio/commissions/${c.id}` }) },
    });
    await enqueueMail(
      {
        to: actor.email,
        studioId: s.id,
        dedupeKey: `request-client:${c.id}`,
        replyTo: s.contactEmail,
        ...requestToClientMessage(s, {
          clientName: actor.name,
          number,
          title,
          url: `${base}/portal/commissions/${c.id}`,
          leadTimeWeeks: s.leadTimeWeeks,
        }),
      },
      tx,
    );
    return { id: c.id, number, title };
  });
}

/** Submits a draft the visitor marked as sent (after signing up and confirming their address). */
export async function finishDraft(actor: Actor, studioId: string, token: string | undefined): Promise<{ id: string } | null> {
  const draft = await loadDraft(studioId, token);
  if (!draft || !draft.data.submitted) return null;
  if (draft.userId && draft.userId !== actor.userId) return null;
  try {
    return await createCommissionFromRequest(actor, { id: studioId }, draft.data, { draftId: draft.id, draftUploadIds: draft.uploadIds });
  } catch (err) {
    if (err instanceof AppError) return null; // the form shows what needs fixing when they return
    throw err;
  }
}

/** The studio's colours as the public request form offers them (name, hex, and the fibre its cautions go by). */
export async function listStudioColours(studioId: string) {
  return db
    .select({ id: yarns.id, colourName: yarns.colourName, hex: yarns.hex, name: yarns.name, fibre: yarns.fibre })
    .from(yarns)
    .where(eq(yarns.studioId, studioId))
    .orderBy(yarns.colourName);
}
