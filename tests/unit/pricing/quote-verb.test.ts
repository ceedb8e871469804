import { describe, expect, test } from "vitest";
import { run } from "@/scripts/core-verbs/quote";

describe("core verb quote", () => {
  test("the documented input gives the documented output (worked: 90/375/45 min at £24.00/h, VAT 20 %)", () => {
    const out = run({
      currency: "GBP",
      hourlyRateMinor: 2400,
      labourMinutes: { design: 90, knitting: 375, embroidery: 45 },
      materials: [{ label: "Yarn", quantity: 3, unitPriceMinor: 450 }],
      fees: [{ label: "Gift box", amountMinor: 500 }],
      taxRatePercent: 20,
      pricesIncludeTax: false,
      depositPercent: 50,
    });
    // 3600 + 15000 + 1800 + 1350 + 500 = 22250; VAT 4450; total 26700; deposit 13350.
    expect(out).toEqual({
      currency: "GBP",
      minorDigits: 2,
      lines: [
        { label: "Design labour (1 h 30 min)", amountMinor: 3600 },
        { label: "Knitting labour (6 h 15 min)", amountMinor: 15000 },
        { label: "Embroidery labour (45 min)", amountMinor: 1800 },
        { label: "Yarn × 3", amountMinor: 1350 },
        { label: "Gift box", amountMinor: 500 },
      ],
      subtotalMinor: 22250,
      taxMinor: 4450,
      totalMinor: 26700,
      depositMinor: 13350,
      balanceMinor: 13350,
    });
  });

  test.each([
    [{ currency: "XYZ" }, /^currency: "XYZ" is not an ISO 4217 currency code/],
    [{ hourlyRateMinor: -1 }, /^hourlyRateMinor: must not be negative/],
    [{ hourlyRateMinor: 24.5 }, /^hourlyRateMinor: must be a whole number of minor units/],
    [{ depositPercent: 120 }, /^depositPercent: must be between 0 and 100/],
    [{ taxRatePercent: 101 }, /^taxRatePercent: must be between 0 and 100/],
    [{ labourMinutes: { knitting: -5 } }, /labourMinutes\.knitting/],
    [{ materials: [{ label: "Yarn", quantity: 1, unitPriceMinor: -3 }] }, /^materials\[0\]\.unitPriceMinor: must not be negative/],
    [{ taxRatePercent: 12.34567 }, /taxRatePercent may have at most 4 decimal places/],
  ])("bad input %j → a clear message", (patch, message) => {
    expect(() => run({ currency: "GBP", hourlyRateMinor: 2400, labourMinutes: { knitting: 60 }, ...patch })).toThrow(message);
  });
  // 0-, 2- and 3-digit currencies (ISO 4217 List One: JPY 0, HUF 2, KWD 3), worked by hand:
  // labour = 125 min × rate ÷ 60; yarn = 2.5 × unit; tax 27 % on the subtotal; deposit 33.3333 %; all half away from zero.
  test.each([
    // JPY: 125 × 600 ÷ 60 = 1250; 2.5 × 200 = 500; 1750 × 0.27 = 472.5 → 473; 2223 × 0.333333 = 740.9993 → 741
    ["JPY", 600, 200, 0, [1250, 500], 1750, 473, 2223, 741],
    // HUF (2 digits, not the locale data's 0): 9 000.00 Ft/h → 18 750.00 Ft; 2.5 × 3 000.00 = 7 500.00; 26 250.00 × 0.27 = 7 087.50
    ["HUF", 900_000, 300_000, 2, [1_875_000, 750_000], 2_625_000, 708_750, 3_333_750, 1_111_249],
    // KWD (3 digits): 7.250 KD/h × 125 ÷ 60 = 15.1041… → 15.104; 2.5 × 2.416 = 6.040; 21.144 × 0.27 = 5.70888 → 5.709
    ["KWD", 7_250, 2_416, 3, [15_104, 6_040], 21_144, 5_709, 26_853, 8_951],
  ])("%s: minorDigits and amounts in its own minor units", (currency, rate, unit, digits, lines, subtotal, tax, total, deposit) => {
    const out = run({
      currency,
      hourlyRateMinor: rate,
      labourMinutes: { knitting: 125 },
      materials: [{ label: "Yarn", quantity: "2.5", unitPriceMinor: unit }],
      taxRatePercent: "27",
      depositPercent: "33.3333",
    }) as Record<string, unknown>;
    expect(Object.keys(out)).toEqual(["currency", "minorDigits", "lines", "subtotalMinor", "taxMinor", "totalMinor", "depositMinor", "balanceMinor"]);
    expect(out).toMatchObject({ currency, minorDigits: digits, subtotalMinor: subtotal, taxMinor: tax, totalMinor: total, depositMinor: deposit, balanceMinor: total - deposit });
    expect((out.lines as { amountMinor: number }[]).map((l) => l.amountMinor)).toEqual(lines);
  });

  test.each(["XYZ", "huf", "ZWL"])("unknown currency %j → a clear message", (currency) => {
    expect(() => run({ currency, hourlyRateMinor: 2400, labourMinutes: { knitting: 60 } })).toThrow(/not an ISO 4217 currency code/);
  });
});
