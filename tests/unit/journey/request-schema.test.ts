import { describe, expect, test } from "vitest";
import { emptyRequest, readRequestMeasurement, requestDraftSchema, requestSchema } from "@/lib/schemas/request";

describe("readRequestMeasurement", () => {
  test.each([
    { name: "handCircumference", raw: "19", units: "cm", cm: 19 },
    { name: "handCircumference", raw: "7.5", units: "in", cm: 19.1 },
    { name: "headCircumference", raw: "56,5", units: "cm", cm: 56.5 },
    { name: "chest", raw: "38", units: "in", cm: 96.5 },
  ] as const)("$raw $units of $name → $cm cm", ({ name, raw, units, cm }) => {
    expect(readRequestMeasurement(name, raw, units)).toEqual({ cm });
  });

  test.each([
    { name: "headCircumference", raw: "22", units: "cm", hint: /looks like inches/ },
    { name: "chest", raw: "96", units: "in", hint: /looks like centimetres/ },
    { name: "headCircumference", raw: "560", units: "cm", hint: /looks like millimetres: enter 56 cm/ },
    { name: "headCircumference", raw: "abc", units: "cm", hint: /Enter a number of centimetres/ },
  ] as const)("$raw $units of $name is refused with a hint", ({ name, raw, units, hint }) => {
    const r = readRequestMeasurement(name, raw, units);
    expect("error" in r && r.error).toMatch(hint);
  });
});

describe("requestSchema", () => {
  test("needs a size or a measurement, and reads measurements into cm", () => {
    expect(requestSchema.safeParse({ ...emptyRequest("hat") }).success).toBe(false);
    const ok = requestSchema.parse({ ...emptyRequest("hat"), units: "in", measurements: { headCircumference: "22" } });
    expect(ok.measurementsCm).toEqual({ headCircumferenceCm: 55.9 });
    // Measurements of another garment are ignored, not stored.
    const other = requestSchema.parse({ ...emptyRequest("hat"), sizeLabel: "M", measurements: { chest: "90" } });
    expect(other.measurementsCm).toEqual({});
  });

  test("refuses a past date, an unknown motif, odd lettering and more than 6 photos", () => {
    const r = requestSchema.safeParse({
      ...emptyRequest("mittens"),
      sizeLabel: "M",
      neededBy: "2020-01-01",
      motifIds: ["dragon"],
      lettering: "<b>",
      uploadIds: Array.from({ length: 7 }, (_, i) => `00000000-0000-4000-8000-00000000000${i}`),
    });
    expect(r.success).toBe(false);
    const paths = r.error!.issues.map((i) => i.path.join("."));
    expect(paths).toEqual(expect.arrayContaining(["neededBy", "motifIds", "lettering", "uploadIds"]));
  });

  test("a draft may be half-filled but not oversized", () => {
    expect(requestDraftSchema.safeParse({ lettering: "AB" }).success).toBe(true);
    expect(requestDraftSchema.safeParse({ notes: "x".repeat(2001) }).success).toBe(false);
  });
});
