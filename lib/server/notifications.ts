import "server-only";
// Notifications: what a person is told about a commission. `notify(tx, event)` is called once per
// event, inside the transaction that makes the event (so an event that rolls back tells nobody,
// and a webhook replay, which never reaches its effects, tells nobody twice). It writes one in-app
// row per recipient and, unless the recipient turned that kind off, queues the e-mail through the
// outbox in the same transaction. Messages are batched: the first one queues a mail that waits
// MESSAGE_BATCH_SECONDS; the next ones in that window join it (one mail listing them all).
//
// Who is told: studio events go to the studio's owners (their mail to the studio's contact address,
// as before, once per address); assistants are told only of client messages (they take part in the
// thread; quotes, money and proofs are the owner's). Client events go to the commission's client.
// The person who caused the event is never told of it.
import { and, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Executor, type Tx } from "@/db";
import { commissions, notificationSettings, notifications, outboxMessages, studioClients, studioMembers, studios, user } from "@/db/schema";
import { env } from "@/lib/env";
import { safeNext } from "@/lib/safe-redirect";
import { CLIENT_KINDS, KIND_LABELS, STUDIO_KINDS, type Audience, type ClientKind, type StudioKind } from "@/lib/schemas/notifications";
import { renderEmail } from "@/templates/email/layout";
import type { Actor } from "./authz";
import { notFound } from "./errors";
import { enqueueMail, type MailAttachment } from "./outbox";

/** Messages sent within this many seconds of the first unsent one come as one e-mail. */
export const MESSAGE_BATCH_SECONDS = 180;
const ASSISTANT_KINDS: ReadonlySet<string> = new Set<StudioKind>(["client_message"]);
const MESSAGE_KINDS: ReadonlySet<string> = new Set(["client_message", "studio_message"]);

/** An e-mail the event already writes (with its attachments); without one a plain mail is made from title and body. */
export interface EventMail {
  subject: string;
  html: string;
  text: string;
  replyTo?: string;
  attachments?: MailAttachment[];
  /** the outbox key the event used before notifications (kept, so a retried event still queues once) */
  dedupeKey?: string;
}

export type NotifyEvent = {
  studioId: string;
  commissionId: string;
  /** what happened, once: e.g. "quote-accepted:<quoteId>" (a person is told of one key once) */
  key: string;
  /** plain words: "Priya accepted the quote for Fox hat" */
  title: string;
  body: string;
  /** the place, a path in the app: "/studio/commissions/<id>#quote" */
  link: string;
  mail?: EventMail;
  replyTo?: string;
  /** the person who caused the event (not told) */
  actorUserId?: string | null;
} & ({ to: "studio"; kind: StudioKind } | { to: "client"; kind: ClientKind });

interface Recipient {
  userId: string;
  /** where the mail goes: the studio's contact address for owners, the person's own otherwise */
  address: string;
  name: string;
}

async function recipientsOf(tx: Executor, e: NotifyEvent, studio: { contactEmail: string }): Promise<Recipient[]> {
  if (e.to === "client") {
    const rows = await tx
      .select({ userId: user.id, address: user.email, name: user.name })
      .from(commissions)
      .innerJoin(studioClients, eq(studioClients.id, commissions.clientId))
      .innerJoin(user, eq(user.id, studioClients.userId))
      .where(eq(commissions.id, e.commissionId));
    return rows.filter((r) => r.userId !== e.actorUserId);
  }
  const members = await tx
    .select({ userId: user.id, email: user.email, name: user.name, role: studioMembers.role })
    .from(studioMembers)
    .innerJoin(user, eq(user.id, studioMembers.userId))
    .where(eq(studioMembers.studioId, e.studioId));
  return members
    .filter((m) => m.userId !== e.actorUserId && (m.role === "owner" || ASSISTANT_KINDS.has(e.kind)))
    .map((m) => ({ userId: m.userId, name: m.name, address: m.role === "owner" ? studio.contactEmail : m.email }));
}

/** The kinds this person gets by e-mail (no row: on). */
async function mailWanted(tx: Executor, userIds: string[], kind: string): Promise<Set<string>> {
  if (!userIds.length) return new Set();
  const off = await tx
    .select({ userId: notificationSettings.userId })
    .from(notificationSettings)
    .where(and(inArray(notificationSettings.userId, userIds), eq(notificationSettings.kind, kind), eq(notificationSettings.email, false)));
  const offIds = new Set(off.map((r) => r.userId));
  return new Set(userIds.filter((id) => !offIds.has(id)));
}

const absolute = (path: string) => `${env.BETTER_AUTH_URL.replace(/\/$/, "")}${path}`;

