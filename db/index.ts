// One cached pool for the whole process (kept on globalThis outside production so hot reload
// does not open a new pool on every save).
import { AsyncLocalStorage } from "node:async_hooks";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Db = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];
/** What a helper that may run inside or outside a transaction takes: the transaction's `tx`, or `db`. */
export type Executor = Db | Tx;

interface TxMark {
  open: boolean;
}

const globalForDb = globalThis as unknown as { darnwellPool?: Pool; darnwellDb?: Db; darnwellTxContext?: AsyncLocalStorage<TxMark> };

// A transaction holds one pooled connection. If, while it is open, the same request awaits a query
// on the shared pool, it holds one connection while waiting for a second: enough such requests at
// once hold every connection and wait for each other for ever. Each db.transaction marks its async
// context, so such a query can be caught (and, with the guard on, refused) where it is made.
const txContext = (globalForDb.darnwellTxContext ??= new AsyncLocalStorage<TxMark>());

/** True while the calling async context is inside the callback of db.transaction(…). */
export function inTransaction(): boolean {
  return txContext.getStore()?.open === true;
}

export class PooledQueryInTransactionError extends Error {
  constructor() {
    super(
      "A query (or a nested db.transaction) went to the shared pool (`db`) while this request holds an open transaction. Pass the transaction's `tx` " +
        "down to every read and write inside it (helpers take `q: Executor`), and do pooled work before or after the " +
        "transaction: a transaction waiting for a second connection deadlocks the app under load.",
    );
    this.name = "PooledQueryInTransactionError";
  }
}

function guardEnabled(): boolean {
  return env.DB_TX_GUARD ? env.DB_TX_GUARD === "on" : env.NODE_ENV === "test";
}

/** Every pooled query and every new transaction takes a connection through pool.connect (a backstop
 *  for code that reaches the pool without going through `db`). */
function guardPool(pool: Pool): void {
  const connect = pool.connect.bind(pool) as (cb?: (err: Error | undefined, ...rest: unknown[]) => void) => unknown;
  pool.connect = ((cb?: (err: Error | undefined, ...rest: unknown[]) => void) => {
    if (inTransaction()) {
      const err = new PooledQueryInTransactionError();
      if (cb) {
        process.nextTick(() => cb(err));
        return undefined;
      }
      return Promise.reject(err);
    }
    return connect(cb);
  }) as Pool["connect"];
}

function create(): { pool: Pool; db: Db } {
  const pool = new Pool({
    connectionString: env.DATABASE_URL,
    max: env.DB_POOL_MAX,
    // A request waits this long for a free connection, then fails (503 with Retry-After) instead of queueing for ever.
    connectionTimeoutMillis: env.DB_CONNECT_TIMEOUT_MS,
    statement_timeout: env.DB_STATEMENT_TIMEOUT_MS,
    idle_in_transaction_session_timeout: env.DB_IDLE_IN_TRANSACTION_TIMEOUT_MS,
  });
  // A connection the server ends (e.g. an idle transaction timed out) must not crash the process;
  // pg drops it from the pool and the request that held it fails on its next query.
  pool.on("connect", (client) => client.on("error", (err) => console.error("database connection:", err.message)));
  pool.on("error", (err) => console.error("database pool:", err.message));
  if (guardEnabled()) guardPool(pool);
  const real = drizzle(pool, { schema });
  const transaction = real.transaction.bind(real);
  // Marks the async context of each transaction's callback (see txContext above).
  real.transaction = ((fn: (tx: Tx) => Promise<unknown>, config?: Parameters<Db["transaction"]>[1]) =>
    transaction(async (tx) => {
      const mark: TxMark = { open: true };
      try {
        return await txContext.run(mark, () => fn(tx));
      } finally {
        mark.open = false;
      }
    }, config)) as Db["transaction"];
  return { pool, db: real };
}

export function getDb(): Db {
  if (!globalForDb.darnwellDb) {
    const { pool, db } = create();
    globalForDb.darnwellPool = pool;
    globalForDb.darnwellDb = db;
  }
  return globalForDb.darnwellDb;
}

/** The pool itself (tests and health figures: totalCount, idleCount, waitingCount). */
export function getPool(): Pool {
  getDb();
  return globalForDb.darnwellPool!;
}

export const db: Db = new Proxy({} as Db, {
  get(_t, key) {
    // With the guard on, the mistake is refused where it is written (`db.select…` inside a transaction).
    if (inTransaction() && guardEnabled()) throw new PooledQueryInTransactionError();
    const real = getDb() as unknown as Record<string | symbol, unknown>;
    const value = real[key];
    return typeof value === "function" ? (value as (...a: unknown[]) => unknown).bind(real) : value;
  },
});

/**
 * True for errors that mean "the database is too busy right now" rather than a fault: no pooled
 * connection came free in time, or a statement ran past statement_timeout.
 */
export function isDatabaseBusy(err: unknown): boolean {
  for (let e = err as { message?: unknown; code?: unknown; cause?: unknown } | undefined, depth = 0; e && depth < 4; e = e.cause as typeof e, depth++) {
    if (typeof e.message === "string" && /timeout exceeded when trying to connect|Connection terminated due to connection timeout/.test(e.message)) return true;
    if (e.code === "57014") return true; // query_canceled: statement_timeout
  }
  return false;
}

export async function closeDb(): Promise<void> {
  const pool = globalForDb.darnwellPool;
  globalForDb.darnwellPool = undefined;
  globalForDb.darnwellDb = undefined;
  await pool?.end();
}

export { schema };
