// Properties of the garment model on generated garments and charts: the rules the `garment` verb
// promises (see lib/core/garment/README.md), whatever the garment, size, gauge, repeat and chart.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { createChart, type Chart } from "@/lib/core/chart/model";
import { buildGarment, garmentFeatures, placeCharts, type ChartPlacement, type Garment } from "@/lib/core/garment";
import { inShapeColumns } from "@/lib/core/garment/build-garment";
import type { ChartArea } from "@/lib/core/sizing/sizing-result";
import { PALETTE, sizeTotal } from "./helpers";

const sizeInputArb = fc.oneof(
  fc.record({
    garment: fc.constant("mittens"),
    size: fc.constantFrom("baby", "toddler", "child", "woman", "man"),
    gauge: fc.record({ stitchesPer10cm: fc.integer({ min: 20, max: 32 }), rowsPer10cm: fc.integer({ min: 24, max: 40 }) }),
    repeat: fc.constantFrom(1, 2, 3, 4),
    options: fc.record({ thumb: fc.constantFrom("gusset", "afterthought") }),
  }),
  fc.record({
    garment: fc.constant("hat"),
    size: fc.constantFrom("baby", "toddler", "child", "teen", "woman", "man"),
    gauge: fc.record({ stitchesPer10cm: fc.integer({ min: 18, max: 28 }), rowsPer10cm: fc.integer({ min: 24, max: 36 }) }),
    repeat: fc.constantFrom(1, 2, 4, 6),
    options: fc.record({ style: fc.constantFrom("beanie", "folded-brim", "tall") }),
  }),
  fc.record({
    garment: fc.constant("pullover"),
    size: fc.constantFrom("women-XS", "women-S"),
    gauge: fc.record({ stitchesPer10cm: fc.integer({ min: 12, max: 16 }), rowsPer10cm: fc.integer({ min: 16, max: 22 }) }),
    repeat: fc.constantFrom(1, 4, 8),
    options: fc.record({ style: fc.constantFrom("yoke", "bands"), backNeckShortRows: fc.boolean() }),
  }),
);

/** A garment the sizing accepts, or null (a refusal is the sizing's business, tested there). */
function tryGarment(input: unknown): Garment | null {
  try {
    return buildGarment(input);
  } catch {
    return null;
  }
}

/** A small deterministic generator, so one seed draws a whole chart. */
function rng(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return (s >>> 0) / 2 ** 32;
  };
}

const inside = (a: ChartArea, y: number) => new Set(inShapeColumns(a.width, a.rowStitches![y], a.narrowing ?? "even"));

/** A chart of the area; `paint` picks the colour index of each real stitch, the rest stay 0. */
function areaChart(g: Garment, a: ChartArea, paint: (x: number, y: number, row: number[]) => number): Chart {
  const chart = createChart(a.width, a.height, { stitchesPer10cm: g.sizing.gauge.stitchesPer10cm, rowsPer10cm: g.sizing.gauge.rowsPer10cm }, PALETTE.slice(0, 3));
  for (let y = 0; y < a.height; y++) {
    const row = [...inside(a, y)];
    for (const x of row) chart.cells[y * a.width + x] = paint(x, y, row);
  }
  return chart;
}

const features = (g: Garment, placements: ChartPlacement[], darn?: string[]) => garmentFeatures(placeCharts(g, placements, darn ? { darn } : {}));

