import { eq } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { db } from "@/db";
import { user } from "@/db/schema";
import { authCall, freshEmail, makeUser, mailCount, newJar, signIn, TEST_PASSWORD, waitForMail } from "./helpers";

describe("sign-up, e-mail verification and sign-in (real database, real SMTP)", () => {
  test("sign-up sends a verification mail whose link verifies and signs in", async () => {
    const email = freshEmail("signup");
    const jar = newJar();
    const res = await authCall(jar, "/sign-up/email", {
      body: { name: "Ilse Marr", email, password: "a-long-enough-pass", callbackURL: "/welcome?studio=hollin-knitworks" },
    });
    expect(res.status).toBe(200);
    // With verification required, sign-up gives no session.
    expect(jar.cookie).not.toMatch(/session_token=/);

    const before = await signInAttempt(email, "a-long-enough-pass");
    expect(before.status).toBe(403);
    expect((await before.json()).code).toBe("EMAIL_NOT_VERIFIED");

    // The sign-up mail carries the sign-up's callback (the refused sign-in above sent a second one).
    const mail = await waitForMail(email, (m) => /confirm/i.test(m.subject) && m.text.includes("welcome"));
    const link = mail.links.find((l) => l.includes("/api/auth/verify-email"));
    expect(link).toBeDefined();
    expect(mail.text).toContain(link!);

    const verify = await authCall(jar, link!);
    expect(verify.status).toBe(302);
    expect(verify.headers.get("location")).toContain("/welcome?studio=hollin-knitworks");
    expect(jar.cookie).toMatch(/session_token=/);
    const [row] = await db.select().from(user).where(eq(user.email, email));
    expect(row.emailVerified).toBe(true);

    const after = await signInAttempt(email, "a-long-enough-pass");
    expect(after.status).toBe(200);
  });

  test("an unverified sign-in sends a fresh verification mail", async () => {
    const email = freshEmail("unverified");
    await authCall(newJar(), "/sign-up/email", { body: { name: "Rae", email, password: "a-long-enough-pass" } });
    await waitForMail(email);
    const n = await mailCount(email);
    const res = await signInAttempt(email, "a-long-enough-pass");
    expect(res.status).toBe(403);
    await expect.poll(() => mailCount(email), { timeout: 5000 }).toBe(n + 1);
  });

  test("a wrong password is refused with a code the form turns into a message", async () => {
    const u = await makeUser("wrongpw");
    const res = await signInAttempt(u.email, "not-the-password");
    expect(res.status).toBe(401);
    expect((await res.json()).code).toBe("INVALID_EMAIL_OR_PASSWORD");
  });

  test("signing up with an address that has an account answers as usual and mails its owner once an hour", async () => {
    const u = await makeUser("existing");
    const before = await mailCount(u.email);
    const res = await authCall(newJar(), "/sign-up/email", { body: { name: "Someone", email: u.email, password: "a-long-enough-pass" } });
    // The same answer as a new address: nothing tells the caller that this address has an account.
    expect(res.status).toBe(200);
    const mail = await waitForMail(u.email, (m) => /tried to sign up/i.test(m.subject));
    expect(mail.text).toContain("/sign-in");
    expect(mail.links.some((l) => l.includes("/forgot-password"))).toBe(true);
    // A second try within the hour sends nothing more; the account's password is unchanged.
    await authCall(newJar(), "/sign-up/email", { body: { name: "Someone", email: u.email, password: "another-long-pass" } });
    await expect.poll(() => mailCount(u.email), { timeout: 3000 }).toBe(before + 1);
    expect((await signInAttempt(u.email, TEST_PASSWORD)).status).toBe(200);
  });

  test("a password that is too short is refused at sign-up", async () => {
    const res = await authCall(newJar(), "/sign-up/email", { body: { name: "Short", email: freshEmail("short"), password: "short" } });
    expect(res.status).toBe(400);
    expect((await res.json()).code).toBe("PASSWORD_TOO_SHORT");
  });

  test("a tampered verification link does not verify and says why", async () => {
    const jar = newJar();
    const res = await authCall(jar, "/verify-email?token=not-a-token&callbackURL=/welcome");
    expect([302, 401]).toContain(res.status);
    if (res.status === 302) expect(res.headers.get("location")).toMatch(/error=/);
    expect(jar.cookie).not.toMatch(/session_token=/);
  });

  test("sign-in is rate limited per client address", async () => {
    // The vitest process runs with AUTH_SIGNIN_LIMIT=5 (scripts/test.sh).
    const u = await makeUser("ratelimit");
    const jar = newJar();
    const statuses: number[] = [];
    // Other (unknown) accounts each time, so the per-account lock (sign-in-lock.test.ts) plays no part.
    for (let i = 0; i < 7; i++) {
      const res = await authCall(jar, "/sign-in/email", { body: { email: freshEmail("ratelimit-guess"), password: "nope-nope-nope" } });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 5).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(5)).toEqual([429, 429]);
    // Another address is not affected.
    expect((await authCall(newJar(), "/sign-in/email", { body: { email: u.email, password: TEST_PASSWORD } })).status).toBe(200);
  });

  test("password reset: mail, link, new password works and the old one does not", async () => {
    const u = await makeUser("reset");
    const jar = newJar();
    const req = await authCall(jar, "/request-password-reset", { body: { email: u.email, redirectTo: "/reset-password" } });
    expect(req.status).toBe(200);
    const mail = await waitForMail(u.email, (m) => /reset/i.test(m.subject));
    const link = mail.links.find((l) => l.includes("/api/auth/reset-password/"))!;
    const hop = await authCall(jar, link);
    expect(hop.status).toBe(302);
    const token = new URL(hop.headers.get("location")!, "http://x").searchParams.get("token");
    expect(token).toBeTruthy();
    const done = await authCall(jar, "/reset-password", { body: { newPassword: "a-brand-new-password", token } });
    expect(done.status).toBe(200);
    expect((await signInAttempt(u.email, TEST_PASSWORD)).status).toBe(401);
    expect((await signInAttempt(u.email, "a-brand-new-password")).status).toBe(200);
    // The link works once.
    const again = await authCall(newJar(), "/reset-password", { body: { newPassword: "yet-another-password", token } });
    expect(again.status).toBe(400);
  });

  test("magic link: mail, link signs in; unknown addresses get no account", async () => {
    const u = await makeUser("magic");
    const jar = newJar();
    const res = await authCall(jar, "/sign-in/magic-link", { body: { email: u.email, callbackURL: "/home" } });
    expect(res.status).toBe(200);
    const mail = await waitForMail(u.email, (m) => /sign-in link/i.test(m.subject));
    const link = mail.links.find((l) => l.includes("/magic-link/verify"))!;
    const hop = await authCall(jar, link);
    expect(hop.status).toBe(302);
    expect(jar.cookie).toMatch(/session_token=/);
    const reuse = await authCall(newJar(), link);
    expect(reuse.headers.get("location") ?? "").toMatch(/error=/);

    const stranger = freshEmail("stranger");
    await authCall(newJar(), "/sign-in/magic-link", { body: { email: stranger, callbackURL: "/home" } });
    const rows = await db.select().from(user).where(eq(user.email, stranger));
    expect(rows).toHaveLength(0);
  });

  test("a session reads back through the same helper every page uses", async () => {
    const u = await makeUser("session");
    const jar = await signIn(u.email);
    const s = await authCall(jar, "/get-session");
    expect((await s.json()).user.email).toBe(u.email);
  });
});

function signInAttempt(email: string, password: string) {
  return authCall(newJar(), "/sign-in/email", { body: { email, password } });
}
