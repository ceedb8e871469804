// Stitch counts for yarn estimates and for reading a chart row by row.
import type { Chart } from "./model";

/** Stitches of each palette colour over the whole chart, indexed like the palette. */
export function getStitchCounts(chart: Pick<Chart, "cells" | "palette">): number[] {
  const counts = new Array<number>(chart.palette.length).fill(0);
  for (let i = 0; i < chart.cells.length; i++) counts[chart.cells[i]] += 1;
  return counts;
}

/** Stitches per colour keyed by palette key, e.g. { A: 120, B: 40 }. */
export function getStitchCountsByKey(chart: Pick<Chart, "cells" | "palette">): Record<string, number> {
  const counts = getStitchCounts(chart);
  return Object.fromEntries(chart.palette.map((c, i) => [c.key, counts[i]]));
}

/** Stitches per colour for each row; index 0 is the bottom row (row 1 in trade numbering). */
export function getRowCounts(chart: Pick<Chart, "width" | "height" | "cells" | "palette">): number[][] {
  const rows: number[][] = [];
  for (let y = 0; y < chart.height; y++) {
    const counts = new Array<number>(chart.palette.length).fill(0);
    for (let x = 0; x < chart.width; x++) counts[chart.cells[y * chart.width + x]] += 1;
    rows.push(counts);
  }
  return rows;
}

/** How many colours each row uses; index 0 is the bottom row. More than two means a third yarn. */
export function getColoursPerRow(chart: Pick<Chart, "width" | "height" | "cells" | "palette">): number[] {
  return getRowCounts(chart).map((counts) => counts.filter((n) => n > 0).length);
}

export interface RowSummary {
  /** row number from the bottom, from 1 */
  row: number;
  counts: Record<string, number>;
  colours: number;
}

/** Per-row counts as a knitter reads them: trade row numbers, colours by key, top row first. */
export function getRowSummaries(chart: Pick<Chart, "width" | "height" | "cells" | "palette">): RowSummary[] {
  return getRowCounts(chart)
    .map((counts, y) => ({
      row: y + 1,
      counts: Object.fromEntries(chart.palette.map((c, i) => [c.key, counts[i]])),
      colours: counts.filter((n) => n > 0).length,
    }))
    .reverse();
}
