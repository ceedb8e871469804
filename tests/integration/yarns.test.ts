import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { PATCH as patchYarn } from "@/app/api/yarns/[id]/route";
import { POST as postYarn, GET as getYarns } from "@/app/api/yarns/route";
import { db } from "@/db";
import { commissions, yarnReservations } from "@/db/schema";
import { listYarns, setLotStock } from "@/lib/server/yarns";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};
const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
const json = (method: string, body: unknown) => ({ method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
const yarn = { name: "Test 4-ply", colourName: "Heather", hex: "#6D5A7E", fibre: "Wool (100 %)", weightCategory: 1, metresPerSkein: 200, gramsPerSkein: 50, price: "8.50" };

beforeAll(async () => {
  w = await makeWorld();
  jars.owner = await signIn(w.owner.email);
  jars.assistant = await signIn(w.assistant.email);
  jars.client = await signIn(w.clientA.email);
});

describe("the studio's yarns", () => {
  test("the owner adds a yarn with a first lot; the assistant cannot add one (403) and a client gets 404", async () => {
    expect((await postYarn(requestWith(jars.assistant, "/api/yarns", json("POST", yarn)), ctx(""))).status).toBe(403);
    expect((await postYarn(requestWith(jars.client, "/api/yarns", json("POST", yarn)), ctx(""))).status).toBe(404);
    const res = await postYarn(requestWith(jars.owner, "/api/yarns", json("POST", { ...yarn, lot: { lotCode: "H1", stockSkeins: 3 } })), ctx(""));
    expect(res.status).toBe(201);
    const list = await (await getYarns(requestWith(jars.assistant, "/api/yarns"), ctx(""))).json();
    const row = list.yarns.find((y: { colourName: string }) => y.colourName === "Heather");
    expect(row).toMatchObject({ priceMinor: 850, stock: 3, reserved: 0, short: 0 });
  });

  test("bad input is refused with field errors and nothing saved", async () => {
    const res = await postYarn(requestWith(jars.owner, "/api/yarns", json("POST", { ...yarn, hex: "red", metresPerSkein: 0, weightCategory: 9, price: "8,5x" })), ctx(""));
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(Object.keys(body.error.fieldErrors).sort()).toEqual(["hex", "metresPerSkein", "weightCategory"]);
    const priceOnly = await postYarn(requestWith(jars.owner, "/api/yarns", json("POST", { ...yarn, price: "8,5x" })), ctx(""));
    expect(priceOnly.status).toBe(422);
  });

  test("the assistant may restock and edit the record but not the price; stock below reservations is flagged with a purchase list", async () => {
    const owner = await w.actor(w.owner.id);
    const created = await (await postYarn(requestWith(jars.owner, "/api/yarns", json("POST", { ...yarn, colourName: "Rowan", lot: { lotCode: "R1", stockSkeins: 2 } })), ctx(""))).json();
    const id = created.yarn.id as string;
    const changedPrice = await patchYarn(requestWith(jars.assistant, `/api/yarns/${id}`, json("PATCH", { ...yarn, colourName: "Rowan", price: "1.00" })), ctx(id));
    expect(changedPrice.status).toBe(403);
    const renamed = await patchYarn(requestWith(jars.assistant, `/api/yarns/${id}`, json("PATCH", { ...yarn, colourName: "Rowan red" })), ctx(id));
    expect(renamed.status).toBe(200);
    await db.update(commissions).set({ state: "in_production" }).where(eq(commissions.id, w.commissionA));
    await db.insert(yarnReservations).values({ commissionId: w.commissionA, yarnId: id, skeins: 5 });
    let list = await listYarns(owner, w.studioId);
    expect(list.yarns.find((y) => y.id === id)).toMatchObject({ stock: 2, reserved: 5, short: 3 });
    expect(list.purchase.find((p) => p.yarnId === id)).toMatchObject({ skeins: 3, costMinor: 3 * 850 });
    await setLotStock(await w.actor(w.assistant.id), id, { lotCode: "R2", stockSkeins: 4 });
    list = await listYarns(owner, w.studioId);
    expect(list.yarns.find((y) => y.id === id)).toMatchObject({ stock: 6, short: 0 });
    expect(list.purchase.find((p) => p.yarnId === id)).toBeUndefined();
    await expect(setLotStock(await w.actor(w.outsider.id), id, { lotCode: "X", stockSkeins: 1 })).rejects.toMatchObject({ status: 404 });
  });
});
