// Small charts written as text for the yarn tests: rows top first, as on paper, one key a stitch.
import { createChart, type Chart } from "@/lib/core/chart/model";

export const PALETTE = [
  { key: "A", name: "Cream", hex: "#F0EAD6" },
  { key: "B", name: "Navy", hex: "#1F2A44" },
  { key: "C", name: "Red", hex: "#C0392B" },
  { key: "D", name: "Gold", hex: "#D4A017" },
];

export function chartOf(rows: string[], stitchesPer10cm = 20): Chart {
  const width = rows[0].length;
  const chart = createChart(width, rows.length, { stitchesPer10cm, rowsPer10cm: 28 }, PALETTE);
  rows.forEach((text, i) => {
    const y = rows.length - 1 - i;
    [...text].forEach((ch, x) => {
      chart.cells[y * width + x] = PALETTE.findIndex((p) => p.key === ch);
    });
  });
  return chart;
}
