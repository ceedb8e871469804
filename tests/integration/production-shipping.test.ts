import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { GET as getCareCard } from "@/app/api/commissions/[id]/care-card/route";
import { POST as postShip } from "@/app/api/commissions/[id]/ship/route";
import { db } from "@/db";
import { commissions, shipments, studioMembers } from "@/db/schema";
import { addDays } from "@/lib/core/schedule";
import { createPieces } from "@/lib/server/production";
import { getEarliestPromiseDate, getStudioSchedule, newPiecesForGarment, updateAvailability } from "@/lib/server/schedule";
import { makeWorld, requestWith, signIn, waitForMail, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};
const ctx = (id: string) => ({ params: Promise.resolve({ id }) });

async function commissionIn(state: "balance_paid" | "in_production" | "booked", extra: Partial<typeof commissions.$inferInsert> = {}) {
  const [c] = await db
    .insert(commissions)
    .values({ studioId: w.studioId, clientId: w.clientA.clientId, number: 100 + Math.floor(Math.random() * 1e6), title: "Shipping test", garment: "hat", currency: "GBP", state, ...extra })
    .returning();
  return c.id;
}

beforeAll(async () => {
  w = await makeWorld();
  jars.owner = await signIn(w.owner.email);
  jars.assistant = await signIn(w.assistant.email);
  jars.clientA = await signIn(w.clientA.email);
  jars.clientB = await signIn(w.clientB.email);
});

describe("shipping and the care card", () => {
  test("the assistant cannot mark shipped (403, nothing written); the owner can, and the client is e-mailed", async () => {
    const id = await commissionIn("balance_paid");
    const body = JSON.stringify({ carrier: "Royal Mail", tracking: "RM123456789GB" });
    const send = (jar: Jar) =>
      postShip(requestWith(jar, `/api/commissions/${id}/ship`, { method: "POST", headers: { "content-type": "application/json" }, body }), ctx(id));
    const refused = await send(jars.assistant);
    expect(refused.status).toBe(403);
    expect(await db.select().from(shipments).where(eq(shipments.commissionId, id))).toHaveLength(0);
    expect((await db.select().from(commissions).where(eq(commissions.id, id)))[0].state).toBe("balance_paid");
    const ok = await send(jars.owner);
    expect(ok.status).toBe(200);
    expect((await ok.json()).state).toBe("shipped");
    const [s] = await db.select().from(shipments).where(eq(shipments.commissionId, id));
    expect(s).toMatchObject({ carrier: "Royal Mail", tracking: "RM123456789GB", shippedBy: w.owner.id });
    const mail = await waitForMail(w.clientA.email, (m) => m.subject.includes("on its way"));
    expect(mail.text).toContain("RM123456789GB");
    expect(mail.text).toContain(`/api/commissions/${id}/care-card`);
    // Shipping twice is refused by the workflow.
    expect((await send(jars.owner)).status).toBe(409);
  });

  test("bad carrier input is refused with field errors", async () => {
    const id = await commissionIn("balance_paid");
    const res = await postShip(
      requestWith(jars.owner, `/api/commissions/${id}/ship`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ carrier: "", tracking: "" }) }),
      ctx(id),
    );
    expect(res.status).toBe(422);
    expect(Object.keys((await res.json()).error.fieldErrors).sort()).toEqual(["carrier", "tracking"]);
  });

  test("the care card downloads as a PDF for the studio and the commission's client; another client gets 404", async () => {
    const id = await commissionIn("balance_paid", { wearer: "baby" });
    for (const jar of [jars.owner, jars.clientA]) {
      const res = await getCareCard(requestWith(jar, `/api/commissions/${id}/care-card`), ctx(id));
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toBe("application/pdf");
      const bytes = Buffer.from(await res.arrayBuffer());
      expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
    }
    expect((await getCareCard(requestWith(jars.clientB, `/api/commissions/${id}/care-card`), ctx(id))).status).toBe(404);
  });
});

