import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { assertCurrency, getCurrencyName, getMinorDigits, ISO4217_EDITION, isCurrencyCode, storedDigitsProblem } from "@/lib/core/pricing/currency";
import { decimalStringToMinor, formatMoney, minorToDecimalString } from "@/lib/core/pricing/format-money";
import { ISO4217 } from "@/lib/core/pricing/iso4217";
import { PROVIDER_CURRENCIES, PROVIDER_THREE_DECIMAL, PROVIDER_ZERO_DECIMAL } from "@/lib/core/pricing/provider-currency";

// Minor-unit digits as published in ISO 4217 List One (SIX, "list-one.xml", Pblshd="2024-06-25"),
// for every currency the card-payment provider takes (its presentment list on docs.stripe.com/currencies,
// from memory: see provider-currency.ts). Written out here, apart from the table, so a wrong row fails.
const PUBLISHED_FOR_PROVIDER_CURRENCIES: Record<number, string> = {
  0: "BIF CLP DJF GNF ISK JPY KMF KRW PYG RWF UGX VND VUV XAF XOF XPF",
  2:
    "AED AFN ALL AMD ANG AOA ARS AUD AWG AZN BAM BBD BDT BGN BMD BND BOB BRL BSD BWP BYN BZD CAD CDF CHF CNY COP CRC CVE CZK " +
    "DKK DOP DZD EGP ETB EUR FJD FKP GBP GEL GIP GMD GTQ GYD HKD HNL HTG HUF IDR ILS INR JMD KES KGS KHR KYD KZT LAK LBP LKR " +
    "LRD LSL MAD MDL MGA MKD MMK MNT MOP MUR MVR MWK MXN MYR MZN NAD NGN NIO NOK NPR NZD PAB PEN PGK PHP PKR PLN QAR RON RSD " +
    "RUB SAR SBD SCR SEK SGD SHP SLE SOS SRD SZL THB TJS TOP TRY TTD TWD TZS UAH USD UYU UZS WST XCD YER ZAR ZMW",
  3: "BHD JOD KWD OMR TND",
};
const published = Object.entries(PUBLISHED_FOR_PROVIDER_CURRENCIES).flatMap(([d, codes]) => codes.split(" ").map((c) => [c, Number(d)] as const));

