// core verb `estimate`: pieces' features (and optional rate settings) → minutes per stage, P50 and P80.
// Each stage's { p50Minutes, p80Minutes } can be passed straight to `quote` as labourMinutes.
// Calibrated figures: `rates` and `p80Factors` take the `calibrate` verb's `rates` and `p80Factors`
// as they are. `pieces[i].p50Minutes` / `p80Minutes` give each piece's own figures per stage.
import { parseOrThrow } from "../../lib/core/labour/describe-issues";
import { estimateLabour } from "../../lib/core/labour/estimate-labour";
import { estimateInputSchema } from "../../lib/core/labour/schemas";

export function run(input: unknown): unknown {
  const parsed = parseOrThrow(estimateInputSchema, input);
  const estimate = estimateLabour(parsed);
  return {
    stages: estimate.stages,
    totals: estimate.totals,
    dryingHours: estimate.dryingHours,
    pieces: estimate.pieces,
    p80Factors: estimate.p80Factors,
    rates: estimate.rates,
  };
}
