// Labour rates for the work that follows the knitting: duplicate stitches, ends, carried yarn and
// float catches. No published averages exist for any of them, so each is a studio setting; the
// defaults match the studio labour defaults so a quote and a colour plan agree out of the box.

export interface DarningRates {
  /** one duplicate stitch, including tidying the tension every 3–4 stitches */
  secondsPerDuplicateStitch: number;
  /** weaving in one end, reversing direction to secure it */
  minutesPerEnd: number;
  /** weaving carried yarn through the wrong side, per cm */
  secondsPerCarryCm: number;
  /** catching one long float while knitting */
  secondsPerFloatCatch: number;
}

export const defaultDarningRates: Readonly<DarningRates> = Object.freeze({
  secondsPerDuplicateStitch: 30, // (memory) no published time per duplicate stitch; ours
  minutesPerEnd: 3, // (memory) no published time per woven-in end; ours
  secondsPerCarryCm: 5, // (memory) our allowance for weaving a carry through worked stitches
  secondsPerFloatCatch: 3, // (memory) our allowance per caught float
});

/** Where each default comes from, to show beside the setting. */
export const darningRateSources: Readonly<Record<keyof DarningRates, string>> = Object.freeze({
  secondsPerDuplicateStitch: "(memory) no published time per duplicate stitch was found; includes tidying every 3–4 stitches",
  minutesPerEnd: "(memory) no published time per woven-in end was found",
  secondsPerCarryCm: "(memory) our allowance for weaving carried yarn through the wrong side",
  secondsPerFloatCatch: "(memory) our allowance per caught float",
});

/** Yarn defaults for the darning estimate. */
export const defaultDarningYarn = Object.freeze({
  /** tail left at each end to weave in, cm (common practice; (memory) for the figure) */
  tailCm: 15,
  /** fully relaxed plain-knit constant: loop length × wales per cm ≈ 4.2 (later work, e.g. Knapton et al. 1968, as quoted in textile-engineering texts; geometry after Munden, J. Textile Inst., 1959) */
  loopConstantKw: 4.2,
});

export interface DarningWork {
  stitches: number;
  ends: number;
  carryCm: number;
  catches?: number;
}

/** Minutes of hand work for darning (and catching floats, when given), unrounded. */
export function getDarningMinutes(work: DarningWork, rates: DarningRates = defaultDarningRates): number {
  return (
    (work.stitches * rates.secondsPerDuplicateStitch +
      work.carryCm * rates.secondsPerCarryCm +
      (work.catches ?? 0) * rates.secondsPerFloatCatch) /
      60 +
    work.ends * rates.minutesPerEnd
  );
}

/** Minutes spent on ends and carried yarn only: the part a better route can save. */
export function getOverheadMinutes(work: Pick<DarningWork, "ends" | "carryCm">, rates: DarningRates = defaultDarningRates): number {
  return work.ends * rates.minutesPerEnd + (work.carryCm * rates.secondsPerCarryCm) / 60;
}

/** Round to one decimal place, for minutes and centimetres shown to a person. */
export function roundTenth(value: number): number {
  return Math.round(value * 10) / 10;
}
