import fc from "fast-check";
import Stripe from "stripe";
import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import { featuresFromChart } from "@/lib/core/labour/chart-features";
import { getRefundDue } from "@/lib/core/pricing/cancellation";
import { composeQuote, type QuoteDraft, type QuotePolicy } from "@/lib/core/pricing/compose-quote";
import { policyFromSettings } from "@/lib/core/pricing/studio-policy";
import { parseForm, signPayload } from "@/scripts/fakes/payments";

const policy = (p: Partial<QuotePolicy> = {}): QuotePolicy => ({
  currency: "GBP",
  hourlyRateMinor: 2000,
  labourPolicy: "p80",
  taxRatePercent: 20,
  pricesIncludeTax: false,
  depositPercent: 50,
  ...p,
});

const draft = (d: Partial<QuoteDraft> = {}): QuoteDraft => ({
  pieces: [{ label: "Hat", plainStitches: 6000, strandedStitches: 3000, duplicateStitches: 40, ends: 4 }],
  materials: [{ yarnId: "y", label: "Yarn (skeins)", skeins: 2, unitPriceMinor: 850 }],
  extras: [{ label: "Gift wrap", amountMinor: 400 }],
  designFeeMinor: 1500,
  shippingMinor: 450,
  discountMinor: 0,
  ...d,
});

