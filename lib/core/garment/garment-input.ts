// The garment verb's input (and the app's): size input, charts on areas, colours to darn.
import { z } from "zod";
import type { ChartPlacement, FeatureOptions, PlaceOptions } from "./types";

export const garmentInputSchema = z.strictObject({
  size: z.unknown(),
  charts: z.array(z.unknown()).optional(),
  darn: z.array(z.string()).optional(),
  proofRounds: z.number().int().min(0).max(20).optional(),
  rates: z.record(z.string(), z.number()).optional(),
});

export type GarmentInput = z.input<typeof garmentInputSchema>;

/** Validated input split for buildGarment / placeCharts / garmentFeatures. */
export function readGarmentInput(input: unknown): { size: unknown; placements: ChartPlacement[]; place: PlaceOptions; features: FeatureOptions } {
  void input;
  throw new Error("not yet");
}
