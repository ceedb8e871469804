// Notifications on the real database, the local mail service and the payments fake: each event
// makes its in-app items in its own transaction and queues its mail through the outbox, by the
// recipient's settings; a webhook replay tells nobody twice; messages within the window make one mail.
import { randomBytes } from "node:crypto";
import { and, eq, like } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { notifications, outboxMessages, studios, yarnLots, yarns } from "@/db/schema";
import { quoteDraftSchema } from "@/lib/schemas/quotes";
import { postMessageSchema } from "@/lib/schemas/messages";
import { postMessage } from "@/lib/server/messages";
import {
  getNotificationSettings,
  listNotifications,
  markAllNotificationsRead,
  MESSAGE_BATCH_SECONDS,
  openNotification,
  saveNotificationSettings,
  unreadNotificationCount,
} from "@/lib/server/notifications";
import { startCheckout } from "@/lib/server/payments";
import { acceptQuote, saveQuoteDraft, sendQuote } from "@/lib/server/quotes";
import type { PaymentsFake } from "@/scripts/fakes/payments";
import { paymentsFakeForFile } from "./payments-fake";
import { makeWorld, mailCount, uid, waitForMail, type World } from "./helpers";

const payFake = paymentsFakeForFile();
let fake: PaymentsFake;
beforeAll(() => {
  fake = payFake.fake();
});

async function setup() {
  const w = await makeWorld();
  const [y] = await db
    .insert(yarns)
    .values({ studioId: w.studioId, name: "Test 4-ply", colourName: "Loch blue", hex: "#2E5A7A", fibre: "Wool", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, priceMinor: 850 })
    .returning();
  await db.insert(yarnLots).values({ yarnId: y.id, lotCode: "L1", stockSkeins: 10 });
  const [s] = await db.select({ contactEmail: studios.contactEmail }).from(studios).where(eq(studios.id, w.studioId));
  return { w, yarnId: y.id, studioMail: s.contactEmail };
}

const draft = (yarnId: string) =>
  quoteDraftSchema.parse({ pieces: [{ label: "Left mitten", plainStitches: 1800, strandedStitches: 2600, ends: 6, thumbs: 1 }], materials: [{ yarnId, skeins: 2 }], shippingMinor: 450 });

async function sentQuote(w: World, yarnId: string, commissionId = w.commissionA) {
  const owner = await w.actor(w.owner.id);
  const v = await saveQuoteDraft(owner, commissionId, draft(yarnId));
  await sendQuote(owner, v.id);
  return v;
}

const outboxRows = (keyPattern: string) => db.select().from(outboxMessages).where(like(outboxMessages.dedupeKey, keyPattern));

