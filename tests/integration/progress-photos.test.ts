// Progress photos per stage of a piece: uploaded by the studio, seen by the client only once shared.
import { eq } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, test } from "vitest";
import { PATCH as sharePhoto } from "@/app/api/production/photos/[id]/route";
import { GET as listPhotos, POST as uploadPhoto } from "@/app/api/production/pieces/[id]/photos/route";
import { GET as download } from "@/app/api/uploads/[id]/route";
import { db } from "@/db";
import { commissions, pieces, uploads } from "@/db/schema";
import { asClient } from "@/lib/server/authz";
import { listProgressPhotos } from "@/lib/server/progress-photos";
import { listCommissionUploads } from "@/lib/server/queries/uploads";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
let w: World;
let assistant: Jar;
let client: Jar;
let outsider: Jar;
let pieceId: string;

beforeAll(async () => {
  w = await makeWorld();
  await db.update(commissions).set({ state: "in_production" }).where(eq(commissions.id, w.commissionA));
  const [p] = await db
    .insert(pieces)
    .values({ studioId: w.studioId, commissionId: w.commissionA, name: "Left mitten", stage: "knitting" })
    .returning();
  pieceId = p.id;
  [assistant, client, outsider] = await Promise.all([signIn(w.assistant.email), signIn(w.clientA.email), signIn(w.outsider.email)]);
});

function form(bytes: Buffer, name: string, type: string, fields: Record<string, string>) {
  const f = new FormData();
  f.append("file", new Blob([new Uint8Array(bytes)], { type }), name);
  for (const [k, v] of Object.entries(fields)) f.append(k, v);
  return f;
}

const post = (jar: Jar, body: FormData) =>
  uploadPhoto(requestWith(jar, `/api/production/pieces/${pieceId}/photos`, { method: "POST", body }), ctx(pieceId));

const share = (jar: Jar, id: string, shared: boolean) =>
  sharePhoto(
    requestWith(jar, `/api/production/photos/${id}`, { method: "PATCH", body: JSON.stringify({ shared }), headers: { "content-type": "application/json" } }),
    ctx(id),
  );

const gate = (jar: Jar, id: string) => download(requestWith(jar, `/api/uploads/${id}?size=thumb`), ctx(id));

const jpeg = () => sharp({ create: { width: 80, height: 60, channels: 3, background: "#8a5b6f" } }).jpeg().toBuffer();

describe("progress photos", () => {
  test("assistant uploads for knitting; the client sees it only after it is shared", async () => {
    const res = await post(assistant, form(await jpeg(), "knit.jpg", "image/jpeg", { stage: "knitting" }));
    expect(res.status).toBe(201);
    const { photo } = (await res.json()) as { photo: { id: string; stage: string; shared: boolean } };
    expect(photo).toMatchObject({ stage: "knitting", shared: false });
    const [row] = await db.select().from(uploads).where(eq(uploads.id, photo.id));
    expect(row).toMatchObject({ kind: "progress", pieceId, stage: "knitting", commissionId: w.commissionA, sharedWithClient: false });

    const clientActor = asClient(await w.actor(w.clientA.id));
    expect((await listProgressPhotos(clientActor, w.commissionA)).map((p) => p.id)).not.toContain(photo.id);
    expect((await listCommissionUploads(clientActor, w.commissionA)).map((p) => p.id)).not.toContain(photo.id);
    expect((await gate(client, photo.id)).status).toBe(404);
    // the studio sees it in the piece's list and through the gate
    const list = (await (await listPhotos(requestWith(assistant, `/api/production/pieces/${pieceId}/photos`), ctx(pieceId))).json()) as {
      photos: { id: string }[];
    };
    expect(list.photos.map((p) => p.id)).toContain(photo.id);
    expect((await gate(assistant, photo.id)).status).toBe(302);

    // the client cannot share it themselves; the assistant can
    expect((await share(client, photo.id, true)).status).toBe(404);
    const shared = await share(assistant, photo.id, true);
    expect(shared.status).toBe(200);
    const seen = await listProgressPhotos(clientActor, w.commissionA);
    expect(seen.find((p) => p.id === photo.id)).toMatchObject({ stage: "knitting", pieceName: "Left mitten", shared: true });
    const g = await gate(client, photo.id);
    expect(g.status).toBe(302);
    expect(g.headers.get("location")).toBeTruthy();

    // un-sharing hides it again
    expect((await share(assistant, photo.id, false)).status).toBe(200);
    expect((await listProgressPhotos(clientActor, w.commissionA)).map((p) => p.id)).not.toContain(photo.id);
    expect((await gate(client, photo.id)).status).toBe(404);
  });

  test("another studio's member and the client get 404 on the piece; its photos stay closed", async () => {
    const res = await post(assistant, form(await jpeg(), "k.jpg", "image/jpeg", { stage: "blocking", shared: "on" }));
    const { photo } = (await res.json()) as { photo: { id: string; shared: boolean } };
    expect(photo.shared).toBe(true);
    expect((await post(outsider, form(await jpeg(), "x.jpg", "image/jpeg", { stage: "knitting" }))).status).toBe(404);
    expect((await post(client, form(await jpeg(), "x.jpg", "image/jpeg", { stage: "knitting" }))).status).toBe(404);
    expect((await listPhotos(requestWith(outsider, `/api/production/pieces/${pieceId}/photos`), ctx(pieceId))).status).toBe(404);
    expect((await share(outsider, photo.id, false)).status).toBe(404);
    expect((await gate(outsider, photo.id)).status).toBe(404);
  });

  test("a PDF renamed .jpg and a missing stage are refused; nothing is stored", async () => {
    const before = (await db.select({ id: uploads.id }).from(uploads).where(eq(uploads.pieceId, pieceId))).length;
    const pdf = Buffer.from("%PDF-1.4\n1 0 obj << /Type /Catalog >> endobj\ntrailer << /Root 1 0 R >>\n%%EOF\n");
    const res = await post(assistant, form(pdf, "photo.jpg", "image/jpeg", { stage: "knitting" }));
    expect(res.status).toBe(422);
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/not a JPEG, PNG or WebP/);
    const noStage = await post(assistant, form(await jpeg(), "k.jpg", "image/jpeg", { stage: "queued" }));
    expect(noStage.status).toBe(422);
    expect(((await noStage.json()) as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors.stage).toBeTruthy();
    const after = (await db.select({ id: uploads.id }).from(uploads).where(eq(uploads.pieceId, pieceId))).length;
    expect(after).toBe(before);
  });
});