describe("ISO 4217 table (List One, pinned edition)", () => {
  test("names its edition", () => {
    expect(ISO4217_EDITION).toBe("ISO 4217 List One, SIX, published 2024-06-25");
  });

  test("every currency the provider takes is in the table with the published digits", () => {
    expect(published.map(([c]) => c).sort()).toEqual([...PROVIDER_CURRENCIES].sort());
    for (const [code, digits] of published) expect({ code, digits: getMinorDigits(code) }).toEqual({ code, digits });
  });

  test("the provider's zero- and three-decimal lists agree with ISO 4217 except where documented (MGA, ISK)", () => {
    // MGA: 2 digits in ISO 4217, zero-decimal for the provider; ISK: 0 in ISO 4217, two-decimal (×100) there.
    expect(PROVIDER_ZERO_DECIMAL.filter((c) => getMinorDigits(c) !== 0)).toEqual(["MGA"]);
    expect(PROVIDER_THREE_DECIMAL.filter((c) => getMinorDigits(c) !== 3)).toEqual([]);
  });

  // The runtime's locale data says 0 for these on Node 20; ISO 4217 says otherwise.
  test.each([
    ["HUF", 2], ["IDR", 2], ["COP", 2], ["PKR", 2], ["IQD", 3], ["ALL", 2], ["AFN", 2], ["LAK", 2], ["LBP", 2], ["MMK", 2], ["SOS", 2], ["YER", 2],
    ["JPY", 0], ["KRW", 0], ["ISK", 0], ["CLP", 0], ["XOF", 0],
    ["KWD", 3], ["BHD", 3], ["JOD", 3], ["OMR", 3], ["TND", 3], ["LYD", 3],
    ["CLF", 4], ["UYW", 4], ["GBP", 2], ["EUR", 2],
  ])("%s has %i minor digits", (code, digits) => {
    expect(getMinorDigits(code)).toBe(digits);
  });

  test("the table does not follow the runtime's locale data", () => {
    const intl = new Intl.NumberFormat("en", { style: "currency", currency: "HUF" }).resolvedOptions().maximumFractionDigits;
    expect(getMinorDigits("HUF")).toBe(2);
    // whatever the runtime says (0 on Node 20), formatting uses the table's 2 digits
    expect(formatMoney(3_000_000, "HUF").replace(/\s/g, " ")).toBe("HUF 30,000.00");
    expect(typeof intl).toBe("number");
  });

  test("shape: unique upper-case codes, digits 0/2/3/4, names; N.A. codes left out", () => {
    expect(ISO4217.size).toBe(166);
    for (const [code, e] of ISO4217) {
      expect(code).toMatch(/^[A-Z]{3}$/);
      expect([0, 2, 3, 4]).toContain(e.minorDigits);
      expect(e.name.length).toBeGreaterThan(1);
    }
    for (const code of ["XDR", "XUA", "XSU", "XTS", "XXX", "XAU", "XAG", "XPD", "XPT", "XBA"]) expect(isCurrencyCode(code)).toBe(false);
    expect(getCurrencyName("HUF")).toBe("Forint");
    expect(ISO4217.get("CLF")!.fund).toBe(true);
    expect(ISO4217.get("CLP")!.fund).toBe(false);
  });

  test.each(["XYZ", "huf", "HU", "", "ZWL", "HRK", "SLL"])("%j is refused with a clear message", (code) => {
    expect(isCurrencyCode(code)).toBe(false);
    expect(() => assertCurrency(code)).toThrow(/is not an ISO 4217 currency code known here/);
    expect(() => getMinorDigits(code)).toThrow(/is not an ISO 4217 currency code/);
  });

  test("stored digits are checked against the table", () => {
    expect(storedDigitsProblem("HUF", 2)).toBeNull();
    expect(storedDigitsProblem("HUF", 0)).toMatch(/^this amount was stored with 0 decimal places but HUF has 2/);
    expect(storedDigitsProblem("KWD", 2)).toMatch(/stored with 2 decimal places but KWD has 3/);
    expect(storedDigitsProblem("XYZ", 2)).toMatch(/not an ISO 4217 currency code/);
  });
});

const codes = [...ISO4217.keys()];

describe("every amount round-trips through its exponent (property)", () => {
  test("minor → decimal text → minor, for every currency in the table", () => {
    fc.assert(
      fc.property(fc.constantFrom(...codes), fc.integer({ min: -1e12, max: 1e12 }), (currency, minor) => {
        const text = minorToDecimalString(minor, currency);
        const digits = getMinorDigits(currency);
        expect(text.split(".")[1]?.length ?? 0).toBe(digits);
        expect(decimalStringToMinor(text, currency)).toBe(minor);
      }),
      { numRuns: 3000 },
    );
  });

  test("format → parse gives the amount back, with exactly the table's digits shown", () => {
    fc.assert(
      fc.property(fc.constantFrom(...codes), fc.integer({ min: -1e10, max: 1e10 }), (currency, minor) => {
        const shown = formatMoney(minor, currency, "en-GB");
        const digits = getMinorDigits(currency);
        const number = shown.replace(/[^\d.-]/g, "").replace(/^(-?)\.?/, "$1");
        expect(number.split(".")[1]?.length ?? 0).toBe(digits);
        expect(decimalStringToMinor(number, currency)).toBe(minor);
      }),
      { numRuns: 2000 },
    );
  });

  test("text with more decimals than the currency has is refused, not rounded", () => {
    expect(decimalStringToMinor("12.345", "GBP")).toBeNull();
    expect(decimalStringToMinor("12.5", "JPY")).toBeNull();
    expect(decimalStringToMinor("12.345", "KWD")).toBe(12345);
    expect(decimalStringToMinor("300.00", "HUF")).toBe(30000);
  });
});
