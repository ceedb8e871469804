// The commission request form: one schema for the browser form and the server.
// Measurements are typed in cm or inches; the output holds centimetres, checked against the human
// ranges of lib/core/sizing (with a hint when the number fits the other unit).
import { z } from "zod";
import { isCalendarDate, safeString } from "./common";
import { MOTIFS } from "@/lib/core/chart/motifs";
import { MEASUREMENT_SPECS, type MeasurementName } from "@/lib/core/sizing/measurements";
import { CM_PER_IN, inToCm, roundTo } from "@/lib/core/sizing/units";

export const GARMENTS = ["mittens", "hat", "pullover"] as const;
export const WEARERS = ["adult", "teen", "child", "baby"] as const;
export const MAX_REFERENCE_PHOTOS = 6;
export const MAX_REQUEST_NOTES = 2000;

/** The measurements asked for each garment (names from lib/core/sizing). */
export const REQUEST_MEASUREMENTS: Record<(typeof GARMENTS)[number], readonly MeasurementName[]> = {
  mittens: ["handCircumference", "handLength"],
  hat: ["headCircumference"],
  pullover: ["chest", "bodyLength", "sleeveLength"],
};

export const MEASUREMENT_LABELS: Partial<Record<MeasurementName, string>> = {
  handCircumference: "Hand around the knuckles",
  handLength: "Hand length, wrist to fingertip",
  headCircumference: "Head around the forehead",
  chest: "Chest or bust, fullest part",
  bodyLength: "Body length, underarm to hem",
  sleeveLength: "Sleeve length, underarm to cuff",
};

const MOTIF_IDS = new Set(MOTIFS.map((m) => m.id));
const today = () => new Date().toISOString().slice(0, 10);

function fmt(n: number): string {
  return String(roundTo(n, 0.1));
}

/** Reads one typed measurement; returns centimetres or a message a person can act on. */
export function readRequestMeasurement(name: MeasurementName, raw: string, units: "cm" | "in"): { cm: number } | { error: string } {
  const text = raw.trim().replace(",", ".");
  if (!/^\d{1,3}(\.\d{1,2})?$/.test(text)) return { error: `Enter a number of ${units === "cm" ? "centimetres" : "inches"}, like ${units === "cm" ? "21.5" : "8.5"}.` };
  const value = Number(text);
  const spec = MEASUREMENT_SPECS[name];
  const cm = units === "cm" ? value : inToCm(value);
  if (cm >= spec.minCm && cm <= spec.maxCm) return { cm: roundTo(cm, 0.1) };
  const range =
    units === "cm"
      ? `${fmt(spec.minCm)}–${fmt(spec.maxCm)} cm`
      : `${fmt(spec.minCm / CM_PER_IN)}–${fmt(spec.maxCm / CM_PER_IN)} in`;
  let hint = "";
  if (units === "cm" && value * CM_PER_IN >= spec.minCm && value * CM_PER_IN <= spec.maxCm) {
    hint = " That looks like inches: switch the units to inches above.";
  } else if (units === "cm" && value / 10 >= spec.minCm && value / 10 <= spec.maxCm) {
    hint = ` That looks like millimetres: enter ${fmt(value / 10)} cm.`;
  } else if (units === "in" && value >= spec.minCm && value <= spec.maxCm) {
    hint = " That looks like centimetres: switch the units to centimetres above.";
  }
  return { error: `A ${spec.noun} usually measures ${range} (${spec.how}).${hint}` };
}

const text = (max: number, what: string) => safeString().trim().max(max, `Keep the ${what} to ${max} characters or fewer.`);

