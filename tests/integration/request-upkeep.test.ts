// Upkeep of the public request form: signed-out visitors' hourly photo allowance per studio, and the
// sweep of unfinished drafts with their photos (real PostgreSQL and the local object storage).
import { randomBytes } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { requestDrafts, uploads } from "@/db/schema";
import { assertDraftPhotoAllowance, sweepRequestDrafts } from "@/lib/server/request-upkeep";
import { addDraftPhoto, saveDraft } from "@/lib/server/requests";
import { getObject } from "@/lib/server/storage";
import { storeUpload } from "@/lib/server/uploads";
import { makeWorld, type World } from "./helpers";

let w: World;
const DAY = 86_400_000;
const photo = () => sharp({ create: { width: 12, height: 10, channels: 3, background: "#7a5c3e" } }).jpeg().toBuffer();

beforeAll(async () => {
  w = await makeWorld();
});

async function anonymousPhoto(studioId: string, at?: Date) {
  const row = await storeUpload({ studioId, commissionId: null, kind: "reference", uploadedBy: null, bytes: await photo() });
  if (at) await db.update(uploads).set({ createdAt: at }).where(eq(uploads.id, row.id));
  return row;
}

describe("signed-out visitors' photo allowance", () => {
  test("counts this studio's anonymous draft photos of the last hour only, then refuses with 429", async () => {
    const now = new Date();
    await anonymousPhoto(w.studioId);
    await anonymousPhoto(w.studioId);
    await anonymousPhoto(w.studioId, new Date(now.getTime() - 2 * 3_600_000)); // older than an hour
    await anonymousPhoto(w.otherStudioId); // another studio's
    await storeUpload({ studioId: w.studioId, commissionId: null, kind: "reference", uploadedBy: w.clientA.id, bytes: await photo() }); // signed in
    await expect(assertDraftPhotoAllowance(w.studioId, now, 3)).resolves.toBeUndefined();
    await anonymousPhoto(w.studioId);
    const err = await assertDraftPhotoAllowance(w.studioId, new Date(), 3).catch((e: unknown) => e);
    expect(err).toMatchObject({ status: 429, code: "too_many_uploads" });
    await expect(assertDraftPhotoAllowance(w.otherStudioId, new Date(), 3)).resolves.toBeUndefined();
  });
});

describe("the draft sweep", () => {
  test("removes drafts untouched for the age limit with their photos, and keeps fresh drafts and taken photos", async () => {
    const old = new Date(Date.now() - 40 * DAY);
    const oldToken = randomBytes(24).toString("base64url");
    const freshToken = randomBytes(24).toString("base64url");
    await saveDraft(w.studioId, oldToken, { garment: "hat", lettering: "ZZ" }, null);
    const oldPhoto = await anonymousPhoto(w.studioId, old);
    await addDraftPhoto(w.studioId, oldToken, oldPhoto.id);
    await db.update(requestDrafts).set({ updatedAt: old }).where(eq(requestDrafts.studioId, w.studioId));

    await saveDraft(w.studioId, freshToken, { garment: "hat", lettering: "YY" }, null);
    const freshPhoto = await anonymousPhoto(w.studioId, old); // old photo, but a live draft holds it
    await addDraftPhoto(w.studioId, freshToken, freshPhoto.id);

    const stray = await anonymousPhoto(w.studioId, old); // never reached a draft
    const taken = await anonymousPhoto(w.studioId, old);
    await db.update(uploads).set({ commissionId: w.commissionA }).where(eq(uploads.id, taken.id));

    const result = await sweepRequestDrafts(new Date(), 30);
    expect(result.drafts).toBeGreaterThanOrEqual(1);
    expect(result.uploads).toBeGreaterThanOrEqual(2);

    const left = await db.select({ id: uploads.id }).from(uploads).where(inArray(uploads.id, [oldPhoto.id, freshPhoto.id, stray.id, taken.id]));
    expect(left.map((r) => r.id).sort()).toEqual([freshPhoto.id, taken.id].sort());
    await expect(getObject(oldPhoto.objectKey)).rejects.toThrow();
    await expect(getObject(stray.thumbKey)).rejects.toThrow();
    expect((await getObject(freshPhoto.objectKey)).length).toBeGreaterThan(0);
    const drafts = await db.select({ data: requestDrafts.data }).from(requestDrafts).where(eq(requestDrafts.studioId, w.studioId));
    expect(drafts.map((d) => d.data.lettering)).toEqual(["YY"]);

    // Running it again finds nothing more to do.
    const again = await sweepRequestDrafts(new Date(), 30);
    const mine = await db.select({ id: uploads.id }).from(uploads).where(inArray(uploads.id, [freshPhoto.id, taken.id]));
    expect(mine).toHaveLength(2);
    expect(again.drafts).toBe(0);
  });
});
