import fc from "fast-check";
import { describe, expect, test } from "vitest";
import {
  fitDepositForProvider,
  fromProviderAmount,
  PROVIDER_CURRENCIES,
  providerStepMinor,
  roundToStep,
  toProviderAmount,
  withProviderDeposit,
} from "@/lib/core/pricing/provider-currency";
import { currencyAmountError } from "@/scripts/fakes/payments";

// The provider's rules (docs.stripe.com/currencies): zero-decimal amounts in whole units; three-decimal
// amounts (BHD JOD KWD OMR TND) must end in 0 ("5.124 KWD must be rounded to 5120 or 5130"); ISK is sent
// with two decimals that must be 00 (5 ISK → 500); HUF and TWD are charged with two decimals.
describe("provider amounts", () => {
  test.each([
    ["GBP", 1234, 1234],
    ["JPY", 500, 500],
    ["HUF", 3_000_000, 3_000_000], // 30 000.00 Ft is sent as 3 000 000 (two-decimal), never 30 000
    ["TWD", 12_345, 12_345],
    ["KWD", 5_120, 5_120],
    ["ISK", 5, 500],
    ["MGA", 123_400, 1_234], // 2 digits in ISO 4217, zero-decimal for the provider
    ["UGX", 5_000, 5_000],
  ])("%s %i minor → %i", (currency, minor, amount) => {
    expect(toProviderAmount(minor, currency)).toEqual({ ok: true, amount, currency: currency.toLowerCase() });
    expect(fromProviderAmount(amount, currency)).toBe(minor);
  });

  test("a three-decimal amount that does not end in 0 is refused with the nearest chargeable one", () => {
    const r = toProviderAmount(5_124, "KWD");
    expect(r).toMatchObject({ ok: false, code: "invalid_amount", nearestMinor: 5_120 });
    expect(r.ok ? "" : r.message).toBe("KWD card payments must be a multiple of 0.010 KWD: 5.124 KWD cannot be charged (the nearest is 5.120 KWD).");
    expect(toProviderAmount(123_456, "MGA")).toMatchObject({ ok: false, nearestMinor: 123_500 });
  });

  test.each(["IQD", "LYD", "CLF", "XYZ", "gbp"])("%s is not offered: refused with a message", (currency) => {
    const r = toProviderAmount(1000, currency);
    expect(r).toMatchObject({ ok: false, code: "unsupported_currency" });
    expect(r.ok ? "" : r.message).toMatch(/not offered by the payment service/);
  });

  test("steps per currency", () => {
    expect([providerStepMinor("GBP"), providerStepMinor("KWD"), providerStepMinor("ISK"), providerStepMinor("MGA"), providerStepMinor("JPY"), providerStepMinor("IQD")]).toEqual([1, 10, 1, 100, 1, null]);
  });

  test("property: every provider currency converts exactly or is refused, and what is sent meets the fake's API rules", () => {
    fc.assert(
      fc.property(fc.constantFrom(...PROVIDER_CURRENCIES), fc.integer({ min: 1, max: 1e11 }), (currency, minor) => {
        const r = toProviderAmount(minor, currency);
        if (r.ok) {
          expect(fromProviderAmount(r.amount, currency)).toBe(minor);
          expect(currencyAmountError(r.currency, r.amount, "amount")).toBeNull();
        } else {
          expect(minor % providerStepMinor(currency)!).not.toBe(0);
          expect(r.nearestMinor! % providerStepMinor(currency)!).toBe(0);
          expect(Math.abs(r.nearestMinor! - minor) * 2).toBeLessThanOrEqual(providerStepMinor(currency)!);
        }
      }),
      { numRuns: 5000 },
    );
  });

  test("the fake refuses what the provider refuses", () => {
    expect(currencyAmountError("kwd", 5124, "amount")?.status).toBe(400);
    expect(currencyAmountError("isk", 550, "amount")?.body.error.message).toMatch(/evenly divisible by 100/);
    expect(currencyAmountError("xyz", 100, "amount")?.body.error.message).toMatch(/^Invalid currency: xyz/);
    expect(currencyAmountError("GBP", 100, "amount")?.status).toBe(400); // codes go lower-case
    expect(currencyAmountError("huf", 3_000_050, "amount")).toBeNull();
  });
});

describe("deposits fitted for the provider", () => {
  test("a KWD deposit is rounded to a multiple of 0.010, with a message a studio owner understands", () => {
    const fit = fitDepositForProvider({ currency: "KWD", totalMinor: 24_690, depositMinor: 12_345 });
    expect(fit).toEqual({
      ok: true,
      depositMinor: 12_350,
      balanceMinor: 12_340,
      rounded: true,
      note: "KWD deposits must be a multiple of 0.010 KWD for card payment: 12.345 KWD becomes 12.350 KWD; the balance is 12.340 KWD.",
    });
  });

  test("a total the provider cannot charge is refused, with the nearest totals", () => {
    const fit = fitDepositForProvider({ currency: "KWD", totalMinor: 25_005, depositMinor: 12_503 });
    expect(fit.ok).toBe(false);
    expect(fit.ok ? "" : fit.message).toBe(
      "KWD card payments must be a multiple of 0.010 KWD, and the total 25.005 KWD is not, so its balance could not be paid. Adjust a line so the total is 25.000 KWD or 25.010 KWD.",
    );
  });

  test("HUF deposits are left as they are (two-decimal charges)", () => {
    expect(fitDepositForProvider({ currency: "HUF", totalMinor: 3_333_751, depositMinor: 1_111_250 })).toMatchObject({ ok: true, depositMinor: 1_111_250, rounded: false, note: null });
  });

  test("property: deposit + balance = total exactly, both chargeable, the deposit moves less than one step", () => {
    fc.assert(
      fc.property(fc.constantFrom(...PROVIDER_CURRENCIES), fc.integer({ min: 0, max: 1e9 }), fc.integer({ min: 0, max: 1_000_000 }), (currency, n, ppm) => {
        const step = providerStepMinor(currency)!;
        const total = n * step;
        const deposit = Math.round((total * ppm) / 1_000_000);
        const fit = fitDepositForProvider({ currency, totalMinor: total, depositMinor: deposit });
        expect(fit.ok).toBe(true);
        if (!fit.ok) return;
        expect(fit.depositMinor + fit.balanceMinor).toBe(total);
        expect(fit.depositMinor % step).toBe(0);
        expect(fit.balanceMinor % step).toBe(0);
        expect(fit.depositMinor).toBeGreaterThanOrEqual(0);
        expect(fit.depositMinor).toBeLessThanOrEqual(total);
        expect(Math.abs(fit.depositMinor - deposit)).toBeLessThan(step);
        const q = withProviderDeposit({ currency, totalMinor: total, depositMinor: deposit, balanceMinor: total - deposit });
        expect(q.quote.depositMinor).toBe(fit.depositMinor);
      }),
      { numRuns: 3000 },
    );
  });

  test("roundToStep: nearest, exact half away from zero", () => {
    expect([roundToStep(12_345, 10), roundToStep(12_344, 10), roundToStep(12_340, 10), roundToStep(150, 100), roundToStep(149, 100)]).toEqual([12_350, 12_340, 12_340, 200, 100]);
  });
});
