// The sizing form of a commission: what the studio types (text, in the unit it measures in), the
// sizing core's input built from it, and the core's messages put back on the field they are about.
// Shared by the form (live results in the browser), the route that saves it and the server readers.
import { z } from "zod";
import { safeString } from "./common";
import { EASE_CATEGORIES, GARMENT_FIELDS, SizingError, sizeGarment, type SizeGarmentInput, type SizingResult } from "@/lib/core/sizing";
import type { GarmentKind } from "@/lib/core/sizing";

const EASE_KEYS = EASE_CATEGORIES.categories.map((c) => c.key) as [string, ...string[]];

export const sizingFormSchema = z.strictObject({
  /** a standard size key, or "" for the measurements alone */
  size: safeString().max(40),
  unit: z.enum(["cm", "in"]),
  /** body measurements and garment lengths, by name without unit, as typed */
  lengths: z
    .record(safeString().max(40), safeString().max(20))
    .refine((r) => Object.keys(r).length <= 20, { error: "Too many lengths." }),
  easeMode: z.enum(["default", "category", "value"]),
  easeCategory: z.enum(EASE_KEYS),
  /** in `unit`, negative for a smaller garment */
  ease: safeString().max(20),
  gaugeOver: z.enum(["10cm", "4in"]),
  stitches: safeString().max(20),
  rows: safeString().max(20),
  /** Standard Yarn Weight System category, or "" */
  yarnCategory: safeString().max(2),
  repeat: safeString().max(20),
  thumb: z.enum(["gusset", "afterthought"]),
  /** pullovers: yoke | bands; hats: beanie | folded-brim | tall (a hat form saved before hat styles says "yoke": a beanie) */
  style: z.enum(["yoke", "bands", "beanie", "folded-brim", "tall"]),
  /** pullovers: raise the back neck with short rows */
  backNeckShortRows: z.boolean().optional(),
});

const HAT_STYLES: readonly string[] = ["beanie", "folded-brim", "tall"];

export type SizingFormValues = z.infer<typeof sizingFormSchema>;
export type FieldErrors = Record<string, string[]>;

export function coreGarment(garment: "mittens" | "hat" | "pullover" | GarmentKind): GarmentKind {
  return garment === "mittens" ? "mitten" : garment;
}

/** The length fields the form shows for a garment: measurements first, then garment lengths. */
export function lengthFields(garment: GarmentKind): { name: string; kind: "required" | "optional" | "option" }[] {
  const f = GARMENT_FIELDS[garment];
  return [
    ...f.required.map((name) => ({ name, kind: "required" as const })),
    ...f.optional.map((name) => ({ name, kind: "optional" as const })),
    ...f.options.map((name) => ({ name, kind: "option" as const })),
  ];
}

const NUMBER = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)$/;

function readNumber(text: string, field: string, errors: FieldErrors, message = "Enter a number, like 21.5."): number | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  if (!NUMBER.test(t)) {
    (errors[field] ??= []).push(message);
    return undefined;
  }
  return Number(t.replace(",", "."));
}

/**
 * The core's input from the form, or the field errors that stop it. Only the shape is checked
 * here; ranges, unit slips and whether the garment can be made are the core's (see sizeForm).
 */
export function toSizeInput(garmentKind: "mittens" | "hat" | "pullover" | GarmentKind, values: SizingFormValues): { input: SizeGarmentInput | null; fieldErrors: FieldErrors } {
  const garment = coreGarment(garmentKind);
  const errors: FieldErrors = {};
  const unit = values.unit === "cm" ? "Cm" : "In";
  const measurements: Record<string, number> = {};
  const options: Record<string, number | string | boolean> = {};
  const f = GARMENT_FIELDS[garment];
  for (const { name, kind } of lengthFields(garment)) {
    const v = readNumber(values.lengths[name] ?? "", `lengths.${name}`, errors);
    if (v === undefined) continue;
    if (kind === "option") options[`${name}${unit}`] = v;
    else measurements[`${name}${unit}`] = v;
  }
  if (!values.size) {
    for (const name of f.required) {
      if (measurements[`${name}${unit}`] === undefined && !errors[`lengths.${name}`]) (errors[`lengths.${name}`] ??= []).push("Measure this, or pick a standard size.");
    }
  }
  const stitches = readNumber(values.stitches, "stitches", errors);
  const rows = readNumber(values.rows, "rows", errors);
  if (stitches === undefined && !errors.stitches) (errors.stitches ??= []).push("Count the stitches over your swatch.");
  const repeatNum = readNumber(values.repeat, "repeat", errors, "Enter a whole number of stitches.");
  if (repeatNum !== undefined && !Number.isInteger(repeatNum)) (errors.repeat ??= []).push("Enter a whole number of stitches.");
  const easeNum = values.easeMode === "value" ? readNumber(values.ease, "ease", errors) : undefined;
  if (values.easeMode === "value" && easeNum === undefined && !errors.ease) (errors.ease ??= []).push("Enter the ease, or choose a category.");
  const yarnCategory = values.yarnCategory === "" ? undefined : Number(values.yarnCategory);
  if (yarnCategory !== undefined && !(Number.isInteger(yarnCategory) && yarnCategory >= 0 && yarnCategory <= 7)) (errors.yarnCategory ??= []).push("Choose a weight category from 0 to 7.");
  if (Object.keys(errors).length) return { input: null, fieldErrors: errors };

  if (garment === "mitten") options.thumb = values.thumb;
  if (garment === "pullover") options.style = values.style;
  if (garment === "hat" && HAT_STYLES.includes(values.style)) options.style = values.style;
  if (garment === "pullover" && values.backNeckShortRows) options.backNeckShortRows = true;
  const over = values.gaugeOver === "10cm" ? "Per10cm" : "Per4in";
  const input: SizeGarmentInput = {
    garment,
    ...(values.size ? { size: values.size } : {}),
    ...(Object.keys(measurements).length ? { measurements } : {}),
    ...(values.easeMode === "category" ? { easeCategory: values.easeCategory as SizeGarmentInput["easeCategory"] } : {}),
    ...(easeNum !== undefined ? (values.unit === "cm" ? { easeCm: easeNum } : { easeIn: easeNum }) : {}),
    gauge: { [`stitches${over}`]: stitches, ...(rows !== undefined ? { [`rows${over}`]: rows } : {}) },
    ...(repeatNum !== undefined ? { repeat: repeatNum } : {}),
    ...(yarnCategory !== undefined ? { yarnCategory } : {}),
    ...(Object.keys(options).length ? { options: options as SizeGarmentInput["options"] } : {}),
  };
  return { input, fieldErrors: {} };
}

