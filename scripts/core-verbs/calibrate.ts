// core verb `calibrate`: finished pieces (features + logged minutes per stage) → fitted rates,
// pieces behind each stage, P80 factors, and accuracy before/after on held-back pieces.
import { calibrateRates } from "../../lib/core/labour/calibrate";
import type { LabourRates } from "../../lib/core/labour/default-rates";
import { parseOrThrow } from "../../lib/core/labour/describe-issues";
import { calibrateInputSchema } from "../../lib/core/labour/schemas";
import { STAGES } from "../../lib/core/labour/stages";

// Three decimals is finer than any studio setting needs and keeps the output readable.
const round3 = (v: number) => Math.round(v * 1000) / 1000;

export function run(input: unknown): unknown {
  const { pieces, ...options } = parseOrThrow(calibrateInputSchema, input);
  const result = calibrateRates(pieces, options);
  const rates = Object.fromEntries(Object.entries(result.rates).map(([k, v]) => [k, round3(v)])) as unknown as LabourRates;
  return {
    rates,
    pieces: Object.fromEntries(STAGES.map((s) => [s, result.stages[s].pieces])),
    stages: result.stages,
    p80Factors: result.p80Factors,
    accuracy: result.accuracy,
    notes: result.notes,
  };
}
