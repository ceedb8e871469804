// Hostile HTTP probe: `npx tsx scripts/bench/hostile.ts --url http://127.0.0.1:3301 [--max 20000] [--seconds 480]`.
// Starts nothing: it drives a RUNNING production build with the demo data, on a loopback address only,
// bounded in requests (--max) and time (--seconds). Signed in as the demo owner, assistant and two
// clients, and signed out, it sends every page hostile search params and ids, every API route every
// method with hostile bodies (wrong types, NUL, lone surrogates, impossible dates, deep nesting, wrong
// content types, bodies over the limits with and without a length, chunked), server actions over
// HTTP (ids from the build's server-reference manifest) with garbage bodies, unknown ids and foreign
// origins, other people's ids (a 2xx whose body names that id counts as a leak), and bursts of 50
// parallel requests at accepting a quote and sending one while /api/health must answer.
// It prints counts by status, every 5xx with its request, leaks and hangs; it never asserts.
import http from "node:http";
import { existsSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}
const base = new URL(arg("url", "http://127.0.0.1:3000"));
if (!["127.0.0.1", "localhost", "[::1]"].includes(base.hostname)) {
  console.error("hostile.ts drives loopback addresses only (127.0.0.1, localhost, [::1])");
  process.exit(2);
}
const MAX = Number(arg("max", "20000"));
const SECONDS = Number(arg("seconds", "480"));
const CONCURRENCY = Number(arg("concurrency", "6"));
const DIST = arg("dist", process.env.NEXT_DIST_DIR ?? ".next-probe");
const PASSWORD = "darnwell-demo";
/** --dump FILE: the requests answered 5xx, as JSON lines (no cookies), for scripts/bench/hostile-replay.ts */
const DUMP = arg("dump", "");
const dumped: string[] = [];
const ORIGIN = base.origin;
const deadline = Date.now() + SECONDS * 1000;
const agent = new http.Agent({ keepAlive: true, maxSockets: 80 });

interface Req {
  method: string;
  path: string;
  headers?: Record<string, string>;
  body?: string | Buffer;
  chunked?: boolean;
  who?: string;
  label?: string;
  /** an id that must not come back in a 2xx body for this caller */
  foreignId?: string;
}
interface Res {
  status: number | "timeout" | "error";
  body: string;
  headers: http.IncomingHttpHeaders;
}

const counts = new Map<string, number>();
const fives: string[] = [];
const leaks: string[] = [];
const hangs: string[] = [];
let sent = 0;
const cookies: Record<string, string> = { out: "" };

function describe(r: Req): string {
  const ct = r.headers?.["content-type"] ?? "";
  const act = r.headers?.["next-action"] ? ` action=${r.headers["next-action"].slice(0, 16)}` : "";
  const body = r.body === undefined ? "" : ` body(${r.body.length}${r.chunked ? ",chunked" : ""})=${JSON.stringify(String(r.body).slice(0, 90))}`;
  return `[${r.who ?? "out"}] ${r.method} ${r.path.slice(0, 160)}${ct ? ` ct=${ct.slice(0, 40)}` : ""}${act}${body}${r.label ? ` (${r.label})` : ""}`;
}

function send(r: Req, timeoutMs = 30_000): Promise<Res> {
  sent++;
  return new Promise((resolve) => {
    const headers: Record<string, string> = { ...(r.headers ?? {}) };
    const c = cookies[r.who ?? "out"];
    if (c) headers.cookie = c;
    if (r.body !== undefined && !r.chunked) headers["content-length"] = String(Buffer.byteLength(r.body));
    const req = http.request(new URL(r.path, base), { method: r.method, headers, agent }, (res) => {
      const chunks: Buffer[] = [];
      let size = 0;
      res.on("data", (d: Buffer) => {
        if (size < 400_000) chunks.push(d);
        size += d.length;
      });
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks).toString("utf8"), headers: res.headers }));
      res.on("error", () => resolve({ status: "error", body: "", headers: {} }));
    });
    req.setTimeout(timeoutMs, () => {
      req.destroy();
      resolve({ status: "timeout", body: "", headers: {} });
    });
    req.on("error", (e) => resolve({ status: "error", body: String(e), headers: {} }));
    if (r.body !== undefined) {
      const buf = Buffer.from(r.body);
      if (r.chunked) for (let i = 0; i < buf.length; i += 65536) req.write(buf.subarray(i, i + 65536));
      else req.write(buf);
    }
    req.end();
  });
}

