import "server-only";
// S3-compatible object storage through the AWS SDK: the local fake by default (scripts start it),
// real storage when S3_ENDPOINT and its keys are set. Downloads use short-lived signed URLs.
import { CreateBucketCommand, DeleteObjectsCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { env } from "@/lib/env";

const globalForS3 = globalThis as unknown as { darnwellS3?: S3Client; darnwellBucketReady?: Promise<void> };

export function s3(): S3Client {
  globalForS3.darnwellS3 ??= new S3Client({
    region: env.S3_REGION,
    endpoint: env.S3_ENDPOINT,
    forcePathStyle: Boolean(env.S3_ENDPOINT),
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
  });
  return globalForS3.darnwellS3;
}

async function ensureBucket(): Promise<void> {
  globalForS3.darnwellBucketReady ??= (async () => {
    try {
      await s3().send(new HeadBucketCommand({ Bucket: env.S3_BUCKET }));
    } catch {
      await s3().send(new CreateBucketCommand({ Bucket: env.S3_BUCKET }));
    }
  })().catch((err) => {
    globalForS3.darnwellBucketReady = undefined;
    throw err;
  });
  return globalForS3.darnwellBucketReady;
}

export async function putObject(key: string, body: Buffer, contentType: string): Promise<void> {
  await ensureBucket();
  await s3().send(new PutObjectCommand({ Bucket: env.S3_BUCKET, Key: key, Body: body, ContentType: contentType }));
}

export async function getObject(key: string): Promise<Buffer> {
  await ensureBucket();
  const res = await s3().send(new GetObjectCommand({ Bucket: env.S3_BUCKET, Key: key }));
  return Buffer.from(await res.Body!.transformToByteArray());
}

/** A URL that works for `seconds` (default 5 minutes); hand it only to people allowed to see the object. */
export async function signedDownloadUrl(key: string, seconds = 300): Promise<string> {
  await ensureBucket();
  return getSignedUrl(s3(), new GetObjectCommand({ Bucket: env.S3_BUCKET, Key: key }), { expiresIn: seconds });
}

/** Removes objects (missing ones are not an error), up to 1000 keys a call as S3 allows. */
export async function deleteObjects(keys: string[]): Promise<void> {
  await ensureBucket();
  for (let i = 0; i < keys.length; i += 1000) {
    const batch = keys.slice(i, i + 1000);
    await s3().send(new DeleteObjectsCommand({ Bucket: env.S3_BUCKET, Delete: { Objects: batch.map((Key) => ({ Key })), Quiet: true } }));
  }
}
