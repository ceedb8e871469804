// One entry for every garment: validates the input, resolves measurements (a standard size and/or
// custom values, in cm or in), ease and gauge, runs the template and reports in both unit systems.
import { z } from "zod";
import { parseWithMessages } from "../chart/zod-messages";
import { EASE_CATEGORY_KEYS, resolveEase, type EaseCategoryKey } from "./ease";
import { resolveGauge } from "./gauge";
import { sizeHat, HAT_PROPORTIONS, type HatStyle } from "./hat";
import { MEASUREMENT_SPECS, measurementFields, readMeasurement, type MeasurementName } from "./measurements";
import { MITTEN_PROPORTIONS, sizeMitten, type TemplateOutput } from "./mitten";
import { PULLOVER_PROPORTIONS, sizePullover } from "./pullover";
import type { GarmentKind, SizingResult } from "./sizing-result";
import { SizingError } from "./sizing-error";
import { HAT_HEIGHTS, STANDARD_SIZES, getAssumedHead, getHatHeightCm, getSizeKeys, getStandardMeasurements, getWristEstimateCm, getYokeDepthCapCm } from "./standard-sizes";
import { CM_PER_IN, roundTo, toLength } from "./units";
import { checkGauge, YARN_WEIGHTS } from "../yarn/yarn-weights";

/** The widest repeat a chart can hold (the chart model's width limit). */
const MAX_REPEAT = 400;

const num = z.number().refine(Number.isFinite, { error: "must be a finite number" });

const gaugeSchema = z.strictObject({
  stitchesPer10cm: num.optional(),
  rowsPer10cm: num.optional(),
  stitchesPer4in: num.optional(),
  rowsPer4in: num.optional(),
  stitchesPerIn: num.optional(),
  rowsPerIn: num.optional(),
  stitches: num.optional(),
  rows: num.optional(),
  overCm: num.optional(),
  overIn: num.optional(),
});

export const sizeGarmentInputSchema = z.strictObject({
  garment: z.enum(["mitten", "mittens", "hat", "pullover"]),
  /** a standard size key (see STANDARD_SIZES); measurements given beside it override it */
  size: z.string().optional(),
  measurements: z.record(z.string(), num).optional(),
  easeCm: num.optional(),
  easeIn: num.optional(),
  easePercent: num.optional(),
  easeCategory: z.enum(EASE_CATEGORY_KEYS as [EaseCategoryKey, ...EaseCategoryKey[]]).optional(),
  gauge: gaugeSchema,
  repeat: z.number().int({ error: "repeat must be a whole number of stitches" }).optional(),
  /** Standard Yarn Weight System category (0–7): the gauge is checked against its range */
  yarnCategory: z.number().int().min(0).max(7).optional(),
  options: z
    .object({
      thumb: z.enum(["gusset", "afterthought"]).optional(),
      /** pullovers: yoke | bands; hats: beanie | folded-brim | tall (fitted, folded and slouch are read as those) */
      style: z.enum(["yoke", "bands", "beanie", "folded-brim", "tall", "fitted", "folded", "slouch"]).optional(),
      /** pullovers: raise the back neck with short rows */
      backNeckShortRows: z.boolean().optional(),
    })
    .catchall(num)
    .optional(),
});

export type SizeGarmentInput = z.input<typeof sizeGarmentInputSchema>;

/** Per garment: the body measurements it needs, those it can use, and the garment lengths it takes as options. */
export const GARMENT_FIELDS: Record<GarmentKind, { required: MeasurementName[]; optional: MeasurementName[]; options: MeasurementName[] }> = {
  mitten: { required: ["handCircumference", "handLength"], optional: ["thumbLength"], options: ["cuffLength"] },
  hat: { required: ["headCircumference"], optional: [], options: ["hatHeight", "brimLength"] },
  pullover: {
    required: ["chest", "bodyLength", "sleeveLength"],
    optional: ["upperArm", "wrist", "headCircumference"],
    options: ["yokeDepth", "hemLength", "cuffLength", "neckbandLength", "bandHeight"],
  },
};

/** The main circumference for each garment, which ease is added to. */
const MAIN: Record<GarmentKind, MeasurementName> = { mitten: "handCircumference", hat: "headCircumference", pullover: "chest" };

