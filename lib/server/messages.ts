import "server-only";
// The message thread of a commission: the studio's members and the client. A send carries the
// sender's own key, so a retry after a lost answer is stored once; reading marks the thread read.
import { and, asc, count, eq, inArray, isNull, sql } from "drizzle-orm";
import { db } from "@/db";
import { commissions, messageReads, messages, studios, uploads, user } from "@/db/schema";
import type { PostMessageInput, Thread, ThreadMessage } from "@/lib/schemas/messages";
import type { Actor } from "./authz";
import { notFound } from "./errors";
import { notify } from "./notifications";
import { getCommissionFor } from "./queries/commissions";
import { roleOn } from "./workflow";

async function participant(actor: Actor, commissionId: string) {
  const c = await getCommissionFor(actor, commissionId);
  const [row] = await db.select({ clientId: commissions.clientId, studioId: commissions.studioId }).from(commissions).where(eq(commissions.id, c.id));
  const role = roleOn(actor, row);
  if (!role || role === "system") throw notFound("That commission");
  return { c, role, clientId: row.clientId };
}

async function unreadFor(userId: string, commissionId: string): Promise<number> {
  const [r] = await db
    .select({ n: count() })
    .from(messages)
    .leftJoin(messageReads, and(eq(messageReads.commissionId, messages.commissionId), eq(messageReads.userId, userId)))
    .where(
      and(
        eq(messages.commissionId, commissionId),
        sql`${messages.authorUserId} is distinct from ${userId}`,
        sql`(${messageReads.lastReadAt} is null or ${messages.createdAt} > ${messageReads.lastReadAt})`,
      ),
    );
  return Number(r?.n ?? 0);
}

async function markRead(userId: string, commissionId: string) {
  await db
    .insert(messageReads)
    .values({ userId, commissionId, lastReadAt: new Date() })
    .onConflictDoUpdate({ target: [messageReads.userId, messageReads.commissionId], set: { lastReadAt: sql`greatest(${messageReads.lastReadAt}, now())` } });
}

export async function getThread(actor: Actor, commissionId: string, opts: { markRead?: boolean } = {}): Promise<Thread> {
  const { c, role } = await participant(actor, commissionId);
  const unread = await unreadFor(actor.userId, c.id);
  const rows = await db
    .select({ m: messages, name: user.name })
    .from(messages)
    .leftJoin(user, eq(user.id, messages.authorUserId))
    .where(eq(messages.commissionId, c.id))
    .orderBy(asc(messages.createdAt), asc(messages.id));
  const ids = rows.map((r) => r.m.id);
  const files = ids.length
    ? await db
        .select({ id: uploads.id, messageId: uploads.messageId, width: uploads.width, height: uploads.height })
        .from(uploads)
        .where(and(inArray(uploads.messageId, ids), ...(role === "client" ? [eq(uploads.sharedWithClient, true)] : [])))
    : [];
  const list: ThreadMessage[] = rows.map(({ m, name }) => ({
    id: m.id,
    clientKey: m.clientKey,
    body: m.body,
    authorName: m.authorRole === "client" ? (name ?? c.clientName) : `${name ?? "Studio"} (${c.studioName})`,
    authorRole: m.authorRole,
    mine: m.authorUserId === actor.userId,
    createdAt: m.createdAt.toISOString(),
    attachments: files
      .filter((f) => f.messageId === m.id)
      .map((f) => ({ id: f.id, width: f.width, height: f.height, thumbUrl: `/api/uploads/${f.id}?size=thumb`, url: `/api/uploads/${f.id}` })),
  }));
  if (opts.markRead !== false) await markRead(actor.userId, c.id);
  return { messages: list, unread };
}

export async function unreadCount(actor: Actor, commissionId: string): Promise<number> {
  const { c } = await participant(actor, commissionId);
  return unreadFor(actor.userId, c.id);
}

export async function postMessage(actor: Actor, commissionId: string, input: PostMessageInput): Promise<{ id: string; created: boolean }> {
  const { c, role } = await participant(actor, commissionId);
  return db.transaction(async (tx) => {
    const [made] = await tx
      .insert(messages)
      .values({ commissionId: c.id, authorUserId: actor.userId, authorRole: role, body: input.body, clientKey: input.clientKey })
      .onConflictDoNothing({ target: [messages.commissionId, messages.clientKey] })
      .returning({ id: messages.id });
    if (!made) {
      const [again] = await tx.select({ id: messages.id }).from(messages).where(and(eq(messages.commissionId, c.id), eq(messages.clientKey, input.clientKey)));
      return { id: again.id, created: false };
    }
    if (input.uploadIds.length) {
      await tx
        .update(uploads)
        .set({ messageId: made.id })
        .where(and(inArray(uploads.id, input.uploadIds), eq(uploads.commissionId, c.id), eq(uploads.uploadedBy, actor.userId), isNull(uploads.messageId)));
    }
    const [s] = await tx.select().from(studios).where(eq(studios.id, c.studioId));
    const excerpt = input.body ? (input.body.length > 300 ? `${input.body.slice(0, 300)}…` : input.body) : "(a photo)";
    const who = role === "client" ? c.clientName : s.name;
    await notify(tx, {
      ...(role === "client" ? ({ to: "studio", kind: "client_message" } as const) : ({ to: "client", kind: "studio_message" } as const)),
      studioId: s.id, commissionId: c.id, key: `message:${made.id}`, actorUserId: actor.userId, replyTo: role === "client" ? actor.email : s.contactEmail,
      link: `/${role === "client" ? "studio" : "portal"}/commissions/${c.id}#messages`, title: `New message from ${who} about ${c.title}`, body: excerpt,
    });
    await tx
      .insert(messageReads)
      .values({ userId: actor.userId, commissionId: c.id, lastReadAt: new Date() })
      .onConflictDoUpdate({ target: [messageReads.userId, messageReads.commissionId], set: { lastReadAt: sql`greatest(${messageReads.lastReadAt}, now())` } });
    return { id: made.id, created: true };
  });
}
