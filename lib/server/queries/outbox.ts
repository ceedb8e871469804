import "server-only";
// The owner's view of mail that did not go out: failed after every retry, or still retrying.
import { and, desc, eq, gt, inArray, or } from "drizzle-orm";
import { db } from "@/db";
import { outboxMessages } from "@/db/schema";
import { assertCan, type Actor } from "../authz";
import { notFound } from "../errors";

export async function listUndeliveredMail(actor: Actor, studioId: string) {
  assertCan(actor, "studio.settings", studioId);
  return db
    .select({
      id: outboxMessages.id,
      to: outboxMessages.to,
      subject: outboxMessages.subject,
      status: outboxMessages.status,
      attempts: outboxMessages.attempts,
      lastError: outboxMessages.lastError,
      nextAttemptAt: outboxMessages.nextAttemptAt,
      createdAt: outboxMessages.createdAt,
    })
    .from(outboxMessages)
    .where(and(eq(outboxMessages.studioId, studioId), or(eq(outboxMessages.status, "failed"), and(eq(outboxMessages.status, "pending"), gt(outboxMessages.attempts, 0)))))
    .orderBy(desc(outboxMessages.createdAt))
    .limit(200);
}

/** Queues a failed mail again from scratch (the owner fixed the address or the mail server). */
export async function retryMail(actor: Actor, studioId: string, id: string) {
  assertCan(actor, "studio.settings", studioId);
  const [row] = await db
    .update(outboxMessages)
    .set({ status: "pending", attempts: 0, nextAttemptAt: new Date() })
    .where(and(eq(outboxMessages.id, id), eq(outboxMessages.studioId, studioId), inArray(outboxMessages.status, ["failed"])))
    .returning({ id: outboxMessages.id });
  if (!row) throw notFound("That failed mail");
  return row;
}
