// Metres and skeins per colour for a chart (and, optionally, a garment's plain parts), rounded up.
import { z } from "zod";
import type { Chart } from "../chart/model";
import { ALLOWANCE_SOURCES, DEFAULT_MARGIN_PERCENT } from "./allowances";
import { estimateChartYarn, type ChartYarnOptions } from "./chart-yarn";
import { darningPlanSchema, type DarningPlanData } from "./darning-plan";
import type { PlainYarnEstimate } from "./garment-yarn";
import { MUNDEN_SOURCE } from "./loop-length";
import { METRES_PER_YARD, getSkeinNeed, type SkeinNeed, type YarnRecord } from "./skeins";

const positive = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine((v) => Number.isFinite(v) && v > 0, { error: `${what} must be more than 0` });

export const yarnRecordSchema = z
  .strictObject({
    key: z.string().min(1, { error: "key must name a palette colour" }),
    name: z.string().min(1, { error: "name must not be empty" }),
    metresPerSkein: positive("metresPerSkein").optional(),
    yardsPerSkein: positive("yardsPerSkein").optional(),
    gramsPerSkein: positive("gramsPerSkein"),
    stockSkeins: z.number().int().min(0).optional(),
    lots: z.array(z.strictObject({ lot: z.string().min(1), skeins: z.number().int().min(0) })).optional(),
  })
  .superRefine((y, ctx) => {
    if ((y.metresPerSkein === undefined) === (y.yardsPerSkein === undefined)) {
      ctx.addIssue({ code: "custom", path: ["metresPerSkein"], message: `yarn '${y.key}': give metresPerSkein or yardsPerSkein (one of them)` });
    }
  })
  .transform(
    (y): YarnRecord => ({
      key: y.key,
      name: y.name,
      metresPerSkein: y.metresPerSkein ?? (y.yardsPerSkein as number) * METRES_PER_YARD,
      gramsPerSkein: y.gramsPerSkein,
      stockSkeins: y.stockSkeins,
      lots: y.lots,
    }),
  );

export const yarnOptionsSchema = z.strictObject({
  knit: z.array(z.string().min(1)).min(1).max(2).optional(),
  underlay: z.record(z.string(), z.string()).optional(),
  carry: z.enum(["round", "span"]).optional(),
  coverageFactor: z.number().min(1).max(5).optional(),
  tailCm: z.number().min(0).max(200).optional(),
  quantity: z.number().int().min(1).max(1000).optional(),
  castOn: z.boolean().optional(),
  bindOff: z.boolean().optional(),
  marginPercent: z.number().min(0).max(100).optional(),
  /** the knitted colour the garment's plain parts use; default the main colour */
  plainKey: z.string().min(1).optional(),
});

export const yarnInputSchema = z.strictObject({
  chart: z.unknown(),
  plan: darningPlanSchema.nullable().optional(),
  yarns: z.array(yarnRecordSchema),
  options: yarnOptionsSchema.optional(),
  /** a size input: its plain-knit parts are added to the main colour */
  garment: z.unknown().optional(),
  /** which of the garment's chart areas this chart fills (left out of the plain parts) */
  chartedAreas: z.array(z.string()).optional(),
});

export type YarnOptions = z.output<typeof yarnOptionsSchema>;

export interface ColourEstimate {
  key: string;
  name: string;
  role: "knitted" | "darned";
  knittedStitches: number;
  darnedStitches: number;
  ends: number;
  /** whole cm, each rounded to the nearest cm; the total is rounded up from the exact sum */
  breakdownCm: Record<"knitted" | "floats" | "darned" | "tails" | "carries" | "castOn" | "bindOff" | "plain" | "margin", number>;
  totalCm: number;
  /** rounded up to 0.1 m */
  metres: number;
  /** rounded up to 0.1 yd */
  yards: number;
  skeins: SkeinNeed | null;
}

export interface YarnEstimate {
  loopLengthCm: number;
  knit: string[];
  quantity: number;
  marginPercent: number;
  colours: ColourEstimate[];
  totals: { metres: number; yards: number; skeins: number; grams: number };
  warnings: string[];
  sources: string[];
}

