// Every route handler and every server action, driven with generated and hostile input as the
// signed-in owner, an assistant, a client and signed out: no answer 500 (no "on our side" error
// state, nothing thrown but a redirect), and a refused call leaves the studio's rows as they were.
// Routes are found by walking app/api for route.ts, actions by looking for "use server" modules, so
// a new one is covered without touching this file. Runs per target are fixed (FUZZ_RUNS, seeded).
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test, vi } from "vitest";
import { z } from "zod";
import { db } from "@/db";
import { commissions, yarnLots, yarns } from "@/db/schema";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { createDesign } from "@/lib/server/designs";
import { startProduction, startTimer } from "@/lib/server/production";
import { saveQuoteDraft } from "@/lib/server/quotes";
import { HOSTILE_VALUES, inputsFor, plantEach, toFormData, validBases, type Pools } from "./fuzz-helpers";
import { BASE, makeWorld, signIn, type Jar, type World } from "./helpers";
import { requestFields } from "@/lib/schemas/request";

// Server actions read the request through next/headers; here it is the caller of the moment.
const ctx = vi.hoisted(() => {
  // A configured webhook secret, so the webhook route checks signatures instead of answering 503.
  process.env.STRIPE_WEBHOOK_SECRET ??= "whsec_fuzz_0123456789";
  return { headers: new Headers(), cookies: new Map<string, string>() };
});
vi.mock("next/headers", () => ({
  headers: async () => ctx.headers,
  cookies: async () => ({
    get: (name: string) => (ctx.cookies.has(name) ? { name, value: ctx.cookies.get(name)! } : undefined),
    getAll: () => [...ctx.cookies].map(([name, value]) => ({ name, value })),
    has: (name: string) => ctx.cookies.has(name),
    set: (name: string | { name: string; value: string }, value?: string) => {
      if (typeof name === "string") ctx.cookies.set(name, value ?? "");
      else ctx.cookies.set(name.name, name.value);
    },
    delete: (name: string) => ctx.cookies.delete(name),
  }),
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined, revalidateTag: () => undefined }));

const ROOT = process.cwd();
const RUNS = Number(process.env.FUZZ_RUNS ?? 3);
const SEED = Number(process.env.FUZZ_SEED ?? 20261203);
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function walk(dir: string, keep: (file: string) => boolean, out: string[] = []): string[] {
  for (const name of readdirSync(dir)) {
    const full = path.join(dir, name);
    if (name === "node_modules" || name.startsWith(".")) continue;
    if (statSync(full).isDirectory()) walk(full, keep, out);
    else if (keep(full)) out.push(full);
  }
  return out.sort();
}

