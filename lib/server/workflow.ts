import "server-only";
// Commission state changes: the pure machine (lib/core/workflow) decides, this writes the change
// and its audit row in one transaction, with the commission row locked so racing moves serialise.
import { and, desc, eq, inArray } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db";
import { commissionEvents, commissions, payments, pieces, quoteVersions } from "@/db/schema";
import { canMove, type Move, type MoveContext, type Role } from "@/lib/core/workflow";
import type { CommissionState } from "@/lib/core/workflow/states";
import { memberRole, type Actor } from "./authz";
import { AppError, notFound } from "./errors";

export const SYSTEM = "system" as const;
export type Mover = Actor | typeof SYSTEM;

export interface MoveOutcome {
  commissionId: string;
  from: CommissionState;
  to: CommissionState;
  move: Move;
  role: Role;
}

/** The role this person plays on this commission, or null when it is none of theirs. */
export function roleOn(mover: Mover, c: { studioId: string; clientId: string }): Role | null {
  if (mover === SYSTEM) return "system";
  const member = memberRole(mover, c.studioId);
  if (member) return member;
  return mover.clientOf.some((x) => x.clientId === c.clientId) ? "client" : null;
}

/** Facts the guards need, read inside the same transaction (or from the pool, for display). */
export async function moveContextFor(tx: Executor, commissionId: string, pausedFrom: CommissionState | null): Promise<MoveContext> {
  const [latestQuote] = await tx
    .select({ status: quoteVersions.status })
    .from(quoteVersions)
    .where(eq(quoteVersions.commissionId, commissionId))
    .orderBy(desc(quoteVersions.number))
    .limit(1);
  const paidDeposit = await tx
    .select({ id: payments.id })
    .from(payments)
    .where(
      and(
        eq(payments.commissionId, commissionId),
        eq(payments.kind, "deposit"),
        inArray(payments.status, ["paid", "partially_refunded", "refunded"]),
      ),
    )
    .limit(1);
  const pieceRows = await tx.select({ stage: pieces.stage }).from(pieces).where(eq(pieces.commissionId, commissionId));
  return {
    quoteAccepted: latestQuote?.status === "accepted",
    depositPaid: paidDeposit.length > 0,
    pieces: pieceRows,
    pausedFrom,
  };
}

const STATUS_FOR = { not_from_state: 409, forbidden: 403, guard: 422, unknown: 400 } as const;

/**
 * Moves a commission. Pass `tx` to make the move part of a larger transaction (e.g. recording a
 * payment and booking the commission together).
 */
export async function moveCommission(
  mover: Mover,
  commissionId: string,
  move: Move,
  opts: { tx?: Tx; reason?: string; detail?: Record<string, unknown>; ctx?: Partial<MoveContext> } = {},
): Promise<MoveOutcome> {
  const run = async (tx: Tx): Promise<MoveOutcome> => {
    const [c] = await tx.select().from(commissions).where(eq(commissions.id, commissionId)).for("update");
    if (!c) throw notFound("That commission");
    const role = roleOn(mover, c);
    if (!role) throw notFound("That commission");
    const ctx = { ...(await moveContextFor(tx, c.id, c.pausedFrom)), ...opts.ctx };
    const result = canMove(c.state, move, role, ctx);
    if (!result.ok) throw new AppError(STATUS_FOR[result.code], `move_${result.code}`, result.reason);
    await tx
      .update(commissions)
      .set({
        state: result.to,
        pausedFrom: result.to === "paused" ? c.state : null,
        updatedAt: new Date(),
      })
      .where(eq(commissions.id, c.id));
    await tx.insert(commissionEvents).values({
      commissionId: c.id,
      actorUserId: mover === SYSTEM ? null : mover.userId,
      actorRole: role,
      kind: "state_changed",
      fromState: c.state,
      toState: result.to,
      detail: { move, ...(opts.reason ? { reason: opts.reason } : {}), ...opts.detail },
    });
    return { commissionId: c.id, from: c.state, to: result.to, move, role };
  };
  return opts.tx ? run(opts.tx) : db.transaction(run);
}
