import { and, eq, isNull } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { POST as postRestore } from "@/app/api/production/entries/[id]/restore/route";
import { DELETE as deleteEntryRoute, PATCH as patchEntry } from "@/app/api/production/entries/[id]/route";
import { POST as postEntry } from "@/app/api/production/entries/route";
import { POST as postMove } from "@/app/api/production/pieces/[id]/move/route";
import { PATCH as patchTimer } from "@/app/api/production/timers/[id]/route";
import { GET as getTimer, POST as postTimer } from "@/app/api/production/timers/route";
import { db } from "@/db";
import { commissionEvents, commissions, labourHistory, pieceEvents, pieces, timeEntries, timeEntryEdits } from "@/db/schema";
import {
  changeTimer,
  closeCommission,
  createPieces,
  loggedMinutesByPiece,
  markCommissionReady,
  movePiece,
  startProduction,
  startTimer,
} from "@/lib/server/production";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};
const ctx = (id: string) => ({ params: Promise.resolve({ id }) });

async function call(handler: (r: Request, c: { params: Promise<Record<string, string>> }) => Promise<Response>, jar: Jar | null, url: string, method: string, id = "", body?: unknown) {
  const res = await handler(
    requestWith(jar, url, { method, headers: body ? { "content-type": "application/json" } : undefined, body: body ? JSON.stringify(body) : undefined }),
    ctx(id),
  );
  return { status: res.status, body: await res.json() };
}

/** A fresh commission of the world's studio, put straight into a state for the test. */
async function commissionIn(state: "proof_approved" | "in_production" | "delivered", garment: "mittens" | "hat" = "mittens") {
  const [c] = await db
    .insert(commissions)
    // Requested a month ago, so entries dated in the last days fall after the request.
    .values({ studioId: w.studioId, clientId: w.clientA.clientId, number: 100 + Math.floor(Math.random() * 1e6), title: "Test piece work", garment, currency: "GBP", state, createdAt: new Date(Date.now() - 30 * 86_400_000) })
    .returning();
  return c.id;
}

beforeAll(async () => {
  w = await makeWorld();
  jars.owner = await signIn(w.owner.email);
  jars.ownerPhone = await signIn(w.owner.email);
  jars.assistant = await signIn(w.assistant.email);
  jars.outsider = await signIn(w.outsider.email);
  jars.client = await signIn(w.clientA.email);
});