/** Which form field a core message is about (`measurements.handLengthCm` → `lengths.handLength`). */
export function formFieldOf(coreField: string): string {
  const m = /^(?:measurements|options)\.([a-zA-Z]+?)(?:Cm|In)?$/.exec(coreField);
  if (m && m[1] !== "thumb" && m[1] !== "style") return `lengths.${m[1]}`;
  if (coreField.startsWith("gauge.rows")) return "rows";
  if (coreField.startsWith("gauge")) return "stitches";
  if (/^ease/.test(coreField)) return "ease";
  if (coreField === "options.thumb") return "thumb";
  if (coreField === "options.style") return "style";
  if (coreField === "repeat" || coreField === "size" || coreField === "yarnCategory") return coreField;
  return "form";
}

/** Sizes the form: the core's result, or field errors with the core's own words. */
export function sizeForm(garment: "mittens" | "hat" | "pullover" | GarmentKind, values: SizingFormValues): { result: SizingResult | null; input: SizeGarmentInput | null; fieldErrors: FieldErrors } {
  const { input, fieldErrors } = toSizeInput(garment, values);
  if (!input) return { result: null, input: null, fieldErrors };
  try {
    return { result: sizeGarment(input), input, fieldErrors: {} };
  } catch (e) {
    if (e instanceof SizingError) {
      const raw = e.message.startsWith(`${e.field}: `) ? e.message.slice(e.field.length + 2) : e.message;
      // The core names API fields; the form has a units switch instead.
      const text = raw.replace(/Send it as [a-zA-Z]+In$/, "Switch the units to inches.").replace(/Send it as [a-zA-Z]+Cm$/, "Switch the units to centimetres.");
      return { result: null, input, fieldErrors: { [formFieldOf(e.field)]: [text.charAt(0).toUpperCase() + text.slice(1)] } };
    }
    return { result: null, input, fieldErrors: { form: [(e as Error).message] } };
  }
}

/** Default stranded gauge for fingering-weight colourwork (CYC category 1 range, firm end). */
export const DEFAULT_SIZING_GAUGE = { stitchesPer10cm: 32, rowsPer10cm: 36 };

/** The standard size a brief's size label names ("Woman M" → "woman"), or "" when it names none. */
export function sizeKeyFromLabel(label: string | undefined, sizeKeys: string[]): string {
  const words = (label ?? "").toLowerCase().split(/[^a-z0-9-]+/).filter(Boolean);
  return sizeKeys.find((k) => words.includes(k.toLowerCase())) ?? "";
}

/** A first form for a commission: the brief's size and measurements, the studio's usual gauge. */
export function defaultSizingForm(
  garmentKind: "mittens" | "hat" | "pullover" | GarmentKind,
  brief: { sizeLabel?: string; measurements?: Record<string, number> },
  sizeKeys: string[],
): SizingFormValues {
  const garment = coreGarment(garmentKind);
  const size = sizeKeyFromLabel(brief.sizeLabel, sizeKeys);
  const given = brief.measurements ?? {};
  const inchesOnly = Object.keys(given).length > 0 && Object.keys(given).every((k) => k.endsWith("In"));
  const unit = inchesOnly ? "in" : "cm";
  const lengths: Record<string, string> = {};
  for (const { name } of lengthFields(garment)) {
    const cm = given[`${name}Cm`];
    const inch = given[`${name}In`];
    if (unit === "in" && inch !== undefined) lengths[name] = String(inch);
    else if (cm !== undefined) lengths[name] = String(cm);
    else if (inch !== undefined) lengths[name] = String(Math.round(inch * 25.4) / 10);
  }
  return {
    size,
    unit,
    lengths,
    easeMode: "default",
    easeCategory: "standard",
    ease: "",
    gaugeOver: "10cm",
    stitches: String(DEFAULT_SIZING_GAUGE.stitchesPer10cm),
    rows: String(DEFAULT_SIZING_GAUGE.rowsPer10cm),
    yarnCategory: "1",
    repeat: "",
    thumb: "gusset",
    style: garment === "hat" ? "beanie" : "yoke",
  };
}
