import "server-only";
// Every e-mail goes through the outbox: queued in the transaction that causes it, sent by a
// worker with retries and backoff, so a mail server that is down loses nothing. Rows are leased
// with FOR UPDATE SKIP LOCKED, so any number of app instances can run the worker.
import { and, eq, sql } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { outboxMessages, type OutboxMessage } from "@/db/schema";
import { env } from "@/lib/env";
import { sendMail, type MailMessage } from "./mail";

export const MAX_ATTEMPTS = 8;
/** seconds before attempt n+1: 5 s, 10 s, 20 s … capped at one hour */
export const backoffSeconds = (attempts: number) => Math.min(3600, 5 * 2 ** Math.max(0, attempts - 1));
/** A leased row is left alone by every other worker this long; sends time out well before (mail.ts). */
export const LEASE_SECONDS = 120;

export interface QueuedMail {
  to: string;
  subject: string;
  html: string;
  text: string;
  replyTo?: string;
  studioId?: string | null;
  /** the same key is queued only once */
  dedupeKey?: string;
  attachments?: MailAttachment[];
  /** not sent before this time (a batch of messages waits for the rest of its window) */
  notBefore?: Date;
}

/**
 * Bytes queued with the mail, or a document rendered by the worker when it sends (`render` names it,
 * see mail-attachments.ts): PDFs are never rendered inside the transaction that queues their mail.
 */
export type MailAttachment = { filename: string; contentType: string } & ({ base64: string } | { render: `${"quote" | "document" | "credit-note"}:${string}` });

export async function enqueueMail(mail: QueuedMail, tx: Executor = db): Promise<void> {
  await tx
    .insert(outboxMessages)
    .values({
      to: mail.to,
      subject: mail.subject,
      html: mail.html,
      text: mail.text,
      replyTo: mail.replyTo,
      studioId: mail.studioId ?? null,
      dedupeKey: mail.dedupeKey,
      attachments: mail.attachments ?? [],
      ...(mail.notBefore ? { nextAttemptAt: mail.notBefore } : {}),
    })
    .onConflictDoNothing({ target: outboxMessages.dedupeKey });
}

async function toMailMessage(row: OutboxMessage): Promise<MailMessage> {
  const attachments: NonNullable<MailMessage["attachments"]> = [];
  for (const a of row.attachments) {
    if (a.base64) attachments.push({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.base64, "base64") });
    else if (a.render) {
      const { renderMailAttachment } = await import("./mail-attachments"); // the renderers load only when needed
      attachments.push({ filename: a.filename, contentType: a.contentType, content: await renderMailAttachment(a.render) });
    }
  }
  return {
    to: row.to,
    subject: row.subject,
    html: row.html,
    text: row.text,
    replyTo: row.replyTo ?? undefined,
    messageId: `<${row.id}@darnwell.outbox>`,
    attachments,
  };
}

/** Sends what is due (at most `limit`); returns how many were sent and how many failed this round. */
export async function processOutbox(
  limit = 20,
  send: (m: MailMessage) => Promise<void> = sendMail,
): Promise<{ sent: number; failed: number }> {
  const due = await db.execute<{ id: string }>(sql`
    update outbox_messages set next_attempt_at = now() + make_interval(secs => ${LEASE_SECONDS})
    where id in (
      select id from outbox_messages
      where status = 'pending' and next_attempt_at <= now()
      order by created_at
      limit ${limit}
      for update skip locked
    )
    returning id`);
  let sent = 0;
  let failed = 0;
  for (const { id } of due.rows) {
    const [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.id, id));
    if (!row || row.status !== "pending") continue;
    try {
      await send(await toMailMessage(row));
      await db
        .update(outboxMessages)
        .set({ status: "sent", sentAt: new Date(), attempts: row.attempts + 1, lastError: null })
        .where(and(eq(outboxMessages.id, id), eq(outboxMessages.status, "pending")));
      sent++;
    } catch (err) {
      const attempts = row.attempts + 1;
      failed++;
      await db
        .update(outboxMessages)
        .set({
          attempts,
          lastError: (err as Error).message.slice(0, 500),
          status: attempts >= MAX_ATTEMPTS ? "failed" : "pending",
          nextAttemptAt: new Date(Date.now() + backoffSeconds(attempts) * 1000),
        })
        .where(eq(outboxMessages.id, id));
    }
  }
  return { sent, failed };
}

const globalForWorker = globalThis as unknown as { darnwellOutbox?: NodeJS.Timeout };

/** Started once per server process (instrumentation.ts). */
export function startOutboxWorker(intervalMs = 1500): void {
  if (globalForWorker.darnwellOutbox || env.OUTBOX_WORKER === "off") return;
  let busy = false;
  globalForWorker.darnwellOutbox = setInterval(() => {
    if (busy) return;
    busy = true;
    processOutbox()
      .catch((err) => console.error("outbox:", (err as Error).message))
      .finally(() => {
        busy = false;
      });
  }, intervalMs);
  globalForWorker.darnwellOutbox.unref();
}
