import { assertColour, cloneChart, inBounds, type Chart, type Point } from "../model";

/** Paints each listed cell with `colour`; cells outside the chart are skipped. */
export function paintCells(chart: Chart, points: readonly Point[], colour: number): Chart {
  assertColour(chart, colour);
  const out = cloneChart(chart);
  for (const p of points) {
    if (inBounds(chart, p.x, p.y)) out.cells[p.y * chart.width + p.x] = colour;
  }
  return out;
}

export function paintCell(chart: Chart, at: Point, colour: number): Chart {
  return paintCells(chart, [at], colour);
}

/** Replaces every stitch of one colour with another (a whole-chart recolour). */
export function replaceColour(chart: Chart, from: number, to: number): Chart {
  assertColour(chart, from);
  assertColour(chart, to);
  const out = cloneChart(chart);
  for (let i = 0; i < out.cells.length; i++) if (out.cells[i] === from) out.cells[i] = to;
  return out;
}
