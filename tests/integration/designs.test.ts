import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { GET as getDesign } from "@/app/api/designs/[id]/route";
import { GET as listVersions, POST as saveVersion } from "@/app/api/designs/[id]/versions/route";
import { GET as listDesigns, POST as createDesignRoute } from "@/app/api/designs/route";
import { db } from "@/db";
import { designs, designVersions } from "@/db/schema";
import { canonicalJson, contentHashOf } from "@/lib/server/designs";
import { makeWorld, requestWith, signIn, type Jar, type World } from "./helpers";

let w: World;
const jars: Record<string, Jar> = {};

const chartRows = (rows: string[]) => ({
  version: 1,
  width: rows[0].length,
  height: rows.length,
  gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 },
  palette: [
    { key: "A", name: "Oat", hex: "#efe6d2" },
    { key: "B", name: "Rowan red", hex: "#9E2B25" },
  ],
  rows,
});
const entry = (rows: string[]) => ({ area: "back-of-hand", label: "Back of hand", chart: chartRows(rows) });

beforeAll(async () => {
  w = await makeWorld();
  for (const [k, p] of Object.entries({ owner: w.owner, assistant: w.assistant, a: w.clientA, outsider: w.outsider })) {
    jars[k] = await signIn(p.email);
  }
});

const ctx = (p: Record<string, string>) => ({ params: Promise.resolve(p) });
const json = (method: string, body: unknown): RequestInit => ({
  method,
  headers: { "content-type": "application/json" },
  body: typeof body === "string" ? body : JSON.stringify(body),
});

async function create(jar: Jar | null, commissionId: string, rows = ["AABB", "ABAB", "AAAA"]) {
  const res = await createDesignRoute(requestWith(jar, "/api/designs", json("POST", { commissionId, title: "Test design", charts: [entry(rows)] })), ctx({}));
  return { status: res.status, body: await res.json() };
}

async function save(jar: Jar | null, id: string, parentVersionId: string | null, charts: unknown) {
  const res = await saveVersion(requestWith(jar, `/api/designs/${id}/versions`, json("POST", { parentVersionId, charts })), ctx({ id }));
  return { status: res.status, body: await res.json() };
}

