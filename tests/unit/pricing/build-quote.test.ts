import { describe, expect, test } from "vitest";
import { buildQuote, type QuoteInput } from "@/lib/core/pricing/build-quote";

const amounts = (q: ReturnType<typeof buildQuote>) => q.lines.map((l) => [l.kind, l.amountMinor]);

describe("worked quotes", () => {
  // GBP, 2 digits, prices exclude VAT at 20 % (the UK standard rate, (memory)).
  //   Design labour     90 min × £24.00/h                        = £36.00
  //   Knitting labour  375 min (P80 of 300/375) × £24.00/h        = £150.00
  //   Embroidery labour 45 min × £24.00/h                         = £18.00
  //   Design fee                                                  = £25.00
  //   Shetland 2-ply    3 × £4.50                                 = £13.50
  //   Rush fee          25 % of labour £204.00                    = £51.00
  //   Gift box                                                    = £5.00
  //   Shipping                                                    = £3.95
  //   Discount 10 % of everything but shipping, 10 % × £298.50    = −£29.85
  //   subtotal £272.60; VAT 20 % = £54.52; total £327.12; deposit 50 % = £163.56; balance £163.56
  const gbp: QuoteInput = {
    currency: "GBP",
    hourlyRateMinor: 2400,
    labourMinutes: { design: 90, knitting: { p50Minutes: 300, p80Minutes: 375 }, embroidery: 45 },
    designFeeMinor: 2500,
    materials: [{ label: "Shetland 2-ply, 25 g", quantity: 3, unitPriceMinor: 450 }],
    rush: { requestedDate: "2025-11-20", earliestDate: "2025-12-05" },
    fees: [{ label: "Gift box", amountMinor: 500 }],
    shippingMinor: 395,
    discount: { percent: 10 },
    taxRatePercent: 20,
    pricesIncludeTax: false,
    depositPercent: 50,
  };

  test("GBP, tax added on top, with rush, extras, shipping and a discount", () => {
    const q = buildQuote(gbp);
    expect(amounts(q)).toEqual([
      ["labour", 3600],
      ["labour", 15000],
      ["labour", 1800],
      ["design", 2500],
      ["material", 1350],
      ["rush", 5100],
      ["fee", 500],
      ["shipping", 395],
      ["discount", -2985],
    ]);
    expect(q.lines[1].label).toBe("Knitting labour (6 h 15 min)");
    expect(q).toMatchObject({ subtotalMinor: 27260, taxMinor: 5452, totalMinor: 32712, netMinor: 27260, depositMinor: 16356, balanceMinor: 16356, rushApplied: true });
  });

  test("GBP, the same quote charged at P50", () => {
    // knitting 300 min = £120.00; labour £174.00; rush 25 % = £43.50;
    // discount 10 % × £261.00 = −£26.10; subtotal £238.85; VAT £47.77; total £286.62; deposit £143.31.
    const q = buildQuote({ ...gbp, labourPolicy: "p50" });
    expect(q.lines[1].amountMinor).toBe(12000);
    expect(q).toMatchObject({ subtotalMinor: 23885, taxMinor: 4777, totalMinor: 28662, depositMinor: 14331, balanceMinor: 14331 });
  });

  test("GBP, rounding at every step, half away from zero", () => {
    // hourly £23.50; design 90 min = £35.25 exactly; knitting 377 min = 14765.83p → £147.66;
    // embroidery 47 min = 1840.83p → £18.41; yarn 2.5 × £4.55 = 1137.5p → £11.38 (half away from zero);
    // subtotal £212.70; VAT 17.5 % (the UK rate before 2011, (memory)) = 3722.25p → £37.22; total £249.92;
    // deposit 33 % = 8247.36p → £82.47; balance £167.45.
    const q = buildQuote({
      currency: "GBP",
      hourlyRateMinor: 2350,
      labourMinutes: { design: 90, knitting: 377, embroidery: 47 },
      materials: [{ label: "Yarn", quantity: 2.5, unitPriceMinor: 455 }],
      taxRatePercent: 17.5,
      depositPercent: 33,
    });
    expect(amounts(q)).toEqual([
      ["labour", 3525],
      ["labour", 14766],
      ["labour", 1841],
      ["material", 1138],
    ]);
    expect(q).toMatchObject({ subtotalMinor: 21270, taxMinor: 3722, totalMinor: 24992, depositMinor: 8247, balanceMinor: 16745 });
  });

  test("GBP, prices include VAT: lines sum to the total and the VAT is the VAT contained", () => {
    // knitting 600 min × £20.00/h = £200.00; 2 × £12.50 = £25.00; shipping £3.95; total £228.95;
    // VAT contained = £228.95 × 20/120 = 3815.83p → £38.16; net £190.79; deposit 11447.5p → £114.48.
    const q = buildQuote({
      currency: "GBP",
      hourlyRateMinor: 2000,
      labourMinutes: { knitting: 600 },
      materials: [{ label: "Yarn", quantity: 2, unitPriceMinor: 1250 }],
      shippingMinor: 395,
      taxRatePercent: 20,
      pricesIncludeTax: true,
    });
    expect(q).toMatchObject({ subtotalMinor: 22895, totalMinor: 22895, taxMinor: 3816, netMinor: 19079, depositMinor: 11448, balanceMinor: 11447 });
  });

  test("JPY, 0 digits, prices include 10 % consumption tax", () => {
    // Japan's standard consumption-tax rate is 10 % and prices are shown tax-inclusive (memory).
    // knitting 250 min × ¥2,500/h = ¥10,416.67 → ¥10,417; embroidery 30 min = ¥1,250;
    // yarn 4 × ¥880 = ¥3,520; shipping ¥1,200; total ¥16,387; tax contained ¥16,387 × 10/110
    // = ¥1,489.73 → ¥1,490; net ¥14,897; deposit 50 % = ¥8,193.5 → ¥8,194; balance ¥8,193.
    const q = buildQuote({
      currency: "JPY",
      hourlyRateMinor: 2500,
      labourMinutes: { knitting: 250, embroidery: 30 },
      materials: [{ label: "Yarn", quantity: 4, unitPriceMinor: 880 }],
      shippingMinor: 1200,
      taxRatePercent: 10,
      pricesIncludeTax: true,
    });
    expect(q.minorDigits).toBe(0);
    expect(amounts(q)).toEqual([
      ["labour", 10417],
      ["labour", 1250],
      ["material", 3520],
      ["shipping", 1200],
    ]);
    expect(q).toMatchObject({ subtotalMinor: 16387, taxMinor: 1490, totalMinor: 16387, netMinor: 14897, depositMinor: 8194, balanceMinor: 8193 });
  });

  test("KWD, 3 digits, no tax", () => {
    // knitting 200 min × 5.000 KWD/h = 16.66667 → 16.667 KWD; yarn 1.25 × 3.150 = 3.9375 → 3.938;
    // total 20.605 KWD; deposit 50 % = 10.3025 → 10.303; balance 10.302.
    const q = buildQuote({
      currency: "KWD",
      hourlyRateMinor: 5000,
      labourMinutes: { knitting: 200 },
      materials: [{ label: "Yarn", quantity: "1.25", unitPriceMinor: 3150 }],
    });
    expect(q.minorDigits).toBe(3);
    expect(amounts(q)).toEqual([
      ["labour", 16667],
      ["material", 3938],
    ]);
    expect(q).toMatchObject({ subtotalMinor: 20605, taxMinor: 0, totalMinor: 20605, depositMinor: 10303, balanceMinor: 10302 });
  });
});

