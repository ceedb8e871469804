// core verb `garment`: { size: <size input>, charts?: [{ area, chart, lettering?, piece?, mirror? }], pins?,
// darn?: ["C"], proofRounds?, rates?, p80Factors? } → every piece one by one with its stitches and
// labour features, what is knitted in each round, yarn per colour, and the labour estimate.
import { buildGarment, garmentFeatures, placeCharts, readGarmentInput } from "@/lib/core/garment";

export function run(input: unknown): unknown {
  const parsed = readGarmentInput(input);
  const garment = buildGarment(parsed.size);
  // A chart is drawn over its area's whole rectangle; cells the shape does not knit (above the
  // decreases, outside a crown sector) are marked in notKnitted and never counted. The editor and a
  // saved design refuse such paint instead (placeCharts' default).
  const placed = placeCharts(garment, parsed.placements, { ...parsed.place, outsideShape: "ignore" });
  const reading = garmentFeatures(placed, parsed.features);
  return {
    garment: garment.kind,
    pieces: reading.pieces,
    rounds: reading.rounds,
    yarn: reading.yarn,
    labour: reading.labour,
    notKnitted: placed.notKnitted,
  };
}
