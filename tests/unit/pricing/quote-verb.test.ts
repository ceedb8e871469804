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
});
