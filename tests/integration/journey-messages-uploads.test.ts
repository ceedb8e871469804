import { eq, like } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, test } from "vitest";
import { GET as getThread, POST as postMessage } from "@/app/api/commissions/[id]/messages/route";
import { POST as upload } from "@/app/api/commissions/[id]/uploads/route";
import { GET as download } from "@/app/api/uploads/[id]/route";
import { db } from "@/db";
import { messages, outboxMessages, uploads } from "@/db/schema";
import type { Thread } from "@/lib/schemas/messages";
import { unreadCount } from "@/lib/server/messages";
import { getObject } from "@/lib/server/storage";
import { makeWorld, requestWith, signIn, uid, waitForMail, type Jar, type World } from "./helpers";

const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
let w: World;
let owner: Jar;
let a: Jar;
let b: Jar;

beforeAll(async () => {
  w = await makeWorld();
  [owner, a, b] = await Promise.all([signIn(w.owner.email), signIn(w.clientA.email), signIn(w.clientB.email)]);
});

function form(bytes: Buffer, name: string, type: string) {
  const f = new FormData();
  f.append("file", new Blob([new Uint8Array(bytes)], { type }), name);
  return f;
}

const sendUpload = (jar: Jar, commissionId: string, body: FormData, q = "kind=message&as=client") =>
  upload(requestWith(jar, `/api/commissions/${commissionId}/uploads?${q}`, { method: "POST", body }), ctx(commissionId));

async function gpsJpeg(): Promise<Buffer> {
  return sharp({ create: { width: 64, height: 48, channels: 3, background: "#6f8a5b" } })
    .withExif({
      IFD0: { Make: "TestCam", Model: "Pocket 1", ImageDescription: "my garden" },
      IFD3: { GPSLatitudeRef: "N", GPSLatitude: "57/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "4/1 15/1 0/1" },
    })
    .jpeg()
    .toBuffer();
}

describe("uploads", () => {
  test("a JPEG with GPS data is stored re-encoded without EXIF, with a thumbnail, behind a participant-only gate", async () => {
    const original = await gpsJpeg();
    const before = await sharp(original).metadata();
    expect(before.exif?.toString("latin1")).toContain("TestCam"); // the test photo really carries EXIF
    const res = await sendUpload(a, w.commissionA, form(original, "garden.jpg", "image/jpeg"));
    expect(res.status).toBe(201);
    const { upload: up } = (await res.json()) as { upload: { id: string } };
    const [row] = await db.select().from(uploads).where(eq(uploads.id, up.id));
    const stored = await getObject(row.objectKey);
    const meta = await sharp(stored).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(stored.toString("latin1")).not.toContain("TestCam");
    expect(stored.toString("latin1")).not.toContain("GPS");
    expect((await sharp(await getObject(row.thumbKey)).metadata()).width).toBeLessThanOrEqual(360);

    const mine = await download(requestWith(a, `/api/uploads/${up.id}`), ctx(up.id));
    expect(mine.status).toBe(302);
    expect(mine.headers.get("location")).toContain("X-Amz-Signature");
    expect((await download(requestWith(owner, `/api/uploads/${up.id}?size=thumb`), ctx(up.id))).status).toBe(302);
    // Another client of the same studio, and a signed-out visitor: 404.
    expect((await download(requestWith(b, `/api/uploads/${up.id}`), ctx(up.id))).status).toBe(404);
    expect((await download(requestWith(null, `/api/uploads/${up.id}`), ctx(up.id))).status).toBe(404);
    // ?bytes=1 (the design page's photo import reads pixels from the app's own origin): the same gate.
    const bytes = await download(requestWith(owner, `/api/uploads/${up.id}?bytes=1`), ctx(up.id));
    expect(bytes.status).toBe(200);
    expect(bytes.headers.get("content-type")).toBe("image/jpeg");
    expect(Buffer.from(await bytes.arrayBuffer()).equals(stored)).toBe(true);
    expect((await download(requestWith(b, `/api/uploads/${up.id}?bytes=1`), ctx(up.id))).status).toBe(404);
    expect((await download(requestWith(null, `/api/uploads/${up.id}?bytes=1`), ctx(up.id))).status).toBe(404);
  });

  test("a PDF renamed .jpg, an empty file and an oversized one are refused with the reason", async () => {
    const pdf = Buffer.from("%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\n%%EOF\n");
    const res = await sendUpload(a, w.commissionA, form(pdf, "photo.jpg", "image/jpeg"));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/not a JPEG, PNG or WebP/);
    const big = Buffer.alloc(10 * 1024 * 1024 + 10, 0);
    big.set([0xff, 0xd8, 0xff]);
    const tooBig = await sendUpload(a, w.commissionA, form(big, "big.jpg", "image/jpeg"));
    expect(tooBig.status).toBe(422);
    expect(((await tooBig.json()) as { error: { message: string } }).error.message).toMatch(/10 MB/);
    expect((await sendUpload(a, w.commissionA, form(Buffer.alloc(0), "empty.jpg", "image/jpeg"))).status).toBe(422);
    const rows = await db.select().from(uploads).where(eq(uploads.commissionId, w.commissionA));
    expect(rows.every((r) => r.contentType === "image/jpeg")).toBe(true);
  });

  test("client B cannot upload to A's commission (404); a client cannot add progress photos (403)", async () => {
    const png = await sharp({ create: { width: 8, height: 8, channels: 3, background: "#fff" } }).png().toBuffer();
    expect((await sendUpload(b, w.commissionA, form(png, "x.png", "image/png"))).status).toBe(404);
    expect((await sendUpload(a, w.commissionA, form(png, "x.png", "image/png"), "kind=progress&as=client")).status).toBe(403);
    expect((await sendUpload(owner, w.commissionA, form(png, "x.png", "image/png"), "kind=progress")).status).toBe(201);
  });
});

