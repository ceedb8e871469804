import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { GET as getPaymentState } from "@/app/api/commissions/[id]/payments/route";
import { GET as getOne } from "@/app/api/commissions/[id]/route";
import { PUT as putPrice } from "@/app/api/commissions/[id]/price/route";
import { GET as list } from "@/app/api/commissions/route";
import { db } from "@/db";
import { commissionEvents, commissions } from "@/db/schema";
import { assertCan } from "@/lib/server/authz";
import { getCommissionFor, listCommissionsFor, setCommissionPrice } from "@/lib/server/queries/commissions";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};

beforeAll(async () => {
  w = await makeWorld();
  for (const [k, p] of Object.entries({ owner: w.owner, assistant: w.assistant, a: w.clientA, b: w.clientB, outsider: w.outsider })) {
    jars[k] = await signIn(p.email);
  }
});

const ctx = (id: string) => ({ params: Promise.resolve({ id }) });

async function getJson(jar: Jar | null, id: string) {
  const res = await getOne(requestWith(jar, `/api/commissions/${id}`), ctx(id));
  return { status: res.status, body: await res.json() };
}

async function put(jar: Jar | null, id: string, body: unknown) {
  const res = await putPrice(
    requestWith(jar, `/api/commissions/${id}/price`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: typeof body === "string" ? body : JSON.stringify(body),
    }),
    ctx(id),
  );
  return { status: res.status, body: await res.json() };
}

describe("who sees what (route handlers and queries)", () => {
  test("anonymous requests to API routes get 401", async () => {
    expect((await list(requestWith(null, "/api/commissions"), ctx(""))).status).toBe(401);
    expect((await getJson(null, w.commissionA)).status).toBe(401);
    expect((await put(null, w.commissionA, { priceMinor: 100 })).status).toBe(401);
  });

  test("client A sees only their own commissions", async () => {
    const res = await list(requestWith(jars.a, "/api/commissions"), ctx(""));
    const ids = ((await res.json()).commissions as { id: string }[]).map((c) => c.id).sort();
    // A is a client of both studios: their own commission in each, nothing of B's.
    expect(ids).toEqual([w.commissionA, w.otherCommission].sort());
  });

  test("client A cannot read client B's commission: 404, as if it did not exist", async () => {
    const res = await getJson(jars.a, w.commissionB);
    expect(res.status).toBe(404);
    expect(res.body.error.message).not.toContain(w.commissionB);
    expect((await getJson(jars.a, w.commissionA)).status).toBe(200);
  });

  test("the payment state the portal polls: the commission's own client only", async () => {
    const state = async (jar: Jar | null, id: string) => (await getPaymentState(requestWith(jar, `/api/commissions/${id}/payments`), ctx(id))).status;
    expect(await state(jars.a, w.commissionA)).toBe(200);
    expect(await state(jars.a, w.commissionB)).toBe(404);
    expect(await state(jars.outsider, w.commissionA)).toBe(404);
    expect(await state(null, w.commissionA)).toBe(401);
    expect(await state(jars.a, "not-a-uuid")).toBe(422);
  });

  test("a member of another studio cannot read this studio's commissions", async () => {
    expect((await getJson(jars.outsider, w.commissionA)).status).toBe(404);
    const outsider = await w.actor(w.outsider.id);
    const seen = await listCommissionsFor(outsider);
    expect(seen.map((c) => c.id)).toEqual([w.otherCommission]);
  });

  test("the assistant sees the studio's commissions but cannot change a price", async () => {
    expect((await getJson(jars.assistant, w.commissionB)).status).toBe(200);
    const res = await put(jars.assistant, w.commissionA, { priceMinor: 12345 });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/owner/);
    const [row] = await db.select().from(commissions).where(eq(commissions.id, w.commissionA));
    expect(row.priceMinor).toBeNull();
  });

  test("a client cannot change a price either (their own or another's)", async () => {
    expect((await put(jars.a, w.commissionA, { priceMinor: 1 })).status).toBe(404);
    expect((await put(jars.a, w.commissionB, { priceMinor: 1 })).status).toBe(404);
  });

  test("the owner sets a price; the change is audited in the same transaction", async () => {
    const res = await put(jars.owner, w.commissionA, { priceMinor: 14250 });
    expect(res.status).toBe(200);
    expect(res.body.commission.priceMinor).toBe(14250);
    const events = await db
      .select()
      .from(commissionEvents)
      .where(and(eq(commissionEvents.commissionId, w.commissionA), eq(commissionEvents.kind, "price_set")));
    expect(events).toHaveLength(1);
    expect(events[0].actorUserId).toBe(w.owner.id);
  });

  test("bad input gets field errors and changes nothing", async () => {
    const bad = await put(jars.owner, w.commissionB, { priceMinor: 12.5 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fieldErrors.priceMinor[0]).toMatch(/whole number/);
    const notJson = await put(jars.owner, w.commissionB, "{oops");
    expect(notJson.status).toBe(400);
    const badId = await getJson(jars.owner, "not-a-uuid");
    expect(badId.status).toBe(422);
    const [row] = await db.select().from(commissions).where(eq(commissions.id, w.commissionB));
    expect(row.priceMinor).toBeNull();
  });

  test("the query layer enforces the same rules without any route in front", async () => {
    const assistant = await w.actor(w.assistant.id);
    await expect(setCommissionPrice(assistant, w.commissionB, 5)).rejects.toMatchObject({ status: 403 });
    const b = await w.actor(w.clientB.id);
    await expect(getCommissionFor(b, w.commissionA)).rejects.toMatchObject({ status: 404 });
    expect(() => assertCan(b, "studio.view", w.studioId)).toThrow();
  });
});
