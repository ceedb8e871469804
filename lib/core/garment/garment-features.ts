// Everything read from a placed garment: per piece plain/stranded/darned stitches, knitted pair per
// round, floats and catches, darning route, yarn per colour and labour.
import type { FeatureOptions, GarmentReading, PlacedGarment } from "./types";

export function garmentFeatures(placed: PlacedGarment, opts: FeatureOptions = {}): GarmentReading {
  void placed;
  void opts;
  throw new Error("not yet");
}
