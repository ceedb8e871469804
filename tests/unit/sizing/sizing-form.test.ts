import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getSizeKeys, sizeGarment } from "@/lib/core/sizing";
import { defaultSizingForm, formFieldOf, sizeForm, toSizeInput, type SizingFormValues } from "@/lib/schemas/sizing";

const hat = (over: Partial<SizingFormValues> = {}): SizingFormValues => ({ ...defaultSizingForm("hat", {}, []), ...over });
const mittens = (over: Partial<SizingFormValues> = {}): SizingFormValues => ({ ...defaultSizingForm("mittens", {}, []), ...over });

describe("a first form from the brief", () => {
  test.each<{ brief: { sizeLabel?: string; measurements?: Record<string, number> }; size: string; unit: string; lengths: Record<string, string> }>([
    { brief: { sizeLabel: "Woman M" }, size: "woman", unit: "cm", lengths: {} },
    { brief: { measurements: { handCircumferenceCm: 19, handLengthCm: 18 } }, size: "", unit: "cm", lengths: { handCircumference: "19", handLength: "18" } },
    { brief: { measurements: { handCircumferenceIn: 7.5 } }, size: "", unit: "in", lengths: { handCircumference: "7.5" } },
    { brief: { sizeLabel: "a man's pair", measurements: { handCircumferenceCm: 21, handLengthIn: 7.5 } }, size: "man", unit: "cm", lengths: { handCircumference: "21", handLength: "19.1" } },
  ])("$brief → size '$size', $unit", ({ brief, size, unit, lengths }) => {
    const f = defaultSizingForm("mittens", brief, getSizeKeys("mitten"));
    expect(f).toMatchObject({ size, unit, lengths, stitches: "32", rows: "36", gaugeOver: "10cm", easeMode: "default" });
  });
});

describe("bad input gets a message on its own field, and no input for the core", () => {
  test.each([
    { why: "a required measurement left empty with no size", values: hat(), field: "lengths.headCircumference", text: /Measure this, or pick a standard size/ },
    { why: "a word in a number field", values: hat({ lengths: { headCircumference: "big" } }), field: "lengths.headCircumference", text: /Enter a number/ },
    { why: "no stitch count", values: hat({ size: "woman", stitches: " " }), field: "stitches", text: /Count the stitches/ },
    { why: "a repeat that is not whole", values: hat({ size: "woman", repeat: "2.5" }), field: "repeat", text: /whole number/ },
    { why: "an ease amount chosen but not typed", values: hat({ size: "woman", easeMode: "value", ease: "" }), field: "ease", text: /Enter the ease/ },
  ])("$why", ({ values, field, text }) => {
    const { input, fieldErrors } = toSizeInput("hat", values);
    expect(input).toBeNull();
    expect(fieldErrors[field]?.join(" ")).toMatch(text);
  });

  // The core's range checks, put back on the form's fields in the form's words.
  test.each([
    { why: "an inch value in a cm field is caught and the inches suggested", values: hat({ lengths: { headCircumference: "22" } }), field: "lengths.headCircumference", text: /did you mean 22 in = 55\.9 cm\? Switch the units to inches\./ },
    { why: "a 3 m head", values: hat({ lengths: { headCircumference: "300" } }), field: "lengths.headCircumference", text: /too large/ },
    { why: "a gauge of zero", values: hat({ size: "woman", stitches: "0" }), field: "stitches", text: /more than 0/ },
    { why: "a repeat wider than the piece", values: hat({ size: "woman", repeat: "300" }), field: "repeat", text: /wider than the hat/ },
    { why: "a hat too short for its brim and crown", values: hat({ size: "woman", lengths: { hatHeight: "9" } }), field: "lengths.hatHeight", text: /too short/ },
  ])("$why", ({ values, field, text }) => {
    const { result, fieldErrors } = sizeForm("hat", values);
    expect(result).toBeNull();
    expect(fieldErrors[field]?.join(" ")).toMatch(text);
  });
});

