import "server-only";
// Limits and upkeep for the public request form, which signed-out visitors use on purpose: a cap on
// the reference photos they add to one studio's drafts per hour, and a sweep that removes drafts
// left unfinished (with photos no commission took) after DRAFT_MAX_AGE_DAYS.
import { and, eq, gte, inArray, isNull, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { requestDrafts, uploads } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "./errors";
import { deleteObjects } from "./storage";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

/** Throws 429 when signed-out visitors have added the studio's hourly allowance of draft photos. */
export async function assertDraftPhotoAllowance(studioId: string, now = new Date(), limit = env.DRAFT_PHOTO_HOURLY_LIMIT): Promise<void> {
  const [row] = await db
    .select({ n: sql<number>`count(*)::int` })
    .from(uploads)
    .where(and(eq(uploads.studioId, studioId), eq(uploads.kind, "reference"), isNull(uploads.commissionId), isNull(uploads.uploadedBy), gte(uploads.createdAt, new Date(now.getTime() - HOUR))));
  if ((row?.n ?? 0) >= limit) {
    throw new AppError(429, "too_many_uploads", "Many photos are being added to requests at the moment; please try again in a few minutes, or sign in first.");
  }
}

/**
 * Removes request drafts not touched for `maxAgeDays`, and reference photos older than that which
 * no commission took and no remaining draft holds (objects first, then rows). Safe to run again.
 */
export async function sweepRequestDrafts(now = new Date(), maxAgeDays = env.DRAFT_MAX_AGE_DAYS): Promise<{ drafts: number; uploads: number }> {
  const cutoff = new Date(now.getTime() - maxAgeDays * DAY);
  const drafts = await db.delete(requestDrafts).where(lt(requestDrafts.updatedAt, cutoff)).returning({ id: requestDrafts.id });
  const stale = await db
    .select({ id: uploads.id, objectKey: uploads.objectKey, thumbKey: uploads.thumbKey })
    .from(uploads)
    .where(
      and(
        eq(uploads.kind, "reference"),
        isNull(uploads.commissionId),
        lt(uploads.createdAt, cutoff),
        sql`not exists (select 1 from ${requestDrafts} d where ${uploads.id} = any(d.upload_ids))`,
      ),
    );
  if (stale.length) {
    await deleteObjects(stale.flatMap((u) => [u.objectKey, u.thumbKey]));
    await db.delete(uploads).where(and(inArray(uploads.id, stale.map((u) => u.id)), isNull(uploads.commissionId)));
  }
  return { drafts: drafts.length, uploads: stale.length };
}

const globalForSweep = globalThis as unknown as { darnwellDraftSweep?: ReturnType<typeof setInterval> };

/** Sweeps once an hour in each app instance (the sweep is idempotent); off with the outbox worker. */
export function startDraftSweeper(intervalMs = HOUR): void {
  if (globalForSweep.darnwellDraftSweep || env.OUTBOX_WORKER === "off") return;
  const run = () => sweepRequestDrafts().catch((err) => console.error("draft sweep:", (err as Error).message));
  globalForSweep.darnwellDraftSweep = setInterval(run, intervalMs);
  globalForSweep.darnwellDraftSweep.unref();
  setTimeout(run, 60_000).unref();
}