describe("garment properties", () => {
  test("stitches: the pieces sum to the size verb's count, plain + stranded = stitches, charts never change a count", () => {
    fc.assert(
      fc.property(sizeInputArb, fc.integer(), fc.array(fc.boolean(), { minLength: 6, maxLength: 6 }), (input, seed, pick) => {
        const g = tryGarment(input);
        fc.pre(g !== null);
        const garment = g!;
        const next = rng(seed);
        const placements = garment.sizing.charts
          .filter((_, i) => pick[i % pick.length])
          .map((a) => ({ area: a.area, chart: areaChart(garment, a, () => (next() < 0.5 ? 1 : next() < 0.1 ? 2 : 0)) }));
        const plain = features(garment, []);
        const charted = features(garment, placements, ["C"].filter(() => placements.length > 0 && placements.some((p) => p.chart.cells.includes(2))));
        const total = sizeTotal(garment.sizing);
        for (const reading of [plain, charted]) {
          expect(reading.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0)).toBe(total);
          for (const p of reading.pieces) {
            expect(p.quantity).toBe(1);
            expect(p.features.plainStitches + p.features.strandedStitches).toBe(p.stitches);
          }
          // only the first piece is a new design; every mitten has its thumb
          expect(reading.pieces.map((p) => p.features.newDesign)).toEqual(reading.pieces.map((_, i) => i === 0));
          if (garment.kind === "mitten") expect(reading.pieces.map((p) => p.features.thumbs)).toEqual([1, 1]);
        }
        expect(charted.pieces.map((p) => p.stitches)).toEqual(plain.pieces.map((p) => p.stitches));
      }),
      { numRuns: 25, seed: 14 },
    );
  }, 120_000);

  test("a chart with two colours in every round of an area adds exactly the area's stitches in shape, every repeat", () => {
    fc.assert(
      fc.property(sizeInputArb, fc.integer(), fc.nat(), (input, seed, which) => {
        const g = tryGarment(input);
        fc.pre(g !== null);
        const garment = g!;
        // an area every row of which keeps two stitches or more can hold two colours in every round
        const candidates = garment.sizing.charts.filter((a) => a.rowStitches!.every((n) => n >= 2));
        fc.pre(candidates.length > 0);
        const a = candidates[which % candidates.length];
        const next = rng(seed);
        const chart = areaChart(garment, a, (x, _y, row) => (x === row[0] ? 1 : x === row[1] ? 0 : next() < 0.5 ? 1 : 0));
        const before = features(garment, []);
        const after = features(garment, [{ area: a.area, chart }]);
        const inShape = a.rowStitches!.reduce((s, n) => s + n, 0) * a.repeats;
        after.pieces.forEach((p, i) => {
          const has = garment.pieces[i].areas.some((x) => x.name === a.area && x.charted);
          expect(p.features.strandedStitches - before.pieces[i].features.strandedStitches).toBe(has ? inShape : 0);
        });
      }),
      { numRuns: 25, seed: 41 },
    );
  }, 120_000);

  test("a darned colour is counted once per real stitch, per repeat, per piece", () => {
    fc.assert(
      fc.property(sizeInputArb, fc.integer(), fc.array(fc.boolean(), { minLength: 6, maxLength: 6 }), (input, seed, pick) => {
        const g = tryGarment(input);
        fc.pre(g !== null);
        const garment = g!;
        const next = rng(seed);
        const areas = garment.sizing.charts.filter((_, i) => pick[i % pick.length]);
        fc.pre(areas.length > 0);
        const placements = areas.map((a) => ({ area: a.area, chart: areaChart(garment, a, () => (next() < 0.04 ? 2 : next() < 0.3 ? 1 : 0)) }));
        const reading = features(garment, placements, ["C"].filter(() => placements.some((p) => p.chart.cells.includes(2))));
        let all = 0;
        reading.pieces.forEach((p, i) => {
          let expected = 0;
          placements.forEach((pl, k) => {
            if (!garment.pieces[i].areas.some((x) => x.name === pl.area && x.charted)) return;
            expected += pl.chart.cells.filter((c) => c === 2).length * areas[k].repeats;
          });
          expect(p.features.duplicateStitches).toBe(expected);
          all += expected;
        });
        expect(reading.yarn.colours.find((c) => c.key === "C")?.darnedStitches ?? 0).toBe(all);
      }),
      { numRuns: 20, seed: 7 },
    );
  }, 120_000);
});