describe("a good form sizes exactly as the core does", () => {
  test("hat: a 56 cm head, the usual ease, an 8-st repeat", () => {
    const { result, input } = sizeForm("hat", hat({ lengths: { headCircumference: "56" }, repeat: "8" }));
    expect(input).toMatchObject({ garment: "hat", measurements: { headCircumferenceCm: 56 }, gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 }, repeat: 8, yarnCategory: 1 });
    expect(result?.castOn).toBe(sizeGarment({ garment: "hat", measurements: { headCircumferenceCm: 56 }, gauge: { stitchesPer10cm: 32, rowsPer10cm: 36 }, repeat: 8 }).castOn);
    expect(result!.castOn % 8).toBe(0);
  });

  test("mittens in inches, per 4 in, an afterthought thumb and a measured ease", () => {
    const values = mittens({ unit: "in", lengths: { handCircumference: "7.5", handLength: "7", cuffLength: "2.5" }, gaugeOver: "4in", stitches: "32", rows: "36", easeMode: "value", ease: "0.5", thumb: "afterthought" });
    const { input, result } = sizeForm("mittens", values);
    expect(input).toEqual({
      garment: "mitten",
      measurements: { handCircumferenceIn: 7.5, handLengthIn: 7 },
      easeIn: 0.5,
      gauge: { stitchesPer4in: 32, rowsPer4in: 36 },
      yarnCategory: 1,
      options: { cuffLengthIn: 2.5, thumb: "afterthought" },
    });
    expect(result?.castOn).toBe(sizeGarment(input).castOn);
  });

  test("a hat's style goes to the core; a hat form saved before hat styles (style yoke) is a beanie", () => {
    expect(toSizeInput("hat", hat({ size: "woman", style: "folded-brim" })).input?.options).toEqual({ style: "folded-brim" });
    expect(toSizeInput("hat", hat({ size: "woman" })).input?.options).toEqual({ style: "beanie" });
    expect(toSizeInput("hat", hat({ size: "woman", style: "yoke" })).input?.options).toBeUndefined();
    const { result } = sizeForm("hat", hat({ size: "woman", style: "tall" }));
    expect(result?.style).toBe("tall");
  });

  test("a pullover's back-neck short rows go to the core only when ticked", () => {
    const pullover = (over: Partial<SizingFormValues>) => ({ ...defaultSizingForm("pullover", {}, []), size: "women-M", ...over });
    expect(toSizeInput("pullover", pullover({ backNeckShortRows: true })).input?.options).toEqual({ style: "yoke", backNeckShortRows: true });
    expect(toSizeInput("pullover", pullover({ backNeckShortRows: false })).input?.options).toEqual({ style: "yoke" });
    expect(sizeForm("pullover", pullover({ backNeckShortRows: true })).result?.rows.backNeckShortRows).toBeGreaterThan(0);
  });

  test("a decimal comma is read as a point", () => {
    expect(toSizeInput("hat", hat({ lengths: { headCircumference: "55,5" } })).input?.measurements).toEqual({ headCircumferenceCm: 55.5 });
  });
});

test("every field the core names lands on a field of the form", () => {
  const cases: [string, string][] = [
    ["measurements.handCircumferenceCm", "lengths.handCircumference"],
    ["measurements.chestIn", "lengths.chest"],
    ["options.hatHeightCm", "lengths.hatHeight"],
    ["options.thumb", "thumb"],
    ["options.style", "style"],
    ["gauge.stitchesPer10cm", "stitches"],
    ["gauge.rowsPer4in", "rows"],
    ["gauge", "stitches"],
    ["easeCm", "ease"],
    ["easeCategory", "ease"],
    ["repeat", "repeat"],
    ["size", "size"],
  ];
  for (const [core, form] of cases) expect(formFieldOf(core)).toBe(form);
});

test("property: whatever is typed in a length field, the form never throws and any failure names a field", () => {
  fc.assert(
    fc.property(fc.string({ maxLength: 8 }), fc.string({ maxLength: 6 }), fc.string({ maxLength: 4 }), (head, stitches, repeat) => {
      const out = sizeForm("hat", hat({ lengths: { headCircumference: head }, stitches, repeat }));
      if (!out.result) expect(Object.keys(out.fieldErrors).length).toBeGreaterThan(0);
    }),
  );
});

// A hat's count also closes the rib and divides into crown sectors, so neighbouring choices can be one
// multiple of lcm(8, repeat) apart (a count that is a multiple of 8 and of the repeat costs nothing):
// with a 4-st repeat, 8 sts.
test("property: a head measured in cm or the same head in inches (to 0.01 in) casts on within lcm(8, repeat) sts", () => {
  fc.assert(
    fc.property(fc.integer({ min: 460, max: 620 }), (mm) => {
      const cm = sizeForm("hat", hat({ lengths: { headCircumference: String(mm / 10) }, repeat: "4" })).result!;
      const inches = sizeForm("hat", hat({ unit: "in", lengths: { headCircumference: String(Math.round((mm / 25.4) * 100) / 100) }, repeat: "4" })).result!;
      expect(Math.abs(cm.castOn - inches.castOn)).toBeLessThanOrEqual(8);
    }),
  );
});

test("a core field the form has no place for is shown on the form as a whole", () => {
  expect(formFieldOf("something.else")).toBe("form");
});

test("the saved form's shape is bounded: unknown fields and a flood of lengths are refused", async () => {
  const { sizingFormSchema } = await import("@/lib/schemas/sizing");
  expect(sizingFormSchema.safeParse(hat()).success).toBe(true);
  // a form saved before hat styles and short rows still reads
  expect(sizingFormSchema.safeParse({ ...hat(), style: "yoke" }).success).toBe(true);
  expect(sizingFormSchema.safeParse({ ...hat(), style: "bobble" }).success).toBe(false);
  expect(sizingFormSchema.safeParse({ ...hat(), extra: 1 }).success).toBe(false);
  const flood = Object.fromEntries(Array.from({ length: 21 }, (_, i) => [`x${i}`, "1"]));
  expect(sizingFormSchema.safeParse(hat({ lengths: flood })).success).toBe(false);
});