describe("pieces and the board", () => {
  test("starting production creates a pair of mittens as two pieces with estimates, in one transaction", async () => {
    const id = await commissionIn("proof_approved");
    const { outcome, pieces: created } = await startProduction(await w.actor(w.assistant.id), id, "pair");
    expect(outcome.to).toBe("in_production");
    expect(created.map((p) => p.name)).toEqual(["Left mitten", "Right mitten"]);
    for (const p of created) {
      expect(p.stage).toBe("queued");
      expect(p.estimate.knitting.p80).toBeGreaterThan(p.estimate.knitting.p50);
      expect(p.estimate.knitting.p50).toBeGreaterThan(0);
    }
    // A second set is refused and nothing is added.
    await expect(createPieces(await w.actor(w.owner.id), id, "pair")).rejects.toMatchObject({ status: 409 });
    expect((await db.select().from(pieces).where(eq(pieces.commissionId, id))).length).toBe(2);
  });

  test("a bad layout or a commission not yet approved is refused and nothing is written", async () => {
    const early = await commissionIn("proof_approved", "hat");
    // "single" was a mitten layout; a hat is tracked as its garment's one piece.
    await expect(startProduction(await w.actor(w.owner.id), early, "single")).rejects.toMatchObject({ status: 422 });
    const [c] = await db.select().from(commissions).where(eq(commissions.id, early));
    expect(c.state).toBe("proof_approved");
    expect((await db.select().from(pieces).where(eq(pieces.commissionId, early))).length).toBe(0);
  });

  test("the assistant moves a piece forward with an event row; backwards past the queue or two stages is refused", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const r1 = await call(postMove, jars.assistant, `/api/production/pieces/${hat.id}/move`, "POST", hat.id, { toStage: "knitting" });
    expect(r1.status).toBe(200);
    expect(r1.body.piece.stage).toBe("knitting");
    const events = await db.select().from(pieceEvents).where(eq(pieceEvents.pieceId, hat.id));
    expect(events.map((e) => [e.fromStage, e.toStage, e.actorRole])).toContainEqual(["queued", "knitting", "assistant"]);
    const back = await call(postMove, jars.assistant, `/api/production/pieces/${hat.id}/move`, "POST", hat.id, { toStage: "queued" });
    expect(back.status).toBe(409);
    expect(back.body.error.message).toMatch(/cannot go back to the queue/);
    await movePiece(await w.actor(w.owner.id), hat.id, "blocking");
    const twoBack = await call(postMove, jars.owner, `/api/production/pieces/${hat.id}/move`, "POST", hat.id, { toStage: "knitting" });
    expect(twoBack.status).toBe(409);
    const [after] = await db.select().from(pieces).where(eq(pieces.id, hat.id));
    expect(after.stage).toBe("blocking");
  });

  test("someone of another studio, or a client, gets 404 for a piece; a commission not in production refuses moves", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    expect((await call(postMove, jars.outsider, "/x", "POST", hat.id, { toStage: "knitting" })).status).toBe(404);
    expect((await call(postMove, jars.client, "/x", "POST", hat.id, { toStage: "knitting" })).status).toBe(404);
    await db.update(commissions).set({ state: "paused", pausedFrom: "in_production" }).where(eq(commissions.id, id));
    expect((await call(postMove, jars.owner, "/x", "POST", hat.id, { toStage: "knitting" })).status).toBe(409);
  });

  test("the commission can be marked ready only when every piece is done", async () => {
    const id = await commissionIn("in_production");
    const [left, right] = await createPieces(await w.actor(w.owner.id), id, "pair");
    const assistant = await w.actor(w.assistant.id);
    await movePiece(assistant, left.id, "done");
    await expect(markCommissionReady(assistant, id)).rejects.toMatchObject({ status: 422 });
    await movePiece(assistant, right.id, "done");
    expect((await markCommissionReady(assistant, id)).to).toBe("ready");
  });
});