const routeFiles = walk(path.join(ROOT, "app/api"), (f) => path.basename(f) === "route.ts");
const actionFiles = [...walk(path.join(ROOT, "app"), (f) => f.endsWith(".ts")), ...walk(path.join(ROOT, "components"), (f) => f.endsWith(".ts"))].filter((f) =>
  /^\s*(\/\/[^\n]*\n\s*)*["']use server["']/.test(readFileSync(f, "utf8")),
);

type Who = "owner" | "assistant" | "client" | "signed-out";
const WHO: Who[] = ["owner", "assistant", "client", "signed-out"];

interface Finding {
  target: string;
  who: Who;
  input: string;
  problem: string;
}

let world: World;
let slug: string;
const jars = new Map<Who, Jar | null>();
const draftCookies = new Map<Who, Map<string, string>>();
let pools: Pools;
const findings: Finding[] = [];
let calls = 0;
let refused = 0;
const errorLogs: string[] = [];

// Row counts of every table that belongs to the test studio (found by its studio_id or commission_id column).
let countSql: ReturnType<typeof sql>;
let snapMs = 0;
let callMs = 0;
async function snapshot(): Promise<string> {
  const t = performance.now();
  const r = await db.execute(countSql);
  snapMs += performance.now() - t;
  return JSON.stringify(r.rows[0]);
}
let rechecked = 0;

const show = (v: unknown) => {
  const s = typeof v === "string" ? v : (JSON.stringify(v, (_k, x) => (x instanceof FormData ? Object.fromEntries([...x.entries()].map(([k, y]) => [k, String(y)])) : x)) ?? String(v));
  return s.length > 160 ? `${s.slice(0, 160)}…(${s.length})` : s;
};

// Things of each kind in the test studio, so generated ids sometimes name a real row and calls go deeper.
const things: Record<string, string[]> = {};
const KINDS: [RegExp, string][] = [
  [/^parentVersionId$|^versionId$/, "version"],
  [/^commission/, "commission"],
  [/^piece/, "piece"],
  [/^yarn/, "yarn"],
  [/^design/, "design"],
  [/^quote/, "quote"],
  [/^proof/, "proof"],
  [/^upload/, "upload"],
  [/^studio/, "studio"],
  [/^(timer|entry)/, "entry"],
];
const kindOf = (name: string) => KINDS.find(([re]) => re.test(name))?.[1] ?? "";
const SEGMENT_KIND: Record<string, string> = { commissions: "commission", designs: "design", yarns: "yarn", pieces: "piece", timers: "entry", entries: "entry", quotes: "quote", uploads: "upload", photos: "upload", documents: "document" };

async function makeThings() {
  const owner = await world.actor(world.owner.id);
  const [y] = await db.insert(yarns).values({ studioId: world.studioId, name: "Fuzz 4-ply", colourName: "Loch blue", hex: "#2E5A7A", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: 850 }).returning();
  await db.insert(yarnLots).values({ yarnId: y.id, lotCode: "L1", stockSkeins: 10 });
  const [c] = await db
    .insert(commissions)
    .values({ studioId: world.studioId, clientId: world.clientA.clientId, number: 500, title: "Fuzz mittens", garment: "mittens", currency: "GBP", state: "proof_approved" })
    .returning();
  const { pieces } = await startProduction(owner, c.id, "pair");
  const entry = await startTimer(owner, pieces[0].id, "knitting");
  const quote = await saveQuoteDraft(owner, world.commissionA, quoteDraftSchema.parse({ pieces: [{ label: "Left mitten", plainStitches: 1800 }], materials: [{ yarnId: y.id, skeins: 2 }] }));
  const { design, version } = await createDesign(owner, {
    commissionId: world.commissionA,
    title: "Fuzz design",
    charts: [{ area: "back-of-hand", label: "Back of hand", chart: { version: 1, width: 4, height: 2, gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 }, palette: [{ key: "A", name: "Oat", hex: "#efe6d2" }, { key: "B", name: "Red", hex: "#9E2B25" }], rows: ["AABB", "ABAB"] } }],
  });
  Object.assign(things, {
    commission: [world.commissionA, world.commissionB, c.id],
    piece: pieces.map((p) => p.id),
    yarn: [y.id],
    entry: [entry.id],
    quote: [quote.id],
    design: [design.id],
    version: [version.id],
    studio: [world.studioId],
  });
}

beforeAll(async () => {
  world = await makeWorld();
  const [s] = (await db.execute(sql`select slug from studios where id = ${world.studioId}`)).rows as { slug: string }[];
  slug = s.slug;
  jars.set("owner", await signIn(world.owner.email));
  jars.set("assistant", await signIn(world.assistant.email));
  jars.set("client", await signIn(world.clientA.email));
  jars.set("signed-out", null);
  for (const w of WHO) draftCookies.set(w, new Map());
  await makeThings();
  pools = {
    ids: [world.commissionA, world.commissionB, world.otherCommission, world.studioId, ...Object.values(things).flat()],
    byName: (name) => things[kindOf(name)],
  };

  const cols = (await db.execute(sql`
    select table_name, bool_or(column_name = 'studio_id') as by_studio
    from information_schema.columns
    where table_schema = 'public' and column_name in ('studio_id', 'commission_id')
    group by table_name order by table_name`)).rows as { table_name: string; by_studio: boolean }[];
  const parts = cols.map((c) =>
    c.by_studio
      ? sql`(select count(*) from ${sql.identifier(c.table_name)} where studio_id = ${world.studioId}) as ${sql.identifier(c.table_name)}`
      : sql`(select count(*) from ${sql.identifier(c.table_name)} where commission_id in (select id from commissions where studio_id = ${world.studioId})) as ${sql.identifier(c.table_name)}`,
  );
  countSql = sql`select ${sql.join(parts, sql`, `)}`;
  expect(cols.length).toBeGreaterThan(10);

  const original = console.error;
  vi.spyOn(console, "error").mockImplementation((...args: unknown[]) => {
    errorLogs.push(args.map((a) => (a instanceof Error ? a.message : String(a))).join(" ").slice(0, 300));
    void original;
  });
});