function record(r: Req, res: Res) {
  const key = String(res.status);
  counts.set(key, (counts.get(key) ?? 0) + 1);
  if (res.status === "timeout") hangs.push(describe(r));
  else if (res.status === "error") {
    // A connection the server closed on an over-limit body is an answer, not a crash; keep a note.
    counts.set("error", counts.get("error") ?? 0);
  } else if (res.status >= 500) {
    fives.push(`${res.status} ${describe(r)} → ${res.body.replace(/\s+/g, " ").slice(0, 160)}`);
    if (DUMP) dumped.push(JSON.stringify({ status: res.status, method: r.method, path: r.path, headers: r.headers ?? {}, chunked: !!r.chunked, body: r.body === undefined ? null : String(r.body) }));
  } else if (r.foreignId && res.status < 300 && res.body.includes(r.foreignId)) leaks.push(`${res.status} ${describe(r)}`);
}

// A bounded pool: runs the queue with CONCURRENCY requests in flight, stops at MAX or the deadline.
async function run(queue: Req[]) {
  let i = 0;
  const worker = async () => {
    while (i < queue.length && sent < MAX && Date.now() < deadline) {
      const r = queue[i++];
      record(r, await send(r));
    }
  };
  await Promise.all(Array.from({ length: CONCURRENCY }, worker));
}

