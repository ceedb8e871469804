// A design read on its garment: the design's charts placed on the garment's areas (by the area
// slug each chart entry carries), every stitch of every piece read once, and the pieces as the
// labour model takes them. The same function serves the server (quote draft, production, yarn,
// work sheet) and the chart editor's live price, so the two can never disagree.
import type { Chart } from "../chart/model";
import { planColours } from "../colourwork/colour-plan";
import { garmentFeatures, garmentFromSizing, GarmentError, placeCharts } from "../garment";
import type { ChartPlacement, FeatureOptions, Garment, GarmentReading, PlacedGarment } from "../garment";
import type { PieceFeatures } from "../labour/piece-features";
import type { SizingResult } from "../sizing/sizing-result";
import { storedPins } from "./pins";
import { findPaintOutsideShape, outsideMessage } from "./shape";

/** A chart area's slug, as design chart entries name their area ("back of hand" → "back-of-hand"). */
export function areaSlug(area: string): string {
  return area.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "");
}

export interface DesignChartOnGarment {
  /** the entry's area slug, e.g. "back-of-hand", "back-of-hand-left", "crown" */
  area: string;
  label: string;
  chart: Chart;
  lettering?: ChartPlacement["lettering"];
  /** the maker's fixed options for this chart (darned colours, mirror on the pair's second piece) */
  options?: Record<string, unknown>;
}

export interface ChartProblem {
  /** index in the design's charts */
  index: number;
  label: string;
  area: string;
  message: string;
}

export interface DesignOnGarment {
  garment: Garment;
  placed: PlacedGarment;
  reading: GarmentReading;
  /** the garment's pieces one by one, for the labour model (design counted once, blocking per piece) */
  pieces: PieceFeatures[];
  /** indices of the charts placed */
  placedCharts: number[];
  /** charts left off, each with why (unknown area, size that does not fit, paint outside the shape …) */
  problems: ChartProblem[];
}

export interface ReadDesignOptions extends FeatureOptions {
  /** colours duplicate-stitched afterwards, on top of those the charts' options name */
  darn?: string[];
}

/** The garment area an entry's slug names, and the piece side a `-left` / `-right` suffix picks. */
export function matchArea(garment: Pick<Garment, "chartAreas">, slug: string): { area: string; side: "left" | "right" | null } | null {
  let best: { area: string; side: "left" | "right" | null; len: number } | null = null;
  for (const area of garment.chartAreas) {
    const s = areaSlug(area);
    if (slug === s) return { area, side: null };
    if (slug.startsWith(`${s}-`) && (!best || s.length > best.len)) {
      const rest = slug.slice(s.length + 1);
      best = { area, side: rest === "left" || rest === "right" ? rest : null, len: s.length };
    }
  }
  return best ? { area: best.area, side: best.side } : null;
}

const strings = (v: unknown): string[] => (Array.isArray(v) ? v.filter((x): x is string => typeof x === "string") : []);

const pinsOf = storedPins;

/** True when some row of the chart holds more than two colours (so something must be darned). */
function needsDarning(chart: Chart): boolean {
  for (let y = 0; y < chart.height; y++) {
    const seen = new Set<number>();
    for (let x = 0; x < chart.width; x++) seen.add(chart.cells[y * chart.width + x]);
    if (seen.size > 2) return true;
  }
  return false;
}

/**
 * The colours a chart darns: the maker's choice when the chart's options name one; else, when a row
 * holds three colours, the colours the colour plan leaves out of the knitted pair ("choose for me",
 * as the colour-plan panel does), else none.
 */
export function chartDarn(entry: Pick<DesignChartOnGarment, "chart" | "options">): string[] {
  if (Array.isArray(entry.options?.darn)) return strings(entry.options.darn);
  if (!needsDarning(entry.chart)) return [];
  const knit = strings(entry.options?.knit);
  try {
    return planColours(entry.chart, { inTheRound: true, ...(knit.length === 2 ? { knit } : {}) }).darn;
  } catch {
    return [];
  }
}

