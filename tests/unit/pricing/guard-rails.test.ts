// Guard rails: warnings at the thresholds (exactly at the limit, just under, just over). The limits
// are ours (no trade rule): rush fee over 100 % of the labour, deposit over 75 % of the total.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { DEPOSIT_WARN_ABOVE_PERCENT, RUSH_FEE_WARN_ABOVE_PERCENT, getGuardRailWarnings } from "@/lib/core/pricing/guard-rails";

const fields = (input: Parameters<typeof getGuardRailWarnings>[0]) => getGuardRailWarnings(input).map((w) => w.field);

describe("deposit over 75 %", () => {
  test.each([
    { value: 75, warns: false },
    { value: "75", warns: false },
    { value: "75.0000", warns: false },
    { value: 74.9999, warns: false },
    { value: "75.0001", warns: true },
    { value: 75.01, warns: true },
    { value: "75,5", warns: true },
    { value: 76, warns: true },
    { value: 100, warns: true },
    { value: 0, warns: false },
    { value: 50, warns: false },
    { value: "", warns: false },
    { value: "abc", warns: false },
    { value: null, warns: false },
  ])("$value → warns $warns", ({ value, warns }) => {
    expect(fields({ depositPercent: value })).toEqual(warns ? ["depositPercent"] : []);
  });

  test.each([
    { ppm: 750_000, warns: false },
    { ppm: 749_999, warns: false },
    { ppm: 750_001, warns: true },
  ])("a quote's deposit of $ppm ppm → warns $warns", ({ ppm, warns }) => {
    expect(fields({ depositPpm: ppm })).toEqual(warns ? ["depositPercent"] : []);
  });

  test("the message names the limit and says saving is still possible", () => {
    const [w] = getGuardRailWarnings({ depositPercent: 100 });
    expect(w!.message).toMatch(/over 75 %/);
    expect(w!.message).toMatch(/still save/);
    expect(DEPOSIT_WARN_ABOVE_PERCENT).toBe(75);
  });
});

describe("rush fee over 100 % of the labour", () => {
  test.each([
    { value: 100, warns: false },
    { value: "100.0000", warns: false },
    { value: "99.9999", warns: false },
    { value: "100.0001", warns: true },
    { value: 101, warns: true },
    { value: 1000, warns: true },
    { value: 25, warns: false },
  ])("percent $value → warns $warns", ({ value, warns }) => {
    expect(fields({ rushFeePercentOfLabour: value })).toEqual(warns ? ["rushFee"] : []);
  });

  test.each([
    { feeMinor: 10_000, labourMinor: 10_000, warns: false, share: null },
    { feeMinor: 9_999, labourMinor: 10_000, warns: false, share: null },
    { feeMinor: 10_001, labourMinor: 10_000, warns: true, share: /just over 100 % of the labour/ },
    { feeMinor: 100_000, labourMinor: 10_000, warns: true, share: /1000 % of the labour/ },
    { feeMinor: 15_050, labourMinor: 10_000, warns: true, share: /150.5 % of the labour/ },
    { feeMinor: 1, labourMinor: 0, warns: true, share: /more than the labour/ },
    { feeMinor: 0, labourMinor: 0, warns: false, share: null },
  ])("fee $feeMinor on labour $labourMinor → warns $warns", ({ feeMinor, labourMinor, warns, share }) => {
    const out = getGuardRailWarnings({ rushFee: { feeMinor, labourMinor } });
    expect(out.map((w) => w.field)).toEqual(warns ? ["rushFee"] : []);
    if (share) expect(out[0]!.message).toMatch(share);
  });

  test("property: a fixed fee warns exactly when fee × 100 > labour × 100 (checked against exact fractions)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 100_000_000 }), fc.integer({ min: 0, max: 100_000_000 }), (feeMinor, labourMinor) => {
        const warns = getGuardRailWarnings({ rushFee: { feeMinor, labourMinor } }).length === 1;
        expect(warns).toBe(feeMinor > 0 && BigInt(feeMinor) * 100n > BigInt(labourMinor) * BigInt(RUSH_FEE_WARN_ABOVE_PERCENT));
      }),
    );
  });

  test("both warnings together, deposit first", () => {
    expect(fields({ depositPercent: 90, rushFee: { feeMinor: 3, labourMinor: 2 } })).toEqual(["depositPercent", "rushFee"]);
  });
});
