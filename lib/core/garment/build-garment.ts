// Sizing → garment: pieces one by one (a pair is a left and a right piece), each part's rounds
// with their stitch counts and which stitches belong to which area.
import { sizeGarment } from "../sizing/size-garment";
import type { SizingResult } from "../sizing/sizing-result";
import type { Garment } from "./types";

/** Sizes the garment (the `size` verb's input) and builds its model. */
export function buildGarment(sizeInput: unknown): Garment {
  return garmentFromSizing(sizeGarment(sizeInput));
}

/** The garment model of a sizing result (one source of truth: the templates' round counts). */
export function garmentFromSizing(sizing: SizingResult): Garment {
  void sizing;
  throw new Error("not yet");
}
