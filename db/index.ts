// One cached pool for the whole process (kept on globalThis outside production so hot reload
// does not open a new pool on every save).
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Db = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

const globalForDb = globalThis as unknown as { darnwellPool?: Pool; darnwellDb?: Db };

function create(): { pool: Pool; db: Db } {
  const pool = new Pool({ connectionString: env.DATABASE_URL, max: 10 });
  return { pool, db: drizzle(pool, { schema }) };
}

export function getDb(): Db {
  if (!globalForDb.darnwellDb) {
    const { pool, db } = create();
    globalForDb.darnwellPool = pool;
    globalForDb.darnwellDb = db;
  }
  return globalForDb.darnwellDb;
}

export const db: Db = new Proxy({} as Db, {
  get(_t, key) {
    const real = getDb() as unknown as Record<string | symbol, unknown>;
    const value = real[key];
    return typeof value === "function" ? (value as (...a: unknown[]) => unknown).bind(real) : value;
  },
});

export async function closeDb(): Promise<void> {
  const pool = globalForDb.darnwellPool;
  globalForDb.darnwellPool = undefined;
  globalForDb.darnwellDb = undefined;
  await pool?.end();
}

export { schema };
