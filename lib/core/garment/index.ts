// The garment model (lib/core/garment): pieces one by one, each round's stitches and areas, charts
// placed on areas, and every number read from that one model. See README.md.
//
//   const garment = buildGarment(sizeInput);               // or garmentFromSizing(sizeGarment(…))
//   const placed = placeCharts(garment, placements, { darn: ["C"] });
//   const { pieces, rounds, yarn, labour } = garmentFeatures(placed, { proofRounds: 1, rates });
export type {
  ChartPlacement,
  ColourYarnReading,
  FeatureOptions,
  Garment,
  GarmentArea,
  GarmentColour,
  GarmentPart,
  GarmentPiece,
  GarmentPieceFeatures,
  GarmentReading,
  GarmentRound,
  Narrowing,
  PieceReading,
  PlacedGarment,
  NotKnittedCells,
  PlaceOptions,
  RoundPinInput,
  RoundReading,
  RoundSpan,
  YarnReading,
} from "./types";
export { GarmentError } from "./garment-error";
export { areaShape, buildGarment, garmentFromSizing, inShapeColumns } from "./build-garment";
export { placeCharts } from "./place-charts";
export { garmentFeatures } from "./garment-features";
export { garmentInputSchema, readGarmentInput, type GarmentInput } from "./garment-input";
