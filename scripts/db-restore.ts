// npm run db:restore -- DIR: restores a backup made by db:backup into the database of DATABASE_URL
// (created when it does not exist; refused when it has tables) and the bucket S3_BUCKET (created
// when missing; refused when it holds objects), then checks every table's row count against the
// backup's manifest. Without DATABASE_URL / S3_*: the local services of `npm start`, so point at a
// new database and bucket, e.g.
//   DATABASE_URL=postgres://darnwell@127.0.0.1:54329/darnwell_restored S3_BUCKET=darnwell-restored npm run db:restore -- DIR
import path from "node:path";
import { restore, targetsFromEnv } from "./backup/backup-lib";

async function main() {
  const dir = process.argv.slice(2).find((a) => !a.startsWith("--"));
  if (!dir) throw new Error("name the backup folder: npm run db:restore -- .data/backups/darnwell-…");
  const t = targetsFromEnv();
  const { manifest, rows } = await restore({ dir: path.resolve(dir), databaseUrl: t.databaseUrl, storage: t.storage });
  console.log(`restored ${dir} (made ${manifest.createdAt})`);
  console.log(`  database ${new URL(t.databaseUrl).pathname.slice(1)}: ${Object.keys(rows).length} tables, row counts match the backup`);
  console.log(`  bucket ${t.storage.bucket}: ${manifest.objects.length} objects, checked against their SHA-256`);
}

main().catch((err) => {
  console.error(`restore failed: ${(err as Error).message}`);
  process.exit(1);
});
