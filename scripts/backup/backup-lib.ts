// Backup and restore of everything Darnwell stores: the PostgreSQL database (pg_dump custom
// format) and the objects in the storage bucket (photos, thumbnails), with a manifest of row counts
// and of each object's key, size and SHA-256 so a restore can be checked. Used by
// scripts/db-backup.ts, scripts/db-restore.ts and the round-trip integration test.
import { execFile } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, readdirSync } from "node:fs";
import { mkdir, readFile, writeFile } from "node:fs/promises";
import path from "node:path";
import { promisify } from "node:util";
import {
  CreateBucketCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import pg from "pg";

const run = promisify(execFile);

export interface StorageTarget {
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
}

export interface Manifest {
  format: "darnwell-backup-1";
  createdAt: string;
  database: string;
  bucket: string;
  /** rows per table ("schema.table"), counted in the snapshot pg_dump read */
  rows: Record<string, number>;
  objects: { key: string; bytes: number; sha256: string; contentType: string | null }[];
}

/** The settings the scripts use: the environment, else the local services `npm start` runs. */
export function targetsFromEnv(env: NodeJS.ProcessEnv = process.env): { databaseUrl: string; storage: StorageTarget } {
  return {
    databaseUrl: env.DATABASE_URL ?? `postgres://darnwell@127.0.0.1:${env.DARNWELL_PG_PORT ?? "54329"}/darnwell`,
    storage: {
      endpoint: env.S3_ENDPOINT ?? (env.S3_ACCESS_KEY_ID ? undefined : `http://127.0.0.1:${env.DARNWELL_S3_PORT ?? "4568"}`),
      region: env.S3_REGION ?? "us-east-1",
      bucket: env.S3_BUCKET ?? "darnwell",
      accessKeyId: env.S3_ACCESS_KEY_ID ?? "S3RVER",
      secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
    },
  };
}

export function s3For(t: StorageTarget): S3Client {
  return new S3Client({
    region: t.region,
    endpoint: t.endpoint,
    forcePathStyle: Boolean(t.endpoint),
    credentials: { accessKeyId: t.accessKeyId, secretAccessKey: t.secretAccessKey },
  });
}

/** The newest PostgreSQL client tools on this machine (the Debian layout), else those on PATH. */
function pgTool(name: "pg_dump" | "pg_restore"): string {
  const root = "/usr/lib/postgresql";
  if (existsSync(root)) {
    const versions = readdirSync(root).filter((v) => existsSync(path.join(root, v, "bin", name))).sort((a, b) => Number(b) - Number(a));
    if (versions.length) return path.join(root, versions[0], "bin", name);
  }
  return name;
}

/** A connection string without its password (given to the tools through PGPASSWORD instead). */
function toolArgs(databaseUrl: string): { dbname: string; env: NodeJS.ProcessEnv } {
  const u = new URL(databaseUrl);
  const password = decodeURIComponent(u.password);
  u.password = "";
  return { dbname: u.toString(), env: { ...process.env, ...(password ? { PGPASSWORD: password } : {}) } };
}

/** Exact row counts of every table outside the system schemas, through `client` (its snapshot). */
async function countWith(client: pg.Client): Promise<Record<string, number>> {
  const tables = await client.query<{ s: string; t: string }>(
    "select schemaname as s, tablename as t from pg_tables where schemaname not in ('pg_catalog', 'information_schema') order by 1, 2",
  );
  const out: Record<string, number> = {};
  for (const { s, t } of tables.rows) {
    const r = await client.query<{ n: string }>(`select count(*) as n from "${s.replace(/"/g, '""')}"."${t.replace(/"/g, '""')}"`);
    out[`${s}.${t}`] = Number(r.rows[0].n);
  }
  return out;
}

export async function countRows(databaseUrl: string): Promise<Record<string, number>> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    return await countWith(client);
  } finally {
    await client.end();
  }
}

/** Every key in the bucket (none when it does not exist yet). */
export async function listKeys(s3: S3Client, bucket: string): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  try {
    await s3.send(new HeadBucketCommand({ Bucket: bucket }));
  } catch {
    return keys;
  }
  do {
    const page = await s3.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys.sort();
}

/** Where an object is kept inside the backup folder; keys that could leave the folder are refused. */
function objectPath(dir: string, key: string): string {
  if (!key || key.startsWith("/") || key.split("/").some((part) => part === ".." || part === "." || part === "")) {
    throw new Error(`refusing the object key ${JSON.stringify(key)}`);
  }
  return path.join(dir, "objects", ...key.split("/"));
}

const sha256 = (b: Buffer) => createHash("sha256").update(b).digest("hex");

/**
 * Writes a backup into `dir` (created): db.dump, objects/…, manifest.json. The database is dumped
 * first and the objects copied after, so every object a dumped row names is in the backup (objects
 * are only ever added or swept, never rewritten).
 */
