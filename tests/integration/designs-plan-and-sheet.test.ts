import { execFileSync } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import { beforeAll, describe, expect, test } from "vitest";
import { POST as createDesignRoute } from "@/app/api/designs/route";
import { GET as workSheet } from "@/app/api/designs/[id]/work-sheet/route";
import { POST as planRoute } from "@/app/api/colourwork/plan/route";
import { buildMittenPair } from "@/db/seed-parts/designs";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};
let designId: string;
const mitten = buildMittenPair();

const ctx = (p: Record<string, string>) => ({ params: Promise.resolve(p) });
const post = (jar: Jar | null, url: string, body: unknown) =>
  requestWith(jar, url, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });

beforeAll(async () => {
  w = await makeWorld();
  for (const [k, p] of Object.entries({ owner: w.owner, assistant: w.assistant, a: w.clientA, outsider: w.outsider })) jars[k] = await signIn(p.email);
  const res = await createDesignRoute(post(jars.owner, "/api/designs", { commissionId: w.commissionA, title: "Sheet mittens", charts: [mitten[0]] }), ctx({}));
  expect(res.status).toBe(201);
  designId = (await res.json()).design.id;
});

async function plan(jar: Jar | null, body: unknown) {
  const res = await planRoute(post(jar, "/api/colourwork/plan", body), ctx({}));
  return { status: res.status, body: await res.json() };
}

describe("POST /api/colourwork/plan", () => {
  test("a chart gives the colour plan and the darning route, in the CLI verbs' shape", async () => {
    const res = await plan(jars.owner, { chart: mitten[0].chart });
    expect(res.status).toBe(200);
    const { colours, darning } = res.body;
    // Gull white and Loch blue carry the whole pattern; Gorse (PO and one dot) is darned
    expect(colours.knit.sort()).toEqual(["A", "B"]);
    expect(colours.darn).toEqual(["C"]);
    expect(colours.candidates.length).toBe(3);
    expect(Array.isArray(colours.rows)).toBe(true);
    expect(colours.totals).toHaveProperty("catches");
    const gorse = darning.colours.find((c: { key: string }) => c.key === "C");
    expect(gorse.stitches).toBe(colours.darnedStitches);
    expect(gorse.ends).toBe(2 * gorse.strands.length);
    expect(gorse.ends).toBe(gorse.lowerBound.ends);
    expect(darning.totals).toHaveProperty("saved");
    expect(darning.settings.carryLimitCm).toBe(2.5); // the studio default
  });

  test("the maker's fixed pair and options win over the studio's", async () => {
    const res = await plan(jars.assistant, { chart: mitten[0].chart, options: { knit: ["A", "C"], carryLimitCm: 4 } });
    expect(res.status).toBe(200);
    expect(res.body.colours.knit).toEqual(["A", "C"]);
    expect(res.body.darning.settings.carryLimitCm).toBe(4);
  });

  test("bad input is 422 with the place named", async () => {
    const bad = { ...(mitten[0].chart as object), rows: (mitten[0].chart as { rows: string[] }).rows.map((r, i) => (i === 65 ? "Q" + r.slice(1) : r)) };
    const r1 = await plan(jars.owner, { chart: bad });
    expect(r1.status).toBe(422);
    expect(r1.body.error.message).toContain("row 1, stitch 30: key 'Q' is not in the palette");
    const r2 = await plan(jars.owner, { chart: mitten[0].chart, options: { knit: ["A", "Z"] } });
    expect(r2.status).toBe(422);
    expect(r2.body.error.message).toMatch(/knit/);
    const r3 = await plan(jars.owner, { chart: mitten[0].chart, options: { carryLimitCm: 0 } });
    expect(r3.status).toBe(422);
    expect(r3.body.error.message).toMatch(/carryLimitCm/);
  });

  test("a chart with nothing to darn is a plan with zero strands", async () => {
    const two = { version: 1, width: 4, height: 2, gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 }, palette: [{ key: "A", name: "a", hex: "#FFFFFF" }, { key: "B", name: "b", hex: "#000000" }], rows: ["ABAB", "BABA"] };
    const res = await plan(jars.owner, { chart: two });
    expect(res.status).toBe(200);
    expect(res.body.darning.totals.strands).toBe(0);
  });

  test("clients and anonymous callers cannot use it", async () => {
    expect((await plan(null, { chart: mitten[0].chart })).status).toBe(401);
    expect((await plan(jars.a, { chart: mitten[0].chart })).status).toBe(404);
  });
});

describe("GET /api/designs/:id/work-sheet", () => {
  test("renders a real PDF with the chart's key, pair, catches and darning per colour", async () => {
    const res = await workSheet(requestWith(jars.owner, `/api/designs/${designId}/work-sheet`), ctx({ id: designId }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const buf = Buffer.from(await res.arrayBuffer());
    expect(buf.subarray(0, 5).toString()).toBe("%PDF-");
    mkdirSync("test-results/pdf", { recursive: true });
    writeFileSync("test-results/pdf/work-sheet.pdf", buf);
    const text = execFileSync("pdftotext", ["-layout", "test-results/pdf/work-sheet.pdf", "-"]).toString();
    expect(text).toMatch(/Sheet\s+mittens: Back of hand \(left\)/);
    expect(text).toContain("Colour key");
    expect(text).toMatch(/Gull white\s+#F2EEE4/);
    expect(text).toContain("Knit in Gull white and Loch blue.");
    expect(text).toContain("Darn afterwards: Gorse.");
    expect(text).toContain("Float catches per row");
    expect(text).toMatch(/Darning Gorse \(C\): \d+ stitches/);
    expect(text).toMatch(/\d+ ends to weave in/);
    expect(text).toMatch(/yarn [\d.,]+ cm/);
    expect(text).toContain("Saved versus row by row");
    execFileSync("pdftoppm", ["-png", "-r", "60", "-f", "1", "-l", "1", "test-results/pdf/work-sheet.pdf", "test-results/pdf/work-sheet"]);
  });

  test("members only: the assistant may print it, the client and other studios get 404", async () => {
    const get = (jar: Jar | null) => workSheet(requestWith(jar, `/api/designs/${designId}/work-sheet`), ctx({ id: designId }));
    expect((await get(jars.assistant)).status).toBe(200);
    expect((await get(jars.a)).status).toBe(404);
    expect((await get(jars.outsider)).status).toBe(404);
    expect((await get(null)).status).toBe(401);
  });
});
