// Load benchmark: `npm run bench:load [-- --url http://127.0.0.1:3000] [--seconds 60] [--connections 50]`.
// Starts nothing: it drives an app that is already running with the demo data (`npm start`, or a
// build of your own started like scripts/e2e-local.sh does), and only on a loopback address. It signs
// in as the demo owner and a demo client, then runs autocannon against five targets one after the
// other (50 connections for 60 s each by default; BENCH_SECONDS / --seconds for a quick run) and
// prints, per target, requests, errors (socket errors incl. timeouts, and non-2xx answers), p50 and p99
// latency and their ratio to the /api/health baseline measured in the same run. It prints and never
// asserts; the target is 0 errors.
import autocannon from "autocannon";

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}

const base = new URL(arg("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000"));
if (!["127.0.0.1", "localhost", "[::1]"].includes(base.hostname)) {
  console.error("bench:load drives loopback addresses only (127.0.0.1, localhost, [::1])");
  process.exit(2);
}
const seconds = Number(arg("seconds", process.env.BENCH_SECONDS ?? "60"));
const connections = Number(arg("connections", process.env.BENCH_CONNECTIONS ?? "50"));
const OWNER = process.env.BENCH_OWNER ?? "maren@hollin.test";
const CLIENT = process.env.BENCH_CLIENT ?? "priya@example.test";
const PASSWORD = process.env.BENCH_PASSWORD ?? "darnwell-demo";

async function signIn(email: string): Promise<string> {
  const res = await fetch(new URL("/api/auth/sign-in/email", base), {
    method: "POST",
    headers: { "content-type": "application/json", origin: base.origin },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} answered ${res.status}: ${await res.text()}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}

interface Target {
  name: string;
  path: string;
  cookie: string;
}

interface Row {
  target: string;
  path: string;
  requests: number;
  errors: number;
  non2xx: number;
  timeouts: number;
  rps: number;
  p50ms: number;
  p99ms: number;
}

async function drive(t: Target): Promise<Row> {
  const result = await autocannon({
    url: new URL(t.path, base).toString(),
    connections,
    duration: seconds,
    timeout: 30,
    headers: { cookie: t.cookie, accept: "text/html,application/json" },
  });
  return {
    target: t.name,
    path: t.path,
    requests: result.requests.total,
    // autocannon counts timeouts among its errors
    errors: result.errors + result.non2xx,
    non2xx: result.non2xx,
    timeouts: result.timeouts,
    rps: Math.round(result.requests.average),
    p50ms: result.latency.p50,
    p99ms: result.latency.p99,
  };
}

async function main() {
  const owner = await signIn(OWNER);
  const client = await signIn(CLIENT);
  const list = await fetch(new URL("/api/commissions", base), { headers: { cookie: owner } });
  const { commissions } = (await list.json()) as { commissions: { id: string }[] };
  if (!commissions?.length) throw new Error("the owner sees no commissions: run against the demo data");
  const targets: Target[] = [
    { name: "health (baseline)", path: "/api/health", cookie: owner },
    { name: "API: commission list", path: "/api/commissions", cookie: owner },
    { name: "studio home (commission list page)", path: "/studio", cookie: owner },
    { name: "commission page", path: `/studio/commissions/${commissions[0].id}`, cookie: owner },
    { name: "portal (client)", path: "/portal", cookie: client },
  ];
  console.log(`bench:load → ${base.origin}: ${connections} connections, ${seconds} s per target, ${targets.length} targets one after the other`);
  const rows: Row[] = [];
  for (const t of targets) {
    const row = await drive(t);
    rows.push(row);
    console.log(JSON.stringify(row));
  }
  const b = rows[0];
  const ratio = (x: number, y: number) => (y > 0 ? (x / y).toFixed(1) : "—");
  console.log("");
  console.log(["target".padEnd(36), "requests".padStart(9), "errors".padStart(7), "req/s".padStart(7), "p50 ms".padStart(7), "p99 ms".padStart(7), "p50 ×base".padStart(10), "p99 ×base".padStart(10)].join(" "));
  for (const r of rows) {
    console.log(
      [r.target.padEnd(36), String(r.requests).padStart(9), String(r.errors).padStart(7), String(r.rps).padStart(7), String(r.p50ms).padStart(7), String(r.p99ms).padStart(7), ratio(r.p50ms, b.p50ms).padStart(10), ratio(r.p99ms, b.p99ms).padStart(10)].join(" "),
    );
  }
  const errors = rows.reduce((s, r) => s + r.errors, 0);
  console.log(`\ntotal errors: ${errors} (target 0)`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
