// Options for the colour plan and the darning route, validated with zod; every message names the
// field. Keys of colours are checked against the chart's palette after parsing.
import { z } from "zod";
import { MAX_PALETTE, type Chart } from "@/lib/core/chart/model";
import { fieldErrorMap, joinIssues, toFieldIssues } from "@/lib/core/chart/zod-messages";
import { ColourworkError } from "./colourwork-error";
import { defaultDarningRates, defaultDarningYarn, type DarningRates } from "./darning-rates";

/** Defaults: floats of more than 5 stitches or 2.5 cm, whichever is fewer, need catching (common practice). */
export const DEFAULT_FLOAT_LIMIT_STITCHES = 5;
export const DEFAULT_FLOAT_LIMIT_CM = 2.5;
/** A single carried stretch on the wrong side longer than ~2.5 cm snags (common practice, as for floats). */
export const DEFAULT_CARRY_LIMIT_CM = 2.5;
export const MAX_LENGTH_LIMIT_CM = 20;

// Messages written here leave the field out: the path is put in front of each when reported.
const positive = () =>
  z.number().refine((v) => Number.isFinite(v) && v > 0, { error: (iss) => `must be more than 0 (got ${String(iss.input)})` });
// Longer than this is not a float or a carry any more but loose yarn; it also bounds the work.
const lengthLimit = () =>
  positive().refine((v) => v <= MAX_LENGTH_LIMIT_CM, { error: (iss) => `must be at most ${MAX_LENGTH_LIMIT_CM} cm (got ${String(iss.input)})` });
const nonNegative = () =>
  z.number().refine((v) => Number.isFinite(v) && v >= 0, { error: (iss) => `must be a number ≥ 0 (got ${String(iss.input)})` });
const key = z.string().min(1, { error: "must not be empty" });

const ratesSchema = z
  .object({
    secondsPerDuplicateStitch: nonNegative().optional(),
    minutesPerEnd: nonNegative().optional(),
    secondsPerCarryCm: nonNegative().optional(),
    secondsPerFloatCatch: nonNegative().optional(),
  })
  .strict();

export const colourPlanOptionsSchema = z
  .object({
    knit: z
      .array(key)
      .length(2, { error: "must name exactly two colours (the pair knitted in stranded work)" })
      .refine((pair) => pair[0] !== pair[1], { error: "must name two different colours" })
      .optional(),
    inTheRound: z.boolean().optional(),
    /** the chart is the whole round: the darning route joins its first and last stitch too (default false) */
    routeInTheRound: z.boolean().optional(),
    floatLimitStitches: z
      .number()
      .int({ error: (iss) => `must be a whole number of stitches (got ${String(iss.input)})` })
      .min(1, { error: (iss) => `must be at least 1 (got ${String(iss.input)})` })
      .max(400, { error: (iss) => `must be at most 400 (got ${String(iss.input)})` })
      .optional(),
    floatLimitCm: lengthLimit().optional(),
    carryLimitCm: lengthLimit().optional(),
    tailCm: nonNegative().optional(),
    rates: ratesSchema.optional(),
  })
  .strict();

export const darningOptionsSchema = colourPlanOptionsSchema
  .extend({ darn: z.array(key).max(MAX_PALETTE, { error: `may name at most ${MAX_PALETTE} colours` }).optional() })
  .strict();

export type ColourPlanOptions = z.input<typeof colourPlanOptionsSchema>;
export type DarningOptions = z.input<typeof darningOptionsSchema>;

export interface ResolvedOptions {
  knit: [number, number] | null;
  darn: number[] | null;
  inTheRound: boolean;
  /** the darning route wraps at the start of the round */
  routeInTheRound: boolean;
  floatLimitStitches: number;
  floatLimitCm: number;
  carryLimitCm: number;
  tailCm: number;
  rates: DarningRates;
}

