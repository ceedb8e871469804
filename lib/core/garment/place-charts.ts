// Charts placed on areas: cells mapped onto real stitches, per piece and repeat.
import type { ChartPlacement, Garment, PlacedGarment, PlaceOptions } from "./types";

export function placeCharts(garment: Garment, placements: ChartPlacement[], opts: PlaceOptions = {}): PlacedGarment {
  void garment;
  void placements;
  void opts;
  throw new Error("not yet");
}