function checkFields(record: Record<string, unknown>, allowed: string[], prefix: string, extra: string[] = []) {
  for (const key of Object.keys(record)) {
    if (allowed.includes(key) || extra.includes(key)) continue;
    const base = allowed.find((a) => a.replace(/(Cm|In)$/, "") === key);
    const hint = base ? `; name the unit: ${key}Cm or ${key}In` : `; expected one of ${allowed.join(", ")}`;
    throw new SizingError(`${prefix}.${key}`, `is not a field here${hint}`);
  }
}

export function sizeGarment(rawInput: unknown): SizingResult {
  const input = parseWithMessages(sizeGarmentInputSchema, rawInput, "size input");
  const garment: GarmentKind = input.garment === "mittens" ? "mitten" : input.garment;
  const spec = GARMENT_FIELDS[garment];
  const warnings: string[] = [];
  const sources: string[] = [];

  // Measurements: a standard size first, then whatever was measured on top of it.
  const measured = input.measurements ?? {};
  checkFields(measured, measurementFields([...spec.required, ...spec.optional]), "measurements");
  let standard: Record<string, number> = {};
  if (input.size !== undefined) {
    const found = getStandardMeasurements(garment, input.size);
    if (!found) {
      throw new SizingError("size", `no standard ${garment} size "${input.size}"; choose one of ${getSizeKeys(garment).join(", ")}`);
    }
    standard = found;
    sources.push(STANDARD_SIZES[garment].source);
  }
  const used: SizingResult["measurements"] = {};
  const cm: Partial<Record<MeasurementName, number>> = {};
  for (const name of [...spec.required, ...spec.optional]) {
    const given = readMeasurement(measured, name);
    const value = given ?? standard[`${name}Cm`];
    if (value === undefined) {
      if (spec.required.includes(name)) {
        throw new SizingError(
          `measurements.${name}Cm`,
          `is missing (${MEASUREMENT_SPECS[name].how}); give ${name}Cm or ${name}In, or pick a standard size (${getSizeKeys(garment).join(", ")})`,
        );
      }
      continue;
    }
    cm[name] = value;
    used[`${name}Cm`] = { ...toLength(value), from: given !== undefined ? "given" : "standard size" };
  }

  const { thumb, style, backNeckShortRows, ...lengths } = input.options ?? {};
  if (thumb !== undefined && garment !== "mitten") throw new SizingError("options.thumb", "applies to mittens only");
  const styleOf = { yoke: "yoke", bands: "bands", beanie: "beanie", fitted: "beanie", "folded-brim": "folded-brim", folded: "folded-brim", tall: "tall", slouch: "tall" } as const;
  const styleName = style === undefined ? undefined : styleOf[style];
  if (styleName !== undefined) {
    if (garment === "mitten") throw new SizingError("options.style", "applies to hats (beanie, folded-brim, tall) and pullovers (yoke, bands) only");
    const allowed: readonly string[] = garment === "hat" ? ["beanie", "folded-brim", "tall"] : ["yoke", "bands"];
    if (!allowed.includes(styleName)) throw new SizingError("options.style", `a ${garment}'s style is ${allowed.join(" or ")} (got ${style})`);
  }
  if (backNeckShortRows !== undefined && garment !== "pullover") throw new SizingError("options.backNeckShortRows", "applies to pullovers only");
  checkFields(lengths, measurementFields(spec.options), "options");
  const opt: Partial<Record<MeasurementName, number>> = {};
  for (const name of spec.options) {
    const v = readMeasurement(lengths, name, "options");
    if (v !== undefined) opt[name] = v;
  }

  const { gauge, given: givenGauge, rowsDerived, warnings: gaugeWarnings } = resolveGauge(input.gauge);
  warnings.push(...gaugeWarnings);
  if (rowsDerived) sources.push("Fully relaxed plain-knit proportions, courses/wales ≈ 5.5 / 4.2 (Knapton et al. 1968, as quoted in textile-engineering texts; geometry after Munden, J. Textile Institute 1959): row gauge assumed");

  if (input.yarnCategory !== undefined) {
    // In the unit the gauge was given: the standard publishes its ranges per 4 in and per 10 cm alike.
    const check = checkGauge(input.yarnCategory, givenGauge.stitches, garment, givenGauge.per);
    if (check.message) warnings.push(check.message);
    sources.push(YARN_WEIGHTS.source);
  }

  const repeat = input.repeat ?? 1;
  if (repeat < 1 || repeat > MAX_REPEAT) {
    throw new SizingError("repeat", `must be between 1 and ${MAX_REPEAT} stitches (got ${repeat})`);
  }

  const main = cm[MAIN[garment]] as number;
  const ease = resolveEase(input, garment, main);
  warnings.push(...ease.warnings);

  let out: TemplateOutput;
  if (garment === "mitten") {
    out = sizeMitten({
      handCircumferenceCm: main,
      handLengthCm: cm.handLength as number,
      thumbLengthCm: cm.thumbLength,
      cuffLengthCm: opt.cuffLength,
      easeCm: ease.cm,
      gauge,
      repeat,
      thumb: thumb ?? "gusset",
    });
    sources.push(MITTEN_PROPORTIONS.source);
  } else if (garment === "hat") {
    out = sizeHat({
      style: (styleName as HatStyle | undefined) ?? "beanie",
      standardHeightCm: getHatHeightCm(used.headCircumferenceCm?.from === "standard size" ? input.size : undefined, main),
      headCircumferenceCm: main,
      hatHeightCm: opt.hatHeight,
      brimLengthCm: opt.brimLength,
      easeCm: ease.cm,
      gauge,
      repeat,
    });
    sources.push(HAT_PROPORTIONS.source);
    if (styleName === "tall" || styleName === "folded-brim") sources.push(HAT_HEIGHTS.source);
  } else {
    out = sizePullover({
      chestCm: main,
      bodyLengthCm: cm.bodyLength as number,
      sleeveLengthCm: cm.sleeveLength as number,
      upperArmCm: cm.upperArm,
      wristCm: cm.wrist,
      headCircumferenceCm: cm.headCircumference,
      assumedHead: getAssumedHead(input.size, main),
      wristEstimateCm: getWristEstimateCm(input.size, main),
      yokeDepthCapCm: getYokeDepthCapCm(main),
      backNeckShortRows: backNeckShortRows ?? false,
      yokeDepthCm: opt.yokeDepth,
      hemLengthCm: opt.hemLength,
      cuffLengthCm: opt.cuffLength,
      neckbandLengthCm: opt.neckbandLength,
      bandHeightCm: opt.bandHeight,
      easeCm: ease.cm,
      gauge,
      repeat,
      style: (styleName as "yoke" | "bands" | undefined) ?? "yoke",
    });
    sources.push(PULLOVER_PROPORTIONS.source);
  }
  if (ease.from !== "given") sources.push(ease.from);
  for (const [k, v] of Object.entries(out.derived)) used[k] = { ...toLength(v), from: "derived" };
  warnings.push(...out.warnings);

  // Say when the repeat pulls the fit far from what was asked (more than 2.5 cm or 5 %).
  const targetCm = main + ease.cm;
  const gotCm = out.castOn / (gauge.stitchesPer10cm / 10);
  if (Math.abs(gotCm - targetCm) > Math.max(2.5, 0.05 * targetCm)) {
    warnings.push(
      `the ${repeat}-st repeat moves the finished size to ${roundTo(gotCm, 0.1)} cm from the ${roundTo(targetCm, 0.1)} cm asked for`,
    );
  }

  const per4in = (v: number) => roundTo((v * 4 * CM_PER_IN) / 10, 0.1);
  return {
    garment,
    size: input.size ?? null,
    ...(garment === "mitten" ? {} : { style: styleName ?? (garment === "hat" ? "beanie" : "yoke") }),
    castOn: out.castOn,
    counts: out.counts,
    rows: out.rows,
    charts: out.charts,
    pieces: out.pieces,
    measurements: used,
    ease: { ...toLength(ease.cm), percent: ease.percent, from: ease.from },
    gauge: {
      stitchesPer10cm: roundTo(gauge.stitchesPer10cm, 0.01),
      rowsPer10cm: roundTo(gauge.rowsPer10cm, 0.01),
      stitchesPer4in: per4in(gauge.stitchesPer10cm),
      rowsPer4in: per4in(gauge.rowsPer10cm),
    },
    finished: out.finished,
    recipe: out.recipe,
    warnings,
    sources,
  };
}