/**
 * Tells the event's recipients, inside `tx` (the event's own transaction). Returns how many in-app
 * items were made (0 when every recipient had already been told of this key).
 */
export async function notify(tx: Tx, e: NotifyEvent): Promise<number> {
  const [s] = await tx.select({ name: studios.name, brandHex: studios.brandHex, contactEmail: studios.contactEmail }).from(studios).where(eq(studios.id, e.studioId));
  if (!s) return 0;
  const recipients = await recipientsOf(tx, e, s);
  const wanted = await mailWanted(tx, recipients.map((r) => r.userId), e.kind);
  const mailedTo = new Set<string>();
  let made = 0;
  for (const r of recipients) {
    const [row] = await tx
      .insert(notifications)
      .values({ recipientUserId: r.userId, studioId: e.studioId, commissionId: e.commissionId, audience: e.to, kind: e.kind, title: e.title, body: e.body, link: e.link, dedupeKey: e.key })
      .onConflictDoNothing({ target: [notifications.recipientUserId, notifications.dedupeKey] })
      .returning({ id: notifications.id });
    if (!row) continue; // told already
    made++;
    if (!wanted.has(r.userId) || mailedTo.has(r.address)) continue;
    mailedTo.add(r.address);
    if (MESSAGE_KINDS.has(e.kind)) {
      await queueMessageMail(tx, e, r, s);
      continue;
    }
    const mail =
      e.mail ??
      renderEmail({
        subject: e.title,
        heading: e.title,
        paragraphs: [e.body],
        action: { label: "Open it in Darnwell", url: absolute(e.link) },
        footer: `Sent by Darnwell for ${s.name}. You can choose which of these come by e-mail in your settings.`,
        accentHex: s.brandHex,
      });
    const dedupeKey = e.mail?.dedupeKey && mailedTo.size === 1 ? e.mail.dedupeKey : `notify:${e.key}:${r.address}`;
    await enqueueMail({ to: r.address, studioId: e.studioId, replyTo: e.replyTo, ...mail, dedupeKey }, tx);
  }
  return made;
}

/**
 * One mail for the messages of a window: the first message queues it to wait MESSAGE_BATCH_SECONDS;
 * a message within that time rewrites the waiting mail to list them all. A waiting row is one still
 * pending, never tried and not leased: a lease (outbox.ts) moves next_attempt_at at least
 * LEASE_SECONDS past its due time, beyond created_at + the window. The row is locked, so the
 * worker's SKIP LOCKED lease leaves it alone until this transaction ends; an advisory lock keeps two
 * messages sent at once from queueing two mails.
 */
