import "server-only";
// Production: pieces per commission, stage moves with their audit rows, timers and manual time
// entries (one running timer per person, overlaps refused), and labour history on close.
import { and, asc, eq, inArray, isNull, ne, or, sql } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db";
import {
  commissions,
  labourHistory,
  pieceEvents,
  pieces,
  studioClients,
  studios,
  timeEntries,
  timeEntryEdits,
  user,
  type Piece,
  type TimeEntry,
} from "@/db/schema";
import type { PieceFeatures } from "@/lib/core/labour";
import {
  estimatePiece,
  findOverlap,
  getPieceLayout,
  pieceLayouts,
  timerFlag,
  timerMinutes,
  timerSeconds,
  type Garment,
  type PieceEstimateMap,
} from "@/lib/core/production";
import { pieceMovesFrom, piecePath, type PieceStage } from "@/lib/core/workflow/pieces";
import { TERMINAL_STATES, type CommissionState } from "@/lib/core/workflow/states";
import { WORK_STAGES, type ManualEntryInput, type WorkStageName } from "@/lib/schemas/production";
import { manualEntrySchema, editEntrySchema, pieceFeaturesEditSchema } from "@/lib/schemas/production";
import type { z } from "zod";
import { assertCan, memberRole, type Actor } from "./authz";
import { AppError, conflict, forbidden, notFound, nullIfNotFound } from "./errors";
import { getCommissionGarment } from "./garment";
import { getCommissionFor } from "./queries/commissions";
import { loadStudioSettings } from "./settings";
import { moveCommission, SYSTEM, type Mover } from "./workflow";

export type StageEstimateMap = PieceEstimateMap;

/** Commission states in which hours may be logged (rework after ready included). */
const LOGGABLE: readonly CommissionState[] = ["in_production", "ready", "balance_paid"];

function featuresForStorage(f: PieceFeatures): Record<string, number | boolean> {
  const out: Record<string, number | boolean> = {};
  for (const [k, v] of Object.entries(f)) if (typeof v === "number" || typeof v === "boolean") out[k] = v;
  return out;
}

// ——— pieces ———

async function lockCommission(tx: Tx, actor: Actor, commissionId: string) {
  const [c] = await tx.select().from(commissions).where(eq(commissions.id, commissionId)).for("update");
  if (!c || memberRole(actor, c.studioId) === null) throw notFound("That commission");
  return c;
}

/**
 * The garment's pieces for a commission about to be set up, loaded before any transaction (the
 * garment reads the sizing, the design and the settings through the pool).
 */
async function garmentPiecesFor(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId).catch(nullIfNotFound);
  if (!c || memberRole(actor, c.studioId) === null) throw notFound("That commission");
  assertCan(actor, "commission.work", c.studioId);
  const settings = await loadStudioSettings(c.studioId);
  const garment = await getCommissionGarment(c, { settings });
  return { pieces: garment.pieces, settings };
}

/** Creates the pieces of a commission (once): the garment's pieces. Owner or assistant; the commission is about to be, or is, in production. */
export async function createPieces(
  actor: Actor,
  commissionId: string,
  layoutId: string,
  opts: { tx?: Tx; prepared?: Awaited<ReturnType<typeof garmentPiecesFor>> } = {},
) {
  const prepared = opts.prepared ?? (await garmentPiecesFor(actor, commissionId));
  const run = async (tx: Tx) => {
    const c = await lockCommission(tx, actor, commissionId);
    assertCan(actor, "commission.work", c.studioId);
    if (!["proof_approved", "in_production"].includes(c.state)) {
      throw conflict("Pieces are set up when production starts (after the proof is approved).");
    }
    const existing = await tx.select({ id: pieces.id }).from(pieces).where(eq(pieces.commissionId, c.id)).limit(1);
    if (existing.length) throw conflict("This commission already has its pieces.");
    let layout;
    try {
      layout = getPieceLayout(c.garment as Garment, prepared.pieces, layoutId);
    } catch (err) {
      throw new AppError(422, "invalid_input", (err as Error).message, { layout: [(err as Error).message] });
    }
    const rows = layout.pieces.map((p, i) => {
      const { estimate, dryingHours } = estimatePiece(p.features, prepared.settings.rates, prepared.settings.p80Factors);
      return {
        studioId: c.studioId,
        commissionId: c.id,
        name: p.name,
        position: i,
        features: featuresForStorage(p.features),
        estimate,
        dryingHours,
      };
    });
    const created = await tx.insert(pieces).values(rows).returning();
    await tx.insert(pieceEvents).values(
      created.map((p) => ({ pieceId: p.id, actorUserId: actor.userId, actorRole: memberRole(actor, c.studioId)!, fromStage: null, toStage: "queued" as const })),
    );
    return created;
  };
  return opts.tx ? run(opts.tx) : db.transaction(run);
}