describe("messages", () => {
  test("a retried send is stored once; unread counts; the other side is mailed with a reply link; B gets 404", async () => {
    const key = `k-${uid()}-${uid()}`;
    const post = (jar: Jar, as: string, body: unknown) =>
      postMessage(requestWith(jar, `/api/commissions/${w.commissionA}/messages?as=${as}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), ctx(w.commissionA));
    const first = await post(owner, "studio", { body: "Your yarn has arrived.", clientKey: key });
    expect(first.status).toBe(201);
    const again = await post(owner, "studio", { body: "Your yarn has arrived.", clientKey: key });
    expect(again.status).toBe(200);
    const rows = await db.select().from(messages).where(eq(messages.clientKey, key));
    expect(rows).toHaveLength(1);
    expect(rows[0].authorRole).toBe("owner");

    const clientA = await w.actor(w.clientA.id);
    expect(await unreadCount(clientA, w.commissionA)).toBeGreaterThanOrEqual(1);
    const res = await getThread(requestWith(a, `/api/commissions/${w.commissionA}/messages?as=client`), ctx(w.commissionA));
    expect(res.status).toBe(200);
    const thread = (await res.json()) as Thread;
    expect(thread.messages.filter((m) => m.body === "Your yarn has arrived.")).toHaveLength(1);
    expect(thread.unread).toBeGreaterThanOrEqual(1);
    expect(await unreadCount(clientA, w.commissionA)).toBe(0);

    // Message mails wait a few minutes to gather the next ones (notifications.ts); let the window pass.
    await db.update(outboxMessages).set({ nextAttemptAt: new Date() }).where(like(outboxMessages.dedupeKey, `messages:${w.commissionA}:%`));
    const mail = await waitForMail(w.clientA.email, (m) => m.subject.includes("New message"));
    expect(mail.links.some((l) => l.includes(`/portal/commissions/${w.commissionA}#messages`))).toBe(true);

    // A reply with a photo attached.
    const photo = await sharp({ create: { width: 10, height: 10, channels: 3, background: "#abc" } }).jpeg().toBuffer();
    const up = (await (await sendUpload(a, w.commissionA, form(photo, "p.jpg", "image/jpeg"))).json()) as { upload: { id: string } };
    expect((await post(a, "client", { body: "Lovely!", clientKey: `r-${uid()}x`, uploadIds: [up.upload.id] })).status).toBe(201);
    const [att] = await db.select().from(uploads).where(eq(uploads.id, up.upload.id));
    expect(att.messageId).not.toBeNull();

    expect((await getThread(requestWith(b, `/api/commissions/${w.commissionA}/messages?as=client`), ctx(w.commissionA))).status).toBe(404);
    expect((await post(b, "client", { body: "hi", clientKey: `b-${uid()}xx` })).status).toBe(404);
    // An empty message is refused with the field named.
    const empty = await post(a, "client", { body: "  ", clientKey: `e-${uid()}xx` });
    expect(empty.status).toBe(422);
  });
});
