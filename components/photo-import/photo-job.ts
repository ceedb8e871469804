// One photo import worked out: the crop's pixels quantised into a chart by the pure core, cells
// outside the area's shape left at the background colour, and the garment read before and after (for
// the price change). Pure (no React, no DOM): it runs in photo-worker.ts, or on the page when no
// worker starts, like the live price's garment reading.
import { parseChart, serializeChart, type Chart, type ChartV1 } from "@/lib/core/chart";
import { areaShapeMask, hasOutsideCells, type AreaShape } from "@/lib/core/design-garment";
import { limitRoundColours, photoToChart, type LimitRoundColoursOptions, type LimitRoundColoursResult, type PhotoReport, type PhotoToChartOptions, type RgbaImage } from "@/lib/core/photo";
import type { ChartPiece } from "@/lib/core/pricing/live-price";
import type { SizingResult } from "@/lib/core/sizing";
import { readGarment, type GarmentRead, type LivePricing } from "../chart-editor/garment-reading";

export interface PhotoJob {
  seq: number;
  image: RgbaImage;
  options: PhotoToChartOptions;
  /** the area's shape, when some of its cells are never knitted */
  shape?: AreaShape | null;
  /** the design's charts and which one the import replaces, to price before and after */
  garment?: { sizing: SizingResult; charts: ChartPiece[]; index: number; pricing: LivePricing } | null;
  /** the round clean-up (limitRoundColours), at the studio's rates and limits when the garment gives them */
  limitRounds?: Pick<LimitRoundColoursOptions, "maxStitches" | "inTheRound"> | null;
}

/** What the round clean-up did, for the preview. */
export type RoundsCleanup = Omit<LimitRoundColoursResult, "chart">;

export type PhotoJobAnswer =
  | { seq: number; ok: true; chart: ChartV1; report: PhotoReport; cellsOutside: number; before: GarmentRead | null; after: GarmentRead | null; rounds?: RoundsCleanup | null }
  | { seq: number; ok: false; message: string; field: string | null };

export function runPhotoJob(job: PhotoJob): PhotoJobAnswer {
  let doc: ChartV1;
  let report: PhotoReport;
  try {
    ({ chart: doc, report } = photoToChart(job.image, job.options));
  } catch (e) {
    // the core's PhotoError names the field (crop, colours, palette …); the page puts the message there
    const field = e && typeof e === "object" && "field" in e && typeof e.field === "string" ? e.field : null;
    return { seq: job.seq, ok: false, message: e instanceof Error ? e.message : String(e), field };
  }
  let chart: Chart = parseChart(doc);
  let cellsOutside = 0;
  if (job.shape && hasOutsideCells(job.shape) && job.shape.width === chart.width && job.shape.height === chart.height) {
    const mask = areaShapeMask(job.shape);
    const cells = chart.cells.slice();
    for (let i = 0; i < cells.length; i++) {
      if (!mask[i]) {
        cellsOutside++;
        cells[i] = 0;
      }
    }
    chart = { ...chart, cells };
    doc = serializeChart(chart);
  }
  const g = job.garment;
  let rounds: RoundsCleanup | null = null;
  if (job.limitRounds) {
    const p = g?.pricing;
    const r = p?.policy.rates;
    try {
      const { chart: cleaned, ...rest } = limitRoundColours(chart, {
        ...job.limitRounds,
        ...(p ? { floatLimitStitches: p.floatLimitStitches } : {}),
        ...(p?.floatLimitCm !== undefined ? { floatLimitCm: p.floatLimitCm } : {}),
        ...(p?.carryLimitCm !== undefined ? { carryLimitCm: p.carryLimitCm } : {}),
        ...(r ? { rates: { secondsPerDuplicateStitch: r.secondsPerDuplicateStitch, minutesPerEnd: r.minutesPerEnd, secondsPerCarryCm: r.secondsPerCarryCm, secondsPerFloatCatch: r.secondsPerFloatCatch } } : {}),
      });
      doc = cleaned;
      chart = parseChart(doc);
      rounds = rest;
    } catch (e) {
      const field = e && typeof e === "object" && "field" in e && typeof e.field === "string" ? e.field : null;
      return { seq: job.seq, ok: false, message: e instanceof Error ? e.message : String(e), field };
    }
  }
  let before: GarmentRead | null = null;
  let after: GarmentRead | null = null;
  if (g) {
    before = readGarment(g.sizing, g.charts, g.pricing);
    after = readGarment(
      g.sizing,
      g.charts.map((c, i) => (i === g.index ? { ...c, chart } : c)),
      g.pricing,
    );
  }
  return { seq: job.seq, ok: true, chart: doc, report, cellsOutside, before, after, rounds };
}

