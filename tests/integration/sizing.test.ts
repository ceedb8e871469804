// A commission's sizing through its route: saved only when it sizes, field errors otherwise with
// nothing lost, studio people only; the saved gauge then sizes the yarn estimate's plain parts.
import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { GET, PUT } from "@/app/api/commissions/[id]/sizing/route";
import { POST as createDesignRoute } from "@/app/api/designs/route";
import { GET as workSheet } from "@/app/api/designs/[id]/work-sheet/route";
import { db } from "@/db";
import { commissions } from "@/db/schema";
import { buildMittenPair } from "@/db/seed-parts/designs";
import { getCommissionYarnEstimate } from "@/lib/server/design-yarn";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { defaultSizingForm, sizeForm } from "@/lib/schemas/sizing";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
let designId: string;
const jars: Record<string, Jar> = {};
const ctx = (id: string) => ({ params: Promise.resolve({ id }) });
const put = (jar: Jar | null, id: string, body: unknown) =>
  PUT(requestWith(jar, `/api/commissions/${id}/sizing`, { method: "PUT", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), ctx(id));
const get = (jar: Jar | null, id: string) => GET(requestWith(jar, `/api/commissions/${id}/sizing`), ctx(id));

const good = { ...defaultSizingForm("mittens", {}, []), lengths: { handCircumference: "19", handLength: "18.5" }, stitches: "30", rows: "34", repeat: "6" };

beforeAll(async () => {
  w = await makeWorld();
  for (const [k, p] of Object.entries({ owner: w.owner, assistant: w.assistant, a: w.clientA, b: w.clientB, outsider: w.outsider })) jars[k] = await signIn(p.email);
  await db.update(commissions).set({ brief: { sizeLabel: "woman" } }).where(eq(commissions.id, w.commissionA));
});

describe("PUT and GET /api/commissions/:id/sizing", () => {
  test("before anything is saved, GET gives a first form from the brief", async () => {
    const res = await get(jars.owner, w.commissionA);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({ saved: false, sizing: { size: "woman", stitches: "32" } });
  });

  test("the owner saves a form that sizes; the answer has the cast-on", async () => {
    const res = await put(jars.owner, w.commissionA, good);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.result.castOn % 6).toBe(0);
    expect(body.result.gauge.stitchesPer10cm).toBe(30);
    const [row] = await db.select({ sizing: commissions.sizing }).from(commissions).where(eq(commissions.id, w.commissionA));
    expect(row.sizing).toMatchObject({ stitches: "30", lengths: { handCircumference: "19" } });
  });

  test("a form that does not size is 422 on the field, and the saved one is kept", async () => {
    const res = await put(jars.assistant, w.commissionA, { ...good, lengths: { handCircumference: "300", handLength: "18.5" } });
    expect(res.status).toBe(422);
    const body = await res.json();
    expect(body.error.fieldErrors["lengths.handCircumference"].join(" ")).toMatch(/too large/);
    const again = await (await get(jars.owner, w.commissionA)).json();
    expect(again).toMatchObject({ saved: true, sizing: { lengths: { handCircumference: "19" } } });
  });

  test("a body of the wrong shape is 422 with its fields named", async () => {
    const res = await put(jars.owner, w.commissionA, { ...good, unit: "furlongs" });
    expect(res.status).toBe(422);
    expect(Object.keys((await res.json()).error.fieldErrors)).toContain("unit");
  });

  test("the assistant can save; clients, other studios and anonymous callers cannot read or write", async () => {
    expect((await put(jars.assistant, w.commissionA, good)).status).toBe(200);
    expect((await get(jars.a, w.commissionA)).status).toBe(404);
    expect((await put(jars.a, w.commissionA, good)).status).toBe(404);
    expect((await get(jars.b, w.commissionA)).status).toBe(404);
    expect((await get(jars.outsider, w.commissionA)).status).toBe(404);
    expect((await put(jars.outsider, w.commissionA, good)).status).toBe(404);
    expect((await get(null, w.commissionA)).status).toBe(401);
  });

  test("the yarn estimate sizes the plain parts from the saved sizing and its gauge", async () => {
    const owner = jars.owner;
    const res = await createDesignRoute(
      requestWith(owner, "/api/designs", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ commissionId: w.commissionA, title: "Sized mittens", charts: buildMittenPair() }) }),
      { params: Promise.resolve({}) },
    );
    expect(res.status).toBe(201);
    designId = (await res.json()).design.id;
    const actor = await w.actor(w.owner.id);
    const est = (await getCommissionYarnEstimate(actor, await getCommissionFor(actor, w.commissionA)))!;
    expect(est.plainNote).toMatch(/sized from the saved sizing at 30 sts per 10 cm, with the design's charts on their areas/);
  });

  test("the work sheet PDF opens with the saved sizing's recipe, metric and imperial", async () => {
    const res = await workSheet(requestWith(jars.assistant, `/api/designs/${designId}/work-sheet`), ctx(designId));
    expect(res.status).toBe(200);
    mkdirSync("test-results/pdf", { recursive: true });
    writeFileSync("test-results/pdf/work-sheet-recipe.pdf", Buffer.from(await res.arrayBuffer()));
    const text = execFileSync("pdftotext", ["-layout", "test-results/pdf/work-sheet-recipe.pdf", "-"]).toString();
    const saved = (await (await get(jars.owner, w.commissionA)).json()).sizing;
    const result = sizeForm("mittens", saved).result!;
    expect(text).toMatch(/Sized\s+mittens: recipe/);
    expect(text).toContain(`cast on ${result.castOn} sts, 30 sts and 34 rnds per 10 cm`);
    expect(text).toMatch(/Metric[\s\S]*1\. Gauge: [\s\S]*Imperial[\s\S]*1\. Gauge: /);
    expect(text).toContain(`Cast on ${result.castOn} sts`);
    // The chart pages follow.
    expect(text).toMatch(/Sized\s+mittens: Back of hand \(left\)/);
  });
});
