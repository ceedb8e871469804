import "server-only";
// A commission's garment with its priced design on it: built from the saved sizing (else the
// brief, else a standard size, said so), the priced design version's charts placed on their areas
// (charts that do not fit are reported, never dropped in silence) and read with the studio's
// settings. Every number the studio is shown for a commission comes from here: the quote draft,
// production's pieces, the schedule, the yarn estimate and the work sheet. Pure work is in
// lib/core/design-garment; this module only loads.
import { eq } from "drizzle-orm";
import { db } from "@/db";
import { commissions, type CommissionBrief, type DesignChartEntry, type GarmentKind } from "@/db/schema";
import { parseChart } from "@/lib/core/chart";
import { parseDesign } from "@/lib/core/chart/layered-design";
import { findPaintOutsideShape, matchArea, outsideMessage, readDesignOnGarment, type ChartProblem, type DesignChartOnGarment, type DesignOnGarment } from "@/lib/core/design-garment";
import { GarmentError } from "@/lib/core/garment";
import { SizingError, sizeGarment, type SizingResult } from "@/lib/core/sizing";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import { coreGarment, DEFAULT_SIZING_GAUGE } from "@/lib/schemas/sizing";
import type { StudioSettings } from "@/lib/schemas/settings";
import { getPricedDesignVersion } from "./design-yarn";
import { AppError } from "./errors";
import { loadStudioSettings } from "./settings";
import { loadSizing, resolveSizing } from "./sizing";

/** The size a garment is estimated at when neither saved sizing nor the brief gives one. */
export const STANDARD_SIZE: Record<"mitten" | "hat" | "pullover", string> = { mitten: "woman", hat: "woman", pullover: "women-M" };

export const ESTIMATED_NOTE = "estimated from a standard size — size the commission for real numbers";

export type PricedVersion = Awaited<ReturnType<typeof getPricedDesignVersion>>;

export interface CommissionGarment extends DesignOnGarment {
  sizing: SizingResult;
  /** where the sizing came from */
  sizedFrom: "saved sizing" | "brief" | "standard size";
  /** said to the studio beside every figure when the size is a stand-in */
  note: string | null;
  designVersionId: string | null;
  /** the priced version's chart entries as stored (the work sheet draws them) */
  entries: DesignChartEntry[];
  problems: ChartProblem[];
}

/** Design entries as the core reads them; an entry that does not parse is reported, not dropped. */
export function chartsOnGarment(entries: DesignChartEntry[]): { charts: DesignChartOnGarment[]; indices: number[]; problems: ChartProblem[] } {
  const charts: DesignChartOnGarment[] = [];
  const indices: number[] = [];
  const problems: ChartProblem[] = [];
  entries.forEach((entry, index) => {
    try {
      const chart = parseChart(entry.chart);
      const lettering = entry.lettering?.length ? parseDesign({ version: 1, chart: entry.chart, lettering: entry.lettering }).lettering : undefined;
      charts.push({ area: entry.area, label: entry.label, chart, ...(lettering ? { lettering } : {}), ...(entry.options ? { options: entry.options } : {}) });
      indices.push(index);
    } catch (e) {
      problems.push({ index, label: entry.label, area: entry.area, message: `the chart could not be read (${(e as Error).message})` });
    }
  });
  return { charts, indices, problems };
}

/** The feature options the studio's settings give (limits and its rates, calibrated ones once accepted). */
export function featureOptionsFrom(settings: StudioSettings) {
  return {
    proofRounds: 1,
    rates: settings.rates,
    p80Factors: settings.p80Factors,
    floatLimitStitches: settings.floatLimitStitches,
    floatLimitCm: settings.floatLimitCm,
    carryLimitCm: settings.carryLimitCm,
  };
}

/** What the commission sizes to, with the note to show when it is a standard size. */
export function commissionSizing(
  c: { garment: GarmentKind; brief: CommissionBrief | null; sizing: unknown },
  chartGauge?: { stitchesPer10cm: number; rowsPer10cm: number },
): { sizing: SizingResult; sizedFrom: CommissionGarment["sizedFrom"]; note: string | null } {
  const gauge = chartGauge ?? DEFAULT_SIZING_GAUGE;
  const { result, saved } = resolveSizing(c, gauge);
  if (result) return { sizing: result, sizedFrom: saved ? "saved sizing" : "brief", note: null };
  const kind = coreGarment(c.garment);
  const sizing = sizeGarment({ garment: kind, size: STANDARD_SIZE[kind], gauge: { stitchesPer10cm: gauge.stitchesPer10cm, rowsPer10cm: gauge.rowsPer10cm } });
  return { sizing, sizedFrom: "standard size", note: `Size ${sizing.size}: ${ESTIMATED_NOTE}.` };
}