describe("rush, labour order, and refusals", () => {
  const base: QuoteInput = { currency: "GBP", hourlyRateMinor: 3000, labourMinutes: { finishing: 20, knitting: 120, consultation: 30 } };

  test("stages come in working order, other labour after; zero-minute stages are left out", () => {
    const q = buildQuote({ ...base, labourMinutes: { ...base.labourMinutes, blocking: 0 } });
    expect(q.lines.map((l) => l.label)).toEqual(["Knitting labour (2 h)", "Finishing labour (20 min)", "Consultation labour (30 min)"]);
  });

  test.each([
    [{ requestedDate: "2026-01-10", earliestDate: "2026-01-10" }, false], // on the earliest date: no rush
    [{ requestedDate: "2026-01-09", earliestDate: "2026-01-10" }, true],
    [{ requested: true }, true],
    [{ requested: false }, false],
  ])("rush %j → %s", (rush, applied) => {
    const q = buildQuote({ ...base, rush, rushFee: { amountMinor: 4000 } });
    expect(q.rushApplied).toBe(applied);
    expect(q.lines.some((l) => l.kind === "rush" && l.amountMinor === 4000)).toBe(applied);
  });

  test("per-stage hourly rates override the studio rate", () => {
    const q = buildQuote({ ...base, labourMinutes: { knitting: 60 }, hourlyRatesMinor: { knitting: 1500 } });
    expect(q.totalMinor).toBe(1500);
  });

  test.each<[Partial<QuoteInput>, RegExp]>([
    [{ currency: "XYZ" }, /currency "XYZ" is not an ISO 4217 currency code/],
    [{ hourlyRateMinor: -100 }, /hourlyRateMinor must not be negative/],
    [{ hourlyRateMinor: 24.5 }, /hourlyRateMinor must be a whole number of minor units/],
    [{ depositPercent: 120 }, /depositPercent must be between 0 and 100 \(got 120\)/],
    [{ taxRatePercent: 150 }, /taxRatePercent must be between 0 and 100 \(got 150\)/],
    [{ materials: [{ label: "Yarn", quantity: -1, unitPriceMinor: 100 }] }, /materials\[0\]\.quantity must not be negative/],
    [{ discount: { amountMinor: 999999 } }, /discount .* is larger than the work and materials/],
    [{ rush: { requestedDate: "20/11/2025", earliestDate: "2025-12-01" } }, /rush\.requestedDate must be a date as YYYY-MM-DD/],
    [{ labourMinutes: { knitting: 10.5 } }, /labourMinutes\.knitting must be a whole number of minutes/],
  ])("refuses %j", (patch, message) => {
    expect(() => buildQuote({ ...base, ...patch })).toThrow(message);
  });
});