export async function backup(opts: { databaseUrl: string; storage: StorageTarget; dir: string }): Promise<Manifest> {
  const { dir, databaseUrl, storage } = opts;
  if (existsSync(path.join(dir, "manifest.json"))) throw new Error(`${dir} already holds a backup`);
  await mkdir(path.join(dir, "objects"), { recursive: true });
  const { dbname, env } = toolArgs(databaseUrl);
  // One snapshot for the counts and the dump: a repeatable-read transaction exports it and pg_dump
  // reads the database as of that moment, so the manifest describes exactly what was dumped.
  const snap = new pg.Client({ connectionString: databaseUrl });
  await snap.connect();
  let rows: Record<string, number>;
  try {
    await snap.query("begin isolation level repeatable read read only");
    const { rows: s } = await snap.query<{ id: string }>("select pg_export_snapshot() as id");
    rows = await countWith(snap);
    await run(
      pgTool("pg_dump"),
      ["--format=custom", "--no-owner", "--no-privileges", `--snapshot=${s[0].id}`, `--file=${path.join(dir, "db.dump")}`, `--dbname=${dbname}`],
      { env, maxBuffer: 16 * 1024 * 1024 },
    );
    await snap.query("commit");
  } finally {
    await snap.end();
  }
  const s3 = s3For(storage);
  const objects: Manifest["objects"] = [];
  for (const key of await listKeys(s3, storage.bucket)) {
    const res = await s3.send(new GetObjectCommand({ Bucket: storage.bucket, Key: key }));
    const body = Buffer.from(await res.Body!.transformToByteArray());
    const file = objectPath(dir, key);
    await mkdir(path.dirname(file), { recursive: true });
    await writeFile(file, body);
    objects.push({ key, bytes: body.length, sha256: sha256(body), contentType: res.ContentType ?? null });
  }
  const manifest: Manifest = {
    format: "darnwell-backup-1",
    createdAt: new Date().toISOString(),
    database: new URL(databaseUrl).pathname.slice(1),
    bucket: storage.bucket,
    rows,
    objects,
  };
  await writeFile(path.join(dir, "manifest.json"), JSON.stringify(manifest, null, 2));
  return manifest;
}

/** Creates the database when it does not exist; refuses one that already has tables. */
async function prepareEmptyDatabase(databaseUrl: string): Promise<void> {
  const u = new URL(databaseUrl);
  const name = decodeURIComponent(u.pathname.slice(1));
  const admin = new URL(databaseUrl);
  admin.pathname = "/postgres";
  const a = new pg.Client({ connectionString: admin.toString() });
  await a.connect();
  try {
    const exists = await a.query("select 1 from pg_database where datname = $1", [name]);
    if (!exists.rowCount) await a.query(`create database "${name.replace(/"/g, '""')}"`);
  } finally {
    await a.end();
  }
  const c = new pg.Client({ connectionString: databaseUrl });
  await c.connect();
  try {
    const r = await c.query<{ n: string }>("select count(*) as n from pg_tables where schemaname not in ('pg_catalog', 'information_schema')");
    if (Number(r.rows[0].n) > 0) throw new Error(`the database ${name} is not empty; restore only into an empty (or new) database`);
  } finally {
    await c.end();
  }
}

/** Restores a backup folder into an empty (or new) database and an empty (or new) bucket, then checks it. */
export async function restore(opts: { dir: string; databaseUrl: string; storage: StorageTarget }): Promise<{ manifest: Manifest; rows: Record<string, number> }> {
  const { dir, databaseUrl, storage } = opts;
  const manifest = JSON.parse(await readFile(path.join(dir, "manifest.json"), "utf8")) as Manifest;
  if (manifest.format !== "darnwell-backup-1") throw new Error(`${dir} is not a Darnwell backup`);
  const s3 = s3For(storage);
  if ((await listKeys(s3, storage.bucket)).length > 0) throw new Error(`the bucket ${storage.bucket} is not empty; restore only into an empty (or new) bucket`);
  await prepareEmptyDatabase(databaseUrl);
  const { dbname, env } = toolArgs(databaseUrl);
  await run(pgTool("pg_restore"), ["--no-owner", "--no-privileges", "--exit-on-error", "--single-transaction", `--dbname=${dbname}`, path.join(dir, "db.dump")], {
    env,
    maxBuffer: 16 * 1024 * 1024,
  });
  try {
    await s3.send(new HeadBucketCommand({ Bucket: storage.bucket }));
  } catch {
    await s3.send(new CreateBucketCommand({ Bucket: storage.bucket }));
  }
  for (const o of manifest.objects) {
    const body = await readFile(objectPath(dir, o.key));
    if (body.length !== o.bytes || sha256(body) !== o.sha256) throw new Error(`the backup's copy of ${o.key} is damaged`);
    await s3.send(new PutObjectCommand({ Bucket: storage.bucket, Key: o.key, Body: body, ContentType: o.contentType ?? undefined }));
  }
  const rows = await countRows(databaseUrl);
  const differs = Object.keys({ ...manifest.rows, ...rows }).filter((t) => manifest.rows[t] !== rows[t]);
  if (differs.length) throw new Error(`restored row counts differ from the backup for: ${differs.join(", ")}`);
  return { manifest, rows };
}