describe("notifications", { timeout: 90_000 }, () => {
  test("an acceptance tells the owner in the app and by mail; the assistant is not told; opening marks it read", async () => {
    const { w, yarnId, studioMail } = await setup();
    const v = await sentQuote(w, yarnId);
    const owner = await w.actor(w.owner.id);
    const assistant = await w.actor(w.assistant.id);
    expect(await unreadNotificationCount(owner, "studio")).toBe(0);
    await acceptQuote(await w.actor(w.clientA.id), { quoteId: v.id, name: "Client A" });

    expect(await unreadNotificationCount(owner, "studio")).toBe(1);
    expect(await unreadNotificationCount(assistant, "studio")).toBe(0);
    const [item] = await listNotifications(owner, "studio");
    expect(item.title).toMatch(/accepted the quote for Test mittens/);
    expect(item.read).toBe(false);
    const mail = await waitForMail(studioMail, (m) => m.subject.includes("accepted the quote"));
    expect(mail.text).toContain(`/studio/commissions/${w.commissionA}#quote-and-payments`);

    expect(await openNotification(owner, "studio", item.id)).toBe(`/studio/commissions/${w.commissionA}#quote-and-payments`);
    expect(await unreadNotificationCount(owner, "studio")).toBe(0);
    // the client was told of the quote in their own list
    const clientList = await listNotifications(await w.actor(w.clientA.id), "client");
    expect(clientList.map((n) => n.title)).toEqual([expect.stringMatching(/sent you a quote/)]);
  });

  test("a paid deposit tells the owner once, however often the webhook is replayed", async () => {
    const { w, yarnId, studioMail } = await setup();
    const v = await sentQuote(w, yarnId);
    const client = await w.actor(w.clientA.id);
    const { paymentId } = await acceptQuote(client, { quoteId: v.id, name: "Client A" });
    const { url } = await startCheckout(client, w.commissionA, "deposit");
    await fetch(url, { method: "POST", body: new URLSearchParams({ card: "4242 4242 4242 4242", action: "pay" }), redirect: "manual" });
    await fake.idle();
    const ev = fake.state.events.find((e) => e.type === "checkout.session.completed" && e.payload.includes(paymentId!))!;
    for (let i = 0; i < 3; i++) {
      const again = await payFake.hook(ev.payload, fake.signPayload(ev.payload));
      expect(await again.json()).toMatchObject({ duplicate: true });
    }
    const paid = await db.select().from(notifications).where(and(eq(notifications.recipientUserId, w.owner.id), eq(notifications.kind, "payment")));
    expect(paid).toHaveLength(1);
    expect(paid[0].title).toMatch(/paid the deposit/);
    expect(paid[0].link).toBe(`/studio/commissions/${w.commissionA}#quote-and-payments`);
    expect(await outboxRows(`notify:paid:${paymentId}:%`)).toHaveLength(1);
    await waitForMail(studioMail, (m) => /paid the deposit/.test(m.subject));
  });

  test("a kind turned off sends no mail but keeps the in-app item", async () => {
    const { w, yarnId, studioMail } = await setup();
    const owner = await w.actor(w.owner.id);
    const before = await getNotificationSettings(owner, "studio");
    expect(before.every((s) => s.email)).toBe(true); // default: on
    await saveNotificationSettings(owner, "studio", Object.fromEntries(before.map((s) => [s.kind, s.kind !== "quote_accepted"])));
    expect((await getNotificationSettings(owner, "studio")).find((s) => s.kind === "quote_accepted")?.email).toBe(false);

    const v = await sentQuote(w, yarnId);
    await acceptQuote(await w.actor(w.clientA.id), { quoteId: v.id, name: "Client A" });
    expect((await listNotifications(owner, "studio")).map((n) => n.title)).toEqual([expect.stringMatching(/accepted the quote/)]);
    expect(await outboxRows(`notify:quote-accepted:${v.id}:%`)).toHaveLength(0);
    expect(await mailCount(studioMail)).toBe(0);
  });

  test("a person sees and opens only their own notifications", async () => {
    const { w, yarnId } = await setup();
    await sentQuote(w, yarnId, w.commissionA);
    await sentQuote(w, yarnId, w.commissionB);
    const a = await w.actor(w.clientA.id);
    const b = await w.actor(w.clientB.id);
    const [itemA] = await listNotifications(a, "client");
    const [itemB] = await listNotifications(b, "client");
    expect(itemA.href).not.toBe(itemB.href);
    expect((await listNotifications(b, "client")).map((n) => n.id)).toEqual([itemB.id]);
    await expect(openNotification(b, "client", itemA.id)).rejects.toMatchObject({ status: 404 });
    await expect(openNotification(await w.actor(w.outsider.id), "studio", itemA.id)).rejects.toMatchObject({ status: 404 });
    await expect(openNotification(a, "client", "not-a-uuid")).rejects.toMatchObject({ status: 404 });
    // the client's items are not in a studio list, not even their own studio-side list
    expect(await listNotifications(await w.actor(w.owner.id), "studio")).toHaveLength(0);
    expect(await markAllNotificationsRead(b, "client")).toBe(1);
    expect(await unreadNotificationCount(a, "client")).toBe(1);
    expect(await openNotification(a, "client", itemA.id)).toBe(`/portal/commissions/${w.commissionA}#quote`);
  });

  test("messages within the window come as one mail; a later one starts a new mail", async () => {
    const { w, studioMail } = await setup();
    const client = await w.actor(w.clientA.id);
    const send = (body: string) => postMessage(client, w.commissionA, postMessageSchema.parse({ body, clientKey: `k-${uid()}-${randomBytes(3).toString("hex")}` }));
    await send("Could the thumb be a little longer?");
    await send("And the cuff in the darker blue.");
    await send("Thank you!");
    const owner = await w.actor(w.owner.id);
    expect(await unreadNotificationCount(owner, "studio")).toBe(3);
    // assistants take part in the thread, so they are told of client messages too
    expect(await unreadNotificationCount(await w.actor(w.assistant.id), "studio")).toBe(3);

    const queued = await outboxRows(`messages:${w.commissionA}:${studioMail}:%`);
    expect(queued).toHaveLength(1);
    const waitMs = queued[0].nextAttemptAt.getTime() - queued[0].createdAt.getTime();
    expect(waitMs).toBe(MESSAGE_BATCH_SECONDS * 1000);
    expect(await mailCount(studioMail)).toBe(0); // still waiting for the window to close

    // the window passes
    await db.update(outboxMessages).set({ nextAttemptAt: new Date() }).where(eq(outboxMessages.id, queued[0].id));
    const mail = await waitForMail(studioMail, (m) => m.subject.startsWith("3 new messages"));
    for (const t of ["thumb be a little longer", "darker blue", "Thank you!"]) expect(mail.text).toContain(t);
    expect(await mailCount(studioMail)).toBe(1);

    await send("One more thing: gift wrap?");
    expect(await outboxRows(`messages:${w.commissionA}:${studioMail}:%`)).toHaveLength(2);
    const [assistantMail] = await outboxRows(`messages:${w.commissionA}:${w.assistant.email}:%`);
    expect(assistantMail.text).toContain("Thank you!");
  });
});
