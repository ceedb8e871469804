// Prints, for the three garments worked by hand in tests/unit/garment/worked-garments.test.ts, the
// stitches per piece and the labour hours (P50) before this model (one piece per chart, as the live
// price read a design) and after (every piece of the garment). Figures, not assertions:
//   npx tsx scripts/bench/garment.ts
import { parseChart } from "@/lib/core/chart/format";
import { buildGarment, garmentFeatures, placeCharts } from "@/lib/core/garment";
import { estimateLabour } from "@/lib/core/labour/estimate-labour";
import { featuresFromChart } from "@/lib/core/labour/chart-features";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import type { Chart } from "@/lib/core/chart/model";
import { sizeGarment } from "@/lib/core/sizing/size-garment";
import { area, chartV1, only } from "@/tests/unit/garment/helpers";

const mittens = { garment: "mittens", size: "child", gauge: { stitchesPer10cm: 28, rowsPer10cm: 32 } };
const hat = { garment: "hat", size: "woman", gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 } };
const pullover = { garment: "pullover", size: "women-M", gauge: { stitchesPer10cm: 20, rowsPer10cm: 28 }, repeat: 8, measurements: { headCircumferenceCm: 50 } };

const cases = [
  {
    name: "child's mitten pair, stranded back, darned palm motif",
    size: mittens,
    charts: (s: ReturnType<typeof sizeGarment>) => [
      { area: "back of hand", chart: chartV1(area(s, "back of hand"), only((x, y) => ((x + y) % 2 ? "B" : "A")), s) },
      { area: "palm", chart: chartV1(area(s, "palm"), only((x, y) => (x >= 10 && x < 13 && y >= 30 && y < 33 ? "C" : "A")), s) },
    ],
    darn: ["C"],
  },
  { name: "woman's hat, crown chart", size: hat, charts: (s: ReturnType<typeof sizeGarment>) => [{ area: "crown", chart: chartV1(area(s, "crown"), only((x) => (x === 13 ? "B" : "A")), s) }], darn: [] },
  {
    name: "women's M yoke pullover, four yoke charts",
    size: pullover,
    charts: (s: ReturnType<typeof sizeGarment>) => s.charts.map((a) => ({ area: a.area, chart: chartV1(a, only((x, y) => ((x + 2 * y) % 8 < 3 ? "B" : "A")), s) })),
    darn: [],
  },
];

const hours = (m: number) => (m / 60).toFixed(2);

/** How the live price and the quote draft read a design before the garment (main's piecesFromCharts): one new, proofed, blocked piece per chart. */
function piecesFromCharts(charts: { label: string; chart: Chart }[]): PieceFeatures[] {
  return charts.map((c) => ({ ...featuresFromChart(c.chart, c.label), newDesign: true, proofRounds: 1, blocked: true }));
}
for (const c of cases) {
  const sizing = sizeGarment(c.size);
  const charts = c.charts(sizing).map((p) => ({ area: p.area, chart: parseChart(p.chart) }));
  const before = estimateLabour({ pieces: piecesFromCharts(charts.map((p) => ({ label: p.area, chart: p.chart }))) });
  const t0 = performance.now();
  const after = garmentFeatures(placeCharts(buildGarment(c.size), charts, { darn: c.darn }));
  const ms = performance.now() - t0;
  const priced = charts.reduce((s, p) => s + p.chart.width * p.chart.height, 0);
  const total = sizing.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0);
  console.log(`\n${c.name} (built, placed and read in ${ms.toFixed(0)} ms)`);
  console.log(`  pieces: ${after.pieces.map((p) => `${p.name} ${p.stitches} (plain ${p.features.plainStitches}, stranded ${p.features.strandedStitches}, darned ${p.features.duplicateStitches})`).join("; ")}`);
  console.log(`  stitches: garment ${total}; charted cells priced before ${priced}`);
  for (const stage of ["design", "knitting", "embroidery", "blocking", "finishing"] as const) {
    console.log(`  ${stage.padEnd(10)} before ${hours(before.stages[stage].p50Minutes).padStart(6)} h   after ${hours(after.labour.stages[stage].p50Minutes).padStart(6)} h`);
  }
  console.log(`  total P50  before ${hours(before.totals.p50Minutes).padStart(6)} h   after ${hours(after.labour.totals.p50Minutes).padStart(6)} h`);
  console.log(`  yarn ${after.yarn.colours.map((y) => `${y.key} ${y.metres} m`).join(", ")} (no margin)`);
}