/** Starts production and creates the pieces in one transaction. */
export async function startProduction(actor: Actor, commissionId: string, layoutId: string) {
  const prepared = await garmentPiecesFor(actor, commissionId);
  return db.transaction(async (tx) => {
    const created = await createPieces(actor, commissionId, layoutId, { tx, prepared });
    const outcome = await moveCommission(actor, commissionId, "start_production", { tx, detail: { pieces: created.length, layout: layoutId } });
    return { outcome, pieces: created };
  });
}

async function loadPieceFor(actor: Actor, pieceId: string, tx: Executor = db, lock = false) {
  const q = tx
    .select({ piece: pieces, commissionState: commissions.state, commissionId: commissions.id, commissionCreatedAt: commissions.createdAt })
    .from(pieces)
    .innerJoin(commissions, eq(commissions.id, pieces.commissionId))
    .where(eq(pieces.id, pieceId));
  const [row] = lock ? await q.for("update", { of: pieces }) : await q;
  // Someone with no link to the studio gets the same answer as for a piece that does not exist.
  if (!row || memberRole(actor, row.piece.studioId) === null) throw notFound("That piece");
  return row;
}

const PIECE_STATUS = { forbidden: 403, not_in_production: 409, same_stage: 409, too_far_back: 409, unknown: 422 } as const;

type PieceRow = Awaited<ReturnType<typeof loadPieceFor>>["piece"];

/**
 * Takes one locked piece through `steps` (from piecePath), one piece event per stage passed, inside
 * the caller's transaction. A piece leaving blocking starts drying; its drying ends after the
 * piece's drying hours.
 */
async function stepPiece(tx: Tx, actor: Actor, role: NonNullable<ReturnType<typeof memberRole>>, piece: PieceRow, steps: PieceStage[]) {
  const now = new Date();
  let from = piece.stage;
  let dryUntil = piece.dryUntil;
  for (const [i, to] of steps.entries()) {
    if (from === "blocking" && to !== "embroidery") dryUntil = new Date(now.getTime() + piece.dryingHours * 3_600_000);
    // One transaction shares one now(): a millisecond apart keeps the stages passed in order.
    await tx.insert(pieceEvents).values({ pieceId: piece.id, actorUserId: actor.userId, actorRole: role, fromStage: from, toStage: to, at: new Date(now.getTime() + i) });
    from = to;
  }
  const [updated] = await tx.update(pieces).set({ stage: from, updatedAt: now, dryUntil }).where(eq(pieces.id, piece.id)).returning();
  return updated;
}

/**
 * Moves a piece to another stage (core rules), passing through every stage between (one piece
 * event each), all in one transaction: a refused step moves nothing.
 */
export async function movePiece(actor: Actor, pieceId: string, toStage: PieceStage) {
  return db.transaction(async (tx) => {
    const { piece, commissionState } = await loadPieceFor(actor, pieceId, tx, true);
    assertCan(actor, "commission.work", piece.studioId);
    const role = memberRole(actor, piece.studioId)!;
    const path = piecePath(piece.stage, toStage, role, { commissionState });
    if (!path.ok) throw new AppError(PIECE_STATUS[path.code], `piece_${path.code}`, path.reason);
    return stepPiece(tx, actor, role, piece, path.steps);
  });
}

/**
 * Moves every piece of a commission to one stage in one transaction (pieces already there stay).
 * If any piece may not go, nothing moves and the refusal names the piece and gives the core's reason.
 */
export async function moveCommissionPieces(actor: Actor, commissionId: string, toStage: PieceStage) {
  return db.transaction(async (tx) => {
    const [c] = await tx
      .select({ id: commissions.id, studioId: commissions.studioId, state: commissions.state })
      .from(commissions)
      .where(eq(commissions.id, commissionId))
      .for("update");
    if (!c || memberRole(actor, c.studioId) === null) throw notFound("That commission");
    assertCan(actor, "commission.work", c.studioId);
    const role = memberRole(actor, c.studioId)!;
    const rows = await tx.select().from(pieces).where(eq(pieces.commissionId, c.id)).orderBy(asc(pieces.createdAt), asc(pieces.id)).for("update");
    if (rows.length === 0) throw new AppError(409, "piece_none", "This commission has no pieces to move yet.");
    const moved = [];
    for (const piece of rows) {
      if (piece.stage === toStage) continue;
      const path = piecePath(piece.stage, toStage, role, { commissionState: c.state });
      if (!path.ok) throw new AppError(PIECE_STATUS[path.code], `piece_${path.code}`, `${piece.name}: ${path.reason} Nothing was moved.`);
      moved.push(await stepPiece(tx, actor, role, piece, path.steps));
    }
    return { moved: moved.length, total: rows.length };
  });
}

