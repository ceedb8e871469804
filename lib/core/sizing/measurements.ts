// Body measurements: names, the range a human body can have, and reading them in either unit.
// A value outside the range is refused; when the same number read in the other unit would fit,
// the message says so (most unit mix-ups are an inch value in a cm field or the reverse).
import { SizingError } from "./sizing-error";
import { CM_PER_IN, inToCm, roundTo } from "./units";

export interface MeasurementSpec {
  /** field name without its unit: `headCircumference` → `headCircumferenceCm` / `headCircumferenceIn` */
  name: string;
  /** what the value is of, in a sentence: "a 22 cm head" */
  noun: string;
  /** how it is measured, for the range note */
  how: string;
  minCm: number;
  maxCm: number;
}

// Limits are wide on purpose: from a newborn to a large adult (our own bounds, built from the
// standard-size tables plus a margin); they catch slips, not unusual bodies.
export const MEASUREMENT_SPECS = {
  handCircumference: { name: "handCircumference", noun: "hand", how: "around the knuckles, thumb excluded", minCm: 6, maxCm: 32 },
  handLength: { name: "handLength", noun: "hand length", how: "wrist crease to fingertip", minCm: 6, maxCm: 28 },
  thumbLength: { name: "thumbLength", noun: "thumb length", how: "thumb crotch to thumb tip", minCm: 1.5, maxCm: 10 },
  cuffLength: { name: "cuffLength", noun: "cuff", how: "cuff depth", minCm: 0.5, maxCm: 30 },
  headCircumference: { name: "headCircumference", noun: "head", how: "around the forehead", minCm: 23, maxCm: 66 },
  hatHeight: { name: "hatHeight", noun: "hat height", how: "brim edge to crown, unfolded", minCm: 8, maxCm: 40 },
  brimLength: { name: "brimLength", noun: "brim", how: "brim depth", minCm: 0.5, maxCm: 20 },
  chest: { name: "chest", noun: "chest", how: "around the fullest part of the chest or bust", minCm: 35, maxCm: 170 },
  bodyLength: { name: "bodyLength", noun: "body length", how: "underarm to hem", minCm: 8, maxCm: 90 },
  sleeveLength: { name: "sleeveLength", noun: "sleeve length", how: "underarm to cuff edge", minCm: 5, maxCm: 80 },
  upperArm: { name: "upperArm", noun: "upper arm", how: "around the upper arm", minCm: 10, maxCm: 70 },
  wrist: { name: "wrist", noun: "wrist", how: "around the wrist", minCm: 8, maxCm: 30 },
  hemLength: { name: "hemLength", noun: "hem", how: "hem rib depth", minCm: 0.5, maxCm: 20 },
  neckbandLength: { name: "neckbandLength", noun: "neckband", how: "neckband depth", minCm: 0.5, maxCm: 15 },
  bandHeight: { name: "bandHeight", noun: "colourwork band", how: "band height", minCm: 1, maxCm: 40 },
  yokeDepth: { name: "yokeDepth", noun: "yoke depth", how: "underarm to neck", minCm: 5, maxCm: 45 },
} as const satisfies Record<string, MeasurementSpec>;

export type MeasurementName = keyof typeof MEASUREMENT_SPECS;

function fmt(n: number): string {
  return String(roundTo(n, 0.1));
}

/** Checks one length in cm against its human range; `given` is the unit the person typed. */
export function checkMeasurement(spec: MeasurementSpec, field: string, value: number, given: "cm" | "in"): number {
  if (!Number.isFinite(value) || value <= 0) {
    throw new SizingError(field, `must be a length more than 0 (got ${String(value)})`);
  }
  const cm = given === "cm" ? value : inToCm(value);
  if (cm >= spec.minCm && cm <= spec.maxCm) return cm;
  const tooSmall = cm < spec.minCm;
  const range = `a ${spec.noun} measures ${fmt(spec.minCm)}–${fmt(spec.maxCm)} cm, ${spec.how}`;
  let hint = "";
  if (given === "cm") {
    const asIn = value * CM_PER_IN;
    const asMm = value / 10;
    if (tooSmall && asIn >= spec.minCm && asIn <= spec.maxCm) {
      hint = `; did you mean ${fmt(value)} in = ${fmt(asIn)} cm? Send it as ${spec.name}In`;
    } else if (!tooSmall && asMm >= spec.minCm && asMm <= spec.maxCm) {
      hint = `; did you give millimetres? ${fmt(value)} mm = ${fmt(asMm)} cm`;
    }
  } else {
    const asCm = value;
    if (!tooSmall && asCm >= spec.minCm && asCm <= spec.maxCm) {
      hint = `; did you mean ${fmt(value)} cm? Send it as ${spec.name}Cm`;
    }
  }
  const shown = given === "cm" ? `${fmt(value)} cm` : `${fmt(value)} in (${fmt(cm)} cm)`;
  throw new SizingError(field, `a ${shown} ${spec.noun} is too ${tooSmall ? "small" : "large"} (${range})${hint}`);
}

/**
 * Reads `<name>Cm` or `<name>In` from a measurements record; both at once is refused.
 * Returns cm (inches converted exactly, kept to the mm) or undefined when neither is there.
 */
export function readMeasurement(
  raw: Readonly<Record<string, number | undefined>>,
  name: MeasurementName,
  prefix = "measurements",
): number | undefined {
  const spec = MEASUREMENT_SPECS[name];
  const cm = raw[`${name}Cm`];
  const inch = raw[`${name}In`];
  if (cm !== undefined && inch !== undefined) {
    throw new SizingError(`${prefix}.${name}`, `give ${name}Cm or ${name}In, not both`);
  }
  if (cm !== undefined) return checkMeasurement(spec, `${prefix}.${name}Cm`, cm, "cm");
  if (inch !== undefined) return checkMeasurement(spec, `${prefix}.${name}In`, inch, "in");
  return undefined;
}

/** The field names a measurements record may hold for the given measurements. */
export function measurementFields(names: readonly MeasurementName[]): string[] {
  return names.flatMap((n) => [`${n}Cm`, `${n}In`]);
}
