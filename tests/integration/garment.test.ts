// The commission's garment behind every number: with saved sizing and a design, the quote
// builder's first draft, production's pieces and the yarn estimate all read the same pieces.
// Expected counts are worked out from the size verb's own output (pieces × quantity, the chart
// area's in-shape stitches) and from the chart's cells, not from the garment reading under test.
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, test } from "vitest";
import { db } from "@/db";
import { commissions, designVersions } from "@/db/schema";
import { serializeChart } from "@/lib/core/chart";
import { createChart } from "@/lib/core/chart/model";
import { rowShape } from "@/lib/core/design-garment";
import { composeQuote } from "@/lib/core/pricing/compose-quote";
import { getSizeKeys, type SizingResult } from "@/lib/core/sizing";
import { defaultSizingForm, sizeForm } from "@/lib/schemas/sizing";
import { createDesign, saveDesignVersion } from "@/lib/server/designs";
import { getCommissionYarnEstimate } from "@/lib/server/design-yarn";
import { ESTIMATED_NOTE, getCommissionGarment } from "@/lib/server/garment";
import { startProduction } from "@/lib/server/production";
import { getCommissionFor } from "@/lib/server/queries/commissions";
import { getQuoteBuilderData } from "@/lib/server/quotes";
import { saveCommissionSizing } from "@/lib/server/sizing";
import { makeWorld, type World } from "./helpers";

let w: World;
let sizing: SizingResult;
let designId: string;
let headId: string;
const palette = [
  { key: "A", name: "Gull white", hex: "#F2EEE4" },
  { key: "B", name: "Loch blue", hex: "#2E5A7A" },
];
let blueInShape = 0;

/** A back-of-hand chart at the area's size: one blue stitch in every row's shape, so every round of the area holds two colours. */
function backChart(s: SizingResult, paintOutside = false) {
  const back = s.charts.find((c) => c.area === "back of hand")!;
  const chart = createChart(back.width, back.height, s.gauge, palette);
  let blue = 0;
  for (let y = 0; y < back.height; y++) {
    const mask = rowShape(back, y);
    const x = mask.indexOf(true);
    chart.cells[y * back.width + x] = 1;
    blue++;
    if (paintOutside && mask.indexOf(false) >= 0) chart.cells[y * back.width + mask.indexOf(false)] = 1;
  }
  return { chart, blue, back };
}

beforeAll(async () => {
  w = await makeWorld();
  const owner = await w.actor(w.owner.id);
  // A child's pair at the studio's own gauge, saved on the commission.
  const form = { ...defaultSizingForm("mittens", { sizeLabel: "child" }, getSizeKeys("mitten")), size: "child", stitches: "30", rows: "34" };
  await saveCommissionSizing(owner, w.commissionA, form);
  sizing = sizeForm("mittens", form).result!;
  const { chart, blue } = backChart(sizing);
  blueInShape = blue;
  const entries = [{ area: "back-of-hand", label: "Back of hand", chart: serializeChart(chart) }];
  const made = await createDesign(owner, { commissionId: w.commissionA, title: "Garment mittens", charts: entries });
  designId = made.design.id;
  headId = made.version.id;
});

