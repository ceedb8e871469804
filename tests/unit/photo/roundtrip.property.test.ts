// Property: a chart drawn to pixels at the gauge's proportions and read back is the same chart —
// with its palette exactly, and with only the number of colours after matching colours one to one.
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import type { ChartV1 } from "@/lib/core/chart/format";
import { hexToLab } from "@/lib/core/colourwork/ciede2000";
import { chartToPixels, photoToChart } from "@/lib/core/photo";
import { agreementMatched } from "./synth";

const KEYS = Array.from("ABCDEFGHIJKLMNOPQRSTUVWXYZ.#*+♥");
const hexArb = fc.integer({ min: 0, max: 0xffffff }).map((n) => "#" + n.toString(16).padStart(6, "0").toUpperCase());

/** Palettes of 2 to 6 colours at least `minLab` apart in CIELAB (distinct yarns). */
const paletteArb = (minLab: number) =>
  fc
    .uniqueArray(hexArb, { minLength: 2, maxLength: 6 })
    .filter((hexes) => hexes.every((a, i) => hexes.every((b, j) => j <= i || Math.hypot(...sub(hexToLab(a), hexToLab(b))) >= minLab)))
    .chain((hexes) => fc.shuffledSubarray(KEYS, { minLength: hexes.length, maxLength: hexes.length }).map((keys) => hexes.map((hex, i) => ({ key: keys[i], name: `Yarn ${i + 1}`, hex }))));

function sub(a: { L: number; a: number; b: number }, b: { L: number; a: number; b: number }): [number, number, number] {
  return [a.L - b.L, a.a - b.a, a.b - b.b];
}

const chartArb = (minLab: number) =>
  fc
    .record({
      width: fc.integer({ min: 1, max: 24 }),
      height: fc.integer({ min: 1, max: 24 }),
      palette: paletteArb(minLab),
      gauge: fc.record({ stitchesPer10cm: fc.integer({ min: 14, max: 36 }), rowsPer10cm: fc.integer({ min: 18, max: 48 }) }),
      cellWidth: fc.integer({ min: 1, max: 12 }),
    })
    .chain(({ width, height, palette, gauge, cellWidth }) =>
      fc.array(fc.array(fc.constantFrom(...palette.map((p) => p.key)), { minLength: width, maxLength: width }), { minLength: height, maxLength: height }).map((cells) => ({
        chart: { version: 1 as const, width, height, gauge, palette, rows: cells.map((r) => r.join("")) } satisfies ChartV1,
        // A stitch is wider than tall: height ÷ width = stitches ÷ rows per 10 cm.
        cellWidth,
        cellHeight: Math.max(1, Math.round((cellWidth * gauge.stitchesPer10cm) / gauge.rowsPer10cm)),
      })),
    );

describe("drawn chart read back", () => {
  test("with the palette: the same chart, exactly", () => {
    fc.assert(
      fc.property(chartArb(1), ({ chart, cellWidth, cellHeight }) => {
        const img = chartToPixels(chart, cellWidth, cellHeight);
        const { chart: back } = photoToChart(img, { width: chart.width, height: chart.height, gauge: chart.gauge, palette: chart.palette });
        expect(back).toEqual(chart);
      }),
      { numRuns: 150, seed: 19 },
    );
  });

  test("with only the number of colours: the same chart after matching colours one to one", () => {
    fc.assert(
      fc.property(chartArb(8), ({ chart, cellWidth, cellHeight }) => {
        const img = chartToPixels(chart, cellWidth, cellHeight);
        const { chart: back } = photoToChart(img, { width: chart.width, height: chart.height, gauge: chart.gauge, colours: chart.palette.length });
        expect(back.palette).toHaveLength(chart.palette.length);
        expect(agreementMatched(chart, back)).toBe(1);
      }),
      { numRuns: 150, seed: 19 },
    );
  });
});
