// Helpers for integration tests: they run against the real PostgreSQL and the local mail
// service started by scripts/test.sh (DATABASE_URL, SMTP_URL, LOCAL_MAIL_API, BETTER_AUTH_URL).
import { randomBytes } from "node:crypto";
import { hashPassword } from "better-auth/crypto";
import { db } from "@/db";
import { account, commissions, studioClients, studioMembers, studios, user } from "@/db/schema";
import { getAuth } from "@/lib/server/auth";
import { loadActor, type Actor } from "@/lib/server/authz";
import { processOutbox } from "@/lib/server/outbox";

export const BASE = process.env.BETTER_AUTH_URL ?? "http://127.0.0.1:3100";
export const uid = () => randomBytes(5).toString("hex");

/** A fresh address per test so parallel files never meet. */
export const freshEmail = (tag: string) => `${tag}-${uid()}@it.test`;

/** A made-up client IP per caller, so rate limits of one test never touch another's. */
export const freshIp = () => `127.${1 + (randomBytes(1)[0] % 250)}.${randomBytes(1)[0]}.${1 + (randomBytes(1)[0] % 250)}`;

export interface Jar {
  cookie: string;
  ip: string;
}
export const newJar = (): Jar => ({ cookie: "", ip: freshIp() });

function absorb(jar: Jar, res: Response) {
  const set = res.headers.getSetCookie();
  if (!set.length) return;
  const map = new Map(jar.cookie ? jar.cookie.split("; ").map((c) => c.split("=", 2) as [string, string]) : []);
  for (const line of set) {
    const [pair] = line.split(";");
    const i = pair.indexOf("=");
    const name = pair.slice(0, i);
    const value = pair.slice(i + 1);
    if (!value || /max-age=0/i.test(line)) map.delete(name);
    else map.set(name, value);
  }
  jar.cookie = [...map].map(([k, v]) => `${k}=${v}`).join("; ");
}

/** Calls the better-auth handler in-process, exactly as the route handler does. */
export async function authCall(jar: Jar, path: string, init: { method?: string; body?: unknown } = {}): Promise<Response> {
  const url = path.startsWith("http") ? path : `${BASE}/api/auth${path}`;
  const headers = new Headers({ origin: BASE, "x-forwarded-for": jar.ip });
  if (jar.cookie) headers.set("cookie", jar.cookie);
  if (init.body !== undefined) headers.set("content-type", "application/json");
  const res = await getAuth().handler(
    new Request(url, {
      method: init.method ?? (init.body !== undefined ? "POST" : "GET"),
      headers,
      body: init.body !== undefined ? JSON.stringify(init.body) : undefined,
      redirect: "manual",
    }),
  );
  absorb(jar, res);
  return res;
}

export function requestWith(jar: Jar | null, url: string, init: RequestInit = {}): Request {
  const headers = new Headers(init.headers);
  if (jar?.cookie) headers.set("cookie", jar.cookie);
  headers.set("origin", BASE);
  return new Request(url.startsWith("http") ? url : `${BASE}${url}`, { ...init, headers });
}

interface CaughtMail {
  id: string;
  subject: string;
  text: string;
  links: string[];
  envelopeTo: string[];
}

/** Waits (bounded) for a message to arrive at the local mail service. */
export async function waitForMail(to: string, match: (m: CaughtMail) => boolean = () => true, tries = 50): Promise<CaughtMail> {
  const api = process.env.LOCAL_MAIL_API;
  if (!api) throw new Error("LOCAL_MAIL_API is not set: run the tests with npm test");
  for (let i = 0; i < tries; i++) {
    // The app's worker sends the outbox; in tests we drive it by hand (OUTBOX_WORKER=off).
    await processOutbox();
    const res = await fetch(`${api}/messages?to=${encodeURIComponent(to)}`);
    const list = (await res.json()) as CaughtMail[];
    const hit = list.find(match);
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} arrived`);
}

export async function mailCount(to: string): Promise<number> {
  await processOutbox();
  const res = await fetch(`${process.env.LOCAL_MAIL_API}/messages?to=${encodeURIComponent(to)}`);
  return ((await res.json()) as unknown[]).length;
}

export const TEST_PASSWORD = "correct-horse-staple";

/** A verified user with a password, written straight to the database. */
export async function makeUser(tag: string, name = `Test ${tag}`): Promise<{ id: string; email: string }> {
  const id = `it-${tag}-${uid()}`;
  const email = freshEmail(tag);
  await db.insert(user).values({ id, name, email, emailVerified: true });
  await db.insert(account).values({
    id: `acc-${id}`,
    accountId: id,
    providerId: "credential",
    userId: id,
    password: await hashPassword(TEST_PASSWORD),
  });
  return { id, email };
}

export async function signIn(email: string, password = TEST_PASSWORD): Promise<Jar> {
  const jar = newJar();
  const res = await authCall(jar, "/sign-in/email", { body: { email, password } });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${await res.text()}`);
  return jar;
}

export interface World {
  studioId: string;
  otherStudioId: string;
  owner: { id: string; email: string };
  assistant: { id: string; email: string };
  clientA: { id: string; email: string; clientId: string };
  clientB: { id: string; email: string; clientId: string };
  outsider: { id: string; email: string };
  commissionA: string;
  commissionB: string;
  otherCommission: string;
  actor: (userId: string) => Promise<Actor>;
}

/** A studio with an owner, an assistant, two clients with one commission each; and a second studio. */
export async function makeWorld(): Promise<World> {
  const tag = uid();
  const [studio] = await db
    .insert(studios)
    .values({ slug: `it-${tag}`, name: `Studio ${tag}`, contactEmail: `studio-${tag}@it.test` })
    .returning();
  const [other] = await db
    .insert(studios)
    .values({ slug: `it-other-${tag}`, name: `Other ${tag}`, contactEmail: `other-${tag}@it.test` })
    .returning();
  const owner = await makeUser("owner");
  const assistant = await makeUser("assistant");
  const a = await makeUser("clienta");
  const b = await makeUser("clientb");
  const outsider = await makeUser("outsider");
  await db.insert(studioMembers).values([
    { studioId: studio.id, userId: owner.id, role: "owner" },
    { studioId: studio.id, userId: assistant.id, role: "assistant" },
    { studioId: other.id, userId: outsider.id, role: "owner" },
  ]);
  const [ca] = await db.insert(studioClients).values({ studioId: studio.id, userId: a.id, displayName: "Client A" }).returning();
  const [cb] = await db.insert(studioClients).values({ studioId: studio.id, userId: b.id, displayName: "Client B" }).returning();
  const [co] = await db.insert(studioClients).values({ studioId: other.id, userId: a.id, displayName: "Client A" }).returning();
  const base = { garment: "mittens" as const, currency: "GBP", title: "Test mittens" };
  const [cA] = await db.insert(commissions).values({ ...base, studioId: studio.id, clientId: ca.id, number: 1 }).returning();
  const [cB] = await db.insert(commissions).values({ ...base, studioId: studio.id, clientId: cb.id, number: 2 }).returning();
  const [cO] = await db.insert(commissions).values({ ...base, studioId: other.id, clientId: co.id, number: 1 }).returning();
  return {
    studioId: studio.id,
    otherStudioId: other.id,
    owner,
    assistant,
    clientA: { ...a, clientId: ca.id },
    clientB: { ...b, clientId: cb.id },
    outsider,
    commissionA: cA.id,
    commissionB: cB.id,
    otherCommission: cO.id,
    actor: async (userId) => (await loadActor(userId))!,
  };
}
