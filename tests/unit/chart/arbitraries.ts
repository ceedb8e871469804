// Shared fast-check generators for chart tests.
import fc from "fast-check";
import type { Chart, PaletteColour } from "@/lib/core/chart/model";

const KEYS = Array.from("ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789.#*+%@♥");

export const hexArb = fc
  .tuple(fc.integer({ min: 0, max: 255 }), fc.integer({ min: 0, max: 255 }), fc.integer({ min: 0, max: 255 }))
  .map(([r, g, b]) => "#" + [r, g, b].map((v) => v.toString(16).padStart(2, "0")).join("").toUpperCase());

export const paletteArb = (min = 1, max = 16): fc.Arbitrary<PaletteColour[]> =>
  fc
    .uniqueArray(fc.constantFrom(...KEYS), { minLength: min, maxLength: max })
    .chain((keys) =>
      fc.tuple(...keys.map((key) => fc.tuple(fc.string({ minLength: 1, maxLength: 12 }).filter((s) => s.trim() !== ""), hexArb).map(([name, hex]) => ({ key, name, hex })))),
    );

export const chartArb = (opts: { maxSide?: number; minColours?: number; maxColours?: number } = {}): fc.Arbitrary<Chart> =>
  fc
    .record({
      width: fc.integer({ min: 1, max: opts.maxSide ?? 16 }),
      height: fc.integer({ min: 1, max: opts.maxSide ?? 16 }),
      palette: paletteArb(opts.minColours ?? 1, opts.maxColours ?? 4),
      gauge: fc.record({ stitchesPer10cm: fc.integer({ min: 8, max: 40 }), rowsPer10cm: fc.integer({ min: 10, max: 50 }) }),
    })
    .chain(({ width, height, palette, gauge }) =>
      fc
        .array(fc.integer({ min: 0, max: palette.length - 1 }), { minLength: width * height, maxLength: width * height })
        .map((cells) => ({ width, height, palette, gauge, cells: Uint8Array.from(cells) })),
    );

/** A deep, independent copy to compare a chart against after an operation. */
export function snapshot(chart: Chart) {
  return { ...chart, gauge: { ...chart.gauge }, palette: chart.palette.map((p) => ({ ...p })), cells: Array.from(chart.cells) };
}

export function sameChart(a: Chart, b: Chart): boolean {
  return a.width === b.width && a.height === b.height && a.cells.length === b.cells.length && a.cells.every((c, i) => c === b.cells[i]);
}
