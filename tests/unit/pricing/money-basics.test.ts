import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { assertCurrency, getMinorDigits, isCurrencyCode } from "@/lib/core/pricing/currency";
import { parseExactDecimal, percentToPpm } from "@/lib/core/pricing/decimal";
import { formatMoney, minorToDecimalString } from "@/lib/core/pricing/format-money";
import { divideRounded } from "@/lib/core/pricing/rounding";

describe("currencies", () => {
  // Minor-unit digits as listed in ISO 4217 (pound 2, yen 0, Kuwaiti and Bahraini dinar 3).
  test.each([
    ["GBP", 2],
    ["EUR", 2],
    ["USD", 2],
    ["JPY", 0],
    ["KRW", 0],
    ["KWD", 3],
    ["BHD", 3],
  ])("%s has %i minor digits", (code, digits) => {
    expect(getMinorDigits(code)).toBe(digits);
  });

  test.each(["XYZ", "ABC", "gbp", "GB", "POUND", ""])("%j is not accepted as a currency", (code) => {
    expect(isCurrencyCode(code)).toBe(false);
    expect(() => assertCurrency(code)).toThrow(/is not an ISO 4217 currency code/);
  });
});

describe("divideRounded (half away from zero)", () => {
  test.each([
    [5n, 2n, 3n], // 2.5 → 3
    [-5n, 2n, -3n], // −2.5 → −3 (symmetric)
    [7n, 2n, 4n],
    [1n, 3n, 0n],
    [2n, 3n, 1n],
    [-2n, 3n, -1n],
    [1137_5n, 10n, 1138n], // 1137.5 → 1138
    [0n, 7n, 0n],
  ])("%i / %i → %i", (n, d, q) => {
    expect(divideRounded(n, d)).toBe(q);
  });

  test("property: off by at most half a unit, ties away from zero, symmetric", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(10n ** 15n), max: 10n ** 15n }), fc.bigInt({ min: 1n, max: 10n ** 9n }), (n, d) => {
        const q = divideRounded(n, d);
        const twiceError = 2n * (q * d - n);
        expect(twiceError <= d && twiceError >= -d).toBe(true);
        if (twiceError === d || twiceError === -d) expect(q < 0n ? -q : q).toBeGreaterThan((n < 0n ? -n : n) / d);
        expect(divideRounded(-n, d)).toBe(-q);
      }),
    );
  });
});

describe("exact decimals", () => {
  test.each([
    [20, 200_000n],
    [17.5, 175_000n],
    [8.875, 88_750n],
    ["12.3456", 123_456n],
    [0, 0n],
    [100, 1_000_000n],
    ["1e1", 100_000n],
  ])("%j %% → %i ppm", (percent, ppm) => {
    expect(percentToPpm(percent, "rate")).toBe(ppm);
  });

  test.each([
    [120, /rate must be between 0 and 100 \(got 120\)/],
    [-1, /rate must be between 0 and 100/],
    [0.00001, /at most 4 decimal places/],
    ["ten", /must be a decimal number/],
    [0.1 + 0.2, /at most 4 decimal places/], // a float that came from arithmetic is refused, not guessed at
  ])("%j is refused", (percent, message) => {
    expect(() => percentToPpm(percent, "rate")).toThrow(message);
  });

  test("quantities keep their exact decimal value", () => {
    expect(parseExactDecimal(2.5, "q", 3)).toEqual({ units: 25n, scale: 1 });
    expect(parseExactDecimal("0.125", "q", 3)).toEqual({ units: 125n, scale: 3 });
    expect(parseExactDecimal("3.000", "q", 3)).toEqual({ units: 3n, scale: 0 });
  });
});

describe("formatMoney", () => {
  const plain = (s: string) => s.replace(/\u00a0/g, " ");
  // Expected strings follow the CLDR locale data shipped with Node's ICU.
  test.each([
    [12345, "GBP", "en-GB", "£123.45"],
    [-2985, "GBP", "en-GB", "-£29.85"],
    [5, "GBP", "en-GB", "£0.05"],
    [16387, "JPY", "en-GB", "JP¥16,387"],
    [20605, "KWD", "en-GB", "KWD 20.605"],
    [123456789, "EUR", "de-DE", "1.234.567,89 €"],
  ])("%i %s in %s → %s", (minor, currency, locale, shown) => {
    expect(plain(formatMoney(minor, currency, locale))).toBe(shown);
  });

  test("the largest safe amount keeps every digit (no float conversion)", () => {
    expect(minorToDecimalString(Number.MAX_SAFE_INTEGER, "GBP")).toBe("90071992547409.91");
    expect(formatMoney(Number.MAX_SAFE_INTEGER, "GBP", "en-GB")).toBe("£90,071,992,547,409.91");
  });

  test("changes show their sign", () => {
    expect(formatMoney(1120, "GBP", "en-GB", { signDisplay: "exceptZero" })).toBe("+£11.20");
    expect(formatMoney(0, "GBP", "en-GB", { signDisplay: "exceptZero" })).toBe("£0.00");
  });

  test("property: the decimal text reads back to the same minor units", () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.constantFrom("GBP", "JPY", "KWD"), (minor, currency) => {
        const d = parseExactDecimal(minorToDecimalString(minor, currency), "x", 3);
        expect(d.units * 10n ** BigInt(getMinorDigits(currency) - d.scale)).toBe(BigInt(minor));
      }),
    );
  });
});
