// Connection discipline on the real database: the guard that refuses a pooled query while the same
// async context holds an open transaction, the server-side timeouts every connection carries, and
// what a request gets when the pool is exhausted (503 with Retry-After, quickly) and after.
import { vi } from "vitest";

// A small pool with a short wait, so exhausting it is cheap (read once, when the pool is made).
vi.hoisted(() => {
  process.env.DB_POOL_MAX = "3";
  process.env.DB_CONNECT_TIMEOUT_MS = "400";
  process.env.DB_IDLE_IN_TRANSACTION_TIMEOUT_MS = "15000";
  process.env.DB_STATEMENT_TIMEOUT_MS = "30000";
});

import type { PoolClient } from "pg";
import { eq, sql } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { db, getPool, inTransaction, isDatabaseBusy, PooledQueryInTransactionError } from "@/db";
import { studios } from "@/db/schema";
import { toErrorState } from "@/lib/server/action";
import { notFound, nullIfNotFound } from "@/lib/server/errors";
import { errorResponse } from "@/lib/server/route";
import { GET as healthGET } from "@/app/api/health/route";
import { GET as commissionsGET } from "@/app/api/commissions/route";
import { makeWorld, requestWith, signIn, uid } from "./helpers";

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));
const studioNamed = async (slug: string) => (await db.select().from(studios).where(eq(studios.slug, slug)))[0];

describe("the transaction guard", () => {
  test("a pooled query inside a transaction is refused, naming the mistake, and the transaction rolls back", async () => {
    const slug = `guard-${uid()}`;
    const run = db.transaction(async (tx) => {
      await tx.insert(studios).values({ slug, name: "Guarded", contactEmail: `${slug}@it.test` });
      expect(inTransaction()).toBe(true);
      await db.select().from(studios).where(eq(studios.slug, slug)); // the mistake: `db`, not `tx`
    });
    await expect(run).rejects.toBeInstanceOf(PooledQueryInTransactionError);
    await expect(run).rejects.toThrow(/shared pool .* open transaction.*Pass the transaction's `tx`/s);
    expect(await studioNamed(slug)).toBeUndefined();
  });

  test("a helper called inside a transaction that opens its own transaction is refused too", async () => {
    const run = db.transaction(async () => db.transaction(async (inner) => inner.execute(sql`select 1`)));
    await expect(run).rejects.toBeInstanceOf(PooledQueryInTransactionError);
  });

  test("the pool itself refuses too, for code that reaches it without going through db", async () => {
    const pool = getPool();
    const run = db.transaction(async () => pool.query("select 1"));
    await expect(run).rejects.toBeInstanceOf(PooledQueryInTransactionError);
    const outside = await pool.query("select 5 as five");
    expect(outside.rows[0]).toEqual({ five: 5 });
  });

  test("queries through tx pass; savepoints pass; the pool is free again after commit and after rollback", async () => {
    const slug = `guard-ok-${uid()}`;
    const n = await db.transaction(async (tx) => {
      await tx.insert(studios).values({ slug, name: "Fine", contactEmail: `${slug}@it.test` });
      await tx.transaction(async (sp) => sp.execute(sql`select 1`));
      const [row] = await tx.select().from(studios).where(eq(studios.slug, slug));
      return row ? 1 : 0;
    });
    expect(n).toBe(1);
    expect(inTransaction()).toBe(false);
    expect(await studioNamed(slug)).toBeDefined();
    await expect(db.transaction(async () => Promise.reject(new Error("no")))).rejects.toThrow("no");
    expect((await db.execute(sql`select 1 as one`)).rows[0]).toEqual({ one: 1 });
  });

  test("other requests running beside a transaction are not mistaken for it", async () => {
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const tx = db.transaction(async (t) => {
      await gate;
      return t.execute(sql`select 2 as two`);
    });
    // A sibling async context: the pool is used while the transaction is open elsewhere.
    const sibling = await db.execute(sql`select 3 as three`);
    expect(sibling.rows[0]).toEqual({ three: 3 });
    release();
    expect((await tx).rows[0]).toEqual({ two: 2 });
  });

  test("work left running by a transaction's callback may use the pool once the transaction has ended", async () => {
    let later!: Promise<unknown>;
    await db.transaction(async () => {
      later = pause(50).then(() => db.execute(sql`select 4 as four`));
    });
    expect(((await later) as { rows: unknown[] }).rows[0]).toEqual({ four: 4 });
  });
});

describe("server-side limits on every pooled connection", () => {
  test("statement_timeout and idle_in_transaction_session_timeout come from the environment", async () => {
    const r = await db.execute<{ st: string; idle: string }>(
      sql`select current_setting('statement_timeout') as st, current_setting('idle_in_transaction_session_timeout') as idle`,
    );
    expect(r.rows[0]).toEqual({ st: "30s", idle: "15s" });
  });

  test("a statement past its timeout is 'busy' (503), not a crash", async () => {
    const err = await db
      .transaction(async (tx) => {
        await tx.execute(sql`set local statement_timeout = 100`);
        await tx.execute(sql`select pg_sleep(2)`);
      })
      .catch((e: unknown) => e);
    expect(isDatabaseBusy(err)).toBe(true);
    expect(errorResponse(err).status).toBe(503);
  });

  test("a transaction left idle is ended by the server; the process survives and the pool heals", async () => {
    const err = await db
      .transaction(async (tx) => {
        await tx.execute(sql`set local idle_in_transaction_session_timeout = 150`);
        await pause(700);
        await tx.execute(sql`select 1`);
      })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Error);
    await pause(50);
    const again = await Promise.all([1, 2, 3, 4, 5].map((i) => db.execute(sql`select ${i}::int as i`)));
    expect(again.map((r) => r.rows[0])).toEqual([1, 2, 3, 4, 5].map((i) => ({ i })));
  });
});

