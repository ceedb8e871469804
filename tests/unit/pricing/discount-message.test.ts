import { describe, expect, it } from "vitest";
import { buildQuote } from "@/lib/core/pricing/build-quote";
import { discountTooLargeMessage } from "@/lib/core/pricing/messages";
import { PricingInputError } from "@/lib/core/pricing/pricing-error";

describe("discountTooLargeMessage", () => {
  it("shows both amounts as money in the quote's currency", () => {
    expect(discountTooLargeMessage(50_000, 21_025, "GBP")).toMatch(/^The discount \(£500\.00\) is larger than the work and materials \(£210\.25\)/);
    expect(discountTooLargeMessage(1_500, 1_200, "JPY")).toContain("¥1,500)");
    expect(discountTooLargeMessage(1_500, 1_200, "KWD")).toContain("1.500");
  });
  it("never mentions minor units", () => {
    expect(discountTooLargeMessage(50_000, 21_025, "GBP")).not.toMatch(/minor|50000|21025/);
  });
});

describe("buildQuote with a discount larger than its base", () => {
  it("throws the money-worded message, pinned to the discount field", () => {
    // 170 minutes at £30.00 an hour = £85.00 of work.
    const input = { currency: "GBP", hourlyRateMinor: 3000, labourMinutes: { finishing: 20, knitting: 120, consultation: 30 }, discount: { amountMinor: 50_000 } };
    let caught: unknown;
    try {
      buildQuote(input);
    } catch (err) {
      caught = err;
    }
    expect(caught).toBeInstanceOf(PricingInputError);
    expect((caught as PricingInputError).field).toBe("discountMinor");
    expect((caught as Error).message).toContain("The discount (£500.00) is larger than the work and materials (£85.00)");
  });
});
