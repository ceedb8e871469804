// Demo designs built with the chart core: a mitten back-of-hand pair with "PO" and a snowflake for
// priya-mittens, and a hat band with "EB" between peerie borders for elias-hat.
import { sizeGarment } from "../../lib/core/sizing";
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import { createChart, getMotif, placeLettering, placeMotif, serializeChart, tileMotif, type Chart } from "../../lib/core/chart";
import { flipHorizontal } from "../../lib/core/chart/ops/flip";
import { mirrorBox } from "../../lib/core/chart/layered-design";
import { designs, designVersions, type DesignChartEntry } from "../schema";
import type { SeedPart } from "./context";

const GAUGE = { stitchesPer10cm: 32, rowsPer10cm: 36 };

// Same canonical JSON and hash as lib/server/designs.ts (that module is server-only).
function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(",")}}`;
}
const hashOf = (charts: DesignChartEntry[]) => createHash("sha256").update(canonicalJson(charts)).digest("hex");

interface Layer {
  text: string;
  font: "5x7" | "3x5";
  box: { x: number; y: number; width: number; height: number };
  key: string;
  backgroundKey: string;
}

function withLayers(chart: Chart, layers: Layer[]): Chart {
  const idx = (k: string) => chart.palette.findIndex((c) => c.key === k);
  return layers.reduce((c, l) => placeLettering(c, { text: l.text, font: l.font, box: l.box, colour: idx(l.key), background: idx(l.backgroundKey) }), chart);
}

/** Back of a woman's mitten (30 × 66 at 32/36, from the sizing core): peerie cuff band, PO, snowflake. */
export function buildMittenPair(): DesignChartEntry[] {
  const palette = [
    { key: "A", name: "Gull white", hex: "#F2EEE4" },
    { key: "B", name: "Loch blue", hex: "#2E5A7A" },
    { key: "C", name: "Gorse", hex: "#E0B33A" },
  ];
  let c = createChart(30, 66, GAUGE, palette);
  c = tileMotif(c, getMotif("diamond-peerie"), { x: 0, y: 2, width: 30, height: 5 }, { pattern: 1 });
  c = placeMotif(c, getMotif("snowflake-large"), { x: 8, y: 34 }, { pattern: 1 });
  // a touch of Gorse: the snowflake's heart, darned afterwards
  c = placeMotif(c, { id: "dot", name: "dot", tags: ["motif"], width: 1, height: 1, rows: ["X"] }, { x: 14, y: 40 }, { pattern: 2 });
  const layers: Layer[] = [{ text: "PO", font: "5x7", box: { x: 3, y: 14, width: 24, height: 9 }, key: "C", backgroundKey: "A" }];
  const left = withLayers(c, layers);
  const rightLayers = layers.map((l) => ({ ...l, box: mirrorBox(l.box, 30) }));
  const right = withLayers(flipHorizontal(left), rightLayers);
  return [
    { area: "back-of-hand-left", label: "Back of hand (left)", chart: serializeChart(left), lettering: layers },
    { area: "back-of-hand-right", label: "Back of hand (right)", chart: serializeChart(right), lettering: rightLayers },
  ];
}

/** Hat band (164 × 29 at 32/36 for a 57 cm head): peerie borders above and below EB. */
export function buildHatBand(): DesignChartEntry[] {
  const palette = [
    { key: "A", name: "Peat brown", hex: "#4A3728" },
    { key: "B", name: "Gull white", hex: "#F2EEE4" },
    { key: "C", name: "Rowanberry", hex: "#A8322D" },
  ];
  // At the band's size for the commission's brief (a 57 cm head at the chart's gauge), so the garment places it.
  const band = sizeGarment({ garment: "hat", measurements: { headCircumferenceCm: 57 }, gauge: GAUGE }).charts.find((a) => a.area === "band")!;
  const { width: W, height: H } = band;
  let c = createChart(W, H, GAUGE, palette);
  c = tileMotif(c, getMotif("diamond-peerie"), { x: 0, y: 2, width: W, height: 5 }, { pattern: 1 });
  c = tileMotif(c, getMotif("diamond-peerie"), { x: 0, y: H - 7, width: W, height: 5 }, { pattern: 1 });
  const layers: Layer[] = [{ text: "EB", font: "5x7", box: { x: Math.floor((W - 24) / 2), y: Math.floor((H - 9) / 2), width: 24, height: 9 }, key: "C", backgroundKey: "A" }];
  return [{ area: "band", label: "Hat band", chart: serializeChart(withLayers(c, layers)), lettering: layers }];
}

export const seedDesigns: SeedPart = async (tx, ctx) => {
  const demo = [
    { commission: "priya-mittens", title: "Snowflake mittens with P·O", charts: buildMittenPair() },
    { commission: "elias-hat", title: "Watch cap with E.B. band", charts: buildHatBand() },
  ];
  for (const d of demo) {
    const commissionId = ctx.commissionIds[d.commission];
    if (!commissionId) continue;
    const [design] = await tx.insert(designs).values({ studioId: ctx.studioId, commissionId, title: d.title }).returning();
    const [v] = await tx
      .insert(designVersions)
      .values({ designId: design.id, number: 1, charts: d.charts, contentHash: hashOf(d.charts), note: "Demo design", createdBy: ctx.userIds.owner })
      .returning();
    await tx.update(designs).set({ headVersionId: v.id }).where(eq(designs.id, design.id));
  }
};
