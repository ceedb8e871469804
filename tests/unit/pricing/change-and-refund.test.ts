import { describe, expect, test } from "vitest";
import { buildQuote, type QuoteInput } from "@/lib/core/pricing/build-quote";
import { getRefundDue } from "@/lib/core/pricing/cancellation";
import { diffQuotes } from "@/lib/core/pricing/diff-quotes";
import { explainChange } from "@/lib/core/pricing/explain-change";

const mitten = { plainStitches: 2000, strandedStitches: 3000, duplicateStitches: 60, ends: 6, carryCm: 40 };

describe("explainChange", () => {
  // Embroidery at our default rates (30 s per duplicate stitch, 3 min per end, 5 s per cm):
  //   before 60 × 0.5 + 6 × 3 + 40 × 5/60 = 51.33 min; after 98 × 0.5 + 10 × 3 + 3.33 = 82.33 min.
  test("P50: 51 → 82 min, 31 min × £24.00/h = £12.40", () => {
    const r = explainChange([mitten], [{ ...mitten, duplicateStitches: 98, ends: 10 }], {
      currency: "GBP",
      hourlyRateMinor: 2400,
      labourPolicy: "p50",
    });
    expect(r.text).toBe("+38 duplicate stitches, +4 ends: +£12.40");
    expect(r.amountDeltaMinor).toBe(1240);
    expect(r.minutesDelta.embroidery).toBe(31);
    expect(r.minutesDelta.knitting).toBe(0);
  });

  test("P80 (default policy): 64 → 103 min (× 1.25), 39 min × £24.00/h = £15.60", () => {
    const r = explainChange([mitten], [{ ...mitten, duplicateStitches: 98, ends: 10 }], { currency: "GBP", hourlyRateMinor: 2400 });
    expect(r.text).toBe("+38 duplicate stitches, +4 ends: +£15.60");
  });

  test("removing work reads as a saving, singular words for one", () => {
    const r = explainChange([mitten], [{ ...mitten, ends: 5 }], { currency: "GBP", hourlyRateMinor: 2400, labourPolicy: "p50" });
    // 51.33 → 48.33 min: 51 → 48, 3 min × 40p = £1.20.
    expect(r.text).toBe("-1 end: -£1.20");
  });

  test("adding a second piece counts pieces and new designs", () => {
    const r = explainChange([mitten], [mitten, { ...mitten, newDesign: false }], { currency: "JPY", hourlyRateMinor: 2400, labourPolicy: "p50" });
    expect(r.changes.map((c) => c.feature)).toEqual(["pieces", "plainStitches", "strandedStitches", "duplicateStitches", "ends", "carryCm"]);
    expect(r.text.startsWith("+1 piece, +2000 plain stitches")).toBe(true);
  });

  test("no change says so", () => {
    expect(explainChange([mitten], [mitten], { currency: "GBP", hourlyRateMinor: 2400 }).text).toBe("no change: £0.00");
  });
});

describe("diffQuotes", () => {
  const base: QuoteInput = {
    currency: "GBP",
    hourlyRateMinor: 2400,
    labourMinutes: { knitting: 300, embroidery: 45 },
    materials: [{ label: "Yarn", quantity: 3, unitPriceMinor: 450 }],
    taxRatePercent: 20,
  };

  test("names changed, added and removed lines, matching labour by stage across new minutes", () => {
    const a = buildQuote(base);
    const b = buildQuote({ ...base, labourMinutes: { knitting: 330, embroidery: 45 }, materials: [], rush: { requested: true }, rushFee: { amountMinor: 3000 } });
    const d = diffQuotes(a, b);
    // knitting £120.00 → £132.00; yarn −£13.50; rush +£30.00; subtotal +£28.50, VAT +£5.70 → +£34.20.
    expect(d.changes.map((c) => [c.change, c.kind, c.deltaMinor])).toEqual([
      ["changed", "labour", 1200],
      ["added", "rush", 3000],
      ["removed", "material", -1350],
    ]);
    expect(d.totalDeltaMinor).toBe(3420);
    expect(d.summary).toBe("Knitting labour +£12.00; Rush fee added +£30.00; Yarn × 3 removed -£13.50 → total +£34.20");
  });

  test("refuses to compare different currencies", () => {
    expect(() => diffQuotes(buildQuote(base), buildQuote({ ...base, currency: "EUR" }))).toThrow(/cannot compare a GBP quote with a EUR quote/);
  });
});

describe("getRefundDue (default policy: deposit refundable until knitting starts)", () => {
  // Total £327.12, deposit £163.56 paid.
  const paid = { currency: "GBP", totalMinor: 32712, depositMinor: 16356, paidMinor: 16356 };

  test.each([
    ["accepted", 16356, 0],
    ["design", 16356, 0],
    ["knitting", 0, 16356],
    ["embroidery", 0, 16356],
    ["blocking", 0, 16356],
  ] as const)("cancelled at %s: refund %i, kept %i", (stageReached, refund, kept) => {
    const r = getRefundDue({ ...paid, stageReached });
    expect(r.refundMinor).toBe(refund);
    expect(r.retainedMinor).toBe(kept);
    expect(r.refundMinor + r.retainedMinor).toBe(paid.paidMinor);
  });

  test("from blocking on, the rest of a personalised piece is owed though not yet paid", () => {
    expect(getRefundDue({ ...paid, stageReached: "finishing" }).unpaidEntitlementMinor).toBe(32712 - 16356);
  });

  test("percentages are configurable and rounded half away from zero", () => {
    // 15 % of £327.12 = 4906.8p → £49.07 kept; refund 16356 − 4907 = 11449.
    const r = getRefundDue({ ...paid, stageReached: "design", policy: { design: { keep: "percentOfTotal", percent: 15 } } });
    expect(r.retainedMinor).toBe(4907);
    expect(r.refundMinor).toBe(11449);
  });

  test.each([
    [{ paidMinor: -1 }, /paidMinor must not be negative/],
    [{ depositMinor: 40000 }, /depositMinor must not exceed totalMinor/],
    [{ currency: "XXY" }, /not an ISO 4217 currency code/],
  ])("refuses %j", (patch, message) => {
    expect(() => getRefundDue({ ...paid, stageReached: "design", ...patch })).toThrow(message);
  });
});
