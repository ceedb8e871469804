import { eq } from "drizzle-orm";
import { describe, expect, test } from "vitest";
import { db } from "@/db";
import { outboxMessages } from "@/db/schema";
import { asClient } from "@/lib/server/authz";
import { enqueueMail } from "@/lib/server/outbox";
import { getAvailableMoves, getLifecycleTimeline } from "@/lib/server/queries/lifecycle";
import { listUndeliveredMail, retryMail } from "@/lib/server/queries/outbox";
import { moveCommission } from "@/lib/server/workflow";
import { makeWorld, uid } from "./helpers";

describe("life cycle on the commission pages", () => {
  test("each person gets the buttons the machine allows them; the timeline uses our wording", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    const assistant = await w.actor(w.assistant.id);
    const client = asClient(await w.actor(w.clientA.id));
    const names = async (a: typeof owner) => (await getAvailableMoves(a, w.commissionA)).map((m) => m.move).sort();
    expect(await names(owner)).toEqual(["decline", "start_quote"]);
    expect(await names(assistant)).toEqual(["start_quote"]);
    expect(await names(client)).toEqual(["decline"]);
    await expect(getAvailableMoves(asClient(await w.actor(w.clientB.id)), w.commissionA)).rejects.toMatchObject({ status: 404 });

    await moveCommission(assistant, w.commissionA, "start_quote");
    await moveCommission(client, w.commissionA, "decline", { reason: "Found some in a shop" });
    const studioView = await getLifecycleTimeline(owner, w.commissionA, false);
    expect(studioView.map((e) => e.title)).toEqual(["Quote started", "Declined"]);
    expect(studioView[0].who).toMatch(/\(assistant\)$/);
    expect(studioView[1].reason).toBe("Found some in a shop");
    // The client does not see the studio's "preparing quote" step, and is "You".
    const clientView = await getLifecycleTimeline(client, w.commissionA, true);
    expect(clientView.map((e) => [e.title, e.who])).toEqual([["Declined", "You"]]);
    expect(await names(owner)).toEqual(["reopen_request"]);
    expect(await names(client)).toEqual([]);
  });
});

describe("mail that did not go out", () => {
  test("the owner sees failed and retrying mail of their studio only, and can queue it again; the assistant cannot", async () => {
    const w = await makeWorld();
    const owner = await w.actor(w.owner.id);
    const key = `it-failed-${uid()}`;
    await enqueueMail({ to: "nobody@it.test", subject: `Failed ${key}`, html: "<p>x</p>", text: "x", studioId: w.studioId, dedupeKey: key });
    await enqueueMail({ to: "other@it.test", subject: `Other ${key}`, html: "<p>x</p>", text: "x", studioId: w.otherStudioId, dedupeKey: `${key}-o` });
    await db.update(outboxMessages).set({ status: "failed", attempts: 8, lastError: "connect ECONNREFUSED 127.0.0.1:25" }).where(eq(outboxMessages.dedupeKey, key));
    await db.update(outboxMessages).set({ status: "failed", attempts: 8 }).where(eq(outboxMessages.dedupeKey, `${key}-o`));
    const rows = await listUndeliveredMail(owner, w.studioId);
    expect(rows.map((r) => [r.subject, r.status, r.lastError])).toEqual([[`Failed ${key}`, "failed", "connect ECONNREFUSED 127.0.0.1:25"]]);
    await expect(listUndeliveredMail(await w.actor(w.assistant.id), w.studioId)).rejects.toMatchObject({ status: 403 });
    await expect(listUndeliveredMail(await w.actor(w.clientA.id), w.studioId)).rejects.toMatchObject({ status: 404 });
    // Another studio's failed mail cannot be retried from here.
    const [other] = await db.select().from(outboxMessages).where(eq(outboxMessages.dedupeKey, `${key}-o`));
    await expect(retryMail(owner, w.studioId, other.id)).rejects.toMatchObject({ status: 404 });
    await retryMail(owner, w.studioId, rows[0].id);
    const [again] = await db.select().from(outboxMessages).where(eq(outboxMessages.id, rows[0].id));
    expect(again).toMatchObject({ status: "pending", attempts: 0 });
    // Clean up so the real mail service is not asked to deliver to a made-up address later.
    await db.delete(outboxMessages).where(eq(outboxMessages.id, rows[0].id));
  });
});