describe("designs through the API", () => {
  test("the owner creates a design: version 1 is the head, hex normalised, content hash is SHA-256 of canonical JSON", async () => {
    const res = await create(jars.owner, w.commissionA);
    expect(res.status).toBe(201);
    const { design, version } = res.body;
    expect(design.headVersionId).toBe(version.id);
    expect(version.number).toBe(1);
    const [row] = await db.select().from(designVersions).where(eq(designVersions.id, version.id));
    const chart = row.charts[0].chart as { palette: { hex: string }[] };
    expect(chart.palette[0].hex).toBe("#EFE6D2");
    expect(row.contentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(row.contentHash).toBe(contentHashOf(row.charts));
    expect(canonicalJson({ b: 1, a: [2, { d: 1, c: 2 }] })).toBe('{"a":[2,{"c":2,"d":1}],"b":1}');
  });

  test("a bad chart is refused with 422 naming row and stitch from the bottom and right; nothing is saved", async () => {
    const before = await db.select().from(designs).where(eq(designs.commissionId, w.commissionB));
    const res = await create(jars.owner, w.commissionB, ["AABB", "ABQB", "AAAA"]);
    expect(res.status).toBe(422);
    // rows[1] of three is row 2 from the bottom; 'Q' is the 3rd character from the left of 4 = stitch 2 from the right
    expect(res.body.error.message).toContain("row 2, stitch 2: key 'Q' is not in the palette");
    expect(Object.keys(res.body.error.fieldErrors)[0]).toMatch(/^charts\.0\.chart\.rows/);
    const after = await db.select().from(designs).where(eq(designs.commissionId, w.commissionB));
    expect(after.length).toBe(before.length);
  });

  test("a chart over 400 × 400 is refused", async () => {
    const wide = chartRows(["A".repeat(401)]);
    const res = await createDesignRoute(
      requestWith(jars.owner, "/api/designs", json("POST", { commissionId: w.commissionB, title: "Too wide", charts: [{ area: "a", label: "A", chart: wide }] })),
      ctx({}),
    );
    expect(res.status).toBe(422);
    expect((await res.json()).error.message).toContain("width must be at most 400");
  });

  test("malformed JSON is 400, not a crash", async () => {
    const res = await createDesignRoute(requestWith(jars.owner, "/api/designs", json("POST", "{nope")), ctx({}));
    expect(res.status).toBe(400);
  });

  test("saving from the head moves the head; saving the same content again adds nothing", async () => {
    const { body } = await create(jars.owner, w.commissionA);
    const id = body.design.id as string;
    const v1 = body.version.id as string;
    const s = await save(jars.owner, id, v1, [entry(["BBBB", "ABAB", "AAAA"])]);
    expect(s.status).toBe(201);
    expect(s.body.version.number).toBe(2);
    expect(s.body.version.parentVersionId).toBe(v1);
    const again = await save(jars.owner, id, s.body.version.id, [entry(["BBBB", "ABAB", "AAAA"])]);
    expect(again.status).toBe(200);
    expect(again.body.unchanged).toBe(true);
    const [d] = await db.select().from(designs).where(eq(designs.id, id));
    expect(d.headVersionId).toBe(s.body.version.id);
  });

  test("two tabs save from the same parent: the second is kept as a sibling and answered 409 with both ids", async () => {
    const { body } = await create(jars.owner, w.commissionA);
    const id = body.design.id as string;
    const v1 = body.version.id as string;
    const [first, second] = await Promise.all([
      save(jars.owner, id, v1, [entry(["BBBB", "ABAB", "AAAA"])]),
      save(jars.assistant, id, v1, [entry(["AAAA", "BBBB", "AAAA"])]),
    ]);
    const statuses = [first.status, second.status].sort();
    expect(statuses).toEqual([201, 409]);
    const winner = first.status === 201 ? first : second;
    const loser = first.status === 201 ? second : first;
    expect(loser.body.error.code).toBe("version_conflict");
    expect(loser.body.headVersionId).toBe(winner.body.version.id);
    expect(loser.body.savedVersionId).toBe(loser.body.version.id);
    expect(loser.body.error.message).toContain(`Yours is kept as version ${loser.body.version.number}`);
    const kept = await db.select().from(designVersions).where(eq(designVersions.designId, id));
    expect(kept.map((v) => v.number).sort()).toEqual([1, 2, 3]);
    expect(kept.filter((v) => v.parentVersionId === v1).length).toBe(2);
    const [d] = await db.select().from(designs).where(eq(designs.id, id));
    expect(d.headVersionId).toBe(winner.body.version.id);
  });

  test("a bad chart in a save is 422 and writes no version", async () => {
    const { body } = await create(jars.owner, w.commissionA);
    const id = body.design.id as string;
    const res = await save(jars.owner, id, body.version.id, [entry(["AABB", "ABA", "AAAA"])]);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toContain("row 2 has 3 stitches, expected 4");
    const kept = await db.select().from(designVersions).where(eq(designVersions.designId, id));
    expect(kept.length).toBe(1);
  });

  test("a locked (approved) design refuses edits with a clear message", async () => {
    const { body } = await create(jars.owner, w.commissionA);
    const id = body.design.id as string;
    await db.update(designs).set({ lockedVersionId: body.version.id }).where(eq(designs.id, id));
    const res = await save(jars.owner, id, body.version.id, [entry(["BBBB", "BBBB", "BBBB"])]);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe("design_locked");
    expect(res.body.error.message).toMatch(/approved/);
    expect((await db.select().from(designVersions).where(eq(designVersions.designId, id))).length).toBe(1);
  });
});

describe("who may see and edit designs", () => {
  let id: string;
  let v1: string;
  beforeAll(async () => {
    const { body } = await create(jars.owner, w.commissionA);
    id = body.design.id;
    v1 = body.version.id;
  });

  test("anonymous: 401", async () => {
    expect((await getDesign(requestWith(null, `/api/designs/${id}`), ctx({ id }))).status).toBe(401);
    expect((await save(null, id, v1, [entry(["BBBB", "BBBB", "BBBB"])])).status).toBe(401);
  });

  test("the client of the commission gets 404 through this API (proofs are their door)", async () => {
    expect((await getDesign(requestWith(jars.a, `/api/designs/${id}`), ctx({ id }))).status).toBe(404);
    expect((await listVersions(requestWith(jars.a, `/api/designs/${id}/versions`), ctx({ id }))).status).toBe(404);
    expect((await save(jars.a, id, v1, [entry(["BBBB", "BBBB", "BBBB"])])).status).toBe(404);
    expect((await create(jars.a, w.commissionA)).status).toBe(404);
    const list = await listDesigns(requestWith(jars.a, "/api/designs"), ctx({}));
    expect((await list.json()).designs).toEqual([]);
  });

  test("a member of another studio gets 404 and cannot create a design on this studio's commission", async () => {
    expect((await getDesign(requestWith(jars.outsider, `/api/designs/${id}`), ctx({ id }))).status).toBe(404);
    expect((await save(jars.outsider, id, v1, [entry(["BBBB", "BBBB", "BBBB"])])).status).toBe(404);
    expect((await create(jars.outsider, w.commissionA)).status).toBe(404);
    const list = await listDesigns(requestWith(jars.outsider, "/api/designs"), ctx({}));
    expect(((await list.json()).designs as { id: string }[]).map((d) => d.id)).not.toContain(id);
  });

  test("the assistant may read and edit designs", async () => {
    const got = await getDesign(requestWith(jars.assistant, `/api/designs/${id}`), ctx({ id }));
    expect(got.status).toBe(200);
    const body = await got.json();
    expect(body.head.charts[0].area).toBe("back-of-hand");
    expect(body.versions.length).toBeGreaterThanOrEqual(1);
    const res = await save(jars.assistant, id, body.design.headVersionId, [entry(["BABA", "BBBB", "BBBB"])]);
    expect(res.status).toBe(201);
    const list = await listDesigns(requestWith(jars.assistant, `/api/designs?commissionId=${w.commissionA}`), ctx({}));
    expect(((await list.json()).designs as { id: string }[]).map((d) => d.id)).toContain(id);
  });
});
