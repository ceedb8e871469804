import "server-only";
// Limits and upkeep for the public request form, which signed-out visitors use on purpose: caps on
// the reference photos one visitor and one address add to drafts per hour, and a sweep that removes drafts
// left unfinished (with photos no commission took) after DRAFT_MAX_AGE_DAYS.
import { createHash } from "node:crypto";
import { and, eq, inArray, isNull, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { requestDrafts, uploads, usageCounters } from "@/db/schema";
import { env } from "@/lib/env";
import { addressKey } from "./client-address";
import { AppError } from "./errors";
import { sweepSignInLocks } from "./sign-in-lock";
import { deleteObjects } from "./storage";

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

export interface PhotoAllowance {
  /** per visitor (the draft's cookie token, for this studio) */
  visitor: number;
  /** per client address (clientAddress(); IPv6 by /64), over every studio */
  address: number;
}

const defaultAllowance = (): PhotoAllowance => ({ visitor: env.DRAFT_PHOTO_VISITOR_HOURLY_LIMIT, address: env.DRAFT_PHOTO_HOURLY_LIMIT });

/**
 * Takes one photo from a signed-out visitor's hourly allowances, per visitor and per address, so one
 * visitor can no longer use up what a studio's other visitors may add. Both counters move together in
 * one transaction (row-locked upserts, shared by every instance); over either limit nothing is taken
 * and it throws 429.
 */
export async function takeDraftPhotoAllowance(
  who: { studioId: string; visitorToken: string; address: string },
  now = new Date(),
  limits: PhotoAllowance = defaultAllowance(),
): Promise<void> {
  const windowStart = new Date(Math.floor(now.getTime() / HOUR) * HOUR);
  const visitorKey = `draft-photos:visitor:${createHash("sha256").update(`${who.studioId}:${who.visitorToken}`).digest("hex")}`;
  const addressKeyed = `draft-photos:address:${addressKey(who.address)}`;
  await db.transaction(async (tx) => {
    for (const [key, limit] of [[visitorKey, limits.visitor], [addressKeyed, limits.address]] as const) {
      const [row] = await tx
        .insert(usageCounters)
        .values({ key, windowStart, count: 1 })
        .onConflictDoUpdate({ target: [usageCounters.key, usageCounters.windowStart], set: { count: sql`${usageCounters.count} + 1` } })
        .returning({ count: usageCounters.count });
      // Thrown inside the transaction, so neither counter moves.
      if ((row?.count ?? 0) > limit) {
        throw new AppError(429, "too_many_uploads", "Many photos were added from here in the last hour; please try again later, or sign in first.");
      }
    }
  });
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
  await db.delete(usageCounters).where(lt(usageCounters.windowStart, new Date(now.getTime() - DAY)));
  return { drafts: drafts.length, uploads: stale.length };
}

const globalForSweep = globalThis as unknown as { darnwellDraftSweep?: ReturnType<typeof setInterval> };

/** Sweeps once an hour in each app instance (the sweep is idempotent); off with the outbox worker. */
export function startDraftSweeper(intervalMs = HOUR): void {
  if (globalForSweep.darnwellDraftSweep || env.OUTBOX_WORKER === "off") return;
  const run = () => {
    sweepRequestDrafts().catch((err) => console.error("draft sweep:", (err as Error).message));
    sweepSignInLocks().catch((err) => console.error("sign-in lock sweep:", (err as Error).message));
  };
  globalForSweep.darnwellDraftSweep = setInterval(run, intervalMs);
  globalForSweep.darnwellDraftSweep.unref();
  setTimeout(run, 60_000).unref();
}