describe("one garment behind the quote, production and yarn", () => {
  test("the quote's first draft is the garment's pieces one by one: every stitch once, design once, a thumb each", async () => {
    const data = await getQuoteBuilderData(await w.actor(w.owner.id), w.commissionA);
    const pieces = data.initial.pieces;
    expect(pieces.map((p) => p.label)).toEqual(["left mitten", "right mitten"]);
    // The size verb counts every stitch of the garment: pieces × quantity (mitten × 2, thumb × 2).
    const sized = sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0);
    expect(pieces.reduce((s, p) => s + (p.plainStitches ?? 0) + (p.strandedStitches ?? 0), 0)).toBe(sized);
    // Two colours in every round of the back of hand: exactly its in-shape stitches are stranded, on each mitten.
    const back = sizing.charts.find((c) => c.area === "back of hand")!;
    expect(pieces.map((p) => p.strandedStitches)).toEqual([back.stitches, back.stitches]);
    expect(pieces.map((p) => p.newDesign)).toEqual([true, false]);
    expect(pieces.map((p) => p.proofRounds)).toEqual([1, 0]);
    expect(pieces.map((p) => p.thumbs)).toEqual([1, 1]);
    expect(pieces.every((p) => p.blocked === true && (p.shapingRounds ?? 0) > 0)).toBe(true);
    expect(data.featuresFromDesign).toBe(true);
    expect(data.garment).toEqual({ sizedFrom: "saved sizing", note: null, problems: null });
    // Design once for the pair, blocking and finishing once per mitten.
    const { estimate } = composeQuote(data.initial, data.policy);
    expect(estimate.pieces.filter((p) => p.p50Minutes.design > 0)).toHaveLength(1);
    expect(estimate.pieces.every((p) => p.p50Minutes.blocking > 0 && p.p50Minutes.finishing > 0)).toBe(true);
  });

  test("production sets up the same pieces with the same features; its knitting estimate is the quote's", async () => {
    const owner = await w.actor(w.owner.id);
    const data = await getQuoteBuilderData(owner, w.commissionA);
    await db.update(commissions).set({ state: "proof_approved" }).where(eq(commissions.id, w.commissionA));
    const { pieces: created } = await startProduction(owner, w.commissionA, "pieces");
    expect(created.map((p) => p.name)).toEqual(["Left mitten", "Right mitten"]);
    for (const [i, p] of created.entries()) {
      const q = data.initial.pieces[i];
      for (const k of ["plainStitches", "strandedStitches", "floatCatches", "shapingRounds", "thumbs", "duplicateStitches", "ends", "carryCm", "newDesign", "proofRounds"] as const) {
        expect(p.features[k], `${p.name} ${k}`).toBe(q[k]);
      }
    }
    const { estimate } = composeQuote(data.initial, data.policy);
    const board = created.reduce((s, p) => s + p.estimate.knitting.p50, 0);
    // Per piece as the quote's estimate rounds it; the quote's stage total is rounded once, so within a minute per piece.
    expect(board).toBe(estimate.pieces.reduce((s, p) => s + p.p50Minutes.knitting, 0));
    expect(Math.abs(board - estimate.stages.knitting.p50Minutes)).toBeLessThanOrEqual(created.length);
  });

  test("the yarn estimate reads the garment: the blue is knitted in every round of both backs, the rest in the main colour", async () => {
    const owner = await w.actor(w.owner.id);
    const c = await getCommissionFor(owner, w.commissionA);
    const garment = await getCommissionGarment(c);
    const blue = garment.reading.yarn.colours.find((y) => y.key === "B")!;
    // One blue stitch per chart row, on each of the two mittens.
    expect(blue.knittedStitches).toBe(blueInShape * 2);
    const white = garment.reading.yarn.colours.find((y) => y.key === "A")!;
    const sized = sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0);
    expect(white.knittedStitches + blue.knittedStitches).toBe(sized);
    const est = (await getCommissionYarnEstimate(owner, c))!;
    expect(est.plainNote).toMatch(/^Every stitch of the left mitten, right mitten .* sized from the saved sizing at 30 sts per 10 cm/);
    // Metres per colour are the garment's, with the studio margin on top (never less).
    const byHex = (hex: string) => est.lines.find((l) => l.hex.toLowerCase() === hex.toLowerCase())!;
    expect(byHex("#2E5A7A").totalCm).toBeGreaterThanOrEqual(blue.totalCm);
    expect(byHex("#F2EEE4").totalCm).toBeGreaterThanOrEqual(white.totalCm);
    expect(byHex("#F2EEE4").roles).toEqual(["knitted"]);
  });

  test("the work sheet prints every piece's stitches and, round by round, what is knitted", async () => {
    const owner = await w.actor(w.owner.id);
    const { loadStudioSettings } = await import("@/lib/server/settings");
    const { buildWorkSheet, workSheetGarment } = await import("@/lib/server/work-sheet");
    const [head] = await db.select().from(designVersions).where(eq(designVersions.id, headId));
    const sheet = (await workSheetGarment(w.commissionA, w.studioId, head.charts, await loadStudioSettings(w.studioId)))!;
    expect(sheet.pieces.map((p) => p.name)).toEqual(["left mitten", "right mitten"]);
    const sized = sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0);
    expect(sheet.pieces.reduce((s, p) => s + p.stitches, 0)).toBe(sized);
    expect(sheet.pieces.every((p) => p.plain + p.stranded === p.stitches)).toBe(true);
    expect(sheet.roundsOf).toBe("left mitten");
    // The back of hand's rounds knit both colours; the cuff below it only the main colour.
    expect(sheet.rounds.some((r) => r.knit === "Gull white and Loch blue")).toBe(true);
    expect(sheet.rounds[0].knit).toBe("Gull white");
    const pdf = await buildWorkSheet(owner, designId);
    expect(pdf.pdf.subarray(0, 5).toString()).toBe("%PDF-");
  });

  test("a save that paints outside the shape is refused naming the place, and nothing is saved", async () => {
    const owner = await w.actor(w.owner.id);
    const { chart, back } = backChart(sizing, true);
    // The first narrowed row of the top, counted from the bottom; its first cell outside the shape is at x = 0, i.e. the last stitch from the right.
    const y = back.rowStitches!.findIndex((n) => n < back.width);
    const before = await db.select().from(designVersions).where(eq(designVersions.designId, designId));
    await expect(
      saveDesignVersion(owner, designId, { parentVersionId: headId, charts: [{ area: "back-of-hand", label: "Back of hand", chart: serializeChart(chart) }] }),
    ).rejects.toMatchObject({ status: 422, message: expect.stringContaining(`row ${y + 1} from the bottom, stitch ${back.width} from the right is outside the shape`) });
    const after = await db.select().from(designVersions).where(eq(designVersions.designId, designId));
    expect(after).toHaveLength(before.length);
  });

  test("with no sizing and no size in the brief, the garment is a standard size and says so", async () => {
    const owner = await w.actor(w.owner.id);
    const c = await getCommissionFor(owner, w.commissionB);
    const garment = await getCommissionGarment(c);
    expect(garment.sizedFrom).toBe("standard size");
    expect(garment.note).toContain(ESTIMATED_NOTE);
    expect(garment.pieces.map((p) => p.label)).toEqual(["left mitten", "right mitten"]);
    const data = await getQuoteBuilderData(owner, w.commissionB);
    expect(data.initial.pieces).toEqual(garment.pieces);
    expect(data.garment.note).toContain("size the commission for real numbers");
  });
});
