// The input rules at the real entry points: the better-auth route (size, text, same-origin
// callbacks) still signs people up, in and through verification links; route() answers impossible
// dates, unstorable text and oversized bodies with 4xx and a message naming the field.
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { messages } from "@/db/schema";
import { GET as authGet, POST as authPost } from "@/app/api/auth/[...all]/route";
import { POST as postMessage } from "@/app/api/commissions/[id]/messages/route";
import { GET as listPayments } from "@/app/api/payments/route";
import { BASE, freshEmail, makeWorld, requestWith, signIn, waitForMail, type Jar, type World } from "./helpers";

const authRequest = (path: string, body?: unknown, headers: Record<string, string> = {}) =>
  new Request(`${BASE}/api/auth${path}`, {
    method: body === undefined ? "GET" : "POST",
    headers: { origin: BASE, "x-forwarded-for": "127.9.9.9", ...(body === undefined ? {} : { "content-type": "application/json" }), ...headers },
    body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
    redirect: "manual",
  });

describe("the auth route checks input before better-auth, and still works", () => {
  test("sign-up through the route, then its verification link (a same-origin callback) signs in", async () => {
    const email = freshEmail("guard");
    const res = await authPost(authRequest("/sign-up/email", { name: "Ilse Marr", email, password: "a-long-enough-pass", callbackURL: "/welcome?studio=x" }));
    expect(res.status).toBe(200);
    const mail = await waitForMail(email, (m) => m.links.some((l) => l.includes("/api/auth/verify-email")));
    const link = mail.links.find((l) => l.includes("/api/auth/verify-email"))!;
    const verify = await authGet(new Request(link, { headers: { origin: BASE }, redirect: "manual" }));
    expect(verify.status).toBe(302);
    expect(verify.headers.get("location")).toContain("/welcome?studio=x");
    const signIn = await authPost(authRequest("/sign-in/email", { email, password: "a-long-enough-pass" }));
    expect(signIn.status).toBe(200);
    expect(signIn.headers.getSetCookie().join(";")).toMatch(/session_token=/);
  });

  test("a password reset link through the route lands on the reset form with its token", async () => {
    const email = freshEmail("reset");
    await authPost(authRequest("/sign-up/email", { name: "Reset Me", email, password: "a-long-enough-pass" }));
    const res = await authPost(authRequest("/request-password-reset", { email, redirectTo: "/reset-password" }));
    expect(res.status).toBe(200);
    const mail = await waitForMail(email, (m) => m.links.some((l) => l.includes("/api/auth/reset-password/")));
    const link = mail.links.find((l) => l.includes("/api/auth/reset-password/"))!;
    const open = await authGet(new Request(link, { headers: { origin: BASE }, redirect: "manual" }));
    expect(open.status).toBe(302);
    expect(open.headers.get("location")).toMatch(/\/reset-password\?token=/);
  });

  test.each([["//evil.test/x"], ["https://evil.test"], ["/\t/evil.test"], ["/\n/x"], ["/\\evil.test"], ["javascript:alert(1)"]])("callbackURL %j is refused with 400", async (callbackURL) => {
    const res = await authPost(authRequest("/sign-in/magic-link", { email: freshEmail("cb"), callbackURL }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.code).toBe("bad_redirect");
  });

  test("a callback in a link's query is checked too", async () => {
    const res = await authGet(authRequest("/verify-email?token=x&callbackURL=%2F%2Fevil.test"));
    expect(res.status).toBe(400);
  });

  test.each([
    ["a NUL in the name", '{"name":"Ilse\\u0000","email":"nul@it.test","password":"a-long-enough-pass"}', 422],
    ["a lone surrogate", '{"name":"Ilse \\ud800","email":"sur@it.test","password":"a-long-enough-pass"}', 422],
    ["bad JSON", '{"name":', 400],
    ["over 64 KB", JSON.stringify({ name: "x".repeat(70_000), email: "big@it.test", password: "a-long-enough-pass" }), 413],
  ])("sign-up with %s → %s", async (_label, body, status) => {
    const res = await authPost(authRequest("/sign-up/email", body));
    expect(res.status).toBe(status);
  });

  test("a text/plain body is 415", async () => {
    const res = await authPost(authRequest("/sign-in/email", '{"email":"a@it.test","password":"x"}', { "content-type": "text/plain" }));
    expect(res.status).toBe(415);
  });
});

describe("route(): dates, text and sizes", () => {
  let w: World;
  let owner: Jar;
  beforeAll(async () => {
    w = await makeWorld();
    owner = await signIn(w.owner.email);
  });
  const ctx = (p: Record<string, string>) => ({ params: Promise.resolve(p) });

  test.each(["2026-99-99", "2026-02-30", "2026-13-01", "1999-12-31"])("the payments filter refuses from=%s with 422 naming the field", async (from) => {
    const res = await listPayments(requestWith(owner, `/api/payments?from=${from}`), ctx({}));
    expect(res.status).toBe(422);
    expect(Object.keys((await res.json()).error.fieldErrors)).toEqual(["from"]);
  });

  test("a real date passes", async () => {
    const res = await listPayments(requestWith(owner, "/api/payments?from=2028-02-29&to=2028-03-01"), ctx({}));
    expect(res.status).toBe(200);
  });

  const post = (body: string, type = "application/json") =>
    postMessage(requestWith(owner, `/api/commissions/${w.commissionA}/messages`, { method: "POST", headers: { "content-type": type }, body }), ctx({ id: w.commissionA }));

  test.each([
    ["a NUL", '{"body":"hi\\u0000","clientKey":"guard-nul-1"}'],
    ["a lone high surrogate", '{"body":"hi \\ud83e","clientKey":"guard-sur-1"}'],
    ["a lone low surrogate", '{"body":"\\udcff hi","clientKey":"guard-sur-2"}'],
  ])("a message with %s is 422 on the body field, and nothing is stored", async (_label, body) => {
    const res = await post(body);
    expect(res.status).toBe(422);
    expect((await res.json()).error.fieldErrors.body[0]).toMatch(/cannot be saved/);
    const key = (JSON.parse(body.replace(/\\u[dD][89a-fA-F][0-9a-fA-F]{2}|\\u0000/g, "")) as { clientKey: string }).clientKey;
    expect(await db.$count(messages, and(eq(messages.commissionId, w.commissionA), eq(messages.clientKey, key)))).toBe(0);
  });

  test("an emoji (a whole surrogate pair) is kept", async () => {
    const res = await post('{"body":"warm hands \\ud83e\\udde4","clientKey":"guard-emoji-1"}');
    expect(res.status).toBe(201);
    const [row] = await db.select({ body: messages.body }).from(messages).where(and(eq(messages.commissionId, w.commissionA), eq(messages.clientKey, "guard-emoji-1")));
    expect(row.body).toBe("warm hands 🧤");
  });

  test("over 1 MB is 413, text/plain is 415, 40 levels deep is 400", async () => {
    expect((await post(JSON.stringify({ body: "x".repeat(1_100_000), clientKey: "guard-big-1" }))).status).toBe(413);
    expect((await post('{"body":"hi","clientKey":"guard-txt-1"}', "text/plain")).status).toBe(415);
    expect((await post(`{"body":"hi","clientKey":"guard-deep-1","uploadIds":${"[".repeat(40)}${"]".repeat(40)}}`)).status).toBe(400);
  });
});
