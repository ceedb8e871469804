// Two app instances against one database: a second `next start` from the same production build
// ($E2E_DIST_DIR, exported by scripts/test.sh and scripts/e2e-local.sh) on another port, with the
// same environment, both running their outbox workers. The same signed webhook event delivered to
// both at once is applied once; mail queued while both workers run arrives exactly once per message.
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { closeSync, mkdtempSync, openSync, readFileSync } from "node:fs";
import net from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { insertDemoCommission, withDb } from "./demo-db";

const FIRST = process.env.E2E_BASE_URL ?? "http://127.0.0.1:3100";
const MAIL_API = process.env.LOCAL_MAIL_API;
const tag = randomBytes(4).toString("hex");
let second: ChildProcess | undefined;
let SECOND = "";
let logFile = "";

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function freePort(): Promise<number> {
  if (process.env.E2E_SECOND_PORT) return Number(process.env.E2E_SECOND_PORT);
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

const listening = (port: number) =>
  new Promise<boolean>((resolve) => {
    const s = net.connect(port, "127.0.0.1");
    s.once("connect", () => (s.destroy(), resolve(true)));
    s.once("error", () => resolve(false));
  });

beforeAll(async () => {
  const dist = process.env.E2E_DIST_DIR;
  if (!dist) throw new Error("E2E_DIST_DIR is not set: run this through npm test or scripts/e2e-local.sh, which build the app");
  if (!MAIL_API) throw new Error("LOCAL_MAIL_API is not set");
  const port = await freePort();
  SECOND = `http://127.0.0.1:${port}`;
  logFile = path.join(mkdtempSync(path.join(tmpdir(), "darnwell-second-")), "app.log");
  const log = openSync(logFile, "a");
  const env: NodeJS.ProcessEnv = { ...process.env, NEXT_DIST_DIR: dist, NODE_ENV: "production", AUTH_SIGNIN_LIMIT: "500" };
  for (const k of Object.keys(env)) if (k.startsWith("VITEST")) delete env[k];
  second = spawn(process.execPath, [path.resolve("node_modules/next/dist/bin/next"), "start", "-H", "127.0.0.1", "-p", String(port)], {
    env,
    detached: true,
    stdio: ["ignore", log, log],
  });
  closeSync(log);
  for (let i = 0; i < 360; i++) {
    if (second.exitCode !== null) break;
    const ok = await fetch(`${SECOND}/api/health`).then((r) => r.ok).catch(() => false);
    if (ok) return;
    await sleep(250);
  }
  throw new Error(`the second instance did not start:\n${readFileSync(logFile, "utf8").slice(-3000)}`);
}, 120_000);

afterAll(async () => {
  if (!second?.pid) return;
  try {
    process.kill(-second.pid, "SIGTERM");
  } catch {
    /* already gone */
  }
  for (let i = 0; i < 80 && second.exitCode === null && second.signalCode === null; i++) await sleep(100);
  if (second.exitCode === null && second.signalCode === null) process.kill(-second.pid, "SIGKILL");
  expect(await listening(Number(new URL(SECOND).port))).toBe(false);
}, 30_000);

interface CaughtMail {
  subject: string;
  envelopeTo: string[];
}
async function mailTo(address: string): Promise<CaughtMail[]> {
  const res = await fetch(`${MAIL_API}/messages?to=${encodeURIComponent(address)}`);
  return (await res.json()) as CaughtMail[];
}

/** Waits (bounded) until every outbox row matching `where` has been sent by some worker. */
async function outboxDrained(where: string, params: unknown[]): Promise<{ to: string; subject: string }[]> {
  for (let i = 0; i < 120; i++) {
    const rows = await withDb((c) => c.query<{ to: string; subject: string; status: string }>(`select "to", subject, status from outbox_messages where ${where}`, params));
    if (rows.rows.length && rows.rows.every((r) => r.status === "sent")) return rows.rows;
    await sleep(500);
  }
  throw new Error("the outbox workers did not send the mail in time");
}

describe("two instances on one database", () => {
  test("both instances answer", async () => {
    for (const base of [FIRST, SECOND]) expect((await fetch(`${base}/api/health`)).status).toBe(200);
  });

  test("the same signed webhook event delivered to both instances at once is applied once", async () => {
    const secret = process.env.STRIPE_WEBHOOK_SECRET;
    if (!secret) throw new Error("STRIPE_WEBHOOK_SECRET is not set (npm test sets it; with e2e-local.sh set E2E_PAYMENTS_PORT)");
    const setup = await withDb(async (c) => {
      const commissionId = await insertDemoCommission(c, { clientEmail: "priya@example.test", title: `Two instances ${tag}`, state: "quote_sent" });
      const v = await c.query<{ id: string; deposit_minor: number; currency: string; minor_digits: number; studio_id: string }>(
        `insert into quote_versions (studio_id, commission_id, number, status, currency, minor_digits, input, result, total_minor, deposit_minor, balance_minor, sent_at, accepted_at, accepted_name)
         select studio_id, $1, 1, 'accepted', currency, minor_digits, input, result, total_minor, deposit_minor, balance_minor, now(), now(), 'Priya'
         from quote_versions where status = 'accepted' and deposit_minor > 0 order by created_at limit 1
         returning id, deposit_minor, currency, minor_digits, studio_id`,
        [commissionId],
      );
      expect(v.rowCount).toBe(1);
      const p = await c.query<{ id: string }>(
        `insert into payments (studio_id, commission_id, quote_version_id, kind, amount_minor, currency, minor_digits, checkout_session_id, idempotency_key)
         values ($1, $2, $3, 'deposit', $4, $5, $6, $7, $8) returning id`,
        [v.rows[0].studio_id, commissionId, v.rows[0].id, v.rows[0].deposit_minor, v.rows[0].currency, v.rows[0].minor_digits, `cs_two_${tag}`, `two-${tag}`],
      );
      return { commissionId, paymentId: p.rows[0].id, amount: v.rows[0].deposit_minor, currency: v.rows[0].currency };
    });
    const eventId = `evt_two_${tag}`;
    const payload = JSON.stringify({
      id: eventId,
      object: "event",
      type: "checkout.session.completed",
      created: Math.floor(Date.now() / 1000),
      livemode: false,
      pending_webhooks: 1,
      request: null,
      data: {
        object: {
          id: `cs_two_${tag}`,
          object: "checkout.session",
          metadata: { paymentId: setup.paymentId },
          payment_status: "paid",
          payment_intent: `pi_two_${tag}`,
          amount_total: setup.amount,
          currency: setup.currency.toLowerCase(),
        },
      },
    });
    const signature = new Stripe("sk_test_signer").webhooks.generateTestHeaderString({ payload, secret });
    const deliveries = [FIRST, SECOND, FIRST, SECOND, FIRST, SECOND, FIRST, SECOND].map((base) =>
      fetch(`${base}/api/payments/webhook`, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": signature }, body: payload }),
    );
    const answers = await Promise.all(deliveries.map(async (r) => ({ status: (await r).status, body: (await (await r).json()) as Record<string, unknown> })));
    expect(answers.map((a) => a.status)).toEqual(Array(8).fill(200));
    expect(answers.filter((a) => !a.body.duplicate)).toHaveLength(1);
    expect(answers.filter((a) => a.body.duplicate)).toHaveLength(7);

    const db = await withDb(async (c) => ({
      events: (await c.query("select status from webhook_events where id = $1", [eventId])).rows,
      payment: (await c.query<{ status: string }>("select status from payments where id = $1", [setup.paymentId])).rows[0],
      receipts: (await c.query<{ number: string }>("select content->>'number' as number from invoices where payment_id = $1 and kind = 'receipt'", [setup.paymentId])).rows,
      state: (await c.query<{ state: string }>("select state from commissions where id = $1", [setup.commissionId])).rows[0].state,
    }));
    expect(db.events).toEqual([{ status: "processed" }]);
    expect(db.payment.status).toBe("paid");
    expect(db.receipts).toHaveLength(1);
    expect(db.state).toBe("booked");

    // and its receipt mail, sent by whichever worker leased it, arrives once per recipient
    const subject = `Receipt ${db.receipts[0].number} from %`;
    const rows = await outboxDrained("subject like $1", [subject]);
    await sleep(3000); // two more rounds of both workers, in case either were to send it again
    for (const r of rows) {
      const got = (await mailTo(r.to)).filter((m) => m.subject === r.subject);
      expect(got, `mail "${r.subject}" to ${r.to}`).toHaveLength(1);
    }
  });

  test("mail queued while both workers run, and sign-ups through either instance, arrive exactly once", async () => {
    const queued = Array.from({ length: 40 }, (_, i) => `two-${tag}-q${i}@example.test`);
    await withDb(async (c) => {
      for (const to of queued) {
        await c.query(`insert into outbox_messages ("to", subject, html, text) values ($1, $2, '<p>Two instances</p>', 'Two instances')`, [to, `Two instances ${tag}`]);
      }
    });
    const signups = Array.from({ length: 6 }, (_, i) => `two-${tag}-s${i}@example.test`);
    const answers = await Promise.all(
      signups.map((email, i) =>
        fetch(`${i % 2 ? SECOND : FIRST}/api/auth/sign-up/email`, {
          method: "POST",
          headers: { "content-type": "application/json", origin: FIRST },
          body: JSON.stringify({ name: `Two ${i}`, email, password: `two-instances-${tag}` }),
        }).then((r) => r.status),
      ),
    );
    expect(answers).toEqual(Array(6).fill(200));
    const all = [...queued, ...signups];
    const rows = await outboxDrained(`"to" = any($1)`, [all]);
    expect(rows).toHaveLength(all.length);
    await sleep(3000); // two more rounds of both workers
    for (const to of all) expect(await mailTo(to), to).toHaveLength(1);
  });
});