describe("timers and time entries", () => {
  test("a timer started in one session is seen running from another, paused there and stopped in the first", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const started = await call(postTimer, jars.owner, "/api/production/timers", "POST", "", { pieceId: hat.id, stage: "knitting" });
    expect(started.status).toBe(201);
    const seen = await call(getTimer, jars.ownerPhone, "/api/production/timers", "GET");
    expect(seen.body.timer).toMatchObject({ pieceId: hat.id, stage: "knitting", paused: false });
    const entryId = seen.body.timer.id as string;
    // One running timer per person: a second start is refused from any device.
    const second = await call(postTimer, jars.ownerPhone, "/api/production/timers", "POST", "", { pieceId: hat.id, stage: "embroidery" });
    expect(second.status).toBe(409);
    expect((await call(patchTimer, jars.ownerPhone, "/x", "PATCH", entryId, { action: "pause" })).body.entry.paused).toBe(true);
    expect((await call(getTimer, jars.owner, "/api/production/timers", "GET")).body.timer.paused).toBe(true);
    expect((await call(patchTimer, jars.owner, "/x", "PATCH", entryId, { action: "resume" })).status).toBe(200);
    const stopped = await call(patchTimer, jars.owner, "/x", "PATCH", entryId, { action: "stop" });
    expect(stopped.status).toBe(200);
    expect(stopped.body.entry.endedAt).not.toBeNull();
    expect((await call(getTimer, jars.ownerPhone, "/api/production/timers", "GET")).body.timer).toBeNull();
    // Stopping twice is refused.
    expect((await call(patchTimer, jars.ownerPhone, "/x", "PATCH", entryId, { action: "stop" })).status).toBe(409);
  });

  test("a timer's paused time is not counted", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const owner = await w.actor(w.owner.id);
    const e = await startTimer(owner, hat.id, "knitting");
    const t0 = e.startedAt.getTime();
    await changeTimer(owner, e.id, "pause", new Date(t0 + 30 * 60_000));
    await changeTimer(owner, e.id, "resume", new Date(t0 + 90 * 60_000));
    const stopped = await changeTimer(owner, e.id, "stop", new Date(t0 + 105 * 60_000));
    expect(stopped.minutes).toBe(45);
  });

  test("a timer left running overnight is flagged, not counted, until its minutes are confirmed (audited)", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const assistant = await w.actor(w.assistant.id);
    const e = await startTimer(assistant, hat.id, "embroidery");
    // Started at 20:00 two days ago (London), stopped now.
    const evening = new Date(Date.now() - 2 * 86_400_000);
    evening.setUTCHours(20, 0, 0, 0);
    await db.update(timeEntries).set({ startedAt: evening, runningSince: evening }).where(eq(timeEntries.id, e.id));
    const stopped = await changeTimer(assistant, e.id, "stop");
    expect(stopped.flag).toBe("overnight");
    expect(stopped.minutes).toBeGreaterThan(24 * 60);
    expect((await loggedMinutesByPiece([hat.id])).get(hat.id)?.embroidery ?? 0).toBe(0);
    const fixed = await call(patchEntry, jars.assistant, "/x", "PATCH", e.id, { minutes: 90, confirm: true });
    expect(fixed.status).toBe(200);
    expect(fixed.body.entry.flag).toBeNull();
    expect((await loggedMinutesByPiece([hat.id])).get(hat.id)?.embroidery).toBe(90);
    const edits = await db.select().from(timeEntryEdits).where(eq(timeEntryEdits.entryId, e.id));
    expect(edits).toHaveLength(1);
    expect(edits[0].before).toMatchObject({ flag: "overnight" });
    expect(edits[0].after).toMatchObject({ minutes: 90, flag: null });
  });

  test("manual entries: negative, future and overlapping time is refused; another studio's piece is 404", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const day = new Date(Date.now() - 3 * 86_400_000).toISOString().slice(0, 10);
    const entry = (over: Record<string, unknown>) => ({ pieceId: hat.id, stage: "knitting", date: day, startTime: "10:00", minutes: 60, note: "", ...over });
    const ok = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({}));
    expect(ok.status).toBe(201);
    const neg = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({ minutes: -30, startTime: "14:00" }));
    expect(neg.status).toBe(422);
    expect(neg.body.error.fieldErrors.minutes[0]).toMatch(/1 or more/);
    const future = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({ date: new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10) }));
    expect(future.status).toBe(422);
    expect(future.body.error.message).toMatch(/future/);
    // A mistyped year: before the commission was requested (and before the schema's window).
    const early = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({ date: new Date(Date.now() - 40 * 86_400_000).toISOString().slice(0, 10) }));
    expect(early.status).toBe(422);
    expect(early.body.error.fieldErrors.date[0]).toMatch(/on or after/);
    const ancient = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({ date: "1999-01-01" }));
    expect(ancient.status).toBe(422);
    const overlap = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({ startTime: "10:30" }));
    expect(overlap.status).toBe(409);
    expect(overlap.body.error.message).toMatch(/overlaps/);
    // Touching end to start is not an overlap; another person at the same time is fine.
    expect((await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", entry({ startTime: "11:00", minutes: 15 }))).status).toBe(201);
    expect((await call(postEntry, jars.owner, "/api/production/entries", "POST", "", entry({ startTime: "10:30" }))).status).toBe(201);
    const other = await call(postEntry, jars.outsider, "/api/production/entries", "POST", "", entry({ startTime: "16:00" }));
    expect(other.status).toBe(404);
    expect((await call(postTimer, jars.outsider, "/x", "POST", "", { pieceId: hat.id, stage: "knitting" })).status).toBe(404);
    const rows = await db.select().from(timeEntries).where(and(eq(timeEntries.pieceId, hat.id), isNull(timeEntries.deletedAt)));
    expect(rows.map((r) => r.minutes).sort((a, b) => a - b)).toEqual([15, 60, 60]);
  });

  test("an assistant cannot change the owner's entry (403); the owner can correct the assistant's", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const day = new Date(Date.now() - 8 * 86_400_000).toISOString().slice(0, 10);
    const mine = await call(postEntry, jars.owner, "/api/production/entries", "POST", "", { pieceId: hat.id, stage: "finishing", date: day, startTime: "08:00", minutes: 20 });
    const theirs = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", { pieceId: hat.id, stage: "finishing", date: day, startTime: "08:00", minutes: 25 });
    expect(theirs.status).toBe(201);
    expect((await call(patchEntry, jars.assistant, "/x", "PATCH", mine.body.entry.id, { minutes: 5 })).status).toBe(403);
    expect((await call(patchEntry, jars.owner, "/x", "PATCH", theirs.body.entry.id, { minutes: 30 })).status).toBe(200);
  });

  test("a deleted entry can be brought back within the undo window, once, by whom could delete it", async () => {
    const id = await commissionIn("in_production", "hat");
    const [hat] = await createPieces(await w.actor(w.owner.id), id, "one");
    const day = new Date(Date.now() - 6 * 86_400_000).toISOString().slice(0, 10);
    const made = await call(postEntry, jars.assistant, "/api/production/entries", "POST", "", { pieceId: hat.id, stage: "knitting", date: day, startTime: "13:00", minutes: 45 });
    const entryId = made.body.entry.id as string;
    const live = async () => (await db.select().from(timeEntries).where(and(eq(timeEntries.pieceId, hat.id), isNull(timeEntries.deletedAt)))).length;
    expect((await call(deleteEntryRoute, jars.assistant, "/x", "DELETE", entryId)).status).toBe(200);
    expect(await live()).toBe(0);
    expect((await call(postRestore, jars.outsider, "/x", "POST", entryId)).status).toBe(404);
    const back = await call(postRestore, jars.assistant, "/x", "POST", entryId);
    expect(back.status).toBe(200);
    expect(back.body.entry.minutes).toBe(45);
    expect(await live()).toBe(1);
    // A second undo (a double click) changes nothing.
    expect((await call(postRestore, jars.assistant, "/x", "POST", entryId)).status).toBe(200);
    expect(await live()).toBe(1);
    // Deleted long ago: refused with a reason, the entry stays deleted.
    await call(deleteEntryRoute, jars.assistant, "/x", "DELETE", entryId);
    await db.update(timeEntries).set({ deletedAt: new Date(Date.now() - 31 * 60_000) }).where(eq(timeEntries.id, entryId));
    const late = await call(postRestore, jars.assistant, "/x", "POST", entryId);
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/within 30 minutes/);
    expect(await live()).toBe(0);
    const audit = await db.select().from(timeEntryEdits).where(eq(timeEntryEdits.entryId, entryId));
    expect(audit.map((a) => a.after)).toContainEqual(expect.objectContaining({ minutes: 45 }));
  });
});

