// Applies the committed migrations in drizzle/ (drizzle-kit migrate can fail without printing why;
// the library migrator reports the SQL error).
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { Pool } from "pg";

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set");
  const pool = new Pool({ connectionString: url, max: 1 });
  try {
    await migrate(drizzle(pool), { migrationsFolder: "drizzle" });
  } finally {
    await pool.end();
  }
}

main().catch((err) => {
  console.error(`migration failed: ${(err as Error).message}`);
  process.exit(1);
});
