import "server-only";
// Capacity and schedule: members' availability, the plan of every booked piece's remaining work,
// and the earliest date the studio can promise a new request (used by quotes).
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { commissions, memberAvailability, pieces, studioMembers, studios, timeEntries, user } from "@/db/schema";
import type { PieceFeatures } from "@/lib/core/labour";
import { estimatePiece, localDate, remainingMinutes, type Garment, type PieceEstimateMap } from "@/lib/core/production";
import {
  addDays,
  earliestPromiseDate,
  planSchedule,
  ScheduleInputError,
  WEEKDAYS,
  WORK_STAGES,
  type NewPiece,
  type ScheduleMember,
  type SchedulePiece,
  type SchedulePlan,
  type WorkStage,
} from "@/lib/core/schedule";
import { PIECE_STAGES, type PieceStage } from "@/lib/core/workflow/pieces";
import type { z } from "zod";
import type { availabilitySchema } from "@/lib/schemas/production";
import { assertCan, type Actor } from "./authz";
import { AppError, notFound } from "./errors";
import { getCommissionGarment, standardGarmentPieces } from "./garment";
import { loadStudioSettings } from "./settings";

/** Commissions whose work is still ahead: booked up to in production. */
export const BOOKED_STATES = ["booked", "designing", "proof_sent", "proof_approved", "in_production"] as const;

const DEFAULT_WEEKDAYS = [360, 360, 360, 360, 360, 0, 0];

export interface MemberAvailabilityView {
  memberId: string;
  userId: string;
  name: string;
  role: "owner" | "assistant";
  weekdayMinutes: number[];
  daysOff: string[];
  stages: WorkStage[];
}

async function loadMembers(studioId: string): Promise<MemberAvailabilityView[]> {
  const rows = await db
    .select({ m: studioMembers, name: user.name, a: memberAvailability })
    .from(studioMembers)
    .innerJoin(user, eq(user.id, studioMembers.userId))
    .leftJoin(memberAvailability, eq(memberAvailability.memberId, studioMembers.id))
    .where(eq(studioMembers.studioId, studioId))
    .orderBy(asc(studioMembers.createdAt));
  return rows.map(({ m, name, a }) => ({
    memberId: m.id,
    userId: m.userId,
    name,
    role: m.role,
    weekdayMinutes: a?.weekdayMinutes ?? DEFAULT_WEEKDAYS,
    daysOff: (a?.daysOff ?? []).map((d) => String(d).slice(0, 10)),
    stages: (a?.stages ?? []).filter((s): s is WorkStage => (WORK_STAGES as readonly string[]).includes(s)),
  }));
}

export async function getAvailability(actor: Actor, studioId: string) {
  assertCan(actor, "studio.view", studioId);
  return loadMembers(studioId);
}

/** Owner only: a member's weekday minutes, days off and stages. */
export async function updateAvailability(actor: Actor, studioId: string, input: z.output<typeof availabilitySchema>) {
  assertCan(actor, "studio.settings", studioId);
  const [m] = await db.select().from(studioMembers).where(and(eq(studioMembers.id, input.memberId), eq(studioMembers.studioId, studioId)));
  if (!m) throw notFound("That team member");
  const values = { weekdayMinutes: input.weekdayMinutes, daysOff: [...new Set(input.daysOff)].sort(), stages: input.stages };
  await db
    .insert(memberAvailability)
    .values({ memberId: m.id, ...values })
    .onConflictDoUpdate({ target: memberAvailability.memberId, set: values });
  return values;
}

function toScheduleMembers(members: MemberAvailabilityView[]): ScheduleMember[] {
  return members.map((m) => ({
    id: m.memberId,
    weekdayMinutes: Object.fromEntries(WEEKDAYS.map((d, i) => [d, m.weekdayMinutes[i] ?? 0])) as ScheduleMember["weekdayMinutes"],
    daysOff: m.daysOff,
  }));
}

function eligible(members: MemberAvailabilityView[], stage: WorkStage): string[] {
  return members.filter((m) => m.stages.length === 0 || m.stages.includes(stage)).map((m) => m.memberId);
}

export interface QueueLabel {
  pieceId: string;
  pieceName: string;
  commissionId: string;
  commissionNumber: number;
  commissionTitle: string;
  neededBy: string | null;
  planned: boolean;
}

