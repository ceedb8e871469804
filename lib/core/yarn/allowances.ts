// Yarn beyond the stitches themselves: cast-on and bind-off, woven-in ends, the studio's margin.

/** Long-tail cast-on tail ≈ 3 × the cast-on width (Righetti, Knitting in Plain English). */
export const LONG_TAIL_PER_WIDTH = 3;
/** A bind-off, taken as about as much as a long-tail cast-on (memory, common practice). */
export const BIND_OFF_PER_WIDTH = 3;
/** Each end left to weave in, in cm (studio default; ends are woven in and reversed). */
export const DEFAULT_TAIL_CM = 15;
/** A duplicate stitch traces its stitch and passes to the back: loop length × this
 * (memory, common practice; a studio setting, not a published value). */
export const DEFAULT_COVERAGE_FACTOR = 1.3;
/** Studio safety margin on every colour, in percent (studio default). */
export const DEFAULT_MARGIN_PERCENT = 10;
/** Stranded colourwork takes about 25 % more yarn than plain (common practice, knitting-technique authors).
 * Not applied by the chart estimate, which counts floats itself; used for garment-level comparisons. */
export const STRANDED_EXTRA_PERCENT = 25;

export const ALLOWANCE_SOURCES = {
  longTail: "Righetti, Knitting in Plain English: long-tail cast-on tail ≈ 3 × cast-on width",
  bindOff: "(memory) a bind-off takes about as much yarn as a cast-on",
  coverage: "(memory) common practice: duplicate stitch ≈ 1.3 × the knitted loop",
  tail: "studio default: 15 cm an end",
  margin: "studio default: 10 % safety margin",
} as const;

export function getCastOnCm(widthCm: number): number {
  return LONG_TAIL_PER_WIDTH * widthCm;
}

export function getBindOffCm(widthCm: number): number {
  return BIND_OFF_PER_WIDTH * widthCm;
}
