// Labour features of one charted area: which stitches are knitted plain or stranded, which are
// added afterwards by duplicate stitch (every colour beyond a row's two knitted ones), long floats
// to catch, and ends to weave in. A first reading of the chart; the colourwork planner refines it.
import type { Chart } from "../chart/model";
import type { PieceFeatures } from "./piece-features";

export interface ChartFeatureOptions {
  /** a float longer than this many stitches is caught (common practice: about 5) */
  floatLimitStitches?: number;
}

export function featuresFromChart(chart: Pick<Chart, "width" | "height" | "cells" | "palette">, label: string, opts: ChartFeatureOptions = {}): PieceFeatures {
  const limit = Math.max(1, opts.floatLimitStitches ?? 5);
  let plain = 0;
  let stranded = 0;
  let duplicate = 0;
  let catches = 0;
  const extraColours = new Set<number>();
  for (let y = 0; y < chart.height; y++) {
    const counts = new Map<number, number>();
    for (let x = 0; x < chart.width; x++) {
      const c = chart.cells[y * chart.width + x];
      counts.set(c, (counts.get(c) ?? 0) + 1);
    }
    // The two most used colours of a row are knitted; the rest are embroidered over them.
    const ranked = [...counts.entries()].sort((a, b) => b[1] - a[1] || a[0] - b[0]);
    const knitted = new Set(ranked.slice(0, 2).map(([c]) => c));
    for (const [c, n] of ranked.slice(2)) {
      duplicate += n;
      extraColours.add(c);
    }
    const knittedCount = chart.width - ranked.slice(2).reduce((s, [, n]) => s + n, 0);
    if (knitted.size <= 1) {
      plain += knittedCount;
      continue;
    }
    stranded += knittedCount;
    // Floats: a run of one knitted colour carries the other behind it.
    let run = 0;
    let prev = -1;
    for (let x = 0; x < chart.width; x++) {
      let c = chart.cells[y * chart.width + x];
      if (!knitted.has(c)) c = ranked[0][0]; // embroidered stitches are knitted in the main colour
      run = c === prev ? run + 1 : 1;
      prev = c;
      if (run > limit && run % limit === 1) catches++;
    }
  }
  return {
    label,
    plainStitches: plain,
    strandedStitches: stranded,
    floatCatches: catches,
    duplicateStitches: duplicate,
    // Two ends per embroidered colour (start and finish), a cautious first count.
    ends: extraColours.size * 2,
  };
}
