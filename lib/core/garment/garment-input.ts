// The garment verb's input (and the app's): the size input, charts placed on areas, colours to darn.
import { z } from "zod";
import { ChartFormatError, parseChart } from "../chart/format";
import { letteringV1Schema } from "../chart/layered-design";
import type { LetteringPlacement } from "../chart/ops/place-lettering";
import { fieldErrorMap, joinIssues, toFieldIssues } from "../chart/zod-messages";
import { p80FactorsSchema, partialRatesSchema } from "../labour/schemas";
import { GarmentError } from "./garment-error";
import type { ChartPlacement, FeatureOptions, PlaceOptions } from "./types";

const chartEntrySchema = z.strictObject({
  /** one of the size output's charts[].area */
  area: z.string().min(1),
  /** chart v1 (see lib/core/chart/FORMAT.md) of the area's width × height */
  chart: z.unknown().refine((v) => v !== undefined, { error: "chart is missing" }),
  /** lettering layers already set in the chart, as a design stores them */
  lettering: z.array(letteringV1Schema).max(20).optional(),
  /** only this piece (e.g. "right mitten"); by default every piece with the area */
  piece: z.string().min(1).optional(),
  /** the second piece of a pair knits the chart mirrored, lettering re-set to read forwards */
  mirror: z.boolean().optional(),
});

export const garmentInputSchema = z.strictObject({
  /** the `size` verb's input */
  size: z.unknown().refine((v) => v !== undefined, { error: "size is missing (the size verb's input)" }),
  charts: z.array(chartEntrySchema).max(40).optional(),
  /** palette keys duplicate-stitched afterwards */
  darn: z.array(z.string().min(1)).max(16).optional(),
  /** the maker's pairs for ranges of rounds: { piece?, part?, fromRound, toRound, pair: ["A", "B"] } */
  pins: z
    .array(
      z.strictObject({
        piece: z.string().min(1).optional(),
        part: z.string().min(1).optional(),
        fromRound: z.number().int().min(1),
        toRound: z.number().int().min(1),
        pair: z.tuple([z.string().min(1), z.string().min(1)]),
      }),
    )
    .max(200)
    .optional(),
  /** proof rounds of the design (default 1) */
  proofRounds: z.number().int().min(0).max(20).optional(),
  rates: partialRatesSchema.optional(),
  p80Factors: p80FactorsSchema.optional(),
});

export type GarmentInput = z.input<typeof garmentInputSchema>;

/** Validated input split for buildGarment / placeCharts / garmentFeatures. */
export function readGarmentInput(input: unknown): { size: unknown; placements: ChartPlacement[]; place: PlaceOptions; features: FeatureOptions } {
  const result = garmentInputSchema.safeParse(input, { error: fieldErrorMap() });
  if (!result.success) {
    const issues = toFieldIssues(result.error.issues);
    throw new GarmentError(issues[0]?.path || "input", joinIssues(issues.map((i) => ({ message: i.message.startsWith(i.path) ? i.message : `${i.path}: ${i.message}` }))));
  }
  const data = result.data;
  const placements: ChartPlacement[] = (data.charts ?? []).map((entry, i) => {
    let chart;
    try {
      chart = parseChart(entry.chart);
    } catch (e) {
      if (e instanceof ChartFormatError) throw new GarmentError(`charts[${i}].chart`, `${entry.area}: ${e.message}`);
      throw e;
    }
    const keys = new Map(chart.palette.map((c, k) => [c.key, k]));
    const lettering: LetteringPlacement[] = (entry.lettering ?? []).map((l, j) => {
      const colour = keys.get(l.key);
      if (colour === undefined) throw new GarmentError(`charts[${i}].lettering[${j}].key`, `'${l.key}' is not in the chart's palette`);
      const background = l.backgroundKey === undefined ? undefined : keys.get(l.backgroundKey);
      if (l.backgroundKey !== undefined && background === undefined) {
        throw new GarmentError(`charts[${i}].lettering[${j}].backgroundKey`, `'${l.backgroundKey}' is not in the chart's palette`);
      }
      return { text: l.text, font: l.font, box: { ...l.box }, colour, ...(background === undefined ? {} : { background }) };
    });
    return {
      area: entry.area,
      chart,
      ...(lettering.length > 0 ? { lettering } : {}),
      ...(entry.piece !== undefined ? { piece: entry.piece } : {}),
      ...(entry.mirror !== undefined ? { mirror: entry.mirror } : {}),
    };
  });
  return {
    size: data.size,
    placements,
    place: { ...(data.darn ? { darn: data.darn } : {}), ...(data.pins ? { pins: data.pins } : {}) },
    features: {
      ...(data.proofRounds !== undefined ? { proofRounds: data.proofRounds } : {}),
      ...(data.rates ? { rates: data.rates } : {}),
      ...(data.p80Factors ? { p80Factors: data.p80Factors } : {}),
    },
  };
}
