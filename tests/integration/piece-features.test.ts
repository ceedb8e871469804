// Correcting a piece's labour features after set-up: the estimate follows with the studio's rates,
// logged hours stay, bad input is 422 with nothing changed, studio people only, not once closed.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { GET, PATCH } from "@/app/api/production/pieces/[id]/route";
import { db } from "@/db";
import { commissions, pieces } from "@/db/schema";
import { startProduction } from "@/lib/server/production";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};
let pieceId: string;
let commissionId: string;
const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
const patch = async (jar: Jar | null, body: unknown) => {
  const res = await PATCH(requestWith(jar, `/api/production/pieces/${pieceId}`, { method: "PATCH", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), ctx(pieceId));
  return { status: res.status, body: await res.json() };
};

beforeAll(async () => {
  w = await makeWorld();
  for (const [k, p] of Object.entries({ owner: w.owner, assistant: w.assistant, a: w.clientA, outsider: w.outsider })) jars[k] = await signIn(p.email);
  const [c] = await db
    .insert(commissions)
    .values({ studioId: w.studioId, clientId: w.clientA.clientId, number: 500 + Math.floor(Math.random() * 1e6), title: "Feature hat", garment: "hat", currency: "GBP", state: "proof_approved" })
    .returning();
  commissionId = c.id;
  const { pieces: created } = await startProduction(await w.actor(w.owner.id), c.id, "one");
  pieceId = created[0].id;
});

describe("PATCH /api/production/pieces/:id", () => {
  test("more duplicate stitches and ends raise the embroidery estimate and nothing else", async () => {
    const before = (await (await GET(requestWith(jars.owner, `/api/production/pieces/${pieceId}`), ctx(pieceId))).json()).piece;
    const features = { ...before.features, duplicateStitches: Number(before.features.duplicateStitches ?? 0) + 600, ends: Number(before.features.ends ?? 0) + 10 };
    const res = await patch(jars.assistant, { features });
    expect(res.status).toBe(200);
    expect(res.body.piece.features).toMatchObject({ duplicateStitches: features.duplicateStitches, ends: features.ends });
    expect(res.body.piece.estimate.embroidery.p50).toBeGreaterThan(before.estimate.embroidery.p50);
    expect(res.body.piece.estimate.knitting).toEqual(before.estimate.knitting);
    const [row] = await db.select().from(pieces).where(eq(pieces.id, pieceId));
    expect(row.estimate.embroidery.p50).toBe(res.body.piece.estimate.embroidery.p50);
    expect(row.name).toBe(before.name);
  });

  test("bad input is 422 with the field named, and the piece is unchanged", async () => {
    const [before] = await db.select().from(pieces).where(eq(pieces.id, pieceId));
    const res = await patch(jars.owner, { features: { ...before.features, ends: -3 } });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fieldErrors).join(" ")).toMatch(/ends/);
    expect((await patch(jars.owner, { features: before.features, extra: 1 })).status).toBe(422);
    const [after] = await db.select().from(pieces).where(eq(pieces.id, pieceId));
    expect(after.features).toEqual(before.features);
  });

  test("clients and other studios get 404; anonymous 401", async () => {
    const [row] = await db.select().from(pieces).where(eq(pieces.id, pieceId));
    expect((await patch(jars.a, { features: row.features })).status).toBe(404);
    expect((await patch(jars.outsider, { features: row.features })).status).toBe(404);
    expect((await patch(null, { features: row.features })).status).toBe(401);
  });

  test("once the commission is closed the features stay as they were (409)", async () => {
    await db.update(commissions).set({ state: "closed" }).where(eq(commissions.id, commissionId));
    const [row] = await db.select().from(pieces).where(eq(pieces.id, pieceId));
    const res = await patch(jars.owner, { features: { ...row.features, ends: 1 } });
    expect(res.status).toBe(409);
  });
});