/** Every booked piece's remaining stage minutes (P80 − logged, not below 0); commissions without pieces yet use their garment's pieces. */
async function loadQueue(studioId: string, members: MemberAvailabilityView[], today: string, now: Date) {
  const [studio] = await db.select({ leadTimeWeeks: studios.leadTimeWeeks }).from(studios).where(eq(studios.id, studioId));
  const settings = await loadStudioSettings(studioId);
  const booked = await db
    .select()
    .from(commissions)
    .where(and(eq(commissions.studioId, studioId), inArray(commissions.state, [...BOOKED_STATES])))
    .orderBy(asc(commissions.number));
  const pieceRows = booked.length
    ? await db.select().from(pieces).where(inArray(pieces.commissionId, booked.map((c) => c.id))).orderBy(asc(pieces.position))
    : [];
  const logged = new Map<string, Record<string, number>>();
  if (pieceRows.length) {
    const sums = await db
      .select({ pieceId: timeEntries.pieceId, stage: timeEntries.stage, minutes: sql<number>`sum(${timeEntries.minutes})::int` })
      .from(timeEntries)
      .where(and(inArray(timeEntries.pieceId, pieceRows.map((p) => p.id)), isNull(timeEntries.deletedAt), sql`${timeEntries.endedAt} is not null`, isNull(timeEntries.flag)))
      .groupBy(timeEntries.pieceId, timeEntries.stage);
    for (const s of sums) logged.set(s.pieceId, { ...(logged.get(s.pieceId) ?? {}), [s.stage]: s.minutes });
  }
  const queue: SchedulePiece[] = [];
  const labels: QueueLabel[] = [];
  const stagesFor = (estimate: PieceEstimateMap, stage: PieceStage, l: Record<string, number>) => {
    const at = PIECE_STAGES.indexOf(stage);
    const out: SchedulePiece["stages"] = {};
    for (const s of WORK_STAGES) {
      const minutes = PIECE_STAGES.indexOf(s) < at ? 0 : remainingMinutes(estimate[s], l[s] ?? 0);
      if (minutes > 0) out[s] = { minutes, memberIds: eligible(members, s) };
    }
    return out;
  };
  for (const c of booked) {
    const due = c.neededBy ?? addDays(today, (studio?.leadTimeWeeks ?? 6) * 7);
    const own = pieceRows.filter((p) => p.commissionId === c.id);
    const base = { commissionId: c.id, commissionNumber: c.number, commissionTitle: c.title, neededBy: c.neededBy };
    if (own.length) {
      for (const p of own) {
        if (p.stage === "done") continue;
        const blockingAhead = PIECE_STAGES.indexOf(p.stage) <= PIECE_STAGES.indexOf("blocking");
        const dryingLeft = blockingAhead ? p.dryingHours : p.dryUntil && p.dryUntil > now ? Math.ceil((p.dryUntil.getTime() - now.getTime()) / 3_600_000) : 0;
        queue.push({ id: p.id, commissionId: c.id, due, stages: stagesFor(p.estimate as PieceEstimateMap, p.stage, logged.get(p.id) ?? {}), dryingHours: dryingLeft });
        labels.push({ ...base, pieceId: p.id, pieceName: p.name, planned: false });
      }
    } else {
      // Not in production yet: the garment's own pieces (its sizing, its design) at the studio's rates.
      const garment = await getCommissionGarment(c, { settings });
      garment.pieces.forEach((f, i) => {
        const { estimate, dryingHours } = estimatePiece(f, settings.rates, settings.p80Factors);
        const id = `${c.id}:${i}`;
        queue.push({ id, commissionId: c.id, due, stages: stagesFor(estimate, "queued", {}), dryingHours });
        labels.push({ ...base, pieceId: id, pieceName: f.label ?? `Piece ${i + 1}`, planned: true });
      });
    }
  }
  return { queue, labels };
}

async function studioToday(studioId: string, now: Date): Promise<string> {
  const [s] = await db.select({ tz: studios.timeZone }).from(studios).where(eq(studios.id, studioId));
  if (!s) throw notFound("That studio");
  return localDate(now, s.tz);
}

export interface StudioSchedule {
  today: string;
  members: MemberAvailabilityView[];
  labels: QueueLabel[];
  plan: SchedulePlan | null;
  problem: string | null;
}

export async function getStudioSchedule(actor: Actor, studioId: string, now = new Date()): Promise<StudioSchedule> {
  assertCan(actor, "studio.view", studioId);
  const today = await studioToday(studioId, now);
  const members = await loadMembers(studioId);
  const { queue, labels } = await loadQueue(studioId, members, today, now);
  try {
    const plan = planSchedule({ today, members: toScheduleMembers(members), pieces: queue });
    return { today, members, labels, plan, problem: null };
  } catch (err) {
    if (err instanceof ScheduleInputError) return { today, members, labels, plan: null, problem: err.message };
    throw err;
  }
}

export interface PromisePieceInput {
  /** the piece's features for the labour model (e.g. from the design, or a garment's usual piece) */
  features: PieceFeatures;
  label?: string;
}

/** The pieces of a plain garment at a standard size, for a promise before any commission exists. */
export function newPiecesForGarment(garment: Garment): PromisePieceInput[] {
  return standardGarmentPieces(garment).map((features) => ({ features, label: features.label }));
}

/**
 * The earliest date the studio can promise a new request of these pieces, after everything booked.
 * For server code that has already checked who is asking (the quotes helper); add shipping on top.
 */
export async function getEarliestPromiseDate(
  studioId: string,
  newPieces: PromisePieceInput[],
  now = new Date(),
): Promise<{ date: string; today: string; pieces: { label?: string; start: string | null; finish: string | null }[] }> {
  const today = await studioToday(studioId, now);
  const members = await loadMembers(studioId);
  const settings = await loadStudioSettings(studioId);
  const { queue } = await loadQueue(studioId, members, today, now);
  const fresh: NewPiece[] = newPieces.map((p, i) => {
    const { estimate, dryingHours } = estimatePiece(p.features, settings.rates, settings.p80Factors);
    const stages: NewPiece["stages"] = {};
    for (const s of WORK_STAGES) {
      const minutes = estimate[s]?.p80 ?? 0;
      if (minutes > 0) stages[s] = { minutes, memberIds: eligible(members, s) };
    }
    return { id: `new-${i}`, stages, dryingHours };
  });
  try {
    const r = earliestPromiseDate({ today, members: toScheduleMembers(members), queue, newPieces: fresh });
    return { date: r.date, today, pieces: r.pieces.map((p, i) => ({ label: newPieces[i].label, start: p.start, finish: p.finish })) };
  } catch (err) {
    if (err instanceof ScheduleInputError) {
      throw new AppError(409, "schedule_unplannable", `The studio's hours cannot fit this work: ${err.message}`);
    }
    throw err;
  }
}
