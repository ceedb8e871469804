// The studio's capacity plan: every piece's remaining work on the members' days, earliest due date first.
import { CapacityLedger } from "./capacity-ledger";
import { dayNumber, isoDate } from "./dates";
import { compareIds, placePiece, type PlacedPiece } from "./place-piece";
import type { CommissionPlan, PiecePlan, PlanInput, ScheduleBlock, SchedulePiece, SchedulePlan } from "./types";
import { checkDayStart, checkDue, checkMembers, checkPieces, checkToday } from "./validate-input";

/** Earliest due date first; ties by commission then piece id, so row order never changes the plan. */
export function comparePieces(a: SchedulePiece, b: SchedulePiece): number {
  return compareIds(a.due, b.due) || compareIds(a.commissionId, b.commissionId) || compareIds(a.id, b.id);
}

export function compareBlocks(a: ScheduleBlock, b: ScheduleBlock): number {
  return compareIds(a.date, b.date) || compareIds(a.memberId, b.memberId) || compareIds(a.start, b.start);
}

export function toPiecePlan(piece: SchedulePiece, placed: PlacedPiece): PiecePlan {
  const due = dayNumber(piece.due);
  return {
    pieceId: piece.id,
    commissionId: piece.commissionId,
    start: placed.start === null ? null : isoDate(placed.start),
    finish: placed.finish === null ? null : isoDate(placed.finish),
    dryUntil: placed.dryUntil === null ? null : isoDate(placed.dryUntil),
    due: piece.due,
    lateByDays: placed.finish === null ? 0 : Math.max(0, placed.finish - due),
    stages: placed.stages,
  };
}

export function toCommissionPlans(pieces: readonly PiecePlan[]): CommissionPlan[] {
  const byId = new Map<string, { finish: string | null; due: string }>();
  for (const p of pieces) {
    const c = byId.get(p.commissionId);
    if (!c) {
      byId.set(p.commissionId, { finish: p.finish, due: p.due });
      continue;
    }
    if (p.finish !== null && (c.finish === null || p.finish > c.finish)) c.finish = p.finish;
    if (p.due < c.due) c.due = p.due;
  }
  return [...byId].map(([commissionId, c]) => ({
    commissionId,
    finish: c.finish,
    due: c.due,
    lateByDays: c.finish === null ? 0 : Math.max(0, dayNumber(c.finish) - dayNumber(c.due)),
  }));
}

/**
 * Places every piece's remaining stages, earliest due date first, never above a member's minutes on
 * any day or in any week. Deterministic: the same input, in any order, gives the same plan.
 */
export function planSchedule(input: PlanInput): SchedulePlan {
  const dayStart = checkDayStart(input.dayStartHour);
  const today = checkToday(input.today);
  const members = checkMembers(input.members, dayStart);
  checkDue(input.pieces, "pieces");
  checkPieces(input.pieces, members, "pieces");

  const ledger = new CapacityLedger(input.members, members.daysOff);
  const index = new Map(input.pieces.map((p, i) => [p, i]));
  const order = [...input.pieces].sort(comparePieces);
  const blocks: ScheduleBlock[] = [];
  const pieces: PiecePlan[] = [];
  for (const piece of order) {
    const where = `pieces[${index.get(piece)}] ("${piece.id}")`;
    const placed = placePiece(ledger, piece, today, dayStart, members.available, where);
    blocks.push(...placed.blocks);
    pieces.push(toPiecePlan(piece, placed));
  }
  return { blocks: blocks.sort(compareBlocks), pieces, commissions: toCommissionPlans(pieces) };
}