/** Marks a commission ready (all pieces done), through the workflow. */
export async function markCommissionReady(actor: Actor, commissionId: string) {
  return moveCommission(actor, commissionId, "mark_ready");
}

// ——— logged minutes ———

/** Counted minutes per piece and stage: stopped, not deleted, not awaiting confirmation. */
export async function loggedMinutesByPiece(pieceIds: string[], tx: Executor = db): Promise<Map<string, Record<string, number>>> {
  const out = new Map<string, Record<string, number>>();
  if (pieceIds.length === 0) return out;
  const rows = await tx
    .select({ pieceId: timeEntries.pieceId, stage: timeEntries.stage, minutes: sql<number>`sum(${timeEntries.minutes})::int` })
    .from(timeEntries)
    .where(
      and(
        inArray(timeEntries.pieceId, pieceIds),
        isNull(timeEntries.deletedAt),
        sql`${timeEntries.endedAt} is not null`,
        isNull(timeEntries.flag),
      ),
    )
    .groupBy(timeEntries.pieceId, timeEntries.stage);
  for (const r of rows) {
    const m = out.get(r.pieceId) ?? {};
    m[r.stage] = r.minutes;
    out.set(r.pieceId, m);
  }
  return out;
}

export interface RunningTimer {
  id: string;
  pieceId: string;
  pieceName: string;
  commissionId: string;
  commissionTitle: string;
  stage: WorkStageName;
  userId: string;
  userName: string;
  startedAt: string;
  paused: boolean;
  seconds: number;
}

async function runningTimers(where: ReturnType<typeof and>, now = new Date()): Promise<RunningTimer[]> {
  const rows = await db
    .select({
      entry: timeEntries,
      pieceName: pieces.name,
      commissionId: commissions.id,
      commissionTitle: commissions.title,
      userName: user.name,
    })
    .from(timeEntries)
    .innerJoin(pieces, eq(pieces.id, timeEntries.pieceId))
    .innerJoin(commissions, eq(commissions.id, pieces.commissionId))
    .innerJoin(user, eq(user.id, timeEntries.userId))
    .where(and(isNull(timeEntries.endedAt), isNull(timeEntries.deletedAt), where))
    .orderBy(asc(timeEntries.startedAt));
  return rows.map((r) => ({
    id: r.entry.id,
    pieceId: r.entry.pieceId,
    pieceName: r.pieceName,
    commissionId: r.commissionId,
    commissionTitle: r.commissionTitle,
    stage: r.entry.stage as WorkStageName,
    userId: r.entry.userId,
    userName: r.userName,
    startedAt: r.entry.startedAt.toISOString(),
    paused: r.entry.runningSince === null,
    seconds: timerSeconds(r.entry, now),
  }));
}

// ——— the board ———

export interface BoardPiece {
  id: string;
  name: string;
  stage: PieceStage;
  commissionId: string;
  commissionNumber: number;
  commissionTitle: string;
  commissionState: CommissionState;
  clientName: string;
  neededBy: string | null;
  estimate: StageEstimateMap;
  logged: Record<string, number>;
  estimateP50: number;
  estimateP80: number;
  loggedTotal: number;
  overP80: boolean;
  moves: PieceStage[];
  dryUntil: string | null;
  running: { userName: string; stage: string; paused: boolean }[];
}

