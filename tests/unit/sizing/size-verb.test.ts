import { describe, expect, test } from "vitest";
import { run } from "@/scripts/core-verbs/size";

describe("core verb size", () => {
  test("a measured mitten gives castOn, counts, rows, chart sizes and a recipe", () => {
    const out = run({
      garment: "mitten",
      measurements: { handCircumferenceCm: 19, handLengthCm: 18.5 },
      easeCm: 1.5,
      gauge: { stitchesPer10cm: 30, rowsPer10cm: 34 },
      repeat: 4,
    }) as { castOn: number; charts: { area: string; width: number; height: number }[]; recipe: { metric: string[]; imperial: string[] } };
    // (19 + 1.5) cm × 3 sts/cm = 61.5; back and palm each hold whole 4-st repeats, so the count is a
    // multiple of 8: 61.5 / 8 = 7.69 → 8 → 64 sts (32 on the back, 32 on the palm)
    expect(out.castOn).toBe(64);
    expect(out.charts.map((c) => c.area)).toEqual(["cuff", "back of hand", "palm"]);
    expect(out.recipe.metric[2]).toMatch(/^Cast on 64 sts/);
    expect(JSON.parse(JSON.stringify(out))).toEqual(out);
  });

  test.each([
    [{ garment: "hat", measurements: { headCircumferenceCm: 22 }, gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 } }, /did you mean 22 in = 55\.9 cm\?/],
    [{ garment: "hat", measurements: { headCircumferenceCm: 56 }, gauge: { stitchesPer10cm: 0, rowsPer10cm: 30 } }, /gauge\.stitchesPer10cm: must be more than 0/],
    [{ garment: "hat", measurements: { headCircumferenceCm: 56 } }, /gauge is missing/],
    [{ garment: "hat", measurements: { headCircumferenceCm: 56 }, gauge: { stitchesPer10cm: 22 }, colour: "red" }, /Unrecognized key|unknown field/],
    ["hat", /size input/],
  ])("bad input %# → a message naming the field", (input, message) => {
    expect(() => run(input)).toThrow(message);
  });
});