afterAll(() => {
  vi.restoreAllMocks();
  console.log(`fuzz: ${calls} calls (${refused} refused) over ${routeFiles.length} route files and ${actionFiles.length} action modules, ${RUNS} generated inputs per target and caller, seed ${SEED}; ${Math.round(callMs)} ms in calls, ${Math.round(snapMs)} ms counting rows, ${rechecked} refused calls run again alone`);
});

function diff(before: string, after: string): string {
  const a = JSON.parse(before) as Record<string, string>;
  const b = JSON.parse(after) as Record<string, string>;
  return Object.keys(b).filter((k) => a[k] !== b[k]).map((k) => `${k} ${a[k]} → ${b[k]}`).join(", ");
}

type Outcome = { refused: boolean; problem?: string };
interface Case {
  input: unknown;
  call: () => Promise<Outcome>;
}

async function runOnce(c: Case): Promise<Outcome> {
  const t = performance.now();
  try {
    return await c.call();
  } catch (err) {
    return { refused: true, problem: `threw: ${err instanceof Error ? `${err.name}: ${err.message}` : String(err)}` };
  } finally {
    callMs += performance.now() - t;
  }
}

/**
 * The calls of one caller to one target: each must answer below 500. The studio's rows are counted
 * before and after the batch; only when they changed is each refused call run again alone, between
 * two counts, to name the one that wrote (counting around every call costs more than the calls).
 */
async function checkBatch(target: string, who: Who, cases: Case[]) {
  const before = await snapshot();
  const refusedCases: Case[] = [];
  for (const c of cases) {
    calls++;
    const o = await runOnce(c);
    if (o.problem) findings.push({ target, who, input: show(c.input), problem: o.problem });
    if (o.refused) {
      refused++;
      refusedCases.push(c);
    }
  }
  if (!refusedCases.length || (await snapshot()) === before) return;
  for (const c of refusedCases) {
    const b = await snapshot();
    const o = await runOnce(c);
    if (!o.refused) continue;
    rechecked++;
    const a = await snapshot();
    if (a !== b) findings.push({ target, who, input: show(c.input), problem: `refused, yet rows changed: ${diff(b, a)}` });
  }
}

// ---- route handlers ----------------------------------------------------------------------------

