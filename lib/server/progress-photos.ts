import "server-only";
// Progress photos of a piece, per work stage: uploaded by the studio (owner or assistant), each
// optionally shared with the client. The bytes go through lib/server/uploads.ts (sniffed,
// re-encoded, EXIF stripped); downloads go through the gate in app/api/uploads/[id].
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { pieces, uploads } from "@/db/schema";
import type { ProgressPhoto, ProgressPhotoFields } from "@/lib/schemas/progress-photos";
import { assertCan, memberRole, type Actor } from "./authz";
import { notFound } from "./errors";
import { getCommissionFor } from "./queries/commissions";
import { storeUpload } from "./uploads";

async function loadPiece(actor: Actor, pieceId: string) {
  const [p] = await db.select().from(pieces).where(eq(pieces.id, pieceId));
  // Anyone outside the piece's studio gets the same answer as for a piece that does not exist.
  if (!p || memberRole(actor, p.studioId) === null) throw notFound("That piece");
  assertCan(actor, "commission.work", p.studioId);
  return p;
}

/** Throws the 404/403 before a request body is read, so outsiders learn nothing from upload errors. */
export async function assertPiecePhotoAccess(actor: Actor, pieceId: string): Promise<void> {
  await loadPiece(actor, pieceId);
}

const cols = {
  id: uploads.id,
  stage: uploads.stage,
  shared: uploads.sharedWithClient,
  width: uploads.width,
  height: uploads.height,
  createdAt: uploads.createdAt,
};

function out(r: { id: string; stage: string | null; shared: boolean; width: number; height: number; createdAt: Date }): ProgressPhoto {
  return { ...r, stage: r.stage ?? "", createdAt: r.createdAt.toISOString() };
}

/** Stores a progress photo for one stage of a piece; not shared unless asked. */
export async function addProgressPhoto(actor: Actor, pieceId: string, fields: ProgressPhotoFields, bytes: Buffer): Promise<ProgressPhoto> {
  const p = await loadPiece(actor, pieceId);
  const row = await storeUpload({
    studioId: p.studioId,
    commissionId: p.commissionId,
    kind: "progress",
    uploadedBy: actor.userId,
    pieceId: p.id,
    stage: fields.stage,
    sharedWithClient: fields.shared,
    bytes,
  });
  return out({ id: row.id, stage: row.stage, shared: row.sharedWithClient, width: row.width, height: row.height, createdAt: row.createdAt });
}

/** The piece's progress photos, for the studio. */
export async function listPiecePhotos(actor: Actor, pieceId: string): Promise<ProgressPhoto[]> {
  const p = await loadPiece(actor, pieceId);
  const rows = await db
    .select(cols)
    .from(uploads)
    .where(and(eq(uploads.pieceId, p.id), eq(uploads.kind, "progress")))
    .orderBy(asc(uploads.createdAt));
  return rows.map(out);
}

/** Shares a progress photo with the client, or stops sharing it. Studio members of its piece only. */
export async function setPhotoShared(actor: Actor, uploadId: string, shared: boolean): Promise<ProgressPhoto> {
  const [u] = await db.select().from(uploads).where(and(eq(uploads.id, uploadId), eq(uploads.kind, "progress")));
  if (!u || !u.pieceId || memberRole(actor, u.studioId) === null) throw notFound("That photo");
  assertCan(actor, "commission.work", u.studioId);
  const [row] = await db.update(uploads).set({ sharedWithClient: shared }).where(eq(uploads.id, u.id)).returning(cols);
  return out(row);
}

/**
 * A commission's progress photos with their piece and stage: all of them for the studio, only the
 * shared ones for anyone else who may see the commission (its client).
 */
export async function listProgressPhotos(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  const member = memberRole(actor, c.studioId) !== null;
  const rows = await db
    .select({ ...cols, pieceId: pieces.id, pieceName: pieces.name })
    .from(uploads)
    .innerJoin(pieces, eq(pieces.id, uploads.pieceId))
    .where(and(eq(uploads.commissionId, c.id), eq(uploads.kind, "progress"), ...(member ? [] : [eq(uploads.sharedWithClient, true)])))
    .orderBy(asc(pieces.position), asc(uploads.createdAt));
  return rows.map((r) => ({ ...out(r), pieceId: r.pieceId, pieceName: r.pieceName }));
}
