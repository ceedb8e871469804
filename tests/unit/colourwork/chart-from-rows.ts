// Test helper: a chart from rows drawn top row first, one palette key per stitch.
import { createChart, type Chart, type Gauge } from "@/lib/core/chart/model";

/** Square stitches of 0.5 cm: 2.5 cm is exactly 5 stitches or 5 rows, which keeps hand sums easy. */
export const HALF_CM_GAUGE: Gauge = { stitchesPer10cm: 20, rowsPer10cm: 20 };

export const HEX: Record<string, string> = {
  A: "#F2EAD3", // cream
  B: "#1F2A44", // navy
  C: "#B3282D", // red
  D: "#D9A441", // gold
  L: "#EFEFEA", // near-white: closest to cream
  N: "#23304A", // near-navy: closest to navy
};

export function chartFromRows(rows: string[], keys: string[], gauge: Gauge = HALF_CM_GAUGE, hex: Record<string, string> = HEX): Chart {
  const height = rows.length;
  const width = height > 0 ? Array.from(rows[0]).length : 0;
  const palette = keys.map((key) => ({ key, name: key, hex: hex[key] ?? "#808080" }));
  const chart = createChart(width, height, gauge, palette, 0);
  rows.forEach((text, i) => {
    const y = height - 1 - i;
    const cells = Array.from(text);
    if (cells.length !== width) throw new Error(`row ${i} has ${cells.length} stitches, expected ${width}`);
    cells.forEach((ch, x) => {
      if (ch === ".") return; // '.' is the first colour, for drawings that read better
      const c = keys.indexOf(ch);
      if (c < 0) throw new Error(`key ${ch} is not in ${keys.join("")}`);
      chart.cells[y * width + x] = c;
    });
  });
  return chart;
}
