// core verb `garment`: { size: <size input>, charts?: [{ area, chart, lettering?, piece?, mirror? }], pins?,
// darn?: ["C"], proofRounds?, rates?, p80Factors? } → every piece one by one with its stitches and
// labour features, what is knitted in each round, yarn per colour, and the labour estimate.
import { buildGarment, garmentFeatures, placeCharts, readGarmentInput } from "@/lib/core/garment";

export function run(input: unknown): unknown {
  const parsed = readGarmentInput(input);
  const garment = buildGarment(parsed.size);
  const placed = placeCharts(garment, parsed.placements, parsed.place);
  const reading = garmentFeatures(placed, parsed.features);
  return {
    garment: garment.kind,
    pieces: reading.pieces,
    rounds: reading.rounds,
    yarn: reading.yarn,
    labour: reading.labour,
  };
}
