// Per-account limit on wrong passwords: through the real auth route handler, with a new
// X-Forwarded-For on every try (what defeated the per-address limit), on the real database and mail.
import { randomBytes } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { POST } from "@/app/api/auth/[...all]/route";
import { db } from "@/db";
import { signInLocks } from "@/db/schema";
import { moveForwardingHeaders } from "@/lib/server/client-address";
import { emailKey, sweepSignInLocks } from "@/lib/server/sign-in-lock";
import { BASE, freshEmail, freshIp, makeUser, mailCount, TEST_PASSWORD, waitForMail } from "./helpers";

function attempt(email: string, password: string): Promise<Response> {
  return POST(
    new Request(`${BASE}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { origin: BASE, "content-type": "application/json", "x-forwarded-for": freshIp() },
      body: JSON.stringify({ email, password }),
    }),
  );
}

const lockMails = (m: { subject: string }) => /paused/i.test(m.subject);
async function lockMailCount(email: string): Promise<number> {
  await mailCount(email);
  const res = await fetch(`${process.env.LOCAL_MAIL_API}/messages?to=${encodeURIComponent(email)}`);
  return ((await res.json()) as { subject: string }[]).filter(lockMails).length;
}

/** Ends the current lock as if its time had passed. */
const expireLock = (email: string) =>
  db.update(signInLocks).set({ lockedUntil: new Date(Date.now() - 1000) }).where(eq(signInLocks.emailHash, emailKey(email)));

// Each attempt hashes a password (scrypt): generous time on a shared, busy machine (not an assertion).
describe("wrong passwords per account, from ever-changing addresses", { timeout: 120_000 }, () => {
  test("five wrong passwords, then 429 with Retry-After even for the right one; the owner gets one mail", async () => {
    const u = await makeUser("locked");
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await attempt(u.email, `wrong-${i}-password`)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401]);

    const refused = await attempt(u.email, "wrong-again-password");
    expect(refused.status).toBe(429);
    expect((await refused.json()).code).toBe("ACCOUNT_LOCKED");
    expect(Number(refused.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(Number(refused.headers.get("retry-after"))).toBeLessThanOrEqual(60);
    // The right password is not even checked during the lock.
    expect((await attempt(u.email, TEST_PASSWORD)).status).toBe(429);

    const mail = await waitForMail(u.email, lockMails);
    expect(mail.text).toContain("1 minute");
    expect(mail.links.some((l) => l.endsWith("/forgot-password"))).toBe(true);
    for (let i = 0; i < 3; i++) expect((await attempt(u.email, "still-wrong-pass")).status).toBe(429);
    expect(await lockMailCount(u.email)).toBe(1);
  });

  test("after a lock each wrong password locks for longer, with one mail per lock; the right one then works", async () => {
    const u = await makeUser("growing");
    for (let i = 0; i < 5; i++) await attempt(u.email, `wrong-${i}-password`);
    await waitForMail(u.email, lockMails);
    await expireLock(u.email);
    expect((await attempt(u.email, "wrong-sixth-password")).status).toBe(401);
    const second = await attempt(u.email, "wrong-seventh-password");
    expect(second.status).toBe(429);
    const wait = Number(second.headers.get("retry-after"));
    expect(wait).toBeGreaterThan(60);
    expect(wait).toBeLessThanOrEqual(120);
    await expect.poll(() => lockMailCount(u.email), { timeout: 5000 }).toBe(2);

    await expireLock(u.email);
    expect((await attempt(u.email, TEST_PASSWORD)).status).toBe(200);
    // A successful sign-in ends the series.
    expect(await db.select().from(signInLocks).where(eq(signInLocks.emailHash, emailKey(u.email)))).toHaveLength(0);
  });

  test("a burst of 30 parallel wrong passwords gets at most five checked", async () => {
    const u = await makeUser("burst");
    const results = await Promise.all(Array.from({ length: 30 }, (_, i) => attempt(u.email, `burst-${i}-password`)));
    const statuses = results.map((r) => r.status);
    expect(statuses.filter((s) => s === 401)).toHaveLength(5);
    expect(statuses.filter((s) => s === 429)).toHaveLength(25);
    expect((await attempt(u.email, TEST_PASSWORD)).status).toBe(429);
    await waitForMail(u.email, lockMails);
    expect(await lockMailCount(u.email)).toBe(1);
  });

  test("an address without an account is treated the same (nothing tells them apart) and nobody is mailed", async () => {
    const ghost = freshEmail("ghost");
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await attempt(ghost, `guess-${i}-password`)).status);
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429]);
    // Case and spaces do not make a new series.
    expect((await attempt(`  ${ghost.toUpperCase()} `, "guess-password")).status).toBe(429);
    expect(await mailCount(ghost)).toBe(0);
  });

  test("a right password inside the series ends it: mistakes spread over sign-ins never lock", async () => {
    const u = await makeUser("typo");
    for (let round = 0; round < 2; round++) {
      for (let i = 0; i < 4; i++) expect((await attempt(u.email, `typo-${round}-${i}-pass`)).status).toBe(401);
      expect((await attempt(u.email, TEST_PASSWORD)).status).toBe(200);
    }
  });

  test("rotating addresses do not reset anything: the count is per account", async () => {
    const u = await makeUser("rotate");
    const seen = new Set<string>();
    for (let i = 0; i < 5; i++) {
      const ip = `10.${randomBytes(1)[0]}.${randomBytes(1)[0]}.${1 + (randomBytes(1)[0] % 250)}`;
      seen.add(ip);
      const res = await POST(
        new Request(`${BASE}/api/auth/sign-in/email`, {
          method: "POST",
          headers: { origin: BASE, "content-type": "application/json", "x-forwarded-for": ip, "x-real-ip": ip },
          body: JSON.stringify({ email: u.email, password: `rotate-${i}-password` }),
        }),
      );
      expect(res.status).toBe(401);
    }
    expect(seen.size).toBeGreaterThan(1);
    expect((await attempt(u.email, TEST_PASSWORD)).status).toBe(429);
  });
});

describe("the per-address limit keys on the address no client chooses", { timeout: 120_000 }, () => {
  test("a new X-Forwarded-For per try from one socket address is still one address (limit 5 a minute)", async () => {
    const socket = freshIp();
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) {
      // The headers as proxy.ts and `next start` hand them to the route: the client's value moved aside,
      // X-Forwarded-For set to the socket's address.
      const headers = moveForwardingHeaders(new Headers({ origin: BASE, "content-type": "application/json", "x-forwarded-for": freshIp(), "x-darnwell-client-address": freshIp() }));
      headers.set("x-forwarded-for", socket);
      const res = await POST(new Request(`${BASE}/api/auth/sign-in/email`, { method: "POST", headers, body: JSON.stringify({ email: freshEmail("spoof"), password: "spoofed-pass" }) }));
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429, 429]);
  });
});

describe("upkeep", () => {
  test("series idle for longer than a day are forgotten; recent ones stay", async () => {
    const old = emailKey(freshEmail("old-series"));
    const recent = emailKey(freshEmail("recent-series"));
    await db.insert(signInLocks).values([
      { emailHash: old, attempts: 7, locks: 3, lastAttemptAt: new Date(Date.now() - 25 * 3600_000) },
      { emailHash: recent, attempts: 2, locks: 0, lastAttemptAt: new Date(Date.now() - 3600_000) },
    ]);
    expect(await sweepSignInLocks()).toBeGreaterThanOrEqual(1);
    const left = await db.select({ k: signInLocks.emailHash }).from(signInLocks).where(inArray(signInLocks.emailHash, [old, recent]));
    expect(left.map((r) => r.k)).toEqual([recent]);
  });
});
