// A gauge against its yarn's weight category, in the unit it was counted in. The Craft Yarn Council's
// Standard Yarn Weight System (edition with category 7, TRADE-REFERENCES.md) publishes one set of numbers
// "per 4 in / 10 cm": category 4 Medium is 16–20 sts. A gauge given per 4 in (or per inch, or over a
// swatch in inches) is compared with 16–20 per 4 in as it stands; converting it to per 10 cm first
// (16 per 4 in = 15.75 per 10 cm) used to warn a gauge at the published bound as "looser than usual".
import { describe, expect, test } from "vitest";
import { sizeGarment } from "@/lib/core/sizing/size-garment";
import { checkGauge } from "@/lib/core/yarn/yarn-weights";

const warnOf = (gauge: Record<string, number | undefined>) =>
  sizeGarment({ garment: "hat", size: "woman", gauge: { ...gauge }, yarnCategory: 4 }).warnings.filter((w) => /usual range/.test(w));

describe("category 4 (16–20 sts per 4 in / 10 cm) at its bounds, in each unit", () => {
  test.each([
    // per 4 in, compared as given
    { gauge: { stitchesPer4in: 16, rowsPer4in: 22 }, warn: null }, // exactly the lower bound
    { gauge: { stitchesPer4in: 15.9, rowsPer4in: 22 }, warn: /15\.9 sts per 4 in is looser .*16–20 sts per 4 in/ },
    { gauge: { stitchesPer4in: 20, rowsPer4in: 28 }, warn: null }, // exactly the upper bound
    { gauge: { stitchesPer4in: 20.1, rowsPer4in: 28 }, warn: /20\.1 sts per 4 in is firmer/ },
    // per inch × 4: 4 per in = 16 per 4 in; 3.95 = 15.8 (under); 5 = 20; 5.05 = 20.2 (over)
    { gauge: { stitchesPerIn: 4, rowsPerIn: 5.5 }, warn: null },
    { gauge: { stitchesPerIn: 3.95, rowsPerIn: 5.5 }, warn: /15\.8 sts per 4 in is looser/ },
    { gauge: { stitchesPerIn: 5, rowsPerIn: 7 }, warn: null },
    { gauge: { stitchesPerIn: 5.05, rowsPerIn: 7 }, warn: /20\.2 sts per 4 in is firmer/ },
    // a swatch in inches: 8 sts over 2 in = 16 per 4 in; 12 over 3 in = 16
    { gauge: { stitches: 8, rows: 11, overIn: 2 }, warn: null },
    { gauge: { stitches: 12, rows: 16, overIn: 3 }, warn: null },
    // per 10 cm and a swatch in cm, compared per 10 cm
    { gauge: { stitchesPer10cm: 16, rowsPer10cm: 22 }, warn: null },
    { gauge: { stitchesPer10cm: 15.99, rowsPer10cm: 22 }, warn: /15\.99 sts per 10 cm is looser/ },
    { gauge: { stitches: 32, rows: 44, overCm: 20 }, warn: null }, // 16 per 10 cm
    { gauge: { stitchesPer10cm: 20.01, rowsPer10cm: 28 }, warn: /20\.01 sts per 10 cm is firmer/ },
  ])("$gauge", ({ gauge, warn }) => {
    const w = warnOf(gauge);
    if (warn === null) expect(w).toEqual([]);
    else expect(w.join(" ")).toMatch(warn);
  });

  test("the per-10-cm check is unchanged for a value converted from per 4 in (16 per 4 in = 15.75 per 10 cm)", () => {
    expect(checkGauge(4, 15.75, "hat", "10cm").direction).toBe("looser");
    expect(checkGauge(4, 16, "hat", "4in").within).toBe(true);
  });
});
