import "server-only";
// Colour plan and darning route for a chart, with the studio's own limits and rates filled in
// where the caller leaves them out. The answer has the shape of the core CLI verbs.
import { ChartFormatError, parseChart, type Chart } from "@/lib/core/chart";
import { planColours, type ColourPlan } from "@/lib/core/colourwork/colour-plan";
import { ColourworkError } from "@/lib/core/colourwork/colourwork-error";
import { planDarning, type DarningPlan } from "@/lib/core/colourwork/darning-plan";
import type { StudioSettings } from "@/lib/schemas/settings";
import { AppError, type FieldErrors } from "./errors";

export interface PlanOptionsInput {
  knit?: string[];
  darn?: string[];
  inTheRound?: boolean;
  floatLimitStitches?: number;
  floatLimitCm?: number;
  carryLimitCm?: number;
  tailCm?: number;
  rates?: Record<string, number>;
}

export interface ChartPlan {
  /** plan-colours */
  colours: ColourPlan;
  /** plan-darning */
  darning: DarningPlan;
}

/** The studio's limits and darning rates as core options. */
export function optionsFromSettings(settings: StudioSettings): PlanOptionsInput {
  return {
    carryLimitCm: settings.carryLimitCm,
    floatLimitStitches: settings.floatLimitStitches,
    floatLimitCm: settings.floatLimitCm,
    rates: {
      secondsPerDuplicateStitch: settings.rates.secondsPerDuplicateStitch,
      minutesPerEnd: settings.rates.minutesPerEnd,
      secondsPerCarryCm: settings.rates.secondsPerCarryCm,
      secondsPerFloatCatch: settings.rates.secondsPerFloatCatch,
    },
  };
}

function asValidation(e: unknown): never {
  if (e instanceof ChartFormatError) {
    const fieldErrors: FieldErrors = {};
    for (const i of e.issues) (fieldErrors[`chart${i.path ? `.${i.path}` : ""}`] ??= []).push(i.message);
    throw new AppError(422, "invalid_chart", e.message, fieldErrors);
  }
  if (e instanceof ColourworkError) throw new AppError(422, "invalid_options", e.message, { [e.field]: [e.message] });
  throw e;
}

/** Plans a parsed chart; options the caller gives win over the studio's. */
export function planChart(chart: Chart, options: PlanOptionsInput, defaults: PlanOptionsInput = {}): ChartPlan {
  const merged = { ...defaults, ...options, rates: { ...(defaults.rates ?? {}), ...(options.rates ?? {}) } };
  const { darn, ...colourOptions } = merged;
  try {
    const colours = planColours(chart, colourOptions);
    const darning = planDarning(chart, darn ? merged : { ...colourOptions });
    return { colours, darning };
  } catch (e) {
    return asValidation(e);
  }
}

/** Validates a chart v1 document and plans it. */
export function planChartDocument(doc: unknown, options: PlanOptionsInput, defaults: PlanOptionsInput = {}): ChartPlan {
  let chart: Chart;
  try {
    chart = parseChart(doc);
  } catch (e) {
    return asValidation(e);
  }
  return planChart(chart, options, defaults);
}
