// Prints one JSON line per (noise σ, history size): P50 and P80 coverage of fresh pieces, per stage
// and on whole pieces, after calibrating on a seeded history (see calibration-sim.ts).
// `npm run --silent bench:calibration [-- histories fresh seed]`; no timing, no assertions.
import { SIM_HISTORY_SIZES, SIM_SIGMAS, simulateCoverage } from "./calibration-sim";

const [histories = 20, fresh = 100, seed = 2026] = process.argv.slice(2).map(Number);
for (const sigma of SIM_SIGMAS) {
  for (const historyPieces of SIM_HISTORY_SIZES) {
    const run = simulateCoverage({ seed: seed + Math.round(sigma * 1000) + historyPieces, sigma, historyPieces, histories, fresh });
    process.stdout.write(JSON.stringify(run) + "\n");
  }
}