async function signIn(who: string, email: string) {
  const res = await fetch(new URL("/api/auth/sign-in/email", base), {
    method: "POST",
    headers: { "content-type": "application/json", origin: ORIGIN },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status} ${await res.text()}`);
  cookies[who] = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}

const UUID = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g;
async function idsSeenBy(who: string, paths: string[]): Promise<Set<string>> {
  const out = new Set<string>();
  for (const p of paths) {
    const res = await send({ method: "GET", path: p, who });
    for (const m of res.body.matchAll(UUID)) out.add(m[0]);
  }
  return out;
}

// ---- hostile values ----
const HOSTILE_PARAMS = [
  "a=1&a=2&a=3",
  "from=2026-99-99&to=2026-02-30&date=0000-00-00&week=2026-W99&month=2026-13",
  "q=%00&name=a%00b&status=%00",
  "q=%ED%A0%80&status=%ED%A0%80&next=%ED%A0%80",
  "page=1e400&limit=99999999999999999999999&offset=-1&year=NaN&size=Infinity",
  "next=//evil.test&callbackURL=https://evil.test",
  "next=/%09/evil.test&redirect=/%0d%0aSet-Cookie:x=1",
  "next=%0a&token=%0d%0a&error=%3Cscript%3E",
  "next=/\\evil.test&commission=../../etc/passwd",
  "commission=%ED%B0%80&version=-1&proof=1e309",
  "status[]=a&status[x]=b&__proto__[x]=1&constructor=1",
  "checkout=success&session_id=%00&tab=%FF%FE&view=" + "x".repeat(4000),
  "%=%&&=&==",
];
const deep = (n: number) => "[".repeat(n) + "]".repeat(n);
const HOSTILE_JSON: string[] = [
  "",
  "null",
  "[]",
  "\"str\"",
  "{}",
  "1e400",
  "{",
  "{\"a\":",
  deep(5000),
  `{"a":${deep(3000)}}`,
  JSON.stringify({ name: "a\u0000b", body: "x\u0000", notes: "\u0000" }),
  '{"name":"\\ud800","body":"\\udc00x","title":"\\ud800"}',
  JSON.stringify({ date: "2026-99-99", dueDate: "2026-02-30", from: "2026-13-01", to: "0000-00-00", startedAt: "2026-99-99T99:99:99Z" }),
  JSON.stringify({ amount: 1e308, price: -1e308, priceMinor: 9007199254740993, hours: -5, minutes: 1e20, quantity: "12", count: [] }),
  JSON.stringify({ id: "not-a-uuid", commissionId: "00000000-0000-0000-0000-000000000000", pieceId: "%00", versionId: {} }),
  JSON.stringify({ __proto__: { admin: true }, constructor: { prototype: { x: 1 } } }),
  JSON.stringify({ body: "x".repeat(300_000) }),
  JSON.stringify(Array.from({ length: 20000 }, (_, i) => i)),
  JSON.stringify({ stage: "shipped", status: "paid", role: "owner", studioId: "00000000-0000-0000-0000-000000000000" }),
  JSON.stringify({ lines: [{ kind: "x", amount: "NaN" }], items: null, chart: { cells: "x" } }),
];
const BIG = "x".repeat(1_500_000);
const BIG_JSON = JSON.stringify({ body: "x".repeat(11_500_000) });
const GARBAGE_IDS = ["not-a-uuid", "%00", "%ED%A0%80", "99999999999999999999999999", "00000000-0000-0000-0000-000000000000", "..%2F..%2Fapi%2Fhealth", "a".repeat(3000)];

function withId(template: string, id: string, slug = "hollin-knitworks"): string {
  return template.replace(/\[slug\]/g, slug).replace(/\[[a-zA-Z]+\]/g, id);
}

function listFiles(dir: string, name: string, out: string[] = []): string[] {
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    if (e.isDirectory()) listFiles(p, name, out);
    else if (e.name === name) out.push(p);
  }
  return out;
}
function templateOf(file: string): string {
  return (
    "/" +
    file
      .replace(/^app\//, "")
      .replace(/\/?(page\.tsx|route\.ts)$/, "")
      .split("/")
      .filter((s) => !/^\(.*\)$/.test(s))
      .map((s) => (s.startsWith("[...") ? "x/y" : s))
      .join("/")
  ).replace(/\/$/, "") || "/";
}

async function main() {
  const started = Date.now();
  const health0 = await send({ method: "GET", path: "/api/health" });
  if (health0.status !== 200) throw new Error(`/api/health answered ${health0.status}`);
  // Signing in again after each action's requests: one of them is sign-out, which ends the session.
  const signInAll = async () => {
    await signIn("owner", "maren@hollin.test");
    await signIn("assistant", "tobias@hollin.test");
    await signIn("priya", "priya@example.test");
    await signIn("elias", "elias@example.test");
  };
  await signInAll();
  const who = ["owner", "assistant", "priya", "elias", "out"];

  // ---- whose ids are whose ----
  const studioLists = ["/api/commissions", "/api/designs", "/api/yarns", "/api/production/timers", "/api/payments", "/api/production/log"];
  const ownerIds = await idsSeenBy("owner", studioLists);
  const priyaIds = await idsSeenBy("priya", ["/api/commissions"]);
  const eliasIds = await idsSeenBy("elias", ["/api/commissions"]);
  // Dig one level into each client's commissions for quotes, documents and uploads.
  for (const [whoId, set] of [["priya", priyaIds], ["elias", eliasIds]] as const)
    for (const id of [...set].slice(0, 6)) for (const m of (await send({ method: "GET", path: `/api/commissions/${id}`, who: whoId })).body.matchAll(UUID)) set.add(m[0]);
  const onlyPriya = [...priyaIds].filter((i) => !eliasIds.has(i));
  const onlyElias = [...eliasIds].filter((i) => !priyaIds.has(i));
  const studioOnly = [...ownerIds].filter((i) => !priyaIds.has(i) && !eliasIds.has(i)).slice(0, 12);
  console.log(`ids: owner ${ownerIds.size}, priya ${priyaIds.size} (${onlyPriya.length} hers only), elias ${eliasIds.size} (${onlyElias.length} his only)`);

  const pages = listFiles("app", "page.tsx").map(templateOf).sort();
  const routes = listFiles("app", "route.ts").map((f) => ({ t: templateOf(f), methods: [...readFileSync(f, "utf8").matchAll(/export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)/g)].map((m) => m[1]) }));

  const queue: Req[] = [];
  const actionQueue: Req[] = [];
  const anyOwn = [...ownerIds].slice(0, 4);
  // ---- pages: own ids, garbage ids, hostile params, each account ----
  for (const p of pages) {
    const ids = p.includes("[") ? anyOwn.slice(0, 2) : [""];
    for (const w of who) {
      for (const id of ids) {
        const path = withId(p, id);
        queue.push({ method: "GET", path, who: w });
        for (const q of HOSTILE_PARAMS) queue.push({ method: "GET", path: `${path}?${q}`, who: w });
      }
      if (p.includes("[")) for (const id of GARBAGE_IDS) queue.push({ method: "GET", path: withId(p, id), who: w, label: "garbage id" });
    }
  }
  // ---- other people's resources, pages and API ----
  const crossTargets = [...pages, ...routes.map((r) => r.t)].filter((t) => t.includes("[id]") || t.includes("[proofId]"));
  const cross: [string, string[]][] = [
    ["elias", onlyPriya],
    ["priya", onlyElias],
    ["priya", studioOnly],
    ["elias", studioOnly],
    ["out", [...onlyPriya, ...studioOnly]],
  ];
  for (const [w, ids] of cross)
    for (const id of ids.slice(0, 14))
      for (const t of crossTargets) {
        queue.push({ method: "GET", path: withId(t, id), who: w, foreignId: id, label: "foreign id" });
      }
  // ---- API routes: every method, hostile bodies and content types ----
  const methods = ["GET", "POST", "PUT", "PATCH", "DELETE", "OPTIONS", "HEAD"];
  for (const r of routes) {
    const ids = r.t.includes("[") ? [anyOwn[0] ?? GARBAGE_IDS[4], ...GARBAGE_IDS.slice(0, 4)] : [""];
    for (const id of ids) {
      const path = withId(r.t, id);
      for (const m of methods) for (const w of ["owner", "priya", "out"]) queue.push({ method: m, path, who: w, headers: { origin: ORIGIN } });
      for (const m of r.methods.filter((x) => x !== "GET")) {
        for (const w of ["owner", "assistant", "priya", "out"]) {
          for (const body of HOSTILE_JSON) queue.push({ method: m, path, who: w, body, headers: { "content-type": "application/json", origin: ORIGIN } });
        }
        const json = HOSTILE_JSON[11];
        for (const ct of ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data; boundary=zz", "multipart/form-data", "application/json; charset=utf-16", "application/xml", ""])
          queue.push({ method: m, path, who: "owner", body: json, headers: { "content-type": ct, origin: ORIGIN } });
        queue.push({ method: m, path, who: "owner", body: "--zz\r\nContent-Disposition: form-data; name=\"file\"; filename=\"a.jpg\"\r\n\r\n\u0000garbage", headers: { "content-type": "multipart/form-data; boundary=zz", origin: ORIGIN } });
        queue.push({ method: m, path, who: "owner", body: BIG, headers: { "content-type": "application/json", origin: ORIGIN }, label: "1.5 MB with length" });
        queue.push({ method: m, path, who: "owner", body: BIG, chunked: true, headers: { "content-type": "application/json", origin: ORIGIN }, label: "1.5 MB chunked" });
        queue.push({ method: m, path, who: "owner", body: BIG_JSON, chunked: true, headers: { "content-type": "application/json", origin: ORIGIN }, label: "11.5 MB chunked" });
        queue.push({ method: m, path, who: "owner", body: "{}", headers: { "content-type": "application/json", origin: "https://evil.test" }, label: "foreign origin" });
        queue.push({ method: m, path, who: "owner", body: "{}", headers: { "content-type": "application/json", origin: "%%garbage" }, label: "garbage origin" });
      }
    }
  }
  // ---- server actions over HTTP ----
  const manifestPath = join(DIST, "server", "server-reference-manifest.json");
  const actions: { id: string; page: string }[] = [];
  if (existsSync(manifestPath)) {
    const manifest = JSON.parse(readFileSync(manifestPath, "utf8")) as { node?: Record<string, { workers?: Record<string, unknown> }> };
    for (const [id, entry] of Object.entries(manifest.node ?? {})) {
      const worker = Object.keys(entry.workers ?? {})[0] ?? "app/page";
      const page = withId(templateOf(worker.replace(/^app\//, "app/").replace(/\/page$/, "/page.tsx")), anyOwn[0] ?? "x");
      actions.push({ id, page });
    }
  } else console.log(`(no ${manifestPath}: server actions probed with unknown ids only)`);
  console.log(`pages ${pages.length}, routes ${routes.length}, actions ${actions.length}`);
  const unknownIds = ["0".repeat(42), "7f" + "a".repeat(40), "zzz", "x".repeat(2000), "%00", "00".repeat(21) + "\u00e9"];
  const actionBodies: { ct: string; body: string; label: string; chunked?: boolean }[] = [
    { ct: "text/plain;charset=UTF-8", body: "garbage{", label: "garbage text" },
    { ct: "text/plain;charset=UTF-8", body: "", label: "empty" },
    { ct: "text/plain;charset=UTF-8", body: "[]", label: "no args" },
    { ct: "text/plain;charset=UTF-8", body: "{}", label: "object root" },
    { ct: "text/plain;charset=UTF-8", body: '"x"', label: "string root" },
    { ct: "text/plain;charset=UTF-8", body: '["hollin-knitworks",{"name":"a\\u0000","from":"2026-99-99"}]', label: "wrong shape" },
    { ct: "text/plain;charset=UTF-8", body: '[null,"$K1"]', label: "form ref without form" },
    { ct: "text/plain;charset=UTF-8", body: '["$nxyz"]', label: "bad bigint" },
    { ct: "text/plain;charset=UTF-8", body: '["$@5"]', label: "missing chunk" },
    { ct: "text/plain;charset=UTF-8", body: '["$Q3","$W4","$h5","$i6"]', label: "outlined refs" },
    { ct: "text/plain;charset=UTF-8", body: '["$T"]', label: "temporary ref" },
    { ct: "text/plain;charset=UTF-8", body: '["$1:constructor:prototype"]', label: "path ref" },
    { ct: "text/plain;charset=UTF-8", body: deep(5000), label: "deep" },
    { ct: "text/plain;charset=UTF-8", body: JSON.stringify(Array.from({ length: 5000 }, () => 0)), label: "5000 args" },
    { ct: "text/plain;charset=UTF-8", body: '["\\ud800",{"x":"\\u0000"}]', label: "surrogates" },
    { ct: "application/json", body: "[null,{}]", label: "json type" },
    { ct: "multipart/form-data; boundary=zz", body: "garbage", label: "garbage multipart" },
    { ct: "multipart/form-data", body: "--zz\r\n", label: "no boundary" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="_1_quoteId"\r\n\r\nx\r\n--zz--\r\n', label: "multipart without root" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n{garbage\r\n--zz--\r\n', label: "multipart garbage root" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n"$K1"\r\n--zz--\r\n', label: "multipart non-array root" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n[null,"$K1"]\r\n--zz\r\nContent-Disposition: form-data; name="_1_quoteId"\r\n\r\n2026-99-99\x00\r\n--zz\r\nContent-Disposition: form-data; name="_1_name"\r\n\r\n\uD800x\r\n--zz--\r\n', label: "hostile form" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n["$2","$K1"]\r\n--zz\r\nContent-Disposition: form-data; name="2"\r\n\r\n{bad\r\n--zz--\r\n', label: "bad outlined part" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n["$@9"]\r\n--zz--\r\n', label: "multipart missing chunk" },
    { ct: "text/plain;charset=UTF-8", body: "[" + '"' + "x".repeat(1_200_000) + '"]', label: "1.2 MB chunked", chunked: true },
    { ct: "text/plain;charset=UTF-8", body: "[" + '"' + "x".repeat(1_200_000) + '"]', label: "1.2 MB with length" },
    { ct: "multipart/form-data; boundary=zz", body: '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n["' + "x".repeat(1_200_000) + '"]\r\n--zz--\r\n', label: "1.2 MB multipart chunked", chunked: true },
  ];
  for (const a of actions) {
    for (const b of actionBodies)
      for (const w of ["owner", "priya", "out"])
        actionQueue.push({ method: "POST", path: a.page, who: w, body: b.body, chunked: b.chunked, headers: { "content-type": b.ct, "next-action": a.id, origin: ORIGIN, accept: "text/x-component" }, label: b.label });
    actionQueue.push({ method: "POST", path: a.page, who: "owner", body: "[]", headers: { "content-type": "text/plain;charset=UTF-8", "next-action": a.id, origin: "https://evil.test" }, label: "foreign origin" });
    actionQueue.push({ method: "POST", path: a.page, who: "owner", body: "[]", headers: { "content-type": "text/plain;charset=UTF-8", "next-action": a.id, origin: "garbage" }, label: "garbage origin" });
    actionQueue.push({ method: "POST", path: a.page, who: "owner", body: "[]", headers: { "content-type": "text/plain;charset=UTF-8", "next-action": a.id, origin: "null" }, label: "null origin" });
    // No-JavaScript form posts (multipart, no Next-Action header)
    for (const body of [
      `--zz\r\nContent-Disposition: form-data; name="$ACTION_ID_${a.id}"\r\n\r\n\r\n--zz\r\nContent-Disposition: form-data; name="quoteId"\r\n\r\n\x00\r\n--zz--\r\n`,
      `--zz\r\nContent-Disposition: form-data; name="$ACTION_REF_1"\r\n\r\n\r\n--zz\r\nContent-Disposition: form-data; name="$ACTION_1:0"\r\n\r\n{garbage\r\n--zz--\r\n`,
      `--zz\r\nContent-Disposition: form-data; name="$ACTION_REF_1"\r\n\r\n\r\n--zz\r\nContent-Disposition: form-data; name="$ACTION_1:0"\r\n\r\n{"id":"${a.id}","bound":"$@1"}\r\n--zz\r\nContent-Disposition: form-data; name="$ACTION_1:1"\r\n\r\n{bad\r\n--zz--\r\n`,
      `--zz\r\nContent-Disposition: form-data; name="$ACTION_REF_1"\r\n\r\n\r\n--zz\r\nContent-Disposition: form-data; name="$ACTION_1:0"\r\n\r\n{"id":"${a.id}","bound":"$@1"}\r\n--zz\r\nContent-Disposition: form-data; name="$ACTION_1:1"\r\n\r\n[{"status":"idle"}]\r\n--zz\r\nContent-Disposition: form-data; name="$ACTION_KEY"\r\n\r\nk\r\n--zz--\r\n`,
      "garbage",
    ])
      for (const w of ["owner", "out"]) actionQueue.push({ method: "POST", path: a.page, who: w, body, headers: { "content-type": "multipart/form-data; boundary=zz", origin: ORIGIN }, label: "no-JS form" });
    actionQueue.push({ method: "POST", path: a.page, who: "owner", body: `--zz\r\nContent-Disposition: form-data; name="$ACTION_ID_${a.id}"\r\n\r\n${"x".repeat(1_300_000)}\r\n--zz--\r\n`, chunked: true, headers: { "content-type": "multipart/form-data; boundary=zz", origin: ORIGIN }, label: "no-JS form 1.3 MB chunked" });
  }
  for (const id of unknownIds)
    for (const p of ["/", "/studio", "/portal", "/sign-in", "/api/health"])
      for (const ct of ["text/plain;charset=UTF-8", "multipart/form-data; boundary=zz"])
        actionQueue.push({ method: "POST", path: p, who: "owner", body: ct.startsWith("text") ? "[]" : '--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n[]\r\n--zz--\r\n', headers: { "content-type": ct, "next-action": id, origin: ORIGIN }, label: "unknown action id" });
  // ---- auth endpoints: hostile shapes, unknown accounts only (no demo account gets locked) ----
  for (const body of HOSTILE_JSON.slice(0, 16))
    for (const p of ["/api/auth/sign-in/email", "/api/auth/sign-up/email", "/api/auth/forget-password", "/api/auth/request-password-reset", "/api/auth/reset-password"])
      queue.push({ method: "POST", path: p, body: body.replace(/"name"/, '"email"'), headers: { "content-type": "application/json", origin: ORIGIN } });
  for (const p of ["/api/auth/sign-in/email?callbackURL=//evil.test", "/api/auth/get-session", "/api/auth/%00", "/api/auth/reset-password/%ED%A0%80?callbackURL=%0a"])
    for (const w of who) queue.push({ method: "GET", path: p, who: w });

  console.log(`queued ${actionQueue.length} action requests, then ${queue.length} others (max ${MAX}, ${SECONDS} s)`);
  for (const a of actions) {
    await run(actionQueue.filter((r) => r.headers?.["next-action"] === a.id || r.body?.includes(a.id)));
    await signInAll();
  }
  await run(actionQueue.filter((r) => !actions.some((a) => r.headers?.["next-action"] === a.id || r.body?.includes(a.id))));

  // ---- bursts of 50 parallel, with /api/health answering ----
  async function burst(name: string, make: () => Req) {
    if (sent >= MAX || Date.now() > deadline) return;
    const healthStart = Date.now();
    const [results, health] = await Promise.all([
      Promise.all(Array.from({ length: 50 }, async () => { const r = make(); const res = await send(r); record(r, res); return res.status; })),
      (async () => { await new Promise((f) => setTimeout(f, 50)); const h = await send({ method: "GET", path: "/api/health" }, 15_000); return { s: h.status, ms: Date.now() - healthStart }; })(),
    ]);
    const by = new Map<string, number>();
    for (const s of results) by.set(String(s), (by.get(String(s)) ?? 0) + 1);
    const after = await send({ method: "GET", path: "/api/health" }, 15_000);
    console.log(`burst ${name}: ${[...by].map(([k, v]) => `${k}×${v}`).join(" ")}; /api/health during ${health.s}, after ${after.status}`);
    if (health.s !== 200 || after.status !== 200) hangs.push(`burst ${name}: /api/health ${health.s}/${after.status}`);
  }
  const acceptId = actions.find((a) => a.page.startsWith("/portal/commissions/") && a.page.split("/").length === 4)?.id;
  const quoteIds = [...priyaIds].slice(0, 8);
  const formBody = (quoteId: string) =>
    `--zz\r\nContent-Disposition: form-data; name="0"\r\n\r\n[null,"$K1"]\r\n--zz\r\nContent-Disposition: form-data; name="_1_quoteId"\r\n\r\n${quoteId}\r\n--zz\r\nContent-Disposition: form-data; name="_1_name"\r\n\r\nPriya Okafor\r\n--zz\r\nContent-Disposition: form-data; name="_1_agree"\r\n\r\non\r\n--zz--\r\n`;
  for (const a of actions.filter((x) => x.page.startsWith("/portal/commissions/")).slice(0, 12)) {
    for (const q of quoteIds.slice(0, 2))
      await burst(`action ${a.id.slice(0, 10)} as client (quote ${q.slice(0, 8)})`, () => ({ method: "POST", path: `/portal/commissions/${[...priyaIds][0]}`, who: "priya", body: formBody(q), headers: { "content-type": "multipart/form-data; boundary=zz", "next-action": a.id, origin: ORIGIN, accept: "text/x-component" } }));
  }
  if (!acceptId) console.log("(no portal action found for the acceptance burst)");
  for (const q of [...ownerIds].slice(0, 4))
    await burst(`send quote ${q.slice(0, 8)}`, () => ({ method: "POST", path: `/api/quotes/${q}/send`, who: "owner", body: "{}", headers: { "content-type": "application/json", origin: ORIGIN } }));
  await burst("garbage at every action", () => { const a = actions[Math.floor(Math.random() * actions.length)] ?? { id: "0".repeat(42), page: "/" }; return { method: "POST", path: a.page, who: "owner", body: "garbage{", headers: { "content-type": "text/plain;charset=UTF-8", "next-action": a.id, origin: ORIGIN } }; });

  await run(queue);

  // ---- report ----
  const secs = ((Date.now() - started) / 1000).toFixed(0);
  console.log(`\n${sent} requests in ${secs} s (max ${MAX}, limit ${SECONDS} s)`);
  console.log("by status: " + [...counts].sort().map(([k, v]) => `${k}: ${v}`).join(", "));
  console.log(`5xx: ${fives.length}`);
  const seen = new Map<string, number>();
  for (const f of fives) {
    const key = f.replace(/action=[0-9a-f]+/, "action=…").replace(/[0-9a-f]{8}-[0-9a-f-]{27}/g, "<id>").replace(/\[(owner|assistant|priya|elias|out)\]/, "[who]");
    seen.set(key, (seen.get(key) ?? 0) + 1);
  }
  for (const f of fives.slice(0, 300)) console.log("  " + f);
  if (fives.length > 300) console.log(`  … ${fives.length - 300} more (same shapes as below)`);
  console.log(`5xx distinct shapes: ${seen.size}`);
  for (const [k, n] of seen) console.log(`  ${n}× ${k}`);
  console.log(`leaks (2xx naming another account's id): ${leaks.length}`);
  for (const l of leaks) console.log("  " + l);
  console.log(`hangs (no answer in 30 s, or /api/health failing in a burst): ${hangs.length}`);
  for (const h of hangs) console.log("  " + h);
  if (DUMP) writeFileSync(DUMP, dumped.join("\n") + "\n");
  agent.destroy();
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