type Handler = ((req: Request, c: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>) & {
  spec?: { params?: z.ZodType; body?: z.ZodType; query?: z.ZodType };
};

const AUTH_PATHS = ["sign-in/email", "sign-up/email", "sign-in/magic-link", "request-password-reset", "reset-password", "get-session", "verify-email", "magic-link/verify", "update-user", "sign-out"];
const authBody = z.object({
  email: z.string().email().optional(),
  password: z.string().optional(),
  name: z.string().optional(),
  callbackURL: z.string().optional(),
  newUserCallbackURL: z.string().optional(),
  errorCallbackURL: z.string().optional(),
  redirectTo: z.string().optional(),
  token: z.string().optional(),
  newPassword: z.string().optional(),
});

const HOSTILE_PARAMS = ["2026-99-99", "\u0000", "\ud800", "not-an-id", "1e400", "00000000-0000-4000-8000-000000000000"];
/** A param value: a real row of the kind the route names (most of the time), else an id that is not, or a hostile string. */
const paramValue = (rel: string, name: string, i: number): string => {
  if (name === "slug") return [slug, slug, "no-such-studio", "\u0000", "x\ud800", "a".repeat(300)][i % 6];
  const segs = rel.split("/");
  const kind = name === "versionId" ? "version" : SEGMENT_KIND[segs[segs.indexOf(`[${name}]`) - 1] ?? ""];
  const real = things[kind] ?? [];
  const pool = [...real, ...real, world.otherCommission, ...HOSTILE_PARAMS];
  return pool[i % pool.length];
};

const bigJson = `{"a":"${"x".repeat(1_100_000)}"}`;
const deepText = `${"[".repeat(100_000)}${"]".repeat(100_000)}`;
/** Raw bodies every writing route must refuse cleanly. */
const RAW_BODIES: { label: string; body: () => BodyInit; type?: string }[] = [
  { label: "over 1 MB", body: () => bigJson, type: "application/json" },
  {
    label: "over 1 MB streamed without a length",
    body: () => {
      let sent = 0;
      return new ReadableStream({
        pull(c) {
          if (sent >= 2_000_000) return c.close();
          sent += 64 * 1024;
          c.enqueue(new TextEncoder().encode(sent === 64 * 1024 ? `{"a":"${"x".repeat(64 * 1024 - 6)}` : "x".repeat(64 * 1024)));
        },
      });
    },
    type: "application/json",
  },
  { label: "text/plain", body: () => '{"body":"hello"}', type: "text/plain" },
  { label: "not JSON", body: () => "{", type: "application/json" },
  { label: "empty", body: () => "", type: "application/json" },
  { label: "bad UTF-8", body: () => new Uint8Array([0x7b, 0xff, 0xfe, 0x7d]), type: "application/json" },
  { label: "NUL escape", body: () => '{"body":"\\u0000","note":"\\ud800"}', type: "application/json" },
  { label: "100,000 deep", body: () => deepText, type: "application/json" },
  { label: "null", body: () => "null", type: "application/json" },
  { label: "number", body: () => "1e400", type: "application/json" },
  { label: "array", body: () => "[1,2,3]", type: "application/json" },
];

function urlFor(file: string, params: Record<string, string>, query: Record<string, string>): string {
  const rel = path.relative(path.join(ROOT, "app"), path.dirname(file)).split(path.sep);
  const segs = rel.map((seg) => {
    const m = /^\[(\.\.\.)?(\w+)\]$/.exec(seg);
    if (!m) return seg;
    try {
      return encodeURIComponent(params[m[2]] ?? "x");
    } catch {
      return "x"; // a lone surrogate cannot be in a URL; the handler still gets it as a param
    }
  });
  const qs = new URLSearchParams(query).toString();
  return `${BASE}/${segs.join("/")}${qs ? `?${qs}` : ""}`;
}

function stringsOf(v: unknown): Record<string, string> {
  if (v === null || typeof v !== "object" || Array.isArray(v)) return { q: typeof v === "string" ? v : JSON.stringify(v) ?? "" };
  return Object.fromEntries(Object.entries(v).filter(([, x]) => x !== undefined).map(([k, x]) => [k, typeof x === "string" ? x : JSON.stringify(x) ?? ""]));
}

async function callRoute(handler: Handler, method: string, url: string, params: Record<string, string | string[]>, jar: Jar | null, body?: { body: BodyInit; type?: string }) {
  const headers = new Headers({ origin: BASE });
  if (jar?.cookie) headers.set("cookie", jar.cookie);
  if (body?.type) headers.set("content-type", body.type);
  const init: RequestInit & { duplex?: "half" } = { method, headers };
  if (body && method !== "GET") {
    init.body = body.body;
    if (body.body instanceof ReadableStream) init.duplex = "half";
  }
  const res = await handler(new Request(url, init), { params: Promise.resolve(params) });
  if (process.env.FUZZ_DEBUG && url.includes(process.env.FUZZ_DEBUG)) console.log(method, url.slice(0, 120), res.status, typeof body?.body === "string" ? body.body.slice(0, 200) : "", (await res.clone().text()).slice(0, 200));
  const problem = res.status >= 500 ? `answered ${res.status}: ${(await res.text()).slice(0, 200)}` : undefined;
  return { refused: res.status >= 400, problem, status: res.status };
}

describe("every route handler answers hostile input below 500 and writes nothing when it refuses", () => {
  test.each(routeFiles.map((f) => [path.relative(ROOT, f)]))("%s", async (rel) => {
    const file = path.join(ROOT, rel);
    const mod = (await import(/* @vite-ignore */ file)) as Record<string, unknown>;
    const names = [...rel.matchAll(/\[(?:\.\.\.)?(\w+)\]/g)].map((m) => m[1]);
    const isAuth = rel.includes("[...all]");
    for (const method of METHODS) {
      const handler = mod[method] as Handler | undefined;
      if (typeof handler !== "function") continue;
      const spec = handler.spec ?? {};
      const writes = method !== "GET";
      for (const who of WHO) {
        const jar = jars.get(who) ?? null;
        // The owner reaches deepest; route() answers a signed-out caller 401 before reading anything.
        // A read without a query schema varies only by its params (some render PDFs, which is slow).
        const plainRead = !writes && handler.spec && !spec.query;
        const runs: number = who === "owner" ? (plainRead ? 2 : RUNS) : !handler.spec ? RUNS : 1;
        const bodies: unknown[] = writes ? inputsFor(isAuth ? authBody : spec.body, pools, runs, SEED) : [];
        const queries: unknown[] = inputsFor(spec.query ?? z.object({ as: z.string(), from: z.string(), size: z.string() }).partial(), pools, runs, SEED + 1);
        const generatedCount = Math.max(bodies.length, queries.length, runs);
        while (bodies.length < queries.length) bodies.push(bodies[0]);
        while (queries.length < bodies.length) queries.push(queries[0]);
        if (who === "owner") {
          // A valid input with one bad value at each place in turn, so no other field hides it.
          const bodyBases = writes && spec.body ? validBases(spec.body, pools, SEED) : [];
          const queryBases = spec.query ? validBases(spec.query, pools, SEED, (v) => stringsOf(v)) : [];
          for (const b of bodyBases.flatMap(plantEach)) {
            bodies.push(b);
            queries.push(queryBases[0]);
          }
          for (const q of queryBases.flatMap(plantEach)) {
            bodies.push(bodyBases[0]);
            queries.push(q);
          }
        }
        const cases: Case[] = [];
        for (let i = 0; i < Math.max(bodies.length, queries.length, runs); i++) {
          // Planted inputs (after the generated ones) go to a real row, so only the planted value is wrong.
          const p = i < generatedCount ? i + (who === "owner" ? 0 : 3) : 0;
          const params: Record<string, string> = Object.fromEntries(names.map((n, j) => [n, paramValue(rel, n, p + j)]));
          const authPath = AUTH_PATHS[i % AUTH_PATHS.length];
          if (isAuth && authPath === "sign-out" && jar) continue; // keep the session for the other targets
          const query = stringsOf(queries[i]);
          const url = isAuth ? `${BASE}/api/auth/${authPath}?${new URLSearchParams(query)}` : urlFor(file, params, query);
          const body = writes ? { body: JSON.stringify(bodies[i]) ?? "null", type: "application/json" } : undefined;
          cases.push({ input: { params, query, body: bodies[i] }, call: () => callRoute(handler, method, url, isAuth ? { all: authPath.split("/") } : params, jar, body) });
        }
        // route() answers a signed-out caller before reading the body; the other handlers read it.
        await checkBatch(`${method} ${rel}`, who, cases);
        // Reading the body is the same for every signed-in caller: the owner tries it for them.
        if (!writes || who === "assistant" || who === "client" || (who === "signed-out" && handler.spec)) continue;
        for (const raw of RAW_BODIES) {
          const params = Object.fromEntries(names.map((n) => [n, paramValue(rel, n, 0)]));
          const url = isAuth ? `${BASE}/api/auth/sign-up/email` : urlFor(file, params, {});
          const r = await callRoute(handler, method, url, isAuth ? { all: ["sign-up", "email"] } : params, jar, { body: raw.body(), type: raw.type });
          calls++;
          if (r.problem) findings.push({ target: `${method} ${rel}`, who, input: raw.label, problem: r.problem });
          if (raw.label.startsWith("over 1 MB") && handler.spec?.body && who !== "signed-out" && r.status !== 413) {
            findings.push({ target: `${method} ${rel}`, who, input: raw.label, problem: `answered ${r.status}, not 413` });
          }
        }
      }
    }
  });
});

// ---- server actions ----------------------------------------------------------------------------

type Action = ((...args: unknown[]) => Promise<unknown>) & { schema?: z.ZodType };

function isNextControlFlow(err: unknown): boolean {
  const digest = (err as { digest?: unknown } | null)?.digest;
  return typeof digest === "string" && (digest.startsWith("NEXT_REDIRECT") || digest.startsWith("NEXT_HTTP_ERROR_FALLBACK") || digest.startsWith("NEXT_NOT_FOUND"));
}

async function callAction(fn: Action, args: unknown[]) {
  try {
    const r = (await fn(...args)) as { status?: string; message?: string } | undefined;
    if (r && typeof r === "object" && r.status === "error") {
      return { refused: true, problem: /on our side/.test(r.message ?? "") ? `error state of a crash: ${r.message}` : undefined };
    }
    return { refused: false };
  } catch (err) {
    if (isNextControlFlow(err)) return { refused: false };
    return { refused: true, problem: `threw: ${err instanceof Error ? `${err.name}: ${err.message}` : String(err)}` };
  }
}

const idle = { status: "idle" };
/** Argument lists in the wrong shape, which a script can send to any action id. */
const wrongShapes = (): unknown[][] => [
  [],
  [null, null],
  [42, new FormData()],
  [idle, { commissionId: world.commissionA }],
  [idle, new FormData(), "extra"],
  [idle, toFormData({ commissionId: world.commissionA, "\u0000": "x" })],
  [slug, null],
  [slug, HOSTILE_VALUES[HOSTILE_VALUES.length - 2]],
  [{ toString: () => slug }, {}],
  ["\u0000", {}, "extra"],
];

describe("every server action answers hostile input with an error state, never a throw", () => {
  test.each(actionFiles.map((f) => [path.relative(ROOT, f)]))("%s", async (rel) => {
    const mod = (await import(/* @vite-ignore */ path.join(ROOT, rel))) as Record<string, unknown>;
    const exported = Object.entries(mod).filter(([, v]) => typeof v === "function") as [string, Action][];
    expect(exported.length).toBeGreaterThan(0);
    for (const [name, fn] of exported) {
      for (const who of WHO) {
        const jar = jars.get(who) ?? null;
        ctx.headers = new Headers({ origin: BASE, ...(jar?.cookie ? { cookie: jar.cookie } : {}) });
        ctx.cookies = draftCookies.get(who)!;
        // The owner reaches deepest; the client acts on the portal's actions; the others mostly meet the permission checks.
        const runs = who === "owner" ? RUNS : who === "client" ? Math.ceil(RUNS / 2) : 1;
        const asForm = (v: unknown) => Object.fromEntries(toFormData(v).entries());
        const bases = who === "owner" ? validBases(fn.schema ?? requestFields, pools, SEED, fn.schema ? asForm : undefined) : [];
        const values = [...inputsFor(fn.schema ?? requestFields, pools, runs, SEED), ...bases.flatMap(plantEach)];
        const generated = values.map((v) => (fn.schema ? [idle, toFormData(v)] : [slug, v]));
        // The shape is checked before the session, so one caller tries the wrong shapes for all.
        const shapes = who === "owner" ? wrongShapes() : [];
        await checkBatch(`${name} (${rel})`, who, [...generated, ...shapes].map((args) => ({ input: args, call: () => callAction(fn, args) })));
      }
    }
  });
});

describe("the findings", () => {
  test("no call answered 500, threw, crashed into an error state or wrote when refused", () => {
    const inputAtDb = errorLogs.filter((l) => l.includes("input reached the database"));
    // One line per target and kind of problem, with the first input that showed it.
    const grouped = new Map<string, string>();
    for (const f of findings) {
      const key = `${f.target} | ${f.problem.slice(0, 120)}`;
      if (!grouped.has(key)) grouped.set(key, `${f.who}: ${f.input}`);
    }
    expect([...grouped].map(([k, v]) => `${k} | ${v}`)).toEqual([]);
    expect(inputAtDb).toEqual([]);
    expect(calls).toBeGreaterThan(800);
  });
});
