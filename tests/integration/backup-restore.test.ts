// Backup round trip: db:backup's dump and object copy, restored into a fresh database and a fresh
// bucket, give the same row count in every table and the same objects, byte for byte.
import { randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { DeleteBucketCommand, DeleteObjectsCommand, GetObjectCommand } from "@aws-sdk/client-s3";
import pg from "pg";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { storeUpload } from "@/lib/server/uploads";
import { backup, countRows, listKeys, restore, s3For, type StorageTarget } from "@/scripts/backup/backup-lib";
import { makeWorld } from "./helpers";

const tag = randomBytes(5).toString("hex");
// Photos of this file go to a bucket of its own (lib/env reads this on first use, after this line).
process.env.S3_BUCKET = `dw-bk-src-${tag}`;

const storage = (bucket: string): StorageTarget => ({
  endpoint: process.env.S3_ENDPOINT,
  region: "us-east-1",
  bucket,
  accessKeyId: "S3RVER",
  secretAccessKey: "S3RVER",
});
const source = storage(`dw-bk-src-${tag}`);
const target = storage(`dw-bk-dst-${tag}`);
const sourceUrl = process.env.DATABASE_URL!;
const targetUrl = (() => {
  const u = new URL(sourceUrl);
  u.pathname = `/${u.pathname.slice(1)}_restore_${tag}`;
  return u.toString();
})();
const dir = mkdtempSync(path.join(tmpdir(), "darnwell-backup-"));
const uploadIds: string[] = [];

async function admin<T>(fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const u = new URL(sourceUrl);
  u.pathname = "/postgres";
  const c = new pg.Client({ connectionString: u.toString() });
  await c.connect();
  try {
    return await fn(c);
  } finally {
    await c.end();
  }
}

async function bytesOf(t: StorageTarget, key: string): Promise<Buffer> {
  const res = await s3For(t).send(new GetObjectCommand({ Bucket: t.bucket, Key: key }));
  return Buffer.from(await res.Body!.transformToByteArray());
}

beforeAll(async () => {
  const w = await makeWorld();
  for (const colour of ["#8a5b6f", "#5b8a7a"]) {
    const bytes = await sharp({ create: { width: 120, height: 90, channels: 3, background: colour } }).jpeg().toBuffer();
    const row = await storeUpload({ studioId: w.studioId, commissionId: w.commissionA, kind: "message", uploadedBy: w.clientA.id, bytes });
    uploadIds.push(row.id);
  }
});

afterAll(async () => {
  await admin((c) => c.query(`drop database if exists "${new URL(targetUrl).pathname.slice(1)}" with (force)`));
  for (const t of [source, target]) {
    const keys = await listKeys(s3For(t), t.bucket);
    if (keys.length) await s3For(t).send(new DeleteObjectsCommand({ Bucket: t.bucket, Delete: { Objects: keys.map((Key) => ({ Key })) } }));
    await s3For(t).send(new DeleteBucketCommand({ Bucket: t.bucket })).catch(() => undefined);
  }
  rmSync(dir, { recursive: true, force: true });
});

describe("db:backup and db:restore", { timeout: 120_000 }, () => {
  test("a round trip into a fresh database and bucket keeps every row count and every object's bytes", async () => {
    const manifest = await backup({ dir, databaseUrl: sourceUrl, storage: source });
    // 2 photos, each with a thumbnail
    expect(manifest.objects).toHaveLength(4);
    expect(manifest.rows["public.uploads"]).toBeGreaterThanOrEqual(2);
    expect(manifest.rows["drizzle.__drizzle_migrations"]).toBeGreaterThan(0);

    const { rows } = await restore({ dir, databaseUrl: targetUrl, storage: target });
    expect(rows).toEqual(manifest.rows);
    expect(await countRows(targetUrl)).toEqual(manifest.rows);

    // this file's uploads are in the restored database, pointing at objects in the restored bucket
    const restored = new pg.Client({ connectionString: targetUrl });
    await restored.connect();
    try {
      const r = await restored.query<{ object_key: string; thumb_key: string }>("select object_key, thumb_key from uploads where id = any($1)", [uploadIds]);
      expect(r.rowCount).toBe(2);
      const keys = await listKeys(s3For(target), target.bucket);
      expect(keys).toEqual(await listKeys(s3For(source), source.bucket));
      for (const row of r.rows) expect(keys).toEqual(expect.arrayContaining([row.object_key, row.thumb_key]));
      for (const key of keys) expect((await bytesOf(target, key)).equals(await bytesOf(source, key))).toBe(true);
    } finally {
      await restored.end();
    }
  });

  test("restore refuses a database or a bucket that is not empty", async () => {
    // the database restored above now has tables
    await expect(restore({ dir, databaseUrl: targetUrl, storage: storage(`dw-bk-new-${tag}`) })).rejects.toThrow(/not empty/);
    // the source bucket has objects
    const fresh = new URL(targetUrl);
    fresh.pathname = `${fresh.pathname}_x`;
    await expect(restore({ dir, databaseUrl: fresh.toString(), storage: source })).rejects.toThrow(/not empty/);
    await admin((c) => c.query(`drop database if exists "${fresh.pathname.slice(1)}" with (force)`));
  });

  test("a second backup into the same folder is refused", async () => {
    await expect(backup({ dir, databaseUrl: sourceUrl, storage: source })).rejects.toThrow(/already holds a backup/);
  });
});