/**
 * The commission's garment with its priced design read on it. No permission check: callers read
 * the commission for their actor first. Pass what the caller has loaded already (settings, the
 * priced version, the saved sizing) so each is loaded once per request.
 */
export async function getCommissionGarment(
  c: { id: string; studioId: string; garment: GarmentKind; brief: CommissionBrief | null; sizing?: unknown },
  loaded: { settings?: StudioSettings; priced?: PricedVersion } = {},
): Promise<CommissionGarment> {
  const [settings, priced, sizingRaw] = await Promise.all([
    loaded.settings ?? loadStudioSettings(c.studioId),
    loaded.priced !== undefined ? loaded.priced : getPricedDesignVersion(c.id),
    c.sizing !== undefined ? c.sizing : loadSizing(c.id),
  ]);
  const version = priced && priced.design.studioId === c.studioId ? priced.version : null;
  const entries = version?.charts ?? [];
  const read = chartsOnGarment(entries);
  let sizing: SizingResult, sizedFrom: CommissionGarment["sizedFrom"], note: string | null, design: DesignOnGarment;
  try {
    ({ sizing, sizedFrom, note } = commissionSizing({ ...c, sizing: sizingRaw }, read.charts[0]?.chart.gauge));
    design = readDesignOnGarment(sizing, read.charts, featureOptionsFrom(settings));
  } catch (e) {
    if (e instanceof GarmentError || e instanceof SizingError) throw new AppError(422, "invalid_garment", `The garment could not be modelled from its sizing: ${e.message}`);
    throw e;
  }
  // Indices of the core's answer are into the parsed list: map them back to the stored entries.
  const back = (i: number) => read.indices[i] ?? i;
  const problems = [...read.problems, ...design.problems.map((p) => ({ ...p, index: back(p.index) }))].sort((a, b) => a.index - b.index);
  return { ...design, placedCharts: design.placedCharts.map(back), problems, sizing, sizedFrom, note, designVersionId: version?.id ?? null, entries };
}

/** One line for the studio about charts that were not placed. */
export function problemsText(problems: ChartProblem[]): string | null {
  if (!problems.length) return null;
  return `Not counted: ${problems.map((p) => `${p.label} (${p.message})`).join("; ")}.`;
}



/** A plain garment's pieces at a standard size and the usual gauge (a promise before any commission exists). */
export function standardGarmentPieces(garment: GarmentKind): PieceFeatures[] {
  const kind = coreGarment(garment);
  const sizing = sizeGarment({ garment: kind, size: STANDARD_SIZE[kind], gauge: DEFAULT_SIZING_GAUGE });
  return readDesignOnGarment(sizing, [], { proofRounds: 1 }).pieces;
}

/**
 * Refuses (422, nothing saved) charts that paint a cell outside their area's shape on the
 * commission's garment, naming the place as a knitter reads it. Charts whose area or size does
 * not match the sizing are not checked here (the quote and live price report them).
 */
export async function assertChartsInShape(commissionId: string | null, entries: DesignChartEntry[]): Promise<void> {
  if (!commissionId || !entries.length) return;
  const [c] = await db.select({ garment: commissions.garment, brief: commissions.brief, sizing: commissions.sizing }).from(commissions).where(eq(commissions.id, commissionId));
  if (!c) return;
  const read = chartsOnGarment(entries);
  let sizing: SizingResult;
  try {
    sizing = commissionSizing(c, read.charts[0]?.chart.gauge).sizing;
  } catch {
    return; // a sizing that cannot be modelled is reported where the garment is read
  }
  const chartAreas = sizing.charts.map((a) => a.area);
  const fieldErrors: Record<string, string[]> = {};
  const messages: string[] = [];
  read.charts.forEach((entry, k) => {
    const found = matchArea({ chartAreas }, entry.area);
    const area = found ? sizing.charts.find((a) => a.area === found.area) : undefined;
    const at = area ? findPaintOutsideShape(entry.chart, area) : null;
    if (!at) return;
    const message = outsideMessage(entry.chart, at.x, at.y);
    fieldErrors[`charts.${read.indices[k]}.chart`] = [message];
    messages.push(`${entry.label}: ${message}`);
  });
  if (messages.length) throw new AppError(422, "outside_shape", `Nothing was saved. ${messages.join(" · ")}.`, fieldErrors);
}
