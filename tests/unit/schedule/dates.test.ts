// Calendar arithmetic on YYYY-MM-DD strings.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { addDays, dayNumber, daysBetween, isIsoDate, isoDate, weekStart, weekdayOf } from "@/lib/core/schedule";

describe("dates", () => {
  test.each([
    // 1970-01-01 is day 0 of the Unix epoch (common practice); it was a Thursday.
    ["1970-01-01", 0, "thu"],
    ["1969-12-31", -1, "wed"],
    ["2000-02-29", 11016, "tue"],
    // 2026-03-02 is a Monday (the platform-calendar property below checks every such day).
    ["2026-03-02", 20514, "mon"],
    ["2026-03-08", 20520, "sun"],
  ] as const)("%s is day %i, a %s", (iso, n, wd) => {
    expect(dayNumber(iso)).toBe(n);
    expect(isoDate(n)).toBe(iso);
    expect(weekdayOf(n)).toBe(wd);
  });

  test.each(["2026-02-29", "2025-13-01", "2026-04-31", "2026-3-1", "20260301", "", "2100-02-29"])(
    "%j is not a date",
    (s) => {
      expect(isIsoDate(s)).toBe(false);
      expect(() => dayNumber(s)).toThrow(/YYYY-MM-DD/);
    },
  );

  test.each([
    ["2024-02-29", true], // 2024 is a leap year (divisible by 4)
    ["2000-02-29", true], // divisible by 400
    ["1900-02-29", false], // divisible by 100, not 400
  ] as const)("leap days: %s → %s", (s, ok) => {
    expect(isIsoDate(s)).toBe(ok);
  });

  test("adding and subtracting across months, years and leap days", () => {
    expect(addDays("2026-02-28", 1)).toBe("2026-03-01");
    expect(addDays("2024-02-28", 1)).toBe("2024-02-29");
    expect(addDays("2025-12-31", 1)).toBe("2026-01-01");
    expect(addDays("2026-03-01", -1)).toBe("2026-02-28");
    expect(daysBetween("2026-03-02", "2026-03-12")).toBe(10);
  });

  test("property: day numbers and dates round-trip, and weeks start on a Monday", () => {
    fc.assert(
      fc.property(fc.integer({ min: -200_000, max: 800_000 }), (n) => {
        const iso = isoDate(n);
        expect(isIsoDate(iso)).toBe(true);
        expect(dayNumber(iso)).toBe(n);
        expect(weekdayOf(weekStart(n))).toBe("mon");
        expect(n - weekStart(n)).toBeGreaterThanOrEqual(0);
        expect(n - weekStart(n)).toBeLessThan(7);
      }),
    );
  });

  test("property: agrees with the platform's UTC calendar", () => {
    fc.assert(
      fc.property(fc.integer({ min: -100_000, max: 100_000 }), (n) => {
        expect(isoDate(n)).toBe(new Date(n * 86_400_000).toISOString().slice(0, 10));
      }),
    );
  });
});