export async function getBoard(actor: Actor, studioId: string) {
  assertCan(actor, "studio.view", studioId);
  const role = memberRole(actor, studioId)!;
  const rows = await db
    .select({ piece: pieces, c: commissions, clientName: studioClients.displayName })
    .from(pieces)
    .innerJoin(commissions, eq(commissions.id, pieces.commissionId))
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(and(eq(pieces.studioId, studioId), inArray(commissions.state, ["in_production", "ready", "balance_paid", "paused"])))
    .orderBy(sql`${commissions.neededBy} asc nulls last`, asc(commissions.number), asc(pieces.position));
  const logged = await loggedMinutesByPiece(rows.map((r) => r.piece.id));
  const timers = await runningTimers(and(eq(timeEntries.studioId, studioId)));
  const cards: BoardPiece[] = rows.map(({ piece, c, clientName }) => {
    const l = logged.get(piece.id) ?? {};
    const est = piece.estimate as StageEstimateMap;
    const estimateP50 = WORK_STAGES.reduce((s, st) => s + (est[st]?.p50 ?? 0), 0);
    const estimateP80 = WORK_STAGES.reduce((s, st) => s + (est[st]?.p80 ?? 0), 0);
    const loggedTotal = Object.values(l).reduce((s, m) => s + m, 0);
    return {
      id: piece.id,
      name: piece.name,
      stage: piece.stage,
      commissionId: c.id,
      commissionNumber: c.number,
      commissionTitle: c.title,
      commissionState: c.state,
      clientName,
      neededBy: c.neededBy,
      estimate: est,
      logged: l,
      estimateP50,
      estimateP80,
      loggedTotal,
      overP80: loggedTotal > estimateP80 || WORK_STAGES.some((st) => (l[st] ?? 0) > (est[st]?.p80 ?? Infinity)),
      moves: pieceMovesFrom(piece.stage, role, { commissionState: c.state }),
      dryUntil: piece.dryUntil ? piece.dryUntil.toISOString() : null,
      running: timers.filter((t) => t.pieceId === piece.id).map((t) => ({ userName: t.userName, stage: t.stage, paused: t.paused })),
    };
  });
  // Commissions that can start production, and ones in production still without pieces.
  const waitingRows = await db
    .select({
      id: commissions.id,
      studioId: commissions.studioId,
      number: commissions.number,
      title: commissions.title,
      garment: commissions.garment,
      brief: commissions.brief,
      sizing: commissions.sizing,
      state: commissions.state,
      neededBy: commissions.neededBy,
    })
    .from(commissions)
    .where(
      and(
        eq(commissions.studioId, studioId),
        inArray(commissions.state, ["proof_approved", "in_production"]),
        sql`not exists (select 1 from ${pieces} where ${pieces.commissionId} = ${commissions.id})`,
      ),
    )
    .orderBy(sql`${commissions.neededBy} asc nulls last`);
  // Each offers the ways its garment's own pieces can be tracked, with the estimate they will get.
  const settings = waitingRows.length ? await loadStudioSettings(studioId) : null;
  const waiting = [];
  for (const { brief, sizing, ...w } of waitingRows) {
    const garment = await getCommissionGarment({ ...w, brief, sizing }, { settings: settings! }).catch((e: Error) => e);
    const layouts =
      garment instanceof Error
        ? []
        : pieceLayouts(w.garment as Garment, garment.pieces).map((l) => ({
            id: l.id,
            label: l.label,
            pieces: l.pieces.map((p) => ({ name: p.name, ...estimatePiece(p.features, settings!.rates, settings!.p80Factors) })),
          }));
    waiting.push({ ...w, layouts, note: garment instanceof Error ? garment.message : garment.note });
  }
  // Commissions whose pieces are all done and can be marked ready.
  const byCommission = new Map<string, BoardPiece[]>();
  for (const card of cards) byCommission.set(card.commissionId, [...(byCommission.get(card.commissionId) ?? []), card]);
  const readyToMark = [...byCommission.values()]
    .filter((ps) => ps[0].commissionState === "in_production" && ps.every((p) => p.stage === "done"))
    .map((ps) => ({ id: ps[0].commissionId, number: ps[0].commissionNumber, title: ps[0].commissionTitle }));
  return { cards, waiting, readyToMark, role };
}

/** Pieces of one commission with estimate vs logged per stage. */
export async function getCommissionPieces(actor: Actor, commissionId: string) {
  const [c] = await db.select().from(commissions).where(eq(commissions.id, commissionId));
  if (!c || memberRole(actor, c.studioId) === null) throw notFound("That commission");
  const rows = await db.select().from(pieces).where(eq(pieces.commissionId, c.id)).orderBy(asc(pieces.position));
  const logged = await loggedMinutesByPiece(rows.map((p) => p.id));
  return rows.map((p) => ({ ...p, logged: logged.get(p.id) ?? {} }));
}

// ——— timers ———

async function studioTimeZone(studioId: string, tx: Executor = db): Promise<string> {
  const [s] = await tx.select({ tz: studios.timeZone }).from(studios).where(eq(studios.id, studioId));
  return s?.tz ?? "Europe/London";
}

function assertLoggable(state: CommissionState) {
  if (!LOGGABLE.includes(state)) {
    throw conflict("Hours are logged while the commission is in production (or being reworked before shipping).");
  }
}

