import "server-only";
// A limit on wrong passwords per account, whatever address they come from (the per-address limit is
// better-auth's). Each attempt is counted BEFORE its password is checked, in a row locked for the
// decision, so parallel attempts cannot slip past the count. From the THRESHOLD-th attempt of a series
// on, each attempt starts a lock (60 s, then twice as long each time, at most an hour) during which
// attempts for that address are refused with 429 without checking the password. A successful sign-in
// ends the series. The owner gets one mail per lock. Unknown addresses are treated exactly like known
// ones, so the answers say nothing about which accounts exist. Common practice (exponential lockout
// with a notification); the numbers are our choice.
import { createHash } from "node:crypto";
import { eq, lt, sql } from "drizzle-orm";
import { db } from "@/db";
import { signInLocks, user } from "@/db/schema";
import { env } from "@/lib/env";
import { signInLockedMessage } from "@/templates/email/auth";
import { enqueueMail } from "./outbox";

export const LOCK_POLICY = {
  /** attempts in a series before each further attempt locks */
  threshold: 5,
  firstLockSeconds: 60,
  maxLockSeconds: 3600,
  /** before the first lock, a series ends after this long without an attempt */
  quietSeconds: 15 * 60,
  /** once locked, the series (and its growing locks) is remembered this long after the last attempt */
  memorySeconds: 24 * 3600,
} as const;

export type LockPolicy = typeof LOCK_POLICY;

export interface LockState {
  attempts: number;
  locks: number;
  lockedUntil: Date | null;
  lastAttemptAt: Date;
}

export type AttemptDecision =
  | { allowed: false; retryAfterSeconds: number; next: LockState }
  | { allowed: true; next: LockState; lockedNow: boolean };

/** Pure: what an attempt at `now` does to the account's series. */
export function decideAttempt(state: LockState | null, now: Date, policy: LockPolicy = LOCK_POLICY): AttemptDecision {
  const t = now.getTime();
  if (state?.lockedUntil && state.lockedUntil.getTime() > t) {
    return { allowed: false, retryAfterSeconds: Math.ceil((state.lockedUntil.getTime() - t) / 1000), next: state };
  }
  const idle = state ? (t - state.lastAttemptAt.getTime()) / 1000 : Infinity;
  const fresh = !state || idle > policy.memorySeconds || (state.locks === 0 && idle > policy.quietSeconds);
  const base: LockState = fresh ? { attempts: 0, locks: 0, lockedUntil: null, lastAttemptAt: now } : state;
  const attempts = base.attempts + 1;
  if (attempts < policy.threshold) {
    return { allowed: true, lockedNow: false, next: { attempts, locks: base.locks, lockedUntil: null, lastAttemptAt: now } };
  }
  const locks = base.locks + 1;
  const seconds = lockSeconds(locks, policy);
  return { allowed: true, lockedNow: true, next: { attempts, locks, lockedUntil: new Date(t + seconds * 1000), lastAttemptAt: now } };
}

/** Length of the n-th lock of a series (n ≥ 1): 60 s, 120 s, 240 s … capped. */
export function lockSeconds(n: number, policy: LockPolicy = LOCK_POLICY): number {
  return Math.min(policy.maxLockSeconds, policy.firstLockSeconds * 2 ** Math.min(30, Math.max(0, n - 1)));
}

export const emailKey = (email: string) => createHash("sha256").update(email.trim().toLowerCase()).digest("hex");

/** Counts an attempt for `email`; returns the refusal (seconds to wait) or null to check the password. */
export async function recordSignInAttempt(email: string, now = new Date()): Promise<{ retryAfterSeconds: number } | null> {
  const key = emailKey(email);
  return db.transaction(async (tx) => {
    await tx.insert(signInLocks).values({ emailHash: key, lastAttemptAt: now }).onConflictDoNothing();
    const [row] = await tx.select().from(signInLocks).where(eq(signInLocks.emailHash, key)).for("update");
    const state: LockState | null = row && (row.attempts > 0 || row.locks > 0) ? row : null;
    const d = decideAttempt(state, now);
    if (!d.allowed) return { retryAfterSeconds: d.retryAfterSeconds };
    await tx.update(signInLocks).set(d.next).where(eq(signInLocks.emailHash, key));
    return null;
  });
}

/** A successful sign-in ends the account's series. */
export async function clearSignInAttempts(email: string): Promise<void> {
  await db.delete(signInLocks).where(eq(signInLocks.emailHash, emailKey(email)));
}

/**
 * After a wrong password: when the series is in a lock, mail the owner (if the account exists) once
 * for that lock; the outbox's dedupe key makes parallel failures and other instances send it once.
 */
export async function noticeFailedSignIn(email: string, now = new Date()): Promise<void> {
  const key = emailKey(email);
  const [row] = await db.select().from(signInLocks).where(eq(signInLocks.emailHash, key));
  if (!row?.lockedUntil || row.lockedUntil.getTime() <= now.getTime()) return;
  const [owner] = await db
    .select({ name: user.name, email: user.email })
    .from(user)
    .where(eq(sql`lower(${user.email})`, email.trim().toLowerCase()));
  if (!owner) return;
  const minutes = Math.max(1, Math.round(lockSeconds(row.locks) / 60));
  const resetUrl = new URL("/forgot-password", env.BETTER_AUTH_URL).toString();
  await enqueueMail({ to: owner.email, ...signInLockedMessage(owner.name, minutes, resetUrl), dedupeKey: `sign-in-lock:${key}:${row.lockedUntil.toISOString()}` });
}

/** Forgets series idle for longer than the policy remembers them (run by the hourly upkeep). */
export async function sweepSignInLocks(now = new Date()): Promise<number> {
  const cutoff = new Date(now.getTime() - LOCK_POLICY.memorySeconds * 1000);
  const gone = await db.delete(signInLocks).where(lt(signInLocks.lastAttemptAt, cutoff)).returning({ k: signInLocks.emailHash });
  return gone.length;
}