describe("composeQuote", () => {
  test("builds lines from the estimate, the skeins, fees and shipping", () => {
    const { quote, estimate } = composeQuote(draft(), policy());
    expect(quote.lines.map((l) => l.kind)).toEqual(["labour", "labour", "labour", "labour", "labour", "design", "material", "fee", "shipping"]);
    expect(quote.lines.find((l) => l.kind === "material")).toMatchObject({ label: "Yarn (skeins) × 2", amountMinor: 1700, kind: "material" });
    expect(estimate.totals.p80Minutes).toBeGreaterThan(estimate.totals.p50Minutes);
  });

  test("a rush fee applies only when the requested date is before the earliest date", () => {
    expect(composeQuote(draft({ requestedDate: "2027-01-10", earliestDate: "2027-01-20" }), policy()).quote.rushApplied).toBe(true);
    expect(composeQuote(draft({ requestedDate: "2027-01-30", earliestDate: "2027-01-20" }), policy()).quote.rushApplied).toBe(false);
    const fixed = composeQuote(draft({ requestedDate: "2027-01-10", earliestDate: "2027-01-20", rushFeeMinor: 2500 }), policy()).quote;
    expect(fixed.lines.find((l) => l.kind === "rush")?.amountMinor).toBe(2500);
  });

  test("zero-skein yarns and empty extras leave no lines", () => {
    const q = composeQuote(draft({ materials: [{ yarnId: "y", label: "Y", skeins: 0, unitPriceMinor: 850 }], extras: [{ label: " ", amountMinor: 5 }] }), policy()).quote;
    expect(q.lines.some((l) => l.kind === "material" || l.kind === "fee")).toBe(false);
  });

  test("property: lines sum to the subtotal, deposit + balance = total, in GBP and JPY, either tax mode", () => {
    fc.assert(
      fc.property(
        fc.record({
          plain: fc.integer({ min: 0, max: 80_000 }),
          stranded: fc.integer({ min: 0, max: 20_000 }),
          dup: fc.integer({ min: 0, max: 500 }),
          skeins: fc.integer({ min: 0, max: 12 }),
          price: fc.integer({ min: 0, max: 5000 }),
          ship: fc.integer({ min: 0, max: 3000 }),
          discount: fc.integer({ min: 0, max: 1000 }),
          tax: fc.integer({ min: 0, max: 25 }),
          deposit: fc.integer({ min: 0, max: 100 }),
          incl: fc.boolean(),
          currency: fc.constantFrom("GBP", "JPY"),
        }),
        (r) => {
          const { quote } = composeQuote(
            draft({ pieces: [{ label: "P", plainStitches: r.plain, strandedStitches: r.stranded, duplicateStitches: r.dup }], materials: [{ yarnId: "y", label: "Y", skeins: r.skeins, unitPriceMinor: r.price }], shippingMinor: r.ship, discountMinor: r.discount }),
            policy({ currency: r.currency, taxRatePercent: r.tax, depositPercent: r.deposit, pricesIncludeTax: r.incl }),
          );
          expect(quote.lines.reduce((s, l) => s + l.amountMinor, 0)).toBe(quote.subtotalMinor);
          expect(quote.depositMinor + quote.balanceMinor).toBe(quote.totalMinor);
          expect(quote.netMinor + quote.taxMinor).toBe(quote.totalMinor);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe("featuresFromChart", () => {
  test("the planner's pair is knitted (plain or stranded per row); the third colour is darned along its route", () => {
    const palette = [
      { key: "A", name: "a", hex: "#000000" },
      { key: "B", name: "b", hex: "#FFFFFF" },
      { key: "C", name: "c", hex: "#FF0000" },
    ];
    const c = createChart(10, 3, { stitchesPer10cm: 30, rowsPer10cm: 30 }, palette);
    // Worked by hand: row 1 (bottom) all A; row 2 A/B alternating; row 3 B C C B B A A A A A.
    // A 20, B 8, C 2 stitches: the cheapest pair is A+B, so C (two touching stitches) is darned:
    // one strand, 2 ends, no carry. Every stitch is knitted first (C over B): row 1 plain (10),
    // rows 2–3 stranded (20). Row 3 after underlay is B×5 A×5 in the round: no float over 5, no catch.
    for (let x = 0; x < 10; x++) c.cells[10 + x] = x % 2;
    c.cells[20] = 1;
    c.cells[23] = 1;
    c.cells[24] = 1;
    c.cells[21] = 2;
    c.cells[22] = 2;
    const f = featuresFromChart(c, "band");
    expect(f).toMatchObject({ label: "band", plainStitches: 10, strandedStitches: 20, duplicateStitches: 2, ends: 2, carryCm: 0, floatCatches: 0 });
  });

  test("long floats are counted for catching", () => {
    const palette = [
      { key: "A", name: "a", hex: "#000000" },
      { key: "B", name: "b", hex: "#FFFFFF" },
    ];
    const c = createChart(20, 1, { stitchesPer10cm: 30, rowsPer10cm: 30 }, palette);
    // 19 stitches of A carry B behind them (in the round the row wraps to the single B):
    // ceil(19 / 5) − 1 = 3 catches (the limit is 5 stitches; 2.5 cm at 30 sts/10 cm would allow 7).
    c.cells[19] = 1;
    expect(featuresFromChart(c, "x", { floatLimitStitches: 5 }).floatCatches).toBe(3);
  });
});

describe("policyFromSettings", () => {
  test("100 % back before knitting keeps nothing; 50 % keeps half the deposit", () => {
    expect(policyFromSettings(50, 100).accepted).toEqual({ keep: "nothing" });
    const half = policyFromSettings(50, 50);
    const due = getRefundDue({ currency: "GBP", totalMinor: 20000, depositMinor: 10000, paidMinor: 10000, stageReached: "design", policy: half });
    expect(due).toMatchObject({ retainedMinor: 5000, refundMinor: 5000 });
    expect(getRefundDue({ currency: "GBP", totalMinor: 20000, depositMinor: 10000, paidMinor: 10000, stageReached: "knitting", policy: half }).refundMinor).toBe(0);
    expect(() => policyFromSettings(50, 120)).toThrow(/between 0 and 100/);
  });

  test("property: the refund never exceeds what was paid", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000_000 }), fc.integer({ min: 0, max: 100 }), fc.integer({ min: 0, max: 100 }), fc.constantFrom("accepted", "design", "knitting", "blocking", "ready" as const), fc.integer({ min: 0, max: 2 }), (total, dep, back, stage, paidKind) => {
        const deposit = Math.round((total * dep) / 100);
        const paid = paidKind === 0 ? 0 : paidKind === 1 ? deposit : total;
        const due = getRefundDue({ currency: "GBP", totalMinor: total, depositMinor: deposit, paidMinor: paid, stageReached: stage, policy: policyFromSettings(dep, back) });
        expect(due.refundMinor).toBeGreaterThanOrEqual(0);
        expect(due.refundMinor).toBeLessThanOrEqual(paid);
        expect(due.refundMinor + due.retainedMinor).toBe(paid);
      }),
    );
  });
});

describe("payments fake wire format", () => {
  test("bracket notation becomes nested objects and arrays", () => {
    const body = "mode=payment&line_items[0][quantity]=1&line_items[0][price_data][currency]=gbp&line_items[0][price_data][unit_amount]=4400&metadata[paymentId]=p1";
    expect(parseForm(body)).toEqual({ mode: "payment", line_items: [{ quantity: "1", price_data: { currency: "gbp", unit_amount: "4400" } }], metadata: { paymentId: "p1" } });
  });

  test("its signatures verify with the SDK, and a changed payload does not", () => {
    const stripe = new Stripe("sk_test_unit");
    const payload = JSON.stringify({ id: "evt_1", object: "event", type: "checkout.session.completed", data: { object: {} } });
    const header = signPayload("whsec_unit_secret", payload);
    expect(stripe.webhooks.constructEvent(payload, header, "whsec_unit_secret").id).toBe("evt_1");
    expect(() => stripe.webhooks.constructEvent(payload.replace("evt_1", "evt_2"), header, "whsec_unit_secret")).toThrow();
  });
});
