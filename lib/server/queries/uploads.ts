import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { studios, uploads, type Upload } from "@/db/schema";
import { memberRole, type Actor } from "../authz";
import { notFound, nullIfNotFound } from "../errors";
import { draftOwnsUpload } from "../requests";
import { getCommissionFor } from "./commissions";

/**
 * One upload the person may see: a participant of its commission (a client only what is shared
 * with them), or, for a photo not yet attached to a commission, the draft that uploaded it.
 */
export async function getUploadFor(
  actor: Actor | null,
  id: string,
  draftTokenFor: (studioSlug: string) => Promise<string | undefined>,
): Promise<Upload> {
  const [row] = await db
    .select({ upload: uploads, slug: studios.slug })
    .from(uploads)
    .innerJoin(studios, eq(studios.id, uploads.studioId))
    .where(eq(uploads.id, id));
  if (!row) throw notFound("That photo");
  const u = row.upload;
  if (!u.commissionId) {
    if (await draftOwnsUpload(u.studioId, await draftTokenFor(row.slug), u.id)) return u;
    throw notFound("That photo");
  }
  if (!actor) throw notFound("That photo");
  const c = await getCommissionFor(actor, u.commissionId).catch(nullIfNotFound);
  if (!c) throw notFound("That photo");
  if (!memberRole(actor, c.studioId) && !u.sharedWithClient) throw notFound("That photo");
  return u;
}

/** The commission's photos the person may see (reference photos and message attachments). */
export async function listCommissionUploads(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  const member = memberRole(actor, c.studioId) !== null;
  return db
    .select({ id: uploads.id, kind: uploads.kind, messageId: uploads.messageId, width: uploads.width, height: uploads.height, createdAt: uploads.createdAt })
    .from(uploads)
    .where(and(eq(uploads.commissionId, c.id), ...(member ? [] : [eq(uploads.sharedWithClient, true)])))
    .orderBy(asc(uploads.createdAt));
}
