// Tax categories and totals per rate. Sources: HMRC VAT Notice 700 (the VAT guide) §16 and the
// HMRC manual VATREC12010 (tax may be worked per invoice on the total of each rate, or line by line;
// we work it once per rate on the invoice); VAT Notice 714 (young children's clothing and footwear
// is zero-rated, hats and mittens included, by size). A deposit creates a tax point (Notice 700,
// from memory: "advance payments and deposits").
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { buildQuote, type QuoteInput } from "@/lib/core/pricing/build-quote";
import { PricingInputError } from "@/lib/core/pricing/pricing-error";
import { run as quoteVerb } from "@/scripts/core-verbs/quote";
import { allocateLargestRemainder, getTaxRateWarnings, splitByRate, type TaxCategoryInput } from "@/lib/core/pricing/tax";

const UK: TaxCategoryInput[] = [
  { id: "standard", label: "Standard rate", ratePercent: 20 },
  { id: "reduced", label: "Reduced rate", ratePercent: 5 },
  { id: "zero", label: "Zero-rated (young children's clothing)" },
  { id: "exempt", label: "Exempt" },
];

const hatAndPullover = (extra: Partial<QuoteInput> = {}): QuoteInput => ({
  currency: "GBP",
  hourlyRateMinor: 2000,
  taxCategories: UK,
  fees: [
    // Notice 714: a hat for a child of two is young children's clothing, zero-rated.
    { label: "Child's hat (age 2), hand-knitted", amountMinor: 3750, taxCategory: "zero" },
    { label: "Adult yoke pullover, hand-knitted", amountMinor: 18_999 },
  ],
  materials: [
    { label: "Yarn for the hat", quantity: 1, unitPriceMinor: 850, taxCategory: "zero" },
    { label: "Yarn for the pullover", quantity: 7, unitPriceMinor: 850 },
  ],
  shippingMinor: 495,
  discount: { percent: 10 },
  pricesIncludeTax: false,
  depositPercent: 50,
  ...extra,
});