describe("an exhausted pool", () => {
  test("the wrappers map pg's acquisition timeout to 503 with Retry-After, and a clear form message", async () => {
    const poolTimeout = new Error("timeout exceeded when trying to connect");
    const res = errorResponse(poolTimeout);
    expect(res.status).toBe(503);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("busy");
    // drizzle wraps pooled query failures; the cause is what counts
    expect(errorResponse(Object.assign(new Error("Failed query: select 1"), { cause: poolTimeout })).status).toBe(503);
    expect(toErrorState(poolTimeout)).toMatchObject({ status: "error", message: expect.stringMatching(/busy.*try again/i) });
    expect(errorResponse(new Error("something else")).status).toBe(500);
    // lookups that hide "not yours" as 404 let a busy database through as itself
    expect(await Promise.reject(notFound("That quote")).catch(nullIfNotFound)).toBeNull();
    await expect(Promise.reject(poolTimeout).catch(nullIfNotFound)).rejects.toBe(poolTimeout);
  });

  test("with every connection held, a request gets 503 + Retry-After quickly; once released, requests succeed", async () => {
    const w = await makeWorld();
    const jar = await signIn(w.owner.email);
    const call = () => commissionsGET(requestWith(jar, "/api/commissions"), { params: Promise.resolve({}) });
    expect((await call()).status).toBe(200);

    const pool = getPool();
    const held: PoolClient[] = [];
    for (let i = 0; i < 3; i++) held.push(await pool.connect());
    let res: Response;
    let health: Response;
    const t0 = performance.now();
    try {
      [res, health] = await Promise.all([call(), healthGET()]);
    } finally {
      const waited = performance.now() - t0;
      for (const c of held) c.release();
      console.log(`[pool exhausted] max ${pool.options.max}, wait limit ${pool.options.connectionTimeoutMillis} ms: answered in ${waited.toFixed(0)} ms`);
    }
    expect(res.status).toBe(503);
    expect(res.headers.get("retry-after")).toBe("2");
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("busy");
    expect(health.status).toBe(503);

    // Recovery by itself: nothing to restart.
    const after = await Promise.all([call(), call(), healthGET()]);
    expect(after.map((r) => r.status)).toEqual([200, 200, 200]);
    expect(pool.waitingCount).toBe(0);
  });
});
