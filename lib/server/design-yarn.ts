import "server-only";
// Yarn per studio yarn for a commission's current design: every chart planned with the studio's
// limits, the garment's plain parts sized from the brief at the chart's gauge, and the free stock
// of each dye lot (recorded stock less what other live commissions hold on it).
import { and, asc, desc, eq, inArray, isNull, ne, notInArray } from "drizzle-orm";
import { db } from "@/db";
import { commissions, designVersions, designs, yarnLots, yarnReservations, yarns, type CommissionBrief, type DesignChartEntry, type GarmentKind } from "@/db/schema";
import { parseChart, type Chart } from "@/lib/core/chart";
import { estimatePlainYarn, type PlainYarnEstimate } from "@/lib/core/yarn/garment-yarn";
import { estimateDesignYarn, type DesignChartYarnInput, type DesignYarnEstimate, type StudioYarnRecord } from "@/lib/core/yarn/design-yarn";
import { assertCan, type Actor } from "./authz";
import { optionsFromSettings, planChart, type PlanOptionsInput } from "./colour-plan";
import { areaSlug } from "./design-sizes";
import { loadStudioSettings } from "./settings";
import { loadSizing, resolveSizing } from "./sizing";

/** Commission states that no longer hold yarn (as the yarn records count them). */
const NOT_HOLDING = ["shipped", "delivered", "closed", "declined", "cancelled"] as const;

export interface CommissionYarnEstimate extends DesignYarnEstimate {
  designTitle: string;
  designVersion: number;
  /** what the plain parts were sized from, or why they are left out */
  plainNote: string;
}

/** The design version a quote prices: the approved one if any, else the head. No permission check: callers read the commission for their actor first. */
export async function getPricedDesignVersion(commissionId: string) {
  const [d] = await db.select().from(designs).where(eq(designs.commissionId, commissionId)).orderBy(desc(designs.updatedAt)).limit(1);
  if (!d) return null;
  const versionId = d.lockedVersionId ?? d.headVersionId;
  const [v] = versionId
    ? await db.select().from(designVersions).where(eq(designVersions.id, versionId))
    : await db.select().from(designVersions).where(eq(designVersions.designId, d.id)).orderBy(desc(designVersions.number)).limit(1);
  return v ? { design: d, version: v } : null;
}

/** Studio yarns with the skeins of each lot not held by another live commission. */
async function studioYarnRecords(studioId: string, commissionId: string): Promise<StudioYarnRecord[]> {
  const rows = await db.select().from(yarns).where(eq(yarns.studioId, studioId)).orderBy(asc(yarns.createdAt), asc(yarns.colourName));
  const ids = rows.map((y) => y.id);
  if (!ids.length) return [];
  const lots = await db.select().from(yarnLots).where(inArray(yarnLots.yarnId, ids)).orderBy(asc(yarnLots.lotCode));
  const held = await db
    .select({ lotId: yarnReservations.lotId, skeins: yarnReservations.skeins })
    .from(yarnReservations)
    .innerJoin(commissions, eq(commissions.id, yarnReservations.commissionId))
    .where(
      and(
        inArray(yarnReservations.yarnId, ids),
        isNull(yarnReservations.releasedAt),
        ne(yarnReservations.commissionId, commissionId),
        notInArray(commissions.state, [...NOT_HOLDING]),
      ),
    );
  return rows.map((y) => {
    const own = lots.filter((l) => l.yarnId === y.id);
    return {
      id: y.id,
      name: y.name,
      colourName: y.colourName,
      hex: y.hex,
      metresPerSkein: y.metresPerSkein,
      gramsPerSkein: y.gramsPerSkein,
      ...(own.length
        ? {
            lots: own.map((l) => ({
              lot: l.lotCode,
              skeins: Math.max(0, l.stockSkeins - held.filter((h) => h.lotId === l.id).reduce((s, h) => s + h.skeins, 0)),
            })),
          }
        : {}),
    };
  });
}

function plainParts(
  c: { garment: GarmentKind; brief: CommissionBrief | null; sizing: unknown },
  entries: DesignChartEntry[],
  chartGauge: Chart["gauge"],
): { plain: PlainYarnEstimate | null; note: string } {
  // The studio's saved sizing first (its measured gauge); else the brief at the chart's gauge.
  const { result, saved, reason } = resolveSizing(c, chartGauge);
  if (!result) return { plain: null, note: `${reason ?? "Nothing to size from"}: only the charts are counted, not the garment's plain parts.` };
  const gauge = result.gauge;
  const slugs = entries.map((e) => e.area);
  const charted = result.charts.map((c) => c.area).filter((area) => slugs.some((s) => s === areaSlug(area) || s.startsWith(`${areaSlug(area)}-`)));
  try {
    const plain = estimatePlainYarn(result, { chartedAreas: charted });
    const from = saved ? "the saved sizing" : result.size ? `size ${result.size}` : "the brief's measurements";
    const at = saved ? "its gauge" : "the chart's gauge";
    return {
      plain,
      note: `Plain parts sized from ${from} at ${at} (${Math.round(gauge.stitchesPer10cm * 10) / 10} sts per 10 cm)${charted.length ? `, less the charted ${charted.join(", ")}` : ""}, in the main colour.`,
    };
  } catch (e) {
    return { plain: null, note: `The plain parts could not be sized (${(e as Error).message}): only the charts are counted.` };
  }
}

/**
 * Yarn for the design a quote prices, or null when the commission has no design with a chart.
 * The caller has read the commission for this actor; the studio check is made here as well.
 */
export async function getCommissionYarnEstimate(
  actor: Actor,
  c: { id: string; studioId: string; garment: GarmentKind; brief: CommissionBrief | null },
  /** the priced version when the caller has loaded it already */
  preloaded?: Awaited<ReturnType<typeof getPricedDesignVersion>>,
): Promise<CommissionYarnEstimate | null> {
  assertCan(actor, "studio.view", c.studioId);
  const priced = preloaded === undefined ? await getPricedDesignVersion(c.id) : preloaded;
  if (!priced || priced.design.studioId !== c.studioId) return null;
  const settings = await loadStudioSettings(c.studioId);
  const defaults = optionsFromSettings(settings);
  const charts: DesignChartYarnInput[] = [];
  const used: DesignChartEntry[] = [];
  const skipped: string[] = [];
  for (const entry of priced.version.charts) {
    let chart: Chart;
    try {
      chart = parseChart(entry.chart);
    } catch {
      continue; // a chart that does not parse is left out, as the labour estimate leaves it out
    }
    const fixed = (entry.options ?? {}) as PlanOptionsInput;
    let plan;
    try {
      // Every garment template is knitted in the round.
      plan = planChart(chart, { inTheRound: true, ...fixed }, defaults);
    } catch (e) {
      skipped.push(`${entry.label}: ${(e as Error).message}`);
      continue;
    }
    charts.push({ label: entry.label, chart, plan: plan.darning, knit: plan.colours.knit });
    used.push(entry);
  }
  if (!charts.length) return null;
  const { plain, note } = plainParts({ ...c, sizing: await loadSizing(c.id) }, used, charts[0].chart.gauge);
  const records = await studioYarnRecords(c.studioId, c.id);
  const estimate = estimateDesignYarn({ charts, yarns: records, plain });
  const warnings = [...skipped.map((s) => `left out, its colour plan could not be made (${s})`), ...estimate.warnings];
  return { ...estimate, warnings, designTitle: priced.design.title, designVersion: priced.version.number, plainNote: note };
}