export async function startTimer(actor: Actor, pieceId: string, stage: WorkStageName) {
  return db.transaction(async (tx) => {
    const { piece, commissionState } = await loadPieceFor(actor, pieceId, tx);
    assertCan(actor, "commission.work", piece.studioId);
    if (commissionState !== "in_production") throw conflict("Timers run only while the commission is in production.");
    if (piece.stage === "done") throw conflict("This piece is done; move it back a stage to log rework.");
    const [running] = await tx
      .select({ id: timeEntries.id })
      .from(timeEntries)
      .where(and(eq(timeEntries.userId, actor.userId), isNull(timeEntries.endedAt), isNull(timeEntries.deletedAt)))
      .for("update");
    if (running) throw conflict("You already have a timer running; stop it before starting another.");
    const now = new Date();
    try {
      const [entry] = await tx
        .insert(timeEntries)
        .values({ studioId: piece.studioId, pieceId: piece.id, stage, userId: actor.userId, source: "timer", startedAt: now, runningSince: now })
        .returning();
      return entry;
    } catch (err) {
      // The partial unique index catches a start racing another start of the same person.
      if ((err as { cause?: { code?: string }; code?: string }).cause?.code === "23505" || (err as { code?: string }).code === "23505") {
        throw conflict("You already have a timer running; stop it before starting another.");
      }
      throw err;
    }
  });
}

async function loadEntryFor(actor: Actor, entryId: string, tx: Tx) {
  const [entry] = await tx.select().from(timeEntries).where(and(eq(timeEntries.id, entryId), isNull(timeEntries.deletedAt))).for("update");
  if (!entry || memberRole(actor, entry.studioId) === null) throw notFound("That time entry");
  assertCan(actor, "commission.work", entry.studioId);
  // An assistant works on their own entries; the owner may correct anyone's in the studio.
  if (entry.userId !== actor.userId && memberRole(actor, entry.studioId) !== "owner") {
    throw forbidden("Only the person who logged this time, or the studio owner, can change it.");
  }
  return entry;
}

function snapshot(e: TimeEntry) {
  return {
    stage: e.stage,
    startedAt: e.startedAt.toISOString(),
    endedAt: e.endedAt?.toISOString() ?? null,
    minutes: e.minutes,
    note: e.note,
    flag: e.flag,
  };
}

/** Pause, resume or stop a running timer (from any device of the person). */
export async function changeTimer(actor: Actor, entryId: string, action: "pause" | "resume" | "stop", now = new Date()) {
  return db.transaction(async (tx) => {
    const entry = await loadEntryFor(actor, entryId, tx);
    if (entry.endedAt) throw conflict("This timer has already been stopped.");
    const banked = timerSeconds(entry, now);
    if (action === "pause") {
      if (!entry.runningSince) throw conflict("This timer is already paused.");
      const [e] = await tx
        .update(timeEntries)
        .set({ bankedSeconds: banked, runningSince: null, pausedAt: now, updatedAt: now })
        .where(eq(timeEntries.id, entry.id))
        .returning();
      return e;
    }
    if (action === "resume") {
      if (entry.runningSince) throw conflict("This timer is already running.");
      const [e] = await tx
        .update(timeEntries)
        .set({ runningSince: now, pausedAt: null, updatedAt: now })
        .where(eq(timeEntries.id, entry.id))
        .returning();
      return e;
    }
    const minutes = timerMinutes(entry, now);
    const flag = timerFlag(entry.startedAt, now, minutes, await studioTimeZone(entry.studioId, tx));
    const [e] = await tx
      .update(timeEntries)
      .set({ endedAt: now, minutes, bankedSeconds: banked, runningSince: null, pausedAt: null, flag, updatedAt: now })
      .where(eq(timeEntries.id, entry.id))
      .returning();
    return e;
  });
}

/** The actor's own running (or paused) timer in their studios, or null. */
export async function getMyTimer(actor: Actor): Promise<RunningTimer | null> {
  const studioIds = actor.memberships.map((m) => m.studioId);
  if (studioIds.length === 0) return null;
  const [t] = await runningTimers(and(eq(timeEntries.userId, actor.userId), inArray(timeEntries.studioId, studioIds)));
  return t ?? null;
}

