// Replays the requests a hostile run answered 5xx (`hostile.ts --dump FILE`) through proxy.ts in-process,
// as Next would call it, and prints how many the proxy now refuses (by status) and which would still
// reach the framework. No server, no build: `npx tsx scripts/bench/hostile-replay.ts FILE [--host 127.0.0.1:3301]`.
import { readFileSync } from "node:fs";

const file = process.argv[2];
if (!file) {
  console.error("usage: npx tsx scripts/bench/hostile-replay.ts DUMP.jsonl [--host 127.0.0.1:3301]");
  process.exit(2);
}
const hi = process.argv.indexOf("--host");
const HOST = hi > 0 ? process.argv[hi + 1] : "127.0.0.1:3301";
// The settings the proxy reads for its headers (nothing is contacted).
process.env.DATABASE_URL ??= "postgres://darnwell@127.0.0.1:1/none";
process.env.BETTER_AUTH_SECRET ??= "replay-secret-replay-secret-replay-0123";
process.env.SMTP_URL ??= "smtp://127.0.0.1:1";
process.env.BETTER_AUTH_URL ??= `http://${HOST}`;

interface Dumped {
  status: number;
  method: string;
  path: string;
  headers: Record<string, string>;
  chunked: boolean;
  body: string | null;
}

async function main() {
  const { NextRequest } = await import("next/server");
  const { proxy } = await import("../../proxy");
  const rows = readFileSync(file, "utf8").split("\n").filter(Boolean).map((l) => JSON.parse(l) as Dumped);
  const by = new Map<string, number>();
  const still: string[] = [];
  for (const r of rows) {
    const headers: Record<string, string> = { host: HOST, ...r.headers };
    if (r.body !== null) {
      if (r.chunked) headers["transfer-encoding"] = "chunked";
      else headers["content-length"] = String(Buffer.byteLength(r.body));
    }
    // The path goes in as sent (still percent-encoded), like Next's own request URL.
    const req = new NextRequest(`http://${HOST}${r.path}`, {
      method: r.method,
      headers,
      body: r.body !== null && !["GET", "HEAD"].includes(r.method) ? r.body : undefined,
    });
    const res = await proxy(req);
    const key = res.headers.get("x-middleware-next") === "1" ? "passed on to Next" : String(res.status);
    by.set(key, (by.get(key) ?? 0) + 1);
    if (key === "passed on to Next") still.push(`${r.method} ${r.path.slice(0, 120)} ${JSON.stringify(headers).slice(0, 160)} ${JSON.stringify(r.body ?? "").slice(0, 80)}`);
  }
  console.log(`${rows.length} requests answered 5xx before; through today's proxy: ` + [...by].map(([k, v]) => `${k}: ${v}`).join(", "));
  for (const s of still.slice(0, 40)) console.log("  still reaches Next: " + s);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
