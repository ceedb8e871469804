import "server-only";
// The commission's life cycle as the pages show it: the moves this person may make now (from the
// pure machine, with the facts read from the database) and a timeline in our own words.
import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { commissionEvents, user } from "@/db/schema";
import { MOVE_DONE, STATE_LABELS, clientFacingState, isMove, movesFrom, type AvailableMove, type Move } from "@/lib/core/workflow";
import type { Actor } from "../authz";
import { moveContextFor, roleOn } from "../workflow";
import { getCommissionFor } from "./commissions";

/** Moves that have their own place on the page (quotes, proofs, payments), so no generic button. */
const OWN_PLACE: ReadonlySet<Move> = new Set<Move>([
  "send_quote",
  "revise_quote",
  "accept_quote",
  "reopen_quote",
  "record_deposit",
  "expire_quote",
  "record_balance",
  "send_proof",
  "request_changes",
  "approve_proof",
  // Production has its own controls: setting up pieces, the shipment record and the labour history.
  "start_production",
  "ship",
  "close",
]);

export async function getAvailableMoves(actor: Actor, commissionId: string): Promise<AvailableMove[]> {
  const c = await getCommissionFor(actor, commissionId);
  const [row] = await db.query.commissions.findMany({ where: (t, { eq: e }) => e(t.id, c.id), columns: { pausedFrom: true, clientId: true, studioId: true }, limit: 1 });
  const role = roleOn(actor, row);
  if (!role) return [];
  const ctx = await moveContextFor(db, c.id, row.pausedFrom);
  return movesFrom(c.state, role, ctx).filter((m) => !OWN_PLACE.has(m.move));
}

export interface TimelineEntry {
  id: string;
  at: Date;
  title: string;
  who: string;
  reason: string | null;
}

/** The audit trail in words; `forClient` hides studio-only steps and names the studio as a whole. */
export async function getLifecycleTimeline(actor: Actor, commissionId: string, forClient: boolean): Promise<TimelineEntry[]> {
  const c = await getCommissionFor(actor, commissionId);
  const rows = await db
    .select({ e: commissionEvents, name: user.name })
    .from(commissionEvents)
    .leftJoin(user, eq(user.id, commissionEvents.actorUserId))
    .where(eq(commissionEvents.commissionId, c.id))
    .orderBy(asc(commissionEvents.at));
  const out: TimelineEntry[] = [];
  for (const { e, name } of rows) {
    const move = isMove(e.detail.move) ? e.detail.move : null;
    let title: string;
    if (e.kind === "requested") title = "Request sent";
    else if (e.kind === "price_set") title = "Price set";
    else if (e.toState) {
      const to = forClient ? clientFacingState(e.toState) : e.toState;
      if (forClient && e.fromState && clientFacingState(e.fromState) === to && move !== "accept_quote") continue;
      title = move ? MOVE_DONE[move] : STATE_LABELS[to];
    } else if (forClient) continue;
    else title = e.kind.replace(/_/g, " ");
    if (forClient && e.kind === "price_set") continue;
    const who =
      e.actorRole === "system"
        ? "Automatic"
        : e.actorRole === "client"
          ? forClient ? "You" : (name ?? "The client")
          : forClient ? c.studioName : `${name ?? "Studio"} (${e.actorRole})`;
    const reason = typeof e.detail.reason === "string" ? e.detail.reason : null;
    out.push({ id: e.id, at: e.at, title, who, reason });
  }
  return out;
}
