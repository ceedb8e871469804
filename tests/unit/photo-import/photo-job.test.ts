import { describe, expect, test } from "vitest";
import { parseChart, serializeChart, type ChartV1 } from "@/lib/core/chart";
import { areaShapeMask, hasOutsideCells } from "@/lib/core/design-garment";
import { chartToPixels } from "@/lib/core/photo";
import { sizeGarment } from "@/lib/core/sizing";
import type { LivePricing } from "@/components/chart-editor/garment-reading";
import { runPhotoJob } from "@/components/photo-import/photo-job";

const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
const palette = [
  { key: "A", name: "Gull white", hex: "#F2EEE4" },
  { key: "B", name: "Lichen green", hex: "#6F8A5B" },
  { key: "C", name: "Rowanberry", hex: "#A8322D" },
];

describe("one photo import worked out (what the worker runs)", () => {
  test("a chart drawn to pixels comes back as the same chart; outside the area's shape is left in the first colour", () => {
    const area = sizeGarment({ garment: "mitten", size: "child", gauge }).charts.find((a) => a.area === "back of hand")!;
    expect(hasOutsideCells(area)).toBe(true);
    const W = area.width;
    const H = area.height;
    const rows = Array.from({ length: H }, (_, r) => Array.from({ length: W }, (_, x) => "ABC"[(Math.floor(x / 3) + Math.floor(r / 2)) % 3]).join(""));
    const doc: ChartV1 = { version: 1, width: W, height: H, gauge, palette, rows };
    const out = runPhotoJob({ seq: 7, image: chartToPixels(doc, 9, 8), options: { width: W, height: H, gauge, palette }, shape: area });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.seq).toBe(7);
    const mask = areaShapeMask(area);
    const want = parseChart(doc);
    for (let i = 0; i < mask.length; i++) if (!mask[i]) want.cells[i] = 0;
    expect(out.chart.rows).toEqual(serializeChart(want).rows);
    expect(out.cellsOutside).toBe(mask.length - mask.reduce((s, v) => s + v, 0));
  });

  test("the core's refusal comes back with the field it is about", () => {
    const doc: ChartV1 = { version: 1, width: 4, height: 4, gauge, palette, rows: ["AAAA", "ABBA", "ABBA", "AAAA"] };
    const out = runPhotoJob({ seq: 1, image: chartToPixels(doc, 4, 4), options: { width: 4, height: 4, gauge, colours: 1 } });
    expect(out).toMatchObject({ ok: false, field: "colours" });
  });

  test("with a garment, the garment is read before and after the chart is replaced", () => {
    const sizing = sizeGarment({ garment: "mitten", size: "child", gauge });
    const area = sizing.charts.find((a) => a.area === "back of hand")!;
    const plain = parseChart({ version: 1, width: area.width, height: area.height, gauge, palette: palette.slice(0, 2), rows: Array(area.height).fill("A".repeat(area.width)) });
    const stripes: ChartV1 = { version: 1, width: area.width, height: area.height, gauge, palette: palette.slice(0, 2), rows: Array.from({ length: area.height }, (_, r) => (r % 2 ? "A" : "B").repeat(area.width)) };
    const pricing = {
      policy: { currency: "GBP", hourlyRateMinor: 2000, labourPolicy: "p50", rates: undefined, p80Factors: undefined, taxRateBasisPoints: 0, pricesIncludeTax: false, depositBasisPoints: 3000 },
      designFeeMinor: 0,
      floatLimitStitches: 5,
    } as unknown as LivePricing; // only what the garment reading uses

    const out = runPhotoJob({
      seq: 2,
      image: chartToPixels(stripes, 9, 8),
      options: { width: area.width, height: area.height, gauge, palette: palette.slice(0, 2) },
      shape: area,
      garment: { sizing, charts: [{ area: "back-of-hand", label: "Back of hand", chart: plain }], index: 0, pricing },
    });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.before?.pieces.length).toBeGreaterThan(0);
    expect(out.after?.pieces.length).toBe(out.before?.pieces.length);
    expect(JSON.stringify(out.after?.pieces)).not.toBe(JSON.stringify(out.before?.pieces));
  });

  test("the round clean-up folds a speck of a third colour and reports the plan before and after", () => {
    const W = 20;
    const H = 12;
    const rows: string[][] = Array.from({ length: H }, (_, r) => Array.from({ length: W }, (_, x) => (((x >> 1) + (r >> 1)) % 3 === 0 ? "B" : "A")));
    rows[4][7] = "C"; // one red stitch in a green and white round
    const doc: ChartV1 = { version: 1, width: W, height: H, gauge, palette, rows: rows.map((r) => r.join("")) };
    const image = chartToPixels(doc, 9, 8);
    const options = { width: W, height: H, gauge, palette };
    const plain = runPhotoJob({ seq: 3, image, options });
    const cleaned = runPhotoJob({ seq: 4, image, options, limitRounds: { maxStitches: 2, inTheRound: true } });
    expect(plain.ok && cleaned.ok).toBe(true);
    if (!plain.ok || !cleaned.ok) return;
    expect(plain.rounds ?? null).toBeNull();
    expect(plain.chart.rows[4][7]).toBe("C");
    expect(cleaned.rounds?.changed).toEqual([{ row: H - 4, stitch: W - 7, from: "C", to: cleaned.chart.rows[4][7] }]);
    expect(cleaned.chart.rows[4][7]).not.toBe("C");
    expect(cleaned.rounds!.after.darnedStitches).toBe(0);
    expect(cleaned.rounds!.before.darnedStitches).toBe(1);
    expect(cleaned.rounds!.after.ends).toBeLessThan(cleaned.rounds!.before.ends);
  });
});