describe("a worked UK invoice: a zero-rated child's hat beside a standard-rated adult pullover", () => {
  test("tax once per rate on that rate's lines after its share of the discount (Notice 700 / VATREC12010)", () => {
    const q = buildQuote(hatAndPullover());
    // By hand, in pence:
    // zero lines 3750 + 850 = 4600; standard lines 18 999 + 7 × 850 = 24 949, plus shipping 495 = 25 444.
    // Discount 10 % of the work and materials 29 549 = 2954.9 → 2955 (half away from zero).
    // Split 4600 : 24 949 by the largest remainder: zero 460.0156 → 460, standard 2494.984 → 2494,
    // one penny left goes to the larger remainder (standard) → 2495. 460 + 2495 = 2955.
    // Zero: net 4600 − 460 = 4140, tax 0.  Standard: net 25 444 − 2495 = 22 949, tax 20 % = 4589.8 → 4590.
    expect(q.taxByRate).toEqual([
      { category: "standard", label: "Standard rate", ratePpm: 200_000, linesMinor: 25_444, discountMinor: 2495, netMinor: 22_949, taxMinor: 4590, grossMinor: 27_539 },
      { category: "zero", label: "Zero-rated (young children's clothing)", ratePpm: 0, linesMinor: 4600, discountMinor: 460, netMinor: 4140, taxMinor: 0, grossMinor: 4140 },
    ]);
    // Totals: subtotal 30 044 − 2955 = 27 089 = 22 949 + 4140; tax 4590; total 31 679.
    expect(q).toMatchObject({ subtotalMinor: 27_089, taxMinor: 4590, totalMinor: 31_679, netMinor: 27_089, taxRatePpm: 200_000 });
    // Deposit 50 % of 31 679 = 15 839.5 → 15 840; balance 15 839.
    expect(q).toMatchObject({ depositMinor: 15_840, balanceMinor: 15_839 });
    // Deposit by rate, in proportion to the gross (27 539 : 4140) by the largest remainder:
    // standard 13 769.93 → 13 769, zero 2070.07 → 2070, the last penny to standard → 13 770.
    // Tax within the standard part: 13 770 × 4590 ÷ 27 539 = 2295.08 → 2295; zero part 0.
    expect(q.depositByRate).toEqual([
      { category: "standard", label: "Standard rate", ratePpm: 200_000, grossMinor: 13_770, taxMinor: 2295, netMinor: 11_475 },
      { category: "zero", label: "Zero-rated (young children's clothing)", ratePpm: 0, grossMinor: 2070, taxMinor: 0, netMinor: 2070 },
    ]);
    // Each line carries its category, quantity and unit price for the invoice.
    expect(q.lines.find((l) => l.label.startsWith("Yarn for the pullover"))).toMatchObject({ taxCategory: "standard", quantity: "7", unitPriceMinor: 850, amountMinor: 5950 });
    expect(q.lines.find((l) => l.label.startsWith("Child's hat"))).toMatchObject({ taxCategory: "zero" });
    expect(q.lines.find((l) => l.kind === "discount")?.taxCategory).toBeUndefined();
  });

  test("prices including tax: the tax contained is worked once per rate (gross × 20/120)", () => {
    const q = buildQuote(hatAndPullover({ pricesIncludeTax: true, discount: undefined, shippingMinor: 0 }));
    // standard gross 18 999 + 5950 = 24 949; tax = 24 949 / 6 = 4158.17 → 4158; zero 4600, tax 0.
    expect(q.taxByRate.map((r) => [r.category, r.grossMinor, r.taxMinor, r.netMinor])).toEqual([
      ["standard", 24_949, 4158, 20_791],
      ["zero", 4600, 0, 4600],
    ]);
    expect(q).toMatchObject({ totalMinor: 29_549, taxMinor: 4158, netMinor: 25_391 });
  });

  test("defaults per kind of line, overridden per line and per labour stage", () => {
    const q = buildQuote({
      currency: "GBP",
      hourlyRateMinor: 2400,
      labourMinutes: { knitting: 600, finishing: 60 },
      labourTaxCategories: { finishing: "reduced" },
      designFeeMinor: 5000,
      shippingMinor: 300,
      taxCategories: UK,
      taxDefaults: { labour: "zero", design: "exempt", shipping: "standard" },
    });
    expect(q.lines.map((l) => [l.kind, l.taxCategory])).toEqual([
      ["labour", "zero"],
      ["labour", "reduced"],
      ["design", "exempt"],
      ["shipping", "standard"],
    ]);
    // finishing: 60 min × £24/h = 2400, 5 % = 120; shipping 300 × 20 % = 60
    expect(q.taxMinor).toBe(180);
    expect(q.taxByRate.map((r) => r.category)).toEqual(["standard", "reduced", "zero", "exempt"]);
  });
});

describe("one rate, as before", () => {
  test("only taxRatePercent: one standard rate for every line, the quote verb's keys (the spec's plus minorDigits)", () => {
    const input = { currency: "GBP", hourlyRateMinor: 2000, labourMinutes: { knitting: 95 }, shippingMinor: 333, discount: { amountMinor: 101 }, taxRatePercent: 17.5 };
    const q = buildQuote(input);
    // 95 min × £20/h = 3166.67 → 3167; + 333 − 101 = 3399; 17.5 % = 594.825 → 595.
    expect(q).toMatchObject({ subtotalMinor: 3399, taxMinor: 595, totalMinor: 3994 });
    expect(q.taxByRate).toHaveLength(1);
    expect(q.taxByRate[0]).toMatchObject({ category: "standard", ratePpm: 175_000, netMinor: 3399, taxMinor: 595, discountMinor: 101 });
    const out = quoteVerb(input) as Record<string, unknown>;
    expect(Object.keys(out).sort()).toEqual(["balanceMinor", "currency", "depositMinor", "lines", "minorDigits", "subtotalMinor", "taxMinor", "totalMinor"].sort());
    expect(Object.keys((out.lines as object[])[0])).toEqual(["label", "amountMinor"]);
  });

  test("a single standard category gives exactly the single-rate quote", () => {
    fc.assert(
      fc.property(fc.nat(50_000), fc.nat(5000), fc.nat(3000), fc.integer({ min: 0, max: 300_000 }), fc.boolean(), (labour, ship, disc, ppm, incl) => {
        const base = { currency: "GBP", hourlyRateMinor: 2000, labourMinutes: { knitting: labour }, shippingMinor: ship, pricesIncludeTax: incl };
        const rate = `${Math.floor(ppm / 10_000)}.${String(ppm % 10_000).padStart(4, "0")}`;
        const labourMinor = buildQuote(base).subtotalMinor - ship;
        const discount = { amountMinor: Math.min(disc, labourMinor) };
        const a = buildQuote({ ...base, discount, taxRatePercent: rate });
        const b = buildQuote({ ...base, discount, taxCategories: [{ id: "standard", ratePercent: rate }] });
        expect([b.subtotalMinor, b.taxMinor, b.totalMinor, b.depositMinor]).toEqual([a.subtotalMinor, a.taxMinor, a.totalMinor, a.depositMinor]);
      }),
    );
  });
});

