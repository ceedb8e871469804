// The refund policy in integers only: checked against exact rational arithmetic written apart from
// the code (fractions of bigints, rounding half away from zero as MONEY.md's one rule says), and
// never giving back more than was paid.
import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { CANCELLATION_STAGES, getRefundDue, shareOfAmount, type CancellationPolicy } from "@/lib/core/pricing/cancellation";
import { policyFromSettings } from "@/lib/core/pricing/studio-policy";

/** An exact decimal as a fraction: "12.345" → 12345 / 1000. */
function fraction(text: string): { n: bigint; d: bigint } {
  const [whole, frac = ""] = text.split(".");
  return { n: BigInt(whole! + frac), d: 10n ** BigInt(frac.length) };
}

/** round(n / d) for n ≥ 0, d > 0, halves away from zero: floor((2n + d) / 2d). */
const roundHalfUp = (n: bigint, d: bigint) => (2n * n + d) / (2n * d);

/** A percentage between 0 and 100 as typed: up to `decimals` decimals. */
const percentText = (decimals: number) =>
  fc.tuple(fc.integer({ min: 0, max: 100 }), fc.integer({ min: 0, max: 10 ** decimals - 1 })).map(([whole, frac]) => {
    if (whole === 100 || decimals === 0) return String(whole);
    return `${whole}.${String(frac).padStart(decimals, "0")}`;
  });

describe("policyFromSettings: the share kept is 100 − refunded, digit for digit", () => {
  test.each([
    { refund: 100, kept: null },
    { refund: 0, kept: "100" },
    { refund: "12.5", kept: "87.5" },
    { refund: "33.333333", kept: "66.666667" },
    { refund: "0.000001", kept: "99.999999" },
    { refund: 99.99, kept: "0.01" },
  ])("refund $refund % → keep $kept % of the deposit", ({ refund, kept }) => {
    const rule = policyFromSettings(50, refund).design;
    expect(rule).toEqual(kept === null ? { keep: "nothing" } : { keep: "percentOfDeposit", percent: kept });
  });

  test.each([[-1], [100.5], ["abc"]])("refuses %j", (bad) => {
    expect(() => policyFromSettings(50, bad as never)).toThrow(/refundBeforeKnittingPercent/);
  });

  test("the deposit actually on the quote decides, not today's deposit setting", () => {
    // Quote deposit £100.01 (the setting has since changed to 30 %): half of it kept, 5000.5 → 5001.
    const due = getRefundDue({ currency: "GBP", totalMinor: 30000, depositMinor: 10001, paidMinor: 10001, stageReached: "design", policy: policyFromSettings(30, 50) });
    expect(due).toMatchObject({ entitledMinor: 5001, retainedMinor: 5001, refundMinor: 5000 });
  });
});

describe("shareOfAmount", () => {
  test.each([
    { amount: 16356n, percent: "15", expected: 2453n }, // 2453.4
    { amount: 5n, percent: "50", expected: 3n }, // 2.5 → 3, half away from zero
    { amount: 3n, percent: "50", expected: 2n }, // 1.5 → 2
    { amount: 1n, percent: "49.99999999", expected: 0n },
    { amount: 1n, percent: "50", expected: 1n },
    { amount: 100n, percent: 0, expected: 0n },
    { amount: 100n, percent: 100, expected: 100n },
  ])("$percent % of $amount → $expected", ({ amount, percent, expected }) => {
    expect(shareOfAmount(amount, percent, "p")).toBe(expected);
  });
  test("refuses a share outside 0–100 or with too many decimals", () => {
    expect(() => shareOfAmount(100n, "100.0001", "p")).toThrow(/between 0 and 100/);
    expect(() => shareOfAmount(100n, "1." + "1".repeat(21), "p")).toThrow(/decimal places/);
  });
});

describe("getRefundDue properties", () => {
  const money = fc.integer({ min: 0, max: 2_000_000_000 });
  const case_ = fc
    .record({ total: money, depositShare: fc.integer({ min: 0, max: 1_000_000 }), paidShare: fc.integer({ min: 0, max: 1_000_000 }), stage: fc.constantFrom(...CANCELLATION_STAGES) })
    .map(({ total, depositShare, paidShare, stage }) => {
      const deposit = Math.floor((total * depositShare) / 1_000_000);
      // paid: anything from nothing to the whole total
      const paid = Math.floor((total * paidShare) / 1_000_000);
      return { total, deposit, paid, stage };
    });

  test("a share of the deposit matches exact fractions and never refunds more than was paid", () => {
    fc.assert(
      fc.property(case_, percentText(6), fc.constantFrom(0, 2, 3), ({ total, deposit, paid, stage }, refundText, digits) => {
        const currency = digits === 0 ? "JPY" : digits === 2 ? "GBP" : "KWD";
        const policy = policyFromSettings(50, refundText);
        const due = getRefundDue({ currency, totalMinor: total, depositMinor: deposit, paidMinor: paid, stageReached: stage, policy });
        // Exact: before knitting keep (100 − r) % of the deposit; then the default policy.
        const r = fraction(refundText);
        let entitled: bigint;
        if (stage === "accepted" || stage === "design") entitled = roundHalfUp(BigInt(deposit) * (100n * r.d - r.n), 100n * r.d);
        else if (stage === "knitting" || stage === "embroidery") entitled = BigInt(deposit);
        else entitled = BigInt(total);
        const retained = entitled < BigInt(paid) ? entitled : BigInt(paid);
        expect(BigInt(due.entitledMinor)).toBe(entitled);
        expect(BigInt(due.retainedMinor)).toBe(retained);
        expect(BigInt(due.refundMinor)).toBe(BigInt(paid) - retained);
        expect(BigInt(due.unpaidEntitlementMinor)).toBe(entitled > BigInt(paid) ? entitled - BigInt(paid) : 0n);
        expect(due.refundMinor).toBeGreaterThanOrEqual(0);
        expect(due.refundMinor).toBeLessThanOrEqual(paid);
        expect(due.refundMinor + due.retainedMinor).toBe(paid);
        for (const v of Object.values(due)) if (typeof v === "number") expect(Number.isSafeInteger(v)).toBe(true);
      }),
      { numRuns: 500 },
    );
  });

  test("a share of the total (up to 4 decimals) matches exact fractions at every stage", () => {
    fc.assert(
      fc.property(case_, percentText(4), ({ total, deposit, paid, stage }, keepText) => {
        const policy = Object.fromEntries(CANCELLATION_STAGES.map((s) => [s, { keep: "percentOfTotal", percent: keepText }])) as CancellationPolicy;
        const due = getRefundDue({ currency: "GBP", totalMinor: total, depositMinor: deposit, paidMinor: paid, stageReached: stage, policy });
        const k = fraction(keepText);
        const entitled = roundHalfUp(BigInt(total) * k.n, 100n * k.d);
        expect(BigInt(due.entitledMinor)).toBe(entitled);
        expect(due.refundMinor).toBeLessThanOrEqual(paid);
        expect(BigInt(due.refundMinor)).toBe(BigInt(paid) - (entitled < BigInt(paid) ? entitled : BigInt(paid)));
      }),
      { numRuns: 300 },
    );
  });
});