/** What the phone view needs: my timer, and the pieces in progress with their current stage. */
export async function getLogView(actor: Actor, studioId: string) {
  assertCan(actor, "commission.work", studioId);
  const [timer] = await runningTimers(and(eq(timeEntries.userId, actor.userId), eq(timeEntries.studioId, studioId)));
  const rows = await db
    .select({ id: pieces.id, name: pieces.name, stage: pieces.stage, commissionTitle: commissions.title, commissionNumber: commissions.number })
    .from(pieces)
    .innerJoin(commissions, eq(commissions.id, pieces.commissionId))
    .where(and(eq(pieces.studioId, studioId), eq(commissions.state, "in_production"), ne(pieces.stage, "done")))
    .orderBy(sql`${commissions.neededBy} asc nulls last`, asc(commissions.number), asc(pieces.position));
  const logged = await loggedMinutesByPiece(rows.map((r) => r.id));
  const recent = await db
    .select({ id: timeEntries.id, pieceName: pieces.name, stage: timeEntries.stage, minutes: timeEntries.minutes, flag: timeEntries.flag, startedAt: timeEntries.startedAt })
    .from(timeEntries)
    .innerJoin(pieces, eq(pieces.id, timeEntries.pieceId))
    .where(and(eq(timeEntries.userId, actor.userId), eq(timeEntries.studioId, studioId), isNull(timeEntries.deletedAt), sql`${timeEntries.endedAt} is not null`))
    .orderBy(sql`${timeEntries.startedAt} desc`)
    .limit(8);
  return {
    timer: timer ?? null,
    pieces: rows.map((r) => ({
      ...r,
      // The stage the quick start offers: the piece's own, or knitting for a queued piece.
      workStage: (WORK_STAGES as readonly string[]).includes(r.stage) ? (r.stage as WorkStageName) : ("knitting" as const),
      logged: logged.get(r.id) ?? {},
    })),
    recent: recent.map((r) => ({ ...r, stage: r.stage as WorkStageName, startedAt: r.startedAt.toISOString() })),
  };
}

// ——— manual entries and edits ———

async function assertNoOverlap(tx: Tx, userId: string, start: Date, end: Date, exceptId?: string) {
  const others = await tx
    .select({ id: timeEntries.id, startedAt: timeEntries.startedAt, endedAt: timeEntries.endedAt })
    .from(timeEntries)
    .where(
      and(
        eq(timeEntries.userId, userId),
        isNull(timeEntries.deletedAt),
        exceptId ? ne(timeEntries.id, exceptId) : undefined,
        // Only entries that could touch the window.
        sql`${timeEntries.startedAt} < ${end.toISOString()}`,
        or(isNull(timeEntries.endedAt), sql`${timeEntries.endedAt} > ${start.toISOString()}`),
      ),
    );
  const now = new Date();
  const hit = findOverlap(
    { start, end },
    others.map((o) => ({ ...o, start: o.startedAt, end: o.endedAt ?? now })),
  );
  if (hit) {
    throw new AppError(409, "overlap", "This time overlaps another entry of yours; one person logs one thing at a time. Change the start or the minutes.", {
      startTime: ["Overlaps another entry of yours."],
    });
  }
}

/** The calendar day (YYYY-MM-DD) an instant falls on in a time zone. */
export function dayIn(instant: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat("en-GB", { timeZone, year: "numeric", month: "2-digit", day: "2-digit" }).formatToParts(instant);
  const g = (t: string) => parts.find((p) => p.type === t)?.value ?? "";
  return `${g("year")}-${g("month")}-${g("day")}`;
}

/** Wall-clock instant of a date and time in the studio's time zone. */
export function zonedInstant(date: string, time: string, timeZone: string): Date {
  const naive = new Date(`${date}T${time}:00Z`);
  // The zone's offset at that moment (two passes settle daylight-saving edges).
  let guess = naive.getTime();
  for (let i = 0; i < 2; i++) {
    const parts = new Intl.DateTimeFormat("en-GB", {
      timeZone,
      hourCycle: "h23",
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
    }).formatToParts(new Date(guess));
    const g = (t: string) => Number(parts.find((p) => p.type === t)?.value);
    const asUtc = Date.UTC(g("year"), g("month") - 1, g("day"), g("hour"), g("minute"), g("second"));
    guess = naive.getTime() - (asUtc - guess);
  }
  return new Date(guess);
}

export async function addManualEntry(actor: Actor, raw: ManualEntryInput | z.output<typeof manualEntrySchema>, now = new Date()) {
  const input = manualEntrySchema.parse(raw);
  return db.transaction(async (tx) => {
    const { piece, commissionState, commissionCreatedAt } = await loadPieceFor(actor, input.pieceId, tx);
    assertCan(actor, "commission.work", piece.studioId);
    assertLoggable(commissionState);
    const tz = await studioTimeZone(piece.studioId, tx);
    const start = zonedInstant(input.date, input.startTime, tz);
    const end = new Date(start.getTime() + input.minutes * 60_000);
    if (end.getTime() > now.getTime()) {
      throw new AppError(422, "in_future", "Time cannot be logged in the future; check the date, start time and minutes.", {
        date: ["This entry would end in the future."],
      });
    }
    // Work on a commission cannot have been done before the client asked for it (a mistyped year).
    const firstDay = zonedInstant(dayIn(commissionCreatedAt, tz), "00:00", tz);
    if (start.getTime() < firstDay.getTime()) {
      const requested = dayIn(commissionCreatedAt, tz);
      throw new AppError(422, "before_commission", `This commission was requested on ${requested}; time for it cannot be logged before that day.`, {
        date: [`Choose a day on or after ${requested}, when the commission was requested.`],
      });
    }
    await assertNoOverlap(tx, actor.userId, start, end);
    const [entry] = await tx
      .insert(timeEntries)
      .values({
        studioId: piece.studioId,
        pieceId: piece.id,
        stage: input.stage,
        userId: actor.userId,
        source: "manual",
        startedAt: start,
        endedAt: end,
        minutes: input.minutes,
        note: input.note,
      })
      .returning();
    await tx.insert(timeEntryEdits).values({ entryId: entry.id, editorUserId: actor.userId, before: null, after: snapshot(entry) });
    return entry;
  });
}