function placementOf(garment: Garment, entry: DesignChartOnGarment): { placement: ChartPlacement } | { problem: string } {
  const found = matchArea(garment, entry.area);
  if (!found) return { problem: `its area "${entry.area}" is not an area of this ${garment.kind} (${garment.chartAreas.join(", ") || "no charted areas"})` };
  const area = garment.pieces.flatMap((p) => p.areas).find((a) => a.name === found.area);
  if (area && (entry.chart.width !== area.width || entry.chart.height !== area.height)) {
    return { problem: `it is ${entry.chart.width} × ${entry.chart.height} but the ${found.area} is ${area.width} stitches × ${area.height} rows at this sizing` };
  }
  const sizing = garment.sizing.charts.find((c) => c.area === found.area);
  const paint = sizing ? findPaintOutsideShape(entry.chart, sizing) : null;
  if (paint) return { problem: outsideMessage(entry.chart, paint.x, paint.y) };
  const piece = found.side ? garment.pieces.find((p) => p.side === found.side && p.areas.some((a) => a.name === found.area))?.name : undefined;
  const mirror = entry.options?.mirror;
  return {
    placement: {
      area: found.area,
      chart: entry.chart,
      ...(entry.lettering?.length ? { lettering: entry.lettering } : {}),
      ...(piece ? { piece } : {}),
      ...(typeof mirror === "boolean" ? { mirror } : {}),
    },
  };
}

/** The garment's reading as labour pieces: one per knitted piece, blocked, as the labour model counts them. */
export function piecesOf(reading: GarmentReading): PieceFeatures[] {
  return reading.pieces.map((p) => {
    const f = p.features;
    return {
      label: p.name,
      newDesign: f.newDesign,
      proofRounds: f.proofRounds,
      plainStitches: f.plainStitches,
      strandedStitches: f.strandedStitches,
      floatCatches: f.floatCatches,
      shapingRounds: f.shapingRounds,
      thumbs: f.thumbs,
      duplicateStitches: f.duplicateStitches,
      ends: f.ends,
      carryCm: f.carryCm,
      blocked: true,
    };
  });
}

/**
 * Builds the garment of `sizing`, places the charts that fit (the others are reported, never
 * silently dropped) and reads every stitch once. Throws only what the core throws for the garment
 * itself (a sizing it cannot model).
 */
export function readDesignOnGarment(sizing: SizingResult, charts: DesignChartOnGarment[], opts: ReadDesignOptions = {}): DesignOnGarment {
  const garment = garmentFromSizing(sizing);
  const problems: ChartProblem[] = [];
  const ok: { index: number; placement: ChartPlacement; darn: string[] }[] = [];
  const extraDarn = opts.darn ?? [];
  charts.forEach((entry, index) => {
    const r = placementOf(garment, entry);
    if ("problem" in r) {
      problems.push({ index, label: entry.label, area: entry.area, message: r.problem });
      return;
    }
    const keys = new Set(entry.chart.palette.map((c) => c.key));
    const darn = [...new Set([...chartDarn(entry), ...extraDarn])].filter((k) => keys.has(k));
    const own = pinsOf(entry.options?.pins);
    try {
      placeCharts(garment, [r.placement], { darn, ...(own.length ? { pins: own } : {}) });
      ok.push({ index, placement: r.placement, darn });
    } catch (e) {
      if (!(e instanceof GarmentError)) throw e;
      problems.push({ index, label: entry.label, area: entry.area, message: e.message });
    }
  });
  const darn = [...new Set(ok.flatMap((o) => o.darn))];
  // The maker's pinned pairs ride on the charts' options (a design stores only its charts).
  const pins = ok.flatMap((o) => pinsOf(charts[o.index].options?.pins));
  let placed: PlacedGarment;
  let placedCharts = ok.map((o) => o.index);
  try {
    placed = placeCharts(garment, ok.map((o) => o.placement), { darn, ...(pins.length ? { pins } : {}) });
  } catch (e) {
    if (!(e instanceof GarmentError)) throw e;
    // Charts that fit one by one but not together (e.g. one palette key, two colours): price the plain garment and say why.
    for (const o of ok) problems.push({ index: o.index, label: charts[o.index].label, area: charts[o.index].area, message: `not placed with the others: ${e.message}` });
    placed = placeCharts(garment, [], {});
    placedCharts = [];
  }
  const { darn: _darn, ...featureOpts } = opts;
  void _darn;
  const reading = garmentFeatures(placed, featureOpts);
  return { garment, placed, reading, pieces: piecesOf(reading), placedCharts, problems: problems.sort((a, b) => a.index - b.index) };
}