describe("bad input: clear errors with the field", () => {
  const err = (f: () => unknown) => {
    try {
      f();
    } catch (e) {
      expect(e).toBeInstanceOf(PricingInputError);
      return e as PricingInputError;
    }
    throw new Error("no error");
  };
  test("a category the studio does not have", () => {
    const e = err(() => buildQuote(hatAndPullover({ taxCategories: [{ id: "standard", ratePercent: 20 }] })));
    expect(e.field).toBe("materials[0].taxCategory");
    expect(e.message).toContain('"zero" is not one of the tax categories in use (standard)');
    expect(err(() => buildQuote(hatAndPullover({ taxDefaults: { material: "reduced" }, taxCategories: UK.filter((c) => c.id !== "reduced") }))).field).toBe("taxDefaults.material");
  });
  test("a negative rate, a rate on zero or exempt, a category twice", () => {
    expect(err(() => buildQuote(hatAndPullover({ taxCategories: [{ id: "standard", ratePercent: -20 }, { id: "zero" }] }))).field).toBe("taxCategories[0].ratePercent");
    expect(err(() => buildQuote(hatAndPullover({ taxCategories: [{ id: "standard", ratePercent: "-0.5" }, { id: "zero" }] }))).message).toContain("must not be negative");
    expect(err(() => buildQuote(hatAndPullover({ taxCategories: [{ id: "standard", ratePercent: 20 }, { id: "zero", ratePercent: 5 }] }))).field).toBe("taxCategories[1].ratePercent");
    expect(err(() => buildQuote(hatAndPullover({ taxCategories: [{ id: "standard" }, { id: "standard" }, { id: "zero" }] }))).field).toBe("taxCategories[1].id");
  });
  test("the quote verb's schema refuses an unknown category name", async () => {
    expect(() => quoteVerb({ currency: "GBP", hourlyRateMinor: 1, fees: [{ label: "x", amountMinor: 1, taxCategory: "luxury" }] })).toThrow(/taxCategory/);
  });
  test("a rate over 30 % is warned about, not refused", () => {
    expect(getTaxRateWarnings([{ id: "standard", ratePercent: 35 }, { id: "reduced", ratePercent: 5 }])).toHaveLength(1);
    expect(buildQuote(hatAndPullover({ taxCategories: [{ id: "standard", ratePercent: 35 }, { id: "zero" }] })).taxByRate[0].ratePpm).toBe(350_000);
  });
});