/** Corrects a stopped entry's minutes or note (and confirms a flagged timer); the change is audited. */
export async function editEntry(actor: Actor, entryId: string, raw: z.input<typeof editEntrySchema>) {
  const input = editEntrySchema.parse(raw);
  return db.transaction(async (tx) => {
    const entry = await loadEntryFor(actor, entryId, tx);
    if (!entry.endedAt) throw conflict("Stop the timer before changing its minutes.");
    const end = new Date(entry.startedAt.getTime() + input.minutes * 60_000);
    if (end.getTime() > Date.now() && input.minutes > entry.minutes) {
      throw new AppError(422, "in_future", "That many minutes would end in the future.", { minutes: ["Ends in the future."] });
    }
    if (input.minutes > entry.minutes) await assertNoOverlap(tx, entry.userId, entry.startedAt, end, entry.id);
    const [updated] = await tx
      .update(timeEntries)
      .set({
        minutes: input.minutes,
        // A manual entry, or a forgotten timer being confirmed, ends when its minutes end.
        endedAt: entry.source === "manual" || (entry.flag && input.confirm) ? end : entry.endedAt,
        note: input.note ?? entry.note,
        flag: input.confirm ? null : entry.flag,
        updatedAt: new Date(),
      })
      .where(eq(timeEntries.id, entry.id))
      .returning();
    await tx.insert(timeEntryEdits).values({ entryId: entry.id, editorUserId: actor.userId, before: snapshot(entry), after: snapshot(updated) });
    return updated;
  });
}

export async function deleteEntry(actor: Actor, entryId: string) {
  return db.transaction(async (tx) => {
    const entry = await loadEntryFor(actor, entryId, tx);
    const now = new Date();
    const [updated] = await tx.update(timeEntries).set({ deletedAt: now, updatedAt: now, endedAt: entry.endedAt ?? now, runningSince: null }).where(eq(timeEntries.id, entry.id)).returning();
    await tx.insert(timeEntryEdits).values({ entryId: entry.id, editorUserId: actor.userId, before: snapshot(entry), after: { deleted: true } });
    return updated;
  });
}

/** How long a deleted entry can be brought back with "Undo". */
export const ENTRY_UNDO_MINUTES = 30;

/** Brings back an entry deleted in the last half hour (the undo after a delete), audited like the delete. */
export async function restoreEntry(actor: Actor, entryId: string, now = new Date()) {
  return db.transaction(async (tx) => {
    const [entry] = await tx.select().from(timeEntries).where(eq(timeEntries.id, entryId)).for("update");
    if (!entry || memberRole(actor, entry.studioId) === null) throw notFound("That time entry");
    assertCan(actor, "commission.work", entry.studioId);
    if (entry.userId !== actor.userId && memberRole(actor, entry.studioId) !== "owner") {
      throw forbidden("Only the person who logged this time, or the studio owner, can change it.");
    }
    if (!entry.deletedAt) return entry; // restored already (a double click): nothing to do
    if (now.getTime() - entry.deletedAt.getTime() > ENTRY_UNDO_MINUTES * 60_000) {
      throw conflict(`An entry can be brought back within ${ENTRY_UNDO_MINUTES} minutes of deleting it; log the time again instead.`);
    }
    await assertNoOverlap(tx, entry.userId, entry.startedAt, entry.endedAt ?? now, entry.id);
    const [restored] = await tx.update(timeEntries).set({ deletedAt: null, updatedAt: now }).where(eq(timeEntries.id, entry.id)).returning();
    await tx.insert(timeEntryEdits).values({ entryId: entry.id, editorUserId: actor.userId, before: { deleted: true }, after: snapshot(restored) });
    return restored;
  });
}

