// Fewer clicks on the board: a piece through several stages in one move, and all pieces of a
// commission together, each in one transaction with a piece event per stage passed.
import { asc, eq, inArray } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissions, pieceEvents, pieces } from "@/db/schema";
import { createPieces, moveCommissionPieces, movePiece } from "@/lib/server/production";
import { makeWorld, type World } from "./helpers";

let w: World;

async function inProduction(garment: "mittens" | "hat" = "mittens") {
  const [c] = await db
    .insert(commissions)
    .values({ studioId: w.studioId, clientId: w.clientA.clientId, number: 100 + Math.floor(Math.random() * 1e6), title: "Board moves", garment, currency: "GBP", state: "in_production" })
    .returning();
  return c.id;
}

/** Moves only (creating a piece writes an event from no stage), in the order they happened. */
const eventsOf = async (ids: string[]) =>
  (await db.select().from(pieceEvents).where(inArray(pieceEvents.pieceId, ids)).orderBy(asc(pieceEvents.at))).filter((e) => e.fromStage !== null);

beforeAll(async () => {
  w = await makeWorld();
});

describe("moving pieces with fewer clicks", () => {
  test("a piece goes from the queue to done in one move, with one event per stage passed", async () => {
    const id = await inProduction("hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const moved = await movePiece(await w.actor(w.assistant.id), hat.id, "done");
    expect(moved.stage).toBe("done");
    const events = await eventsOf([hat.id]);
    expect(events.map((e) => `${e.fromStage}>${e.toStage}`)).toEqual(["queued>knitting", "knitting>embroidery", "embroidery>blocking", "blocking>finishing", "finishing>done"]);
    expect(events.every((e) => e.actorRole === "assistant")).toBe(true);
    // It left blocking on the way, so it is drying.
    const [row] = await db.select().from(pieces).where(eq(pieces.id, hat.id));
    expect(row.dryUntil).not.toBeNull();
  });

  test("all pieces of a commission move together, each through the stages between", async () => {
    const id = await inProduction();
    const [left, right] = await createPieces(await w.actor(w.owner.id), id, "pair");
    await movePiece(await w.actor(w.owner.id), left.id, "knitting");
    const r = await moveCommissionPieces(await w.actor(w.owner.id), id, "blocking");
    expect(r).toEqual({ moved: 2, total: 2 });
    const rows = await db.select().from(pieces).where(eq(pieces.commissionId, id));
    expect(rows.map((p) => p.stage)).toEqual(["blocking", "blocking"]);
    const events = await eventsOf([left.id, right.id]);
    expect(events.filter((e) => e.pieceId === left.id).map((e) => e.toStage)).toEqual(["knitting", "embroidery", "blocking"]);
    expect(events.filter((e) => e.pieceId === right.id).map((e) => e.toStage)).toEqual(["knitting", "embroidery", "blocking"]);
  });

  test("if one piece may not go, none moves and no event is written; the refusal names the piece and the rule", async () => {
    const id = await inProduction();
    const [left, right] = await createPieces(await w.actor(w.owner.id), id, "pair");
    const owner = await w.actor(w.owner.id);
    await movePiece(owner, left.id, "knitting");
    await movePiece(owner, right.id, "finishing");
    const before = (await eventsOf([left.id, right.id])).length;
    // Left would go forward to embroidery, right two stages back: refused as a whole.
    const err = await moveCommissionPieces(owner, id, "embroidery").catch((e: unknown) => e);
    expect(err).toMatchObject({ status: 409 });
    expect((err as Error).message).toMatch(/^Right mitten: A piece goes back only one stage/);
    expect((err as Error).message).toMatch(/Nothing was moved/);
    const rows = await db.select().from(pieces).where(eq(pieces.commissionId, id)).orderBy(asc(pieces.name));
    expect(rows.map((p) => [p.name, p.stage])).toEqual([
      ["Left mitten", "knitting"],
      ["Right mitten", "finishing"],
    ]);
    expect((await eventsOf([left.id, right.id])).length).toBe(before);
  });

  test("another studio's member, a client, or a paused commission cannot move the pieces", async () => {
    const id = await inProduction();
    await createPieces(await w.actor(w.owner.id), id, "pair");
    await expect(moveCommissionPieces(await w.actor(w.outsider.id), id, "knitting")).rejects.toMatchObject({ status: 404 });
    await expect(moveCommissionPieces(await w.actor(w.clientA.id), id, "knitting")).rejects.toMatchObject({ status: 404 });
    await db.update(commissions).set({ state: "paused", pausedFrom: "in_production" }).where(eq(commissions.id, id));
    await expect(moveCommissionPieces(await w.actor(w.owner.id), id, "knitting")).rejects.toMatchObject({ status: 409 });
    const rows = await db.select().from(pieces).where(eq(pieces.commissionId, id));
    expect(rows.every((p) => p.stage === "queued")).toBe(true);
  });
});
