import "server-only";
// Builds the work sheet PDF of a design's head version: for a commission's design first the whole
// garment (every piece's stitches, round by round what is knitted and darned, from the garment
// model), then per chart its colour key, knitted pair, catches and darning route maps, planned with
// the studio's limits and rates.
import { parseChart, serializeChart } from "@/lib/core/chart";
import { getStitchCounts } from "@/lib/core/chart/counts";
import { and, eq } from "drizzle-orm";
import { db } from "@/db";
import { commissions, type DesignChartEntry } from "@/db/schema";
import { readDesignOnGarment, roundRuns } from "@/lib/core/design-garment";
import type { StudioSettings } from "@/lib/schemas/settings";
import { WorkSheetDocument, type WorkSheetChart, type WorkSheetGarment, type WorkSheetRecipe } from "@/templates/pdf/work-sheet";
import type { Actor } from "./authz";
import { renderChartPng, svgToPng } from "./chart-png";
import { optionsFromSettings, planChart, type PlanOptionsInput } from "./colour-plan";
import { renderDarningMapSvg } from "./darning-map-svg";
import { getDesignWithHead } from "./designs";
import { chartsOnGarment, commissionSizing, featureOptionsFrom, problemsText } from "./garment";
import { notFound } from "./errors";
import { renderPdf } from "./pdf";
import { loadStudioSettings } from "./settings";
import { sizedCommission } from "./sizing";

const dataUrl = (png: Buffer) => `data:image/png;base64,${png.toString("base64")}`;

/** The whole garment with the head version's charts on it, for the sheet's first pages (null without a commission). */
export async function workSheetGarment(commissionId: string | null, studioId: string, entries: DesignChartEntry[], settings: StudioSettings): Promise<WorkSheetGarment | null> {
  if (!commissionId) return null;
  const [c] = await db
    .select({ garment: commissions.garment, brief: commissions.brief, sizing: commissions.sizing })
    .from(commissions)
    .where(and(eq(commissions.id, commissionId), eq(commissions.studioId, studioId)));
  if (!c) return null;
  const read = chartsOnGarment(entries);
  try {
    const { sizing, sizedFrom, note } = commissionSizing(c, read.charts[0]?.chart.gauge);
    const g = readDesignOnGarment(sizing, read.charts, featureOptionsFrom(settings));
    const problems = problemsText([...read.problems, ...g.problems.map((p) => ({ ...p, index: read.indices[p.index] ?? p.index }))]);
    const palette = g.placed.palette;
    const name = (key: string) => palette.find((p) => p.key === key)?.name ?? key;
    const first = g.reading.pieces[0]?.name;
    const r1 = (v: number) => Math.round(v * 10) / 10;
    return {
      summary: `sized from the ${sizedFrom}${sizing.size ? `, size ${sizing.size}` : ""}, ${r1(sizing.gauge.stitchesPer10cm)} sts and ${r1(sizing.gauge.rowsPer10cm)} rnds per 10 cm`,
      note,
      problems,
      pieces: g.reading.pieces.map((p) => ({
        name: p.name,
        stitches: p.stitches,
        plain: p.features.plainStitches,
        stranded: p.features.strandedStitches,
        darned: p.features.darnedStitches,
        catches: p.features.floatCatches,
        ends: p.features.ends,
      })),
      roundsOf: first ?? "",
      rounds: roundRuns(g.reading.rounds.filter((r) => r.piece === first)).map((r) => ({
        part: r.part,
        rounds: r.from === r.to ? String(r.from) : `${r.from}–${r.to}`,
        knit: r.knit.map(name).join(" and "),
        darned: r.darned,
        why: r.why ?? (r.knit.length > 1 ? "two colours: stranded" : "one colour: plain"),
      })),
    };
  } catch (e) {
    return { summary: "", note: `The garment could not be read: ${(e as Error).message}`, problems: null, pieces: [], roundsOf: "", rounds: [] };
  }
}

/** The recipe of the design's commission's saved sizing, or null. */
async function recipeFor(commissionId: string | null, studioId: string): Promise<WorkSheetRecipe | null> {
  if (!commissionId) return null;
  const [c] = await db
    .select({ garment: commissions.garment, sizing: commissions.sizing })
    .from(commissions)
    .where(and(eq(commissions.id, commissionId), eq(commissions.studioId, studioId)));
  const result = c ? sizedCommission(c) : null;
  if (!result) return null;
  const r1 = (v: number) => Math.round(v * 10) / 10;
  return {
    summary: `cast on ${result.castOn} sts${result.size ? `, size ${result.size}` : ""}, ${r1(result.gauge.stitchesPer10cm)} sts and ${r1(result.gauge.rowsPer10cm)} rnds per 10 cm`,
    metric: result.recipe.metric,
    imperial: result.recipe.imperial,
    warnings: result.warnings,
  };
}

