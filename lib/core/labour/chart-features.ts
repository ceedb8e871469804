// Labour features of one charted area, read from the colourwork planner: the knitted pair for the
// whole piece, which stitches are knitted plain (one colour in the row) or stranded (two), the
// stitches added afterwards by duplicate stitch, the float catches, and the ends and carry of the
// planned darning route. The same reading serves the quote on the server and the live price in
// the browser.
import type { Chart } from "../chart/model";
import { planColours } from "../colourwork/colour-plan";
import { planDarning } from "../colourwork/darning-plan";
import type { PieceFeatures } from "./piece-features";

export interface ChartFeatureOptions {
  /** a float longer than this many stitches is caught (common practice: about 5) */
  floatLimitStitches?: number;
  /** longest carry on the wrong side between darned stitches, cm (common practice: about 2.5) */
  carryLimitCm?: number;
  inTheRound?: boolean;
}

export function featuresFromChart(chart: Chart, label: string, opts: ChartFeatureOptions = {}): PieceFeatures {
  const colourOptions = {
    ...(opts.floatLimitStitches !== undefined ? { floatLimitStitches: Math.max(1, Math.round(opts.floatLimitStitches)) } : {}),
    ...(opts.inTheRound !== undefined ? { inTheRound: opts.inTheRound } : {}),
  };
  const colours = planColours(chart, colourOptions);
  let plain = 0;
  let stranded = 0;
  // Every stitch is knitted first (darned stitches over their underlay colour).
  for (const row of colours.knittedRows) {
    if (new Set(row).size <= 1) plain += row.length;
    else stranded += row.length;
  }
  const darning =
    colours.darn.length > 0
      ? planDarning(chart, { darn: colours.darn, ...(opts.carryLimitCm !== undefined ? { carryLimitCm: opts.carryLimitCm } : {}) }).totals
      : { stitches: 0, ends: 0, carryCm: 0 };
  return {
    label,
    plainStitches: plain,
    strandedStitches: stranded,
    floatCatches: colours.totals.catches,
    duplicateStitches: darning.stitches,
    ends: darning.ends,
    carryCm: darning.carryCm,
  };
}
