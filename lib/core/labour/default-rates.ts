// Studio labour rates with the defaults a new studio starts from. Hand-knitting speed varies
// widely between makers, so none of these is a standard: each is a setting to calibrate.
import { defaultDarningRates } from "../colourwork/darning-rates";

export interface LabourRates {
  /** design: charting and placing a new personalised design, once per new design */
  designBaseMinutes: number;
  /** design: preparing and revising one proof round */
  minutesPerProofRound: number;
  /** knitting: single-colour stitches per minute (must be > 0) */
  plainStitchesPerMinute: number;
  /** knitting: two-colour stranded stitches per minute (must be > 0) */
  strandedStitchesPerMinute: number;
  /** knitting: allowance per shaping round or row */
  minutesPerShapingRound: number;
  /** knitting: allowance per thumb */
  minutesPerThumb: number;
  /** knitting: catching one long float */
  secondsPerFloatCatch: number;
  /** embroidery: one duplicate stitch, including tidying every 3–4 stitches */
  secondsPerDuplicateStitch: number;
  /** embroidery: weaving in one end */
  minutesPerEnd: number;
  /** embroidery: carrying yarn through the wrong side, per cm */
  secondsPerCarryCm: number;
  /** blocking: hands-on time (soaking, pressing out, pinning) per blocked piece */
  blockingMinutesPerPiece: number;
  /** blocking: calendar drying time per piece; not labour */
  dryingHoursPerPiece: number;
  /** finishing and packing per piece */
  finishingMinutesPerPiece: number;
}

export type RateBasis = "common practice" | "(memory)";

export interface RateSource {
  basis: RateBasis;
  note: string;
}

export const defaultRates: Readonly<LabourRates> = Object.freeze({
  designBaseMinutes: 120,
  minutesPerProofRound: 30,
  plainStitchesPerMinute: 25,
  strandedStitchesPerMinute: 15,
  minutesPerShapingRound: 2,
  minutesPerThumb: 20,
  // The darning and float-catch defaults are the colourwork planner's, so a plan and a quote agree.
  secondsPerFloatCatch: defaultDarningRates.secondsPerFloatCatch,
  secondsPerDuplicateStitch: defaultDarningRates.secondsPerDuplicateStitch,
  minutesPerEnd: defaultDarningRates.minutesPerEnd,
  secondsPerCarryCm: defaultDarningRates.secondsPerCarryCm,
  blockingMinutesPerPiece: 15,
  dryingHoursPerPiece: 24,
  finishingMinutesPerPiece: 20,
});

/** Where each default comes from, shown beside the setting so nobody mistakes it for a standard. */
export const rateSources: Readonly<Record<keyof LabourRates, RateSource>> = Object.freeze({
  designBaseMinutes: { basis: "(memory)", note: "our starting guess for charting one personalised design" },
  minutesPerProofRound: { basis: "(memory)", note: "our starting guess for one proof and its revisions" },
  plainStitchesPerMinute: {
    basis: "common practice",
    note: "reported speeds run from about 20–30 sts/min (casual) to 40–50 (experienced); 25 is a cautious middle of the casual range",
  },
  strandedStitchesPerMinute: {
    basis: "(memory)",
    note: "two-colour work is slower than plain; 15 sts/min is our assumption, not a published figure",
  },
  minutesPerShapingRound: { basis: "(memory)", note: "our allowance for counting and working decreases or increases" },
  minutesPerThumb: { basis: "(memory)", note: "our allowance for picking up and knitting a mitten thumb" },
  secondsPerFloatCatch: { basis: "(memory)", note: "our allowance per caught float" },
  secondsPerDuplicateStitch: {
    basis: "(memory)",
    note: "no published time per duplicate stitch was found; ours includes tidying every 3–4 stitches",
  },
  minutesPerEnd: { basis: "(memory)", note: "no published time per woven-in end was found; ours" },
  secondsPerCarryCm: { basis: "(memory)", note: "our allowance for weaving carried yarn through the wrong side" },
  blockingMinutesPerPiece: {
    basis: "(memory)",
    note: "hands-on part only; the 15–30 min soak itself is waiting time",
  },
  dryingHoursPerPiece: { basis: "common practice", note: "wet-blocked pieces dry in a day or two (a sweater 24 h or more)" },
  finishingMinutesPerPiece: { basis: "(memory)", note: "our allowance for final press, label, care card and packing" },
});

/** Rates that divide (stitches per minute) must be positive; all others may be zero. */
export const DIVISOR_RATES = ["plainStitchesPerMinute", "strandedStitchesPerMinute"] as const;

export const RATE_KEYS = Object.keys(defaultRates) as (keyof LabourRates)[];

/** Merge partial studio settings over the defaults and reject impossible values with a clear message. */
export function resolveRates(partial: Partial<LabourRates> = {}, base: LabourRates = defaultRates): LabourRates {
  const rates: LabourRates = { ...base };
  for (const key of RATE_KEYS) {
    const value = partial[key];
    if (value === undefined) continue;
    if (typeof value !== "number" || !Number.isFinite(value)) {
      throw new RangeError(`rates.${key} must be a finite number`);
    }
    if (value < 0) throw new RangeError(`rates.${key} must not be negative (got ${value})`);
    rates[key] = value;
  }
  for (const key of DIVISOR_RATES) {
    if (!(rates[key] > 0)) throw new RangeError(`rates.${key} must be greater than 0 (got ${rates[key]})`);
  }
  return rates;
}
