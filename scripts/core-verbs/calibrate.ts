// core verb `calibrate`: finished pieces (features + logged minutes per stage) → fitted rates,
// pieces behind each stage, P80 factors, and accuracy before/after on held-back pieces.
// The fit is in log space (the rates give a median, P50, for a new piece); each stage's P80 factor
// is a prediction bound from leave-one-out ratios (lib/core/labour/CALIBRATION.md). `stages.<s>.spread`
// shows that check; `accuracy` adds p50Coverage / p80Coverage (% of held-back pieces at or below).
// To estimate with the result, pass its `rates` and `p80Factors` unchanged as the `estimate` verb's
// `rates` and `p80Factors`: { "pieces": [...], "rates": out.rates, "p80Factors": out.p80Factors }.
// (`rates` is every rate, three decimals; `p80Factors` is one factor ≥ 1 per stage, rounded up.)
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
