// core verb `size`: garment, measurements (or a standard size), ease, gauge and motif repeat →
// cast-on, stitch and row counts, chart sizes per decorated area, and a recipe in metric and imperial.
import { sizeGarment } from "@/lib/core/sizing/size-garment";

export function run(input: unknown): unknown {
  return sizeGarment(input);
}