async function queueMessageMail(tx: Tx, e: NotifyEvent, r: Recipient, s: { name: string; brandHex: string }) {
  const prefix = `messages:${e.commissionId}:${r.address}:`;
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${prefix}))`);
  const [waiting] = await tx
    .select({ id: outboxMessages.id, createdAt: outboxMessages.createdAt })
    .from(outboxMessages)
    .where(
      and(
        sql`${outboxMessages.dedupeKey} like ${`${prefix}%`}`,
        eq(outboxMessages.status, "pending"),
        eq(outboxMessages.attempts, 0),
        sql`${outboxMessages.nextAttemptAt} > now()`,
        sql`${outboxMessages.nextAttemptAt} <= ${outboxMessages.createdAt} + make_interval(secs => ${MESSAGE_BATCH_SECONDS})`,
      ),
    )
    .orderBy(desc(outboxMessages.createdAt))
    .limit(1)
    .for("update");
  const list = waiting
    ? await tx
        .select({ title: notifications.title, body: notifications.body })
        .from(notifications)
        .where(and(eq(notifications.recipientUserId, r.userId), eq(notifications.commissionId, e.commissionId), eq(notifications.kind, e.kind), sql`${notifications.createdAt} >= ${waiting.createdAt}`))
        .orderBy(notifications.createdAt, notifications.id)
    : [{ title: e.title, body: e.body }];
  const [c] = await tx.select({ title: commissions.title }).from(commissions).where(eq(commissions.id, e.commissionId));
  const mail = renderEmail({
    subject: list.length > 1 ? `${list.length} new messages about ${c?.title ?? "your commission"}` : e.title,
    heading: list.length > 1 ? `${list.length} new messages` : "A new message",
    paragraphs: list.map((m) => `${m.title}: ${m.body}`),
    action: { label: "Read and answer", url: absolute(e.link) },
    footer: `Sent by Darnwell for ${s.name}. Messages sent within a few minutes of each other come in one e-mail.`,
    accentHex: s.brandHex,
  });
  if (waiting) {
    await tx.update(outboxMessages).set({ subject: mail.subject, html: mail.html, text: mail.text }).where(eq(outboxMessages.id, waiting.id));
    return;
  }
  // The wait counts from the transaction's own now(), the created_at of the row, so the test above holds exactly.
  const { rows } = await tx.execute<{ now: string | Date }>(sql`select now() as now`);
  const notBefore = new Date(new Date(rows[0].now).getTime() + MESSAGE_BATCH_SECONDS * 1000);
  await enqueueMail(
    { to: r.address, studioId: e.studioId, replyTo: e.replyTo, dedupeKey: `${prefix}${e.key}`, notBefore, ...mail },
    tx,
  );
}

// --- reading (every query is the actor's own rows only) -----------------------------------------

function scope(actor: Actor, audience: Audience) {
  const studioIds = actor.memberships.map((m) => m.studioId);
  return and(
    eq(notifications.recipientUserId, actor.userId),
    eq(notifications.audience, audience),
    // A studio's list only while the person still works there.
    audience === "studio" ? (studioIds.length ? inArray(notifications.studioId, studioIds) : sql`false`) : undefined,
  );
}

export async function unreadNotificationCount(actor: Actor, audience: Audience): Promise<number> {
  const [r] = await db.select({ n: sql<number>`count(*)::int` }).from(notifications).where(and(scope(actor, audience), isNull(notifications.readAt)));
  return r?.n ?? 0;
}

export interface NotificationItem {
  id: string;
  title: string;
  body: string;
  createdAt: Date;
  read: boolean;
  /** opens the item (marks it read, then goes to its place) */
  href: string;
}

export async function listNotifications(actor: Actor, audience: Audience, limit = 100): Promise<NotificationItem[]> {
  const rows = await db
    .select({ id: notifications.id, title: notifications.title, body: notifications.body, createdAt: notifications.createdAt, readAt: notifications.readAt })
    .from(notifications)
    .where(scope(actor, audience))
    .orderBy(desc(notifications.createdAt), desc(notifications.id))
    .limit(Math.min(Math.max(1, limit), 500));
  const base = audience === "studio" ? "/studio" : "/portal";
  return rows.map((r) => ({ id: r.id, title: r.title, body: r.body, createdAt: r.createdAt, read: r.readAt !== null, href: `${base}/notifications/${r.id}` }));
}

/** Marks the actor's own item read and returns its place; someone else's (or none) is 404. */
export async function openNotification(actor: Actor, audience: Audience, id: string): Promise<string> {
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id)) throw notFound("That notification");
  const [row] = await db
    .update(notifications)
    .set({ readAt: sql`coalesce(${notifications.readAt}, now())` })
    .where(and(eq(notifications.id, id), scope(actor, audience)))
    .returning({ link: notifications.link });
  if (!row) throw notFound("That notification");
  return safeNext(row.link, audience === "studio" ? "/studio" : "/portal");
}

export async function markAllNotificationsRead(actor: Actor, audience: Audience): Promise<number> {
  const done = await db
    .update(notifications)
    .set({ readAt: sql`now()` })
    .where(and(scope(actor, audience), isNull(notifications.readAt)))
    .returning({ id: notifications.id });
  return done.length;
}

export interface KindSetting {
  kind: string;
  label: string;
  email: boolean;
}

export async function getNotificationSettings(actor: Actor, audience: Audience): Promise<KindSetting[]> {
  const kinds: readonly string[] = audience === "studio" ? STUDIO_KINDS : CLIENT_KINDS;
  const rows = await db.select().from(notificationSettings).where(and(eq(notificationSettings.userId, actor.userId), inArray(notificationSettings.kind, [...kinds])));
  const off = new Set(rows.filter((r) => !r.email).map((r) => r.kind));
  return kinds.map((k) => ({ kind: k, label: KIND_LABELS[audience][k], email: !off.has(k) }));
}

/** Saves the actor's own choices for the kinds of one audience (others are left as they are). */
export async function saveNotificationSettings(actor: Actor, audience: Audience, choices: Record<string, boolean>): Promise<void> {
  const kinds: readonly string[] = audience === "studio" ? STUDIO_KINDS : CLIENT_KINDS;
  const values = kinds.map((k) => ({ userId: actor.userId, kind: k, email: choices[k] === true, updatedAt: new Date() }));
  await db
    .insert(notificationSettings)
    .values(values)
    .onConflictDoUpdate({ target: [notificationSettings.userId, notificationSettings.kind], set: { email: sql`excluded.email`, updatedAt: sql`now()` } });
}
