// Uploads are read as a stream with the byte limit enforced while reading: a body over the limit
// is refused with 413 whether its length is declared, missing or false, and the server stops
// pulling bytes at the limit (counted here at the source stream, so nothing beyond it was held).
import sharp from "sharp";
import { beforeAll, describe, expect, test } from "vitest";
import { POST as upload } from "@/app/api/commissions/[id]/uploads/route";
import { POST as piecePhoto } from "@/app/api/production/pieces/[id]/photos/route";
import { db } from "@/db";
import { pieces } from "@/db/schema";
import { readBodyLimited } from "@/lib/server/body-limit";
import { MAX_UPLOAD_BODY_BYTES } from "@/lib/server/uploads";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
const BOUNDARY = "----darnwell-limit-test";
const CHUNK = 64 * 1024;

/**
 * A multipart body whose "file" part is `fileBytes` long, produced lazily; `pulled()` says how many
 * bytes the reader has taken so far.
 */
function streamedForm(fileBytes: number, head: Buffer) {
  const prefix = Buffer.from(
    `--${BOUNDARY}\r\nContent-Disposition: form-data; name="file"; filename="big.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`,
  );
  const suffix = Buffer.from(`\r\n--${BOUNDARY}--\r\n`);
  let phase: "prefix" | "file" | "suffix" | "done" = "prefix";
  let pulled = 0;
  let fileSent = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      let chunk: Buffer;
      if (phase === "prefix") {
        chunk = prefix;
        phase = fileBytes > 0 ? "file" : "suffix";
      } else if (phase === "file") {
        const n = Math.min(CHUNK, fileBytes - fileSent);
        chunk = Buffer.alloc(n, 0x41);
        if (fileSent === 0) head.copy(chunk, 0, 0, Math.min(head.length, n));
        fileSent += n;
        if (fileSent >= fileBytes) phase = "suffix";
      } else if (phase === "suffix") {
        chunk = suffix;
        phase = "done";
      } else {
        controller.close();
        return;
      }
      pulled += chunk.length;
      controller.enqueue(new Uint8Array(chunk));
    },
  });
  return { stream, pulled: () => pulled };
}

function streamedRequest(jar: Jar, url: string, body: ReadableStream<Uint8Array>, contentLength?: string) {
  const headers: Record<string, string> = { "content-type": `multipart/form-data; boundary=${BOUNDARY}` };
  if (contentLength !== undefined) headers["content-length"] = contentLength;
  return requestWith(jar, url, { method: "POST", body, headers, duplex: "half" } as RequestInit);
}

let w: World;
let client: Jar;
let assistant: Jar;
let pieceId: string;
let jpeg: Buffer;

beforeAll(async () => {
  w = await makeWorld();
  [client, assistant] = await Promise.all([signIn(w.clientA.email), signIn(w.assistant.email)]);
  const [p] = await db.insert(pieces).values({ studioId: w.studioId, commissionId: w.commissionA, name: "Left mitten", stage: "knitting" }).returning();
  pieceId = p.id;
  jpeg = await sharp({ create: { width: 40, height: 30, channels: 3, background: "#7a5b8a" } }).jpeg().toBuffer();
});

describe("uploads streamed with the limit enforced while reading", { timeout: 60_000 }, () => {
  test("100 MB without a Content-Length: 413, and reading stopped at the limit", async () => {
    const body = streamedForm(100 * 1024 * 1024, jpeg);
    const res = await upload(streamedRequest(client, `/api/commissions/${w.commissionA}/uploads?kind=message&as=client`, body.stream), ctx(w.commissionA));
    expect(res.status).toBe(413);
    expect(res.headers.get("connection")).toBe("close");
    expect(((await res.json()) as { error: { code: string; message: string } }).error).toMatchObject({ code: "too_large", message: expect.stringMatching(/10 MB/) });
    // at most one chunk (plus what the stream queued ahead) beyond the limit was ever pulled
    expect(body.pulled()).toBeLessThanOrEqual(MAX_UPLOAD_BODY_BYTES + 4 * CHUNK);
    expect(body.pulled()).toBeGreaterThan(MAX_UPLOAD_BODY_BYTES);
  });

  test("a false, small Content-Length does not let a large body through", async () => {
    const body = streamedForm(50 * 1024 * 1024, jpeg);
    const res = await piecePhoto(streamedRequest(assistant, `/api/production/pieces/${pieceId}/photos`, body.stream, "1000"), ctx(pieceId));
    expect(res.status).toBe(413);
    expect(body.pulled()).toBeLessThanOrEqual(MAX_UPLOAD_BODY_BYTES + 4 * CHUNK);
  });

  test("a declared Content-Length over the limit is refused before a byte is read", async () => {
    const body = streamedForm(20 * 1024 * 1024, jpeg);
    const res = await upload(
      streamedRequest(client, `/api/commissions/${w.commissionA}/uploads?kind=message&as=client`, body.stream, String(20 * 1024 * 1024 + 300)),
      ctx(w.commissionA),
    );
    expect(res.status).toBe(413);
    // the stream queues its first piece on creation; nothing more was asked for
    expect(body.pulled()).toBeLessThanOrEqual(CHUNK);
  });

  test("a small photo streamed without a Content-Length is still accepted", async () => {
    const body = streamedForm(jpeg.length, jpeg);
    const res = await upload(streamedRequest(client, `/api/commissions/${w.commissionA}/uploads?kind=message&as=client`, body.stream), ctx(w.commissionA));
    expect(res.status).toBe(201);
    expect(((await res.json()) as { upload: { width: number } }).upload.width).toBe(40);
  });

  test("readBodyLimited: exactly the limit passes, one byte more is 413; a broken stream is 400", async () => {
    const exact = new Request("http://127.0.0.1/x", { method: "POST", body: new Uint8Array(1000) });
    expect((await readBodyLimited(exact, 1000, "too big")).length).toBe(1000);
    const over = new Request("http://127.0.0.1/x", { method: "POST", body: new Uint8Array(1001) });
    await expect(readBodyLimited(over, 1000, "too big")).rejects.toMatchObject({ status: 413 });
    const broken = new ReadableStream<Uint8Array>({
      pull(c) {
        c.error(new Error("connection reset"));
      },
    });
    const req = new Request("http://127.0.0.1/x", { method: "POST", body: broken, duplex: "half" } as RequestInit);
    await expect(readBodyLimited(req, 1000, "too big")).rejects.toMatchObject({ status: 400 });
  });
});