const ceilTenth = (v: number) => Math.ceil(v * 10 - 1e-9) / 10;

export function estimateYarn(args: {
  chart: Pick<Chart, "width" | "height" | "gauge" | "palette" | "cells">;
  plan: DarningPlanData | null;
  yarns: YarnRecord[];
  options?: YarnOptions;
  plain?: PlainYarnEstimate | null;
}): YarnEstimate {
  const options = args.options ?? {};
  const seen = new Set<string>();
  for (const y of args.yarns) {
    if (seen.has(y.key)) throw new Error(`yarns: two yarn records for colour '${y.key}'`);
    seen.add(y.key);
  }
  const chartOptions: ChartYarnOptions = options;
  const est = estimateChartYarn(args.chart, args.plan, chartOptions);
  const margin = options.marginPercent ?? DEFAULT_MARGIN_PERCENT;
  const warnings = [...est.warnings];

  const plainKey = options.plainKey ?? est.knit[0];
  if (args.plain && !est.knit.includes(plainKey)) {
    throw new Error(`options.plainKey: '${plainKey}' is not one of the knitted colours (${est.knit.join(", ")})`);
  }

  const colours = est.colours.map((c): ColourEstimate => {
    const plain = args.plain && c.key === plainKey ? args.plain.totalCm : 0;
    const sum = c.cm.knitted + c.cm.floats + c.cm.darned + c.cm.tails + c.cm.carries + c.cm.castOn + c.cm.bindOff + plain;
    const marginCm = (sum * margin) / 100;
    const totalCm = Math.ceil(sum + marginCm - 1e-9);
    const yarn = args.yarns.find((y) => y.key === c.key);
    if (!yarn) warnings.push(`no yarn record for colour '${c.key}' (${c.name}): metres only, no skeins`);
    const skeins = yarn ? getSkeinNeed(totalCm, yarn) : null;
    if (skeins?.note) warnings.push(`'${c.key}': ${skeins.note}`);
    return {
      key: c.key,
      name: c.name,
      role: c.role,
      knittedStitches: c.knittedStitches * est.quantity,
      darnedStitches: c.darnedStitches * est.quantity,
      ends: c.ends * est.quantity,
      breakdownCm: {
        knitted: Math.round(c.cm.knitted),
        floats: Math.round(c.cm.floats),
        darned: Math.round(c.cm.darned),
        tails: Math.round(c.cm.tails),
        carries: Math.round(c.cm.carries),
        castOn: Math.round(c.cm.castOn),
        bindOff: Math.round(c.cm.bindOff),
        plain: Math.round(plain),
        margin: Math.round(marginCm),
      },
      totalCm,
      metres: ceilTenth(totalCm / 100),
      yards: ceilTenth(totalCm / 100 / METRES_PER_YARD),
      skeins,
    };
  });
  for (const y of args.yarns) {
    if (!colours.some((c) => c.key === y.key)) warnings.push(`yarn record '${y.key}' (${y.name}) is for a colour the chart does not use`);
  }
  const totalCm = colours.reduce((s, c) => s + c.totalCm, 0);
  return {
    loopLengthCm: Math.round(est.loopLengthCm * 100) / 100,
    knit: est.knit,
    quantity: est.quantity,
    marginPercent: margin,
    colours,
    totals: {
      metres: ceilTenth(totalCm / 100),
      yards: ceilTenth(totalCm / 100 / METRES_PER_YARD),
      skeins: colours.reduce((s, c) => s + (c.skeins?.skeins ?? 0), 0),
      grams: colours.reduce((s, c) => s + (c.skeins?.grams ?? 0), 0),
    },
    warnings,
    sources: [MUNDEN_SOURCE, ALLOWANCE_SOURCES.longTail, ALLOWANCE_SOURCES.coverage, ALLOWANCE_SOURCES.tail, ALLOWANCE_SOURCES.margin],
  };
}
