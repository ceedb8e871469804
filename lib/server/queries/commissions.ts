import "server-only";
import { and, asc, desc, eq, inArray, or, sql, type SQL } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { commissionEvents, commissions, messageReads, messages, studioClients, studios, user } from "@/db/schema";
import { assertCan, type Actor } from "../authz";
import { notFound } from "../errors";

/** Rows the actor may see: their studios' commissions, and their own as a client. */
function visibleTo(actor: Actor): SQL {
  const studioIds = actor.memberships.map((m) => m.studioId);
  const clientIds = actor.clientOf.map((c) => c.clientId);
  const parts: SQL[] = [];
  if (studioIds.length) parts.push(inArray(commissions.studioId, studioIds));
  if (clientIds.length) parts.push(inArray(commissions.clientId, clientIds));
  return parts.length ? (or(...parts) as SQL) : sql`false`;
}

const listColumns = {
  id: commissions.id,
  number: commissions.number,
  title: commissions.title,
  garment: commissions.garment,
  wearer: commissions.wearer,
  state: commissions.state,
  neededBy: commissions.neededBy,
  currency: commissions.currency,
  budgetMinor: commissions.budgetMinor,
  priceMinor: commissions.priceMinor,
  studioId: commissions.studioId,
  studioName: studios.name,
  studioSlug: studios.slug,
  clientName: studioClients.displayName,
  updatedAt: commissions.updatedAt,
};

export type CommissionListItem = Awaited<ReturnType<typeof listCommissionsFor>>[number];

export async function listCommissionsFor(actor: Actor, opts: { studioId?: string } = {}) {
  const where = opts.studioId ? and(visibleTo(actor), eq(commissions.studioId, opts.studioId)) : visibleTo(actor);
  // Messages from others since this person last opened the thread (as the thread itself counts them).
  const unread = sql<number>`(
    select count(*)::int from ${messages} m
    left join ${messageReads} r on r.commission_id = m.commission_id and r.user_id = ${actor.userId}
    where m.commission_id = ${commissions.id}
      and m.author_user_id is distinct from ${actor.userId}
      and (r.last_read_at is null or m.created_at > r.last_read_at)
  )`;
  return db
    .select({ ...listColumns, unread })
    .from(commissions)
    .innerJoin(studios, eq(studios.id, commissions.studioId))
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(where)
    .orderBy(asc(commissions.neededBy), desc(commissions.updatedAt));
}

/** One commission the actor may see, or a 404 (never a hint that it exists). */
export async function getCommissionFor(actor: Actor, id: string, q: Executor = db) {
  const [row] = await q
    .select({ ...listColumns, brief: commissions.brief, createdAt: commissions.createdAt })
    .from(commissions)
    .innerJoin(studios, eq(studios.id, commissions.studioId))
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .where(and(visibleTo(actor), eq(commissions.id, id)))
    .limit(1);
  if (!row) throw notFound("That commission");
  return row;
}

export async function getCommissionTimeline(actor: Actor, id: string) {
  const c = await getCommissionFor(actor, id);
  return db
    .select()
    .from(commissionEvents)
    .where(eq(commissionEvents.commissionId, c.id))
    .orderBy(asc(commissionEvents.at));
}

/** Owner only: set the agreed price. Written with an audit row in one transaction. */
export async function setCommissionPrice(actor: Actor, id: string, priceMinor: number) {
  const c = await getCommissionFor(actor, id);
  assertCan(actor, "commission.price", c.studioId);
  return db.transaction(async (tx) => {
    const [updated] = await tx
      .update(commissions)
      .set({ priceMinor, updatedAt: new Date() })
      .where(eq(commissions.id, c.id))
      .returning({ id: commissions.id, priceMinor: commissions.priceMinor, currency: commissions.currency });
    await tx.insert(commissionEvents).values({
      commissionId: c.id,
      actorUserId: actor.userId,
      actorRole: "owner",
      kind: "price_set",
      detail: { from: c.priceMinor, to: priceMinor },
    });
    return updated;
  });
}

/**
 * Who a commission's mail goes to and from: the client's address and name, the studio's name,
 * colour and contact address. No permission check: for server code that has already checked.
 */
export async function getCommissionMailParties(tx: Executor, commissionId: string) {
  const [row] = await tx
    .select({
      title: commissions.title,
      number: commissions.number,
      clientEmail: user.email,
      clientName: studioClients.displayName,
      studioName: studios.name,
      brandHex: studios.brandHex,
      contactEmail: studios.contactEmail,
    })
    .from(commissions)
    .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
    .innerJoin(user, eq(user.id, studioClients.userId))
    .innerJoin(studios, eq(studios.id, commissions.studioId))
    .where(eq(commissions.id, commissionId));
  if (!row) throw notFound("That commission");
  return row;
}