/** The raw form values (all strings and lists), as the browser keeps them; also the draft's shape. */
export const requestFields = z.object({
  garment: z.enum(GARMENTS, { error: "Choose what you would like knitted." }),
  wearer: z.enum(WEARERS, { error: "Tell us who it is for." }),
  units: z.enum(["cm", "in"]),
  sizeLabel: text(60, "size"),
  measurements: z.record(safeString().max(60), safeString().max(12)).refine((m) => Object.keys(m).length <= 12, "Too many measurements."),
  yarnIds: z.array(z.string().uuid()).max(8, "Choose at most 8 colours."),
  colourNotes: text(300, "colour wishes"),
  lettering: text(24, "initials or name").regex(/^[\p{L}\p{N} .·&'-]*$/u, "Use letters, numbers, spaces and . · & ' - only."),
  motifIds: z.array(z.string().max(60)).max(4, "Choose at most 4 motifs.").refine((ids) => ids.every((id) => MOTIF_IDS.has(id)), "Choose motifs from the list."),
  neededBy: safeString()
    .trim()
    .refine((v) => v === "" || isCalendarDate(v), "Enter a date that exists (like 2027-01-31), or leave it empty.")
    .refine((v) => v === "" || v > today(), "Choose a date after today."),
  budget: safeString()
    .trim()
    .refine((v) => v === "" || /^\d{1,7}([.]\d{1,2})?$/.test(v.replace(/,/g, "")), "Enter an amount like 120 or 120.50, or leave it empty."),
  notes: text(MAX_REQUEST_NOTES, "notes"),
  uploadIds: z.array(z.string().uuid()).max(MAX_REFERENCE_PHOTOS, `Add at most ${MAX_REFERENCE_PHOTOS} photos.`),
});

export type RequestFormValues = z.input<typeof requestFields>;

export const emptyRequest = (garment: (typeof GARMENTS)[number] = "mittens"): RequestFormValues => ({
  garment,
  wearer: "adult",
  units: "cm",
  sizeLabel: "",
  measurements: {},
  yarnIds: [],
  colourNotes: "",
  lettering: "",
  motifIds: [],
  neededBy: "",
  budget: "",
  notes: "",
  uploadIds: [],
});

/** The full check: the fields above plus size-or-measurements, with measurements read into cm. */
export const requestSchema = requestFields.transform((v, ctx) => {
  const measurementsCm: Record<string, number> = {};
  let bad = false;
  for (const name of REQUEST_MEASUREMENTS[v.garment]) {
    const raw = v.measurements[name] ?? "";
    if (!raw.trim()) continue;
    const r = readRequestMeasurement(name, raw, v.units);
    if ("error" in r) {
      bad = true;
      ctx.addIssue({ code: "custom", path: ["measurements", name], message: r.error });
    } else measurementsCm[`${name}Cm`] = r.cm;
  }
  if (!v.sizeLabel && Object.keys(measurementsCm).length === 0 && !bad) {
    ctx.addIssue({ code: "custom", path: ["sizeLabel"], message: "Give a size (such as Woman M) or at least one measurement." });
  }
  return { ...v, measurementsCm, budget: v.budget.replace(/,/g, "") };
});

export type RequestInput = z.output<typeof requestSchema>;

/** What a saved draft may hold: the same fields, each optional, so a half-filled form is kept. */
export const requestDraftSchema = requestFields.partial().extend({
  /** the visitor pressed "send" and is now creating an account */
  submitted: z.boolean().optional(),
});
export type RequestDraft = z.output<typeof requestDraftSchema>;

export type DraftFieldErrors = Record<string, string[]>;

/**
 * Reads a draft field by field: each field is checked on its own, so one invalid field never stops
 * the rest from being kept. Returns the valid fields and, for each invalid one, its message (by the
 * form's field name, like "lettering" or "measurements.handLength"). Unknown keys are dropped.
 */
export function parseDraftLeniently(data: unknown): { data: RequestDraft; invalid: DraftFieldErrors } {
  const out: Record<string, unknown> = {};
  const invalid: DraftFieldErrors = {};
  if (data === null || typeof data !== "object" || Array.isArray(data)) return { data: {}, invalid: {} };
  const shape = requestDraftSchema.shape;
  for (const [key, value] of Object.entries(data as Record<string, unknown>)) {
    if (!Object.hasOwn(shape, key) || value === undefined) continue;
    if (key === "measurements" && value !== null && typeof value === "object" && !Array.isArray(value)) {
      // Each measurement on its own too: a mistyped hand length keeps the hand circumference.
      const kept: Record<string, string> = {};
      for (const [name, raw] of Object.entries(value as Record<string, unknown>).slice(0, 12)) {
        const one = safeString().max(12, "Keep a measurement to 12 characters or fewer.").safeParse(raw);
        if (one.success && name.length <= 60) kept[name] = one.data;
        else (invalid[`measurements.${name.slice(0, 60)}`] ??= []).push(one.success ? "Check this measurement." : one.error.issues[0]!.message);
      }
      out.measurements = kept;
      continue;
    }
    const r = shape[key as keyof typeof shape].safeParse(value);
    if (r.success) {
      out[key] = r.data;
    } else {
      for (const issue of r.error.issues) {
        const path = [key, ...issue.path.map(String)].join(".");
        (invalid[path] ??= []).push(issue.message);
      }
    }
  }
  return { data: out as RequestDraft, invalid };
}