/**
 * Owner or assistant: corrects a piece's labour features (a design changed after set-up, more
 * darning than planned) and re-estimates its stages with the studio's rates, in one transaction.
 * Logged hours are untouched; once the commission is closed (its history written for calibration),
 * declined or cancelled, its pieces no longer change.
 */
export async function updatePieceFeatures(actor: Actor, pieceId: string, raw: unknown) {
  const input = pieceFeaturesEditSchema.parse(raw);
  return db.transaction(async (tx) => {
    const { piece, commissionState } = await loadPieceFor(actor, pieceId, tx, true);
    assertCan(actor, "commission.work", piece.studioId);
    if ((TERMINAL_STATES as readonly string[]).includes(commissionState)) {
      throw conflict("This commission has finished; its pieces' features are kept as they were.");
    }
    const settings = await loadStudioSettings(piece.studioId, tx);
    // A drying time set for this piece at set-up is kept; the form does not show it.
    const kept = typeof piece.features.dryingHours === "number" ? { dryingHours: piece.features.dryingHours } : {};
    const features: PieceFeatures = { ...kept, ...input.features, label: piece.name };
    const { estimate, dryingHours } = estimatePiece(features, settings.rates, settings.p80Factors);
    const [updated] = await tx
      .update(pieces)
      .set({ features: featuresForStorage(features), estimate, dryingHours, updatedAt: new Date() })
      .where(eq(pieces.id, piece.id))
      .returning();
    return { piece: { id: updated.id, name: updated.name, features: updated.features, estimate: updated.estimate, dryingHours: updated.dryingHours } };
  });
}

/** A piece's entries (newest first) and estimate vs logged per stage, for the piece view. */
export async function getPieceDetail(actor: Actor, pieceId: string) {
  const { piece, commissionState } = await loadPieceFor(actor, pieceId);
  const entries = await db
    .select({ entry: timeEntries, userName: user.name })
    .from(timeEntries)
    .innerJoin(user, eq(user.id, timeEntries.userId))
    .where(and(eq(timeEntries.pieceId, piece.id), isNull(timeEntries.deletedAt)))
    .orderBy(sql`${timeEntries.startedAt} desc`);
  const logged = (await loggedMinutesByPiece([piece.id])).get(piece.id) ?? {};
  const now = new Date();
  const live: Record<string, number> = { ...logged };
  for (const { entry } of entries) {
    if (!entry.endedAt) live[entry.stage] = (live[entry.stage] ?? 0) + Math.floor(timerSeconds(entry, now) / 60);
  }
  return {
    piece: { id: piece.id, name: piece.name, stage: piece.stage, estimate: piece.estimate as StageEstimateMap, features: piece.features, commissionState },
    logged,
    live,
    entries: entries.map(({ entry, userName }) => ({
      id: entry.id,
      userId: entry.userId,
      userName,
      stage: entry.stage,
      source: entry.source,
      startedAt: entry.startedAt.toISOString(),
      endedAt: entry.endedAt?.toISOString() ?? null,
      minutes: entry.endedAt ? entry.minutes : Math.floor(timerSeconds(entry, now) / 60),
      running: !entry.endedAt,
      note: entry.note,
      flag: entry.flag,
    })),
  };
}

// ——— closing: history for calibration ———

/** Writes each piece's features and counted minutes to labour_history (once per piece). */
export async function recordLabourHistory(tx: Tx, commissionId: string): Promise<number> {
  const rows: Piece[] = await tx.select().from(pieces).where(eq(pieces.commissionId, commissionId));
  if (rows.length === 0) return 0;
  const done = await tx.select({ pieceId: labourHistory.pieceId }).from(labourHistory).where(inArray(labourHistory.pieceId, rows.map((p) => p.id)));
  const already = new Set(done.map((d) => d.pieceId));
  const logged = await loggedMinutesByPiece(rows.map((p) => p.id), tx);
  const fresh = rows.filter((p) => !already.has(p.id));
  if (fresh.length === 0) return 0;
  await tx.insert(labourHistory).values(
    fresh.map((p) => ({
      studioId: p.studioId,
      pieceId: p.id,
      features: p.features,
      loggedMinutes: logged.get(p.id) ?? {},
      estimatedMinutes: Object.fromEntries(Object.entries(p.estimate as StageEstimateMap).map(([s, e]) => [s, e.p50])),
    })),
  );
  return fresh.length;
}

/** Closes a commission (owner, or the system timer) and records its pieces' labour history in the same transaction. */
export async function closeCommission(mover: Mover, commissionId: string) {
  return db.transaction(async (tx) => {
    const outcome = await moveCommission(mover, commissionId, "close", { tx });
    const written = await recordLabourHistory(tx, commissionId);
    return { outcome, historyRows: written };
  });
}

export { SYSTEM };