describe("capacity and schedule", () => {
  test("only the owner edits availability", async () => {
    const [owner] = await db.select().from(studioMembers).where(eq(studioMembers.userId, w.owner.id));
    const input = { memberId: owner.id, weekdayMinutes: [300, 300, 300, 300, 300, 0, 0], daysOff: [], stages: [] as never[] };
    await expect(updateAvailability(await w.actor(w.assistant.id), w.studioId, input)).rejects.toMatchObject({ status: 403 });
    await expect(updateAvailability(await w.actor(w.outsider.id), w.studioId, input)).rejects.toMatchObject({ status: 404 });
    expect((await updateAvailability(await w.actor(w.owner.id), w.studioId, input)).weekdayMinutes).toEqual([300, 300, 300, 300, 300, 0, 0]);
  });

  test("a commission due today is flagged late; the promise for a new hat comes after the queue and moves with days off", async () => {
    const owner = await w.actor(w.owner.id);
    const now = new Date();
    const today = now.toISOString().slice(0, 10);
    const id = await commissionIn("in_production", { neededBy: today });
    await createPieces(owner, id, "one");
    const plan = await getStudioSchedule(owner, w.studioId, now);
    expect(plan.problem).toBeNull();
    const mine = plan.plan!.commissions.find((c) => c.commissionId === id)!;
    expect(mine.lateByDays).toBeGreaterThan(0);
    const before = await getEarliestPromiseDate(w.studioId, newPiecesForGarment("hat"), now);
    expect(before.date > plan.today).toBe(true);
    // A fortnight off for everyone pushes the promise later.
    const members = await db.select().from(studioMembers).where(eq(studioMembers.studioId, w.studioId));
    const off = Array.from({ length: 14 }, (_, i) => addDays(plan.today, i));
    for (const m of members) await updateAvailability(owner, w.studioId, { memberId: m.id, weekdayMinutes: [300, 300, 300, 300, 300, 0, 0], daysOff: off, stages: [] });
    const after = await getEarliestPromiseDate(w.studioId, newPiecesForGarment("hat"), now);
    expect(after.date > before.date).toBe(true);
  });
});

describe("insights and calibration", () => {
  test("closed history gives a proposal; accepting writes the rates into the settings, deciding twice is refused", async () => {
    const { labourHistory } = await import("@/db/schema");
    const { decideProposal, getCalibration, getInsights, proposeRates } = await import("@/lib/server/insights");
    const { loadStudioSettings } = await import("@/lib/server/settings");
    const owner = await w.actor(w.owner.id);
    const assistant = await w.actor(w.assistant.id);
    await expect(getInsights(assistant, w.studioId)).rejects.toMatchObject({ status: 403 });
    await expect(proposeRates(owner, w.studioId)).rejects.toMatchObject({ status: 409 });
    // Ten mittens whose knitting took 1.5 × the default estimate (the test's own features: the
    // formula below reads its catches, shaping rounds and thumb).
    const features = { label: "Left mitten", plainStitches: 2500, strandedStitches: 3700, floatCatches: 300, shapingRounds: 15, thumbs: 1, duplicateStitches: 80, ends: 8, carryCm: 40, blocked: true };
    for (let i = 0; i < 10; i++) {
      const { label: _label, ...plain } = features;
      void _label;
      const f = { ...plain, plainStitches: 2000 + i * 150, strandedStitches: 3000 + ((i * 7) % 5) * 300 };
      const minutes = Math.round((f.plainStitches / 25 + f.strandedStitches / 15 + 15 * 2 + 20 + (300 * 3) / 60) * 1.5);
      await db.insert(labourHistory).values({ studioId: w.studioId, features: f as Record<string, number | boolean>, loggedMinutes: { knitting: minutes, finishing: 20 } });
    }
    const cal = await getCalibration(owner, w.studioId);
    expect(cal.pieces).toBe(10);
    expect(cal.result!.accuracy!.overall.after!).toBeLessThan(cal.result!.accuracy!.overall.before!);
    const p1 = await proposeRates(owner, w.studioId);
    await expect(decideProposal(assistant, w.studioId, p1.id, "accepted")).rejects.toMatchObject({ status: 403 });
    expect((await decideProposal(owner, w.studioId, p1.id, "rejected")).status).toBe("rejected");
    expect((await loadStudioSettings(w.studioId)).rates.plainStitchesPerMinute).toBe(25);
    const p2 = await proposeRates(owner, w.studioId);
    await decideProposal(owner, w.studioId, p2.id, "accepted");
    const rates = (await loadStudioSettings(w.studioId)).rates;
    expect(rates.plainStitchesPerMinute).toBeLessThan(25);
    expect(rates.plainStitchesPerMinute).toBe((p2.rates as { plainStitchesPerMinute: number }).plainStitchesPerMinute);
    // The P80 margins measured with those rates are accepted with them and price the quotes from then on.
    const accepted = await loadStudioSettings(w.studioId);
    expect(accepted.p80Factors).toEqual((p2.report as { p80Factors: Record<string, number> }).p80Factors);
    expect(accepted.p80Factors.knitting).toBeGreaterThanOrEqual(1);
    expect(cal.result!.accuracy!.overall.p80Coverage).not.toBeNull();
    await expect(decideProposal(owner, w.studioId, p2.id, "rejected")).rejects.toMatchObject({ status: 409 });
    const insights = await getInsights(owner, w.studioId);
    expect(insights.accuracy.length).toBeGreaterThan(0);
  });
});