export async function buildWorkSheet(actor: Actor, designId: string): Promise<{ pdf: Buffer; filename: string }> {
  const { design, head } = await getDesignWithHead(actor, designId);
  if (!head) throw notFound("That design's charts");
  const settings = await loadStudioSettings(design.studioId);
  const defaults = optionsFromSettings(settings);
  const studioName = actor.memberships.find((m) => m.studioId === design.studioId)?.studioName ?? "";
  const charts: WorkSheetChart[] = [];
  for (const entry of head.charts) {
    const chart = parseChart(entry.chart);
    const doc = serializeChart(chart);
    const fixed = (entry.options ?? {}) as PlanOptionsInput;
    const plan = planChart(chart, { inTheRound: design.garment !== null, ...fixed }, defaults);
    const counts = getStitchCounts(chart);
    const name = (k: string) => chart.palette.find((c) => c.key === k)?.name ?? k;
    const darned = await Promise.all(
      plan.darning.colours.map(async (d) => ({
        key: d.key,
        name: d.name,
        stitches: d.stitches,
        ends: d.ends,
        carryCm: d.carryCm,
        yarnCm: d.yarnCm,
        minutes: d.minutes,
        strands: d.strands.map((s) => {
          const a = s.stitches[0];
          const b = s.stitches[s.stitches.length - 1];
          return { from: `row ${a.row}, stitch ${a.stitch}`, to: `row ${b.row}, stitch ${b.stitch}`, stitches: s.stitches.length, carryCm: s.carryCm };
        }),
        mapArea: (() => {
          const all = d.strands.flatMap((s) => s.stitches);
          const rows = all.map((s) => s.row);
          const sts = all.map((s) => s.stitch);
          return all.length ? `rows ${Math.min(...rows)} to ${Math.max(...rows)}, stitches ${Math.min(...sts)} to ${Math.max(...sts)}` : "";
        })(),
        mapPng: dataUrl(await svgToPng(renderDarningMapSvg(doc, d, { maxWidthPx: 1000 }), { maxWidthPx: 1000 })),
      })),
    );
    const limit = plan.colours.settings.floatLimitStitches;
    charts.push({
      label: entry.label,
      size: `${chart.width} stitches × ${chart.height} rows`,
      gauge: `${chart.gauge.stitchesPer10cm} sts and ${chart.gauge.rowsPer10cm} rows per 10 cm`,
      chartPng: dataUrl(await renderChartPng(chart, { cellPx: Math.max(6, Math.min(16, Math.floor(1000 / chart.width))) })),
      key: chart.palette.map((c, i) => ({
        key: c.key,
        name: c.name,
        hex: c.hex,
        stitches: counts[i],
        role: plan.colours.knit.includes(c.key) ? "knitted" : counts[i] > 0 ? "duplicate stitch" : "not used",
      })),
      knit: plan.colours.knit.map(name).join(" and "),
      darn: plan.colours.darn.length ? `Darn afterwards: ${plan.colours.darn.map(name).join(", ")}.` : "Nothing is darned afterwards.",
      floatRule: `A float longer than ${limit} stitches is caught (${plan.colours.settings.inTheRound ? "knitted in the round: rows wrap" : "knitted flat"}).`,
      catchRows: plan.colours.rows
        .filter((r) => r.catches > 0)
        .map((r) => ({ row: r.row, longestFloat: r.longestFloat, catches: r.catches, behind: r.floats.flatMap((f) => f.catchStitches).join(", ") })),
      totalCatches: plan.colours.totals.catches,
      darned,
      totals: {
        stitches: plan.darning.totals.stitches,
        ends: plan.darning.totals.ends,
        endsBound: plan.darning.totals.lowerBound.ends,
        carryCm: plan.darning.totals.carryCm,
        yarnCm: plan.darning.totals.yarnCm,
        minutes: plan.darning.totals.minutes,
        savedEnds: plan.darning.totals.saved.ends,
        savedMinutes: plan.darning.totals.saved.minutes,
      },
    });
  }
  const recipe = await recipeFor(design.commissionId, design.studioId);
  const garment = await workSheetGarment(design.commissionId, design.studioId, head.charts, settings);
  const pdf = await renderPdf(
    WorkSheetDocument({
      studioName,
      recipe,
      garment,
      title: design.title,
      commission: design.commissionNumber ? `commission ${design.commissionNumber}: ${design.commissionTitle}` : "no commission",
      version: head.number,
      printedOn: new Date().toISOString().slice(0, 10),
      charts,
    }),
  );
  return { pdf, filename: `work-sheet-${design.title}-v${head.number}.pdf` };
}
