// Upload memory measurement: `npm run bench:uploads -- [--url http://127.0.0.1:3000] [--pid N]
// [--count 3] [--mb 100]`. Against a running app (it starts nothing; loopback only), sends `count`
// parallel uploads of `mb` MB each as a signed-out visitor's draft photo, streamed without a
// Content-Length, and prints the server's resident memory (VmRSS of the process listening on the
// port, or --pid) before, at its peak while sampling every 50 ms, and after, with each answer.
// It prints and never asserts: the figure to look at is "peak growth".
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { request } from "node:http";
import { randomBytes } from "node:crypto";

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}

const base = new URL(arg("url", process.env.BENCH_URL ?? "http://127.0.0.1:3000"));
if (!["127.0.0.1", "localhost", "[::1]"].includes(base.hostname)) throw new Error("bench:uploads targets loopback only");
const count = Number(arg("count", "3"));
const megabytes = Number(arg("mb", "100"));
const slug = arg("studio", "hollin-knitworks");

function serverPid(): number {
  const given = arg("pid", "");
  if (given) return Number(given);
  const out = execFileSync("ss", ["-ltnpH", `sport = :${base.port || 80}`], { encoding: "utf8" });
  const m = out.match(/pid=(\d+)/);
  if (!m) throw new Error(`no process of yours listens on port ${base.port}; pass --pid`);
  return Number(m[1]);
}

const rssMb = (pid: number) => {
  const m = readFileSync(`/proc/${pid}/status`, "utf8").match(/VmRSS:\s+(\d+) kB/);
  return m ? Math.round(Number(m[1]) / 1024) : NaN;
};

/** One streamed upload without a Content-Length; resolves with the status (or the socket error). */
function upload(totalBytes: number): Promise<{ status: string; sentMb: number }> {
  return new Promise((resolve) => {
    const boundary = `----bench${randomBytes(6).toString("hex")}`;
    const req = request(new URL(`/api/studios/${slug}/request-photos`, base), {
      method: "POST",
      headers: {
        "content-type": `multipart/form-data; boundary=${boundary}`,
        "transfer-encoding": "chunked",
        cookie: `dw-request-${slug}=${randomBytes(16).toString("hex")}`,
        origin: base.origin,
      },
    });
    let sent = 0;
    let finished = false;
    const done = (status: string) => {
      if (finished) return;
      finished = true;
      resolve({ status, sentMb: Math.round(sent / 1048576) });
    };
    req.on("response", (res) => {
      done(String(res.statusCode));
      res.resume();
      res.on("end", () => req.destroy());
    });
    req.on("close", () => done("closed without an answer"));
    req.on("error", (err) => done(`socket: ${(err as NodeJS.ErrnoException).code ?? err.message}`));
    req.write(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
    const chunk = Buffer.alloc(1024 * 1024, 0x41);
    chunk.set([0xff, 0xd8, 0xff]);
    const pump = () => {
      while (!finished && sent < totalBytes) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once("drain", pump);
      }
      if (!finished && sent >= totalBytes) req.end(`\r\n--${boundary}--\r\n`);
    };
    pump();
  });
}

async function main() {
  const pid = serverPid();
  // Warm up first (one small upload loads the route, sharp, the storage SDK and the pool), so the
  // figure is what the large uploads cost, not the first request's module loading.
  await fetch(new URL("/api/health", base)).catch(() => undefined);
  const warm = await upload(4096);
  await new Promise((r) => setTimeout(r, 500));
  const before = rssMb(pid);
  let peak = before;
  const timer = setInterval(() => {
    peak = Math.max(peak, rssMb(pid));
  }, 50);
  const results = await Promise.all(Array.from({ length: count }, () => upload(megabytes * 1024 * 1024)));
  await new Promise((r) => setTimeout(r, 1000));
  clearInterval(timer);
  const after = rssMb(pid);
  console.log(
    JSON.stringify({ target: base.origin, pid, warmUp: warm.status, uploads: count, mbEach: megabytes, answers: results, rssBeforeMb: before, rssPeakMb: peak, rssAfterMb: after, peakGrowthMb: peak - before }),
  );
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
