// Upkeep of the public request form: signed-out visitors' hourly photo allowances (per visitor and per
// address), and the sweep of unfinished drafts with their photos (real PostgreSQL and the local object storage).
import { randomBytes } from "node:crypto";
import { eq, inArray } from "drizzle-orm";
import sharp from "sharp";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { requestDrafts, uploads } from "@/db/schema";
import { sweepRequestDrafts, takeDraftPhotoAllowance } from "@/lib/server/request-upkeep";
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

describe("signed-out visitors' photo allowances, per visitor and per address", () => {
  const token = () => randomBytes(24).toString("base64url");
  const limits = { visitor: 3, address: 5 };
  // Addresses of this run's own (the counters live in the database for the hour).
  const ip = () => `198.51.${randomBytes(1)[0]}.${1 + (randomBytes(1)[0] % 250)}`;
  const refused = (p: Promise<void>) => p.then(() => null, (e: unknown) => e);

  test("one visitor's allowance runs out without touching another visitor's of the same studio", async () => {
    const now = new Date();
    const greedy = { studioId: w.studioId, visitorToken: token(), address: ip() };
    for (let i = 0; i < 3; i++) await takeDraftPhotoAllowance(greedy, now, limits);
    expect(await refused(takeDraftPhotoAllowance(greedy, now, limits))).toMatchObject({ status: 429, code: "too_many_uploads" });
    // Another visitor (another address) still adds photos to the same studio.
    await expect(takeDraftPhotoAllowance({ studioId: w.studioId, visitorToken: token(), address: ip() }, now, limits)).resolves.toBeUndefined();
    // The next hour is a new allowance.
    await expect(takeDraftPhotoAllowance(greedy, new Date(now.getTime() + 3_600_000), limits)).resolves.toBeUndefined();
  });

  test("new draft tokens from one address stop at the address's allowance", async () => {
    const now = new Date();
    const address = `2001:db8:${randomBytes(2).toString("hex")}:1::5`;
    const outcomes: unknown[] = [];
    for (let i = 0; i < 8; i++) {
      // A new token each time, and another host of the same /64.
      outcomes.push(await refused(takeDraftPhotoAllowance({ studioId: i % 2 ? w.studioId : w.otherStudioId, visitorToken: token(), address: address.replace(/5$/, String(i)) }, now, limits)));
    }
    expect(outcomes.slice(0, 5)).toEqual([null, null, null, null, null]);
    expect(outcomes.slice(5).every((e) => (e as { status?: number })?.status === 429)).toBe(true);
  });

  test("a refused photo takes nothing from the visitor's allowance; bursts never exceed it", async () => {
    const now = new Date();
    const visitor = { studioId: w.studioId, visitorToken: token(), address: ip() };
    const results = await Promise.all(Array.from({ length: 12 }, () => refused(takeDraftPhotoAllowance(visitor, now, limits))));
    expect(results.filter((r) => r === null)).toHaveLength(3);
    // The address counted only the three taken, so another visitor there still has two.
    const neighbour = { studioId: w.studioId, visitorToken: token(), address: visitor.address };
    await expect(takeDraftPhotoAllowance(neighbour, now, limits)).resolves.toBeUndefined();
    await expect(takeDraftPhotoAllowance(neighbour, now, limits)).resolves.toBeUndefined();
    expect(await refused(takeDraftPhotoAllowance(neighbour, now, limits))).toMatchObject({ status: 429 });
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
