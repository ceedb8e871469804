// npm run db:backup [-- --out DIR]: backs up the database (pg_dump) and the stored photos (every
// object in the bucket) into DIR, by default .data/backups/darnwell-<UTC time>. Uses DATABASE_URL
// and S3_* when set, else the local services of a running `npm start` (ports from
// DARNWELL_PG_PORT / DARNWELL_S3_PORT). Prints where the backup is and what it holds.
import path from "node:path";
import { backup, targetsFromEnv } from "./backup/backup-lib";

async function main() {
  const i = process.argv.indexOf("--out");
  const stamp = new Date().toISOString().replace(/[:.]/g, "-");
  const dir = path.resolve(i > 0 && process.argv[i + 1] ? process.argv[i + 1] : path.join(".data", "backups", `darnwell-${stamp}`));
  const t = targetsFromEnv();
  const m = await backup({ dir, databaseUrl: t.databaseUrl, storage: t.storage });
  const rows = Object.values(m.rows).reduce((a, b) => a + b, 0);
  const bytes = m.objects.reduce((a, o) => a + o.bytes, 0);
  console.log(`backup written to ${dir}`);
  console.log(`  database ${m.database}: ${Object.keys(m.rows).length} tables, ${rows} rows`);
  console.log(`  bucket ${m.bucket}: ${m.objects.length} objects, ${(bytes / 1048576).toFixed(1)} MB`);
  console.log(`restore with: npm run db:restore -- ${path.relative(process.cwd(), dir)}`);
}

main().catch((err) => {
  console.error(`backup failed: ${(err as Error).message}`);
  process.exit(1);
});