describe("closing a commission", () => {
  test("close writes each piece's features and counted minutes to labour_history, once", async () => {
    const id = await commissionIn("in_production");
    const [left, right] = await createPieces(await w.actor(w.owner.id), id, "pair");
    const day = new Date(Date.now() - 5 * 86_400_000).toISOString().slice(0, 10);
    const owner = await w.actor(w.owner.id);
    const { addManualEntry } = await import("@/lib/server/production");
    await addManualEntry(owner, { pieceId: left.id, stage: "knitting", date: day, startTime: "09:00", minutes: 400 });
    await addManualEntry(owner, { pieceId: left.id, stage: "finishing", date: day, startTime: "17:00", minutes: 25 });
    await addManualEntry(owner, { pieceId: right.id, stage: "knitting", date: day, startTime: "16:00", minutes: 55 });
    await db.update(commissions).set({ state: "delivered" }).where(eq(commissions.id, id));
    // Only the owner (or the system) closes.
    await expect(closeCommission(await w.actor(w.assistant.id), id)).rejects.toMatchObject({ status: 403 });
    expect((await db.select().from(labourHistory).where(eq(labourHistory.pieceId, left.id))).length).toBe(0);
    const { historyRows } = await closeCommission(owner, id);
    expect(historyRows).toBe(2);
    const [h] = await db.select().from(labourHistory).where(eq(labourHistory.pieceId, left.id));
    expect(h.loggedMinutes).toEqual({ knitting: 400, finishing: 25 });
    expect(h.features.plainStitches).toBeGreaterThan(0);
    expect(h.estimatedMinutes.knitting).toBe(left.estimate.knitting.p50);
    const events = await db.select().from(commissionEvents).where(eq(commissionEvents.commissionId, id));
    expect(events.map((e) => e.toState)).toContain("closed");
  });
});