function parseOptions<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input ?? {}, { error: fieldErrorMap("options") });
  if (result.success) return result.data;
  const issues = toFieldIssues(result.error.issues, "options");
  const named = issues.map((i) => ({ message: i.message.startsWith(i.path) ? i.message : `${i.path}: ${i.message}` }));
  throw new ColourworkError(issues[0]?.path || "options", joinIssues(named));
}

/** Throws a ColourworkError unless the chart can be planned (palette size, cells, gauge). */
export function assertPlannableChart(chart: Chart): void {
  if (chart.palette.length < 1) throw new ColourworkError("chart.palette", "the chart has no colours");
  if (chart.palette.length > MAX_PALETTE) {
    throw new ColourworkError("chart.palette", `the chart has ${chart.palette.length} colours; at most ${MAX_PALETTE} are allowed`);
  }
  if (!(chart.gauge.stitchesPer10cm > 0) || !(chart.gauge.rowsPer10cm > 0)) {
    throw new ColourworkError("chart.gauge", "stitches and rows per 10 cm must both be more than 0");
  }
  if (chart.cells.length !== chart.width * chart.height) {
    throw new ColourworkError("chart.cells", `expected ${chart.width * chart.height} cells, got ${chart.cells.length}`);
  }
  for (let i = 0; i < chart.cells.length; i++) {
    if (chart.cells[i] >= chart.palette.length) {
      const x = i % chart.width;
      const y = Math.floor(i / chart.width);
      throw new ColourworkError("chart.cells", `row ${y + 1}, stitch ${chart.width - x} uses colour ${chart.cells[i]}, which is not in the palette`);
    }
  }
}

function colourIndex(chart: Chart, k: string, field: string): number {
  const i = chart.palette.findIndex((c) => c.key === k);
  if (i < 0) {
    const keys = chart.palette.map((c) => c.key).join(", ");
    throw new ColourworkError(field, `colour '${k}' is not in the chart's palette (${keys})`);
  }
  return i;
}

function resolve(chart: Chart, o: z.output<typeof darningOptionsSchema>): ResolvedOptions {
  assertPlannableChart(chart);
  const knit = o.knit ? ([colourIndex(chart, o.knit[0], "options.knit[0]"), colourIndex(chart, o.knit[1], "options.knit[1]")] as [number, number]) : null;
  let darn: number[] | null = null;
  if (o.darn) {
    darn = o.darn.map((k, i) => colourIndex(chart, k, `options.darn[${i}]`));
    const dup = darn.findIndex((c, i) => darn!.indexOf(c) !== i);
    if (dup >= 0) throw new ColourworkError(`options.darn[${dup}]`, `colour '${o.darn[dup]}' is named twice`);
  }
  const rates: DarningRates = { ...defaultDarningRates };
  for (const [k, v] of Object.entries(o.rates ?? {})) if (v !== undefined) rates[k as keyof DarningRates] = v;
  return {
    knit,
    darn,
    inTheRound: o.inTheRound ?? true, // mittens, hats and yokes are knitted in the round
    // A chart often covers part of a round (a back of hand), so the route wraps only when asked.
    routeInTheRound: o.routeInTheRound ?? false,
    floatLimitStitches: o.floatLimitStitches ?? DEFAULT_FLOAT_LIMIT_STITCHES,
    floatLimitCm: o.floatLimitCm ?? DEFAULT_FLOAT_LIMIT_CM,
    carryLimitCm: o.carryLimitCm ?? DEFAULT_CARRY_LIMIT_CM,
    tailCm: o.tailCm ?? defaultDarningYarn.tailCm,
    rates,
  };
}

export function resolveColourPlanOptions(chart: Chart, input: unknown): ResolvedOptions {
  return resolve(chart, parseOptions(colourPlanOptionsSchema, input));
}

export function resolveDarningOptions(chart: Chart, input: unknown): ResolvedOptions {
  return resolve(chart, parseOptions(darningOptionsSchema, input));
}
