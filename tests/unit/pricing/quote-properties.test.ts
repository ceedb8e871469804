import { describe, expect, test } from "vitest";
import fc from "fast-check";
import { buildQuote, type QuoteInput } from "@/lib/core/pricing/build-quote";
import { diffQuotes } from "@/lib/core/pricing/diff-quotes";

// A percentage with up to 4 decimals, built as exact text from integer parts per million.
const percentText = (maxPercent: number) =>
  fc.integer({ min: 0, max: maxPercent * 10_000 }).map((ppm) => `${Math.floor(ppm / 10_000)}.${String(ppm % 10_000).padStart(4, "0")}`);
const percentPpm = (text: string) => BigInt(text.replace(".", "")) * 1n; // "12.3456" → 123456 ppm

const quoteInput: fc.Arbitrary<QuoteInput> = fc.record({
  currency: fc.constantFrom("GBP", "EUR", "USD", "JPY", "KWD", "BHD"),
  hourlyRateMinor: fc.integer({ min: 0, max: 500_000 }),
  labourMinutes: fc.record(
    { design: fc.nat(3000), knitting: fc.nat(20_000), embroidery: fc.nat(3000), blocking: fc.nat(300), finishing: fc.nat(300) },
    { requiredKeys: [] },
  ),
  materials: fc.array(
    fc.record({
      label: fc.constantFrom("Yarn", "Buttons", "Label"),
      quantity: fc.tuple(fc.nat(50_000), fc.integer({ min: 0, max: 3 })).map(([u, scale]) => (scale === 0 ? String(u) : `${Math.floor(u / 10 ** scale)}.${String(u % 10 ** scale).padStart(scale, "0")}`)),
      unitPriceMinor: fc.nat(100_000),
    }),
    { maxLength: 4 },
  ),
  fees: fc.array(fc.record({ label: fc.constantFrom("Gift box", "Name tape"), amountMinor: fc.nat(20_000) }), { maxLength: 3 }),
  shippingMinor: fc.nat(5000),
  designFeeMinor: fc.nat(50_000),
  rush: fc.record({ requested: fc.boolean() }),
  discount: fc.option(fc.record({ percent: percentText(100) }), { nil: undefined }),
  taxRatePercent: percentText(100),
  pricesIncludeTax: fc.boolean(),
  depositPercent: percentText(100),
});

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

describe("quote properties", () => {
  test("lines sum to the subtotal; deposit + balance = total; 0 ≤ deposit ≤ total", () => {
    fc.assert(
      fc.property(quoteInput, (input) => {
        const q = buildQuote(input);
        expect(sum(q.lines.map((l) => l.amountMinor))).toBe(q.subtotalMinor);
        expect(q.depositMinor + q.balanceMinor).toBe(q.totalMinor);
        expect(q.depositMinor).toBeGreaterThanOrEqual(0);
        expect(q.depositMinor).toBeLessThanOrEqual(q.totalMinor);
        expect(q.netMinor + q.taxMinor).toBe(q.totalMinor);
        if (q.pricesIncludeTax) expect(q.totalMinor).toBe(q.subtotalMinor);
        else expect(q.subtotalMinor + q.taxMinor).toBe(q.totalMinor);
        for (const v of [q.subtotalMinor, q.taxMinor, q.totalMinor, q.depositMinor, q.balanceMinor, ...q.lines.map((l) => l.amountMinor)]) {
          expect(Number.isSafeInteger(v)).toBe(true);
        }
      }),
    );
  });

  test("each rounding is within half a minor unit of the exact value, so none loses or adds a unit", () => {
    fc.assert(
      fc.property(quoteInput, (input) => {
        const q = buildQuote(input);
        const M = 1_000_000n;
        const taxPpm = percentPpm(input.taxRatePercent as string);
        const depPpm = percentPpm(input.depositPercent as string);
        // |rounded × denominator − exact numerator| ≤ denominator / 2, all in integers.
        const within = (rounded: number, numerator: bigint, denominator: bigint) => {
          const twice = 2n * (BigInt(rounded) * denominator - numerator);
          return twice <= denominator && twice >= -denominator;
        };
        const S = BigInt(q.subtotalMinor);
        if (q.pricesIncludeTax) expect(within(q.taxMinor, S * taxPpm, M + taxPpm)).toBe(true);
        else expect(within(q.taxMinor, S * taxPpm, M)).toBe(true);
        expect(within(q.depositMinor, BigInt(q.totalMinor) * depPpm, M)).toBe(true);
        const labour = q.lines.filter((l) => l.kind === "labour");
        const minutes = Object.values(input.labourMinutes ?? {}).filter((m) => (m as number) > 0) as number[];
        labour.forEach((l, i) => expect(within(l.amountMinor, BigInt(minutes[i]) * BigInt(input.hourlyRateMinor), 60n)).toBe(true));
      }),
    );
  });

  test("tax-inclusive and tax-exclusive agree: the exclusive total, quoted inclusive, gives back the same tax", () => {
    fc.assert(
      fc.property(quoteInput, (input) => {
        const exclusive = buildQuote({ ...input, pricesIncludeTax: false });
        // The same goods at gross prices: the exclusive quote's tax added to a line that no
        // percentage depends on (shipping is outside the discount's base).
        const inclusive = buildQuote({
          ...input,
          pricesIncludeTax: true,
          shippingMinor: (input.shippingMinor ?? 0) + exclusive.taxMinor,
        });
        expect(inclusive.totalMinor).toBe(exclusive.totalMinor);
        expect(inclusive.taxMinor).toBe(exclusive.taxMinor);
        expect(inclusive.netMinor).toBe(exclusive.subtotalMinor);
        expect(inclusive.depositMinor).toBe(exclusive.depositMinor);
      }),
    );
  });

  test("at a 0 % tax rate the two modes give the same amounts", () => {
    fc.assert(
      fc.property(quoteInput, (input) => {
        const a = buildQuote({ ...input, taxRatePercent: 0, pricesIncludeTax: false });
        const b = buildQuote({ ...input, taxRatePercent: 0, pricesIncludeTax: true });
        expect({ ...b, pricesIncludeTax: false }).toEqual(a);
        expect(a.taxMinor).toBe(0);
      }),
    );
  });

  test("a diff's line changes add up to the change in subtotal", () => {
    fc.assert(
      fc.property(quoteInput, quoteInput, (x, y) => {
        const a = buildQuote(x);
        const b = buildQuote({ ...y, currency: x.currency });
        const d = diffQuotes(a, b);
        expect(sum(d.changes.map((c) => c.deltaMinor))).toBe(b.subtotalMinor - a.subtotalMinor);
        expect(d.totalDeltaMinor).toBe(b.totalMinor - a.totalMinor);
      }),
    );
  });
});