describe("properties", () => {
  const category = fc.constantFrom("standard" as const, "reduced" as const, "zero" as const, "exempt" as const);
  const ratePercent = fc.integer({ min: 0, max: 1_000_000 }).map((ppm) => `${Math.floor(ppm / 10_000)}.${String(ppm % 10_000).padStart(4, "0")}`);
  const input = fc.record({
    std: ratePercent,
    red: ratePercent,
    incl: fc.boolean(),
    fees: fc.array(fc.record({ amountMinor: fc.nat(1_000_000), cat: category }), { maxLength: 6 }),
    materials: fc.array(fc.record({ quantity: fc.nat(40), unitPriceMinor: fc.nat(5000), cat: category }), { maxLength: 4 }),
    shipping: fc.nat(5000),
    discountShare: fc.double({ min: 0, max: 1, noNaN: true }),
    deposit: fc.integer({ min: 0, max: 100 }),
    currency: fc.constantFrom("GBP", "JPY", "KWD"),
  });
  test("totals per rate add up exactly to the quote's totals, and the deposit's split to the deposit", () => {
    fc.assert(
      fc.property(input, (x) => {
        const base: QuoteInput = {
          currency: x.currency,
          hourlyRateMinor: 0,
          taxCategories: [{ id: "standard", ratePercent: x.std }, { id: "reduced", ratePercent: x.red }, { id: "zero" }, { id: "exempt" }],
          fees: x.fees.map((f, i) => ({ label: `f${i}`, amountMinor: f.amountMinor, taxCategory: f.cat })),
          materials: x.materials.map((m, i) => ({ label: `m${i}`, quantity: m.quantity, unitPriceMinor: m.unitPriceMinor, taxCategory: m.cat })),
          shippingMinor: x.shipping,
          pricesIncludeTax: x.incl,
          depositPercent: x.deposit,
        };
        const work = buildQuote(base).subtotalMinor - x.shipping;
        const q = buildQuote({ ...base, discount: { amountMinor: Math.floor(work * x.discountShare) } });
        const s = (k: "netMinor" | "taxMinor" | "grossMinor" | "discountMinor" | "linesMinor") => q.taxByRate.reduce((t, r) => t + r[k], 0);
        expect(s("grossMinor")).toBe(q.totalMinor);
        expect(s("taxMinor")).toBe(q.taxMinor);
        expect(s("netMinor")).toBe(q.netMinor);
        expect(s("linesMinor") - s("discountMinor")).toBe(q.subtotalMinor);
        expect(s("discountMinor")).toBe(Math.floor(work * x.discountShare));
        for (const r of q.taxByRate) {
          expect(r.discountMinor).toBeGreaterThanOrEqual(0);
          expect(r.netMinor).toBeGreaterThanOrEqual(0);
          if (r.category === "zero" || r.category === "exempt") expect(r.taxMinor).toBe(0);
        }
        expect(q.depositByRate.reduce((t, r) => t + r.grossMinor, 0)).toBe(q.depositMinor);
        for (const d of q.depositByRate) expect(d.grossMinor).toBe(d.netMinor + d.taxMinor);
      }),
      { numRuns: 300 },
    );
  });
  test("largest remainder: nothing lost or added, each share within one unit of its exact share", () => {
    fc.assert(
      fc.property(fc.bigInt({ min: -(10n ** 12n), max: 10n ** 12n }), fc.array(fc.bigInt({ min: 0n, max: 10n ** 9n }), { minLength: 1, maxLength: 6 }), (amount, weights) => {
        const total = weights.reduce((s, w) => s + w, 0n);
        if (total === 0n) return;
        const shares = allocateLargestRemainder(amount, weights);
        expect(shares.reduce((s, x) => s + x, 0n)).toBe(amount);
        shares.forEach((sh, i) => {
          const exactTimesTotal = amount * weights[i];
          const diff = sh * total - exactTimesTotal;
          expect(diff < 0n ? -diff : diff).toBeLessThan(total);
          if (weights[i] === 0n) expect(sh).toBe(0n);
        });
      }),
    );
  });
  test("a refund of the whole reverses every figure; a part never exceeds the whole", () => {
    const q = buildQuote(hatAndPullover());
    const back = splitByRate(-q.totalMinor, q.taxByRate);
    expect(back.map((r) => [r.grossMinor, r.taxMinor])).toEqual(q.taxByRate.map((r) => [0 - r.grossMinor || 0, 0 - r.taxMinor || 0]));
    expect(() => splitByRate(q.totalMinor + 1, q.taxByRate)).toThrow(PricingInputError);
  });
});
