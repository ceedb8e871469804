// The quote builder's yarn from the design, read from the garment: every stitch of both mittens
// (sized from the brief) with the charts on their areas, studio yarns matched by colour, free stock
// per dye lot.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { POST as createDesignRoute } from "@/app/api/designs/route";
import { db } from "@/db";
import { commissions, yarnLots, yarnReservations, yarns } from "@/db/schema";
import { buildMittenPair } from "@/db/seed-parts/designs";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { getCommissionYarnEstimate } from "@/lib/server/design-yarn";
import { getQuoteBuilderData } from "@/lib/server/quotes";
import { makeWorld, requestWith, signIn, type World } from "./helpers";

let w: World;
const pair = buildMittenPair();
const yarnIds: Record<string, string> = {};

const post = (jar: Awaited<ReturnType<typeof signIn>>, url: string, body: unknown) =>
  requestWith(jar, url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

beforeAll(async () => {
  w = await makeWorld();
  // Two of the chart's three colours are studio yarns; Gorse (the darned colour) is not, at first.
  const rows = await db
    .insert(yarns)
    .values([
      { studioId: w.studioId, name: "Test 4-ply", colourName: "Gull white", hex: "#F2EEE4", fibre: "Wool", weightCategory: 1, metresPerSkein: 50, gramsPerSkein: 25, priceMinor: 450 },
      { studioId: w.studioId, name: "Test 4-ply", colourName: "Loch blue", hex: "#2e5a7a", fibre: "Wool", weightCategory: 1, metresPerSkein: 50, gramsPerSkein: 25, priceMinor: 450 },
    ])
    .returning();
  for (const r of rows) yarnIds[r.colourName] = r.id;
  await db.update(commissions).set({ brief: { sizeLabel: "woman" } }).where(eq(commissions.id, w.commissionA));
  const owner = await signIn(w.owner.email);
  const res = await createDesignRoute(post(owner, "/api/designs", { commissionId: w.commissionA, title: "Yarn mittens", charts: pair }), { params: Promise.resolve({}) });
  expect(res.status).toBe(201);
});

async function estimateFor(userId: string, commissionId = w.commissionA) {
  const actor = await w.actor(userId);
  const c = await getCommissionFor(actor, commissionId);
  return getCommissionYarnEstimate(actor, c);
}

describe("yarn from the design in the quote builder", () => {
  test("every stitch of a woman's pair with both charts on it, matched to the studio's yarns", async () => {
    const est = (await estimateFor(w.owner.id))!;
    expect(est.designTitle).toBe("Yarn mittens");
    expect(est.plainNote).toMatch(/Every stitch of the left mitten, right mitten .* sized from size woman from the brief/);
    const white = est.lines.find((l) => l.yarnId === yarnIds["Gull white"])!;
    const blue = est.lines.find((l) => l.yarnId === yarnIds["Loch blue"])!;
    expect(white.uses).toEqual(["left mitten, right mitten"]);
    expect(blue.roles).toEqual(["knitted"]);
    // The first chart's first colour is the main colour: it carries the plain parts (cuff, palm, thumb, top) of both mittens.
    const main = white;
    expect(main.metres).toBeGreaterThan(50);
    expect(main.skeins!.skeins).toBe(Math.ceil(main.totalCm / 5000));
    // Gorse is darned and no studio yarn has it: metres only, named in a warning.
    const gorse = est.lines.find((l) => l.label === "Gorse")!;
    expect(gorse).toMatchObject({ yarnId: null, skeins: null, roles: ["darned"] });
    expect(est.warnings.join("\n")).toContain("no studio yarn has the colour Gorse (#E0B33A)");
  });

  test("the first quote draft takes its skeins from the estimate", async () => {
    const data = await getQuoteBuilderData(await w.actor(w.owner.id), w.commissionA);
    const est = data.yarnEstimate!;
    const expected = est.lines.filter((l) => l.yarnId).map((l) => ({ yarnId: l.yarnId, skeins: l.skeins!.skeins }));
    expect(data.initial.materials.map((m) => ({ yarnId: m.yarnId, skeins: m.skeins }))).toEqual(expected);
  });

  test("skeins another live commission holds on a lot are not counted as free", async () => {
    const before = (await estimateFor(w.owner.id))!;
    const main = before.lines.find((l) => l.yarnId === yarnIds["Gull white"])!;
    const need = main.skeins!.skeins;
    const [lot] = await db.insert(yarnLots).values({ yarnId: main.yarnId!, lotCode: "IT-1", stockSkeins: need }).returning();
    const enough = (await estimateFor(w.owner.id))!;
    expect(enough.lines.find((l) => l.yarnId === main.yarnId)!.skeins!.note).toBeNull();
    await db.update(commissions).set({ state: "in_production" }).where(eq(commissions.id, w.commissionB));
    await db.insert(yarnReservations).values({ commissionId: w.commissionB, yarnId: main.yarnId!, lotId: lot.id, skeins: 1 });
    const held = (await estimateFor(w.owner.id))!;
    const line = held.lines.find((l) => l.yarnId === main.yarnId)!;
    expect(line.skeins!.shortBy).toBe(1);
    expect(held.warnings.join("\n")).toMatch(new RegExp(`needs ${need} skeins? .*${need - 1} in stock: order 1 more`));
  });

  test("only the studio's own people see it; the quote builder is the owner's", async () => {
    await expect(estimateFor(w.outsider.id)).rejects.toThrow();
    await expect(estimateFor(w.clientA.id)).rejects.toThrow();
    expect(await estimateFor(w.assistant.id)).not.toBeNull();
    await expect(getQuoteBuilderData(await w.actor(w.assistant.id), w.commissionA)).rejects.toThrow();
  });

  test("a commission without a design has no estimate", async () => {
    expect(await estimateFor(w.owner.id, w.commissionB)).toBeNull();
  });
});
