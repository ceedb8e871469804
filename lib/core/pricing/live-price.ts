// The live price beside the chart editor: the charts read as pieces (the same reading the quote
// builder starts from), priced with the studio's policy, and what changed against a baseline.
// Pure, so the browser prices every edit without asking the server.
import type { Chart } from "../chart/model";
import { featuresFromChart } from "../labour/chart-features";
import type { PieceFeatures } from "../labour/piece-features";
import { composeQuote, type ComposedQuote, type QuotePolicy } from "./compose-quote";
import { explainChange, type PriceChangeExplanation } from "./explain-change";

export interface ChartPiece {
  label: string;
  chart: Chart;
}

/** One piece per charted area: a new design with one proof round, blocked (as the quote builder reads a design). */
export function piecesFromCharts(charts: ChartPiece[], floatLimitStitches?: number, carryLimitCm?: number): PieceFeatures[] {
  return charts.map((c) => ({
    ...featuresFromChart(c.chart, c.label, { floatLimitStitches, carryLimitCm }),
    newDesign: true,
    proofRounds: 1,
    blocked: true,
  }));
}

export interface LivePrice {
  composed: ComposedQuote;
  /** labour lines only, as explainChange words it ("+38 duplicate stitches, +4 ends: +£11.20") */
  change: PriceChangeExplanation;
  /** change of the whole quote total (tax included), in minor units */
  totalDeltaMinor: number;
}

/** Prices `after` (labour lines + design fee; no materials) and says what changed since `before`. */
export function livePrice(before: PieceFeatures[], after: PieceFeatures[], policy: QuotePolicy, designFeeMinor = 0, locale = "en-GB"): LivePrice {
  const draft = (pieces: PieceFeatures[]) => ({ pieces, materials: [], extras: [], designFeeMinor, shippingMinor: 0, discountMinor: 0 });
  const composed = composeQuote(draft(after), policy);
  const base = composeQuote(draft(before), policy);
  const change = explainChange(before, after, {
    currency: policy.currency,
    hourlyRateMinor: policy.hourlyRateMinor,
    labourPolicy: policy.labourPolicy,
    rates: policy.rates,
    p80Factors: policy.p80Factors,
    locale,
  });
  return { composed, change, totalDeltaMinor: composed.quote.totalMinor - base.quote.totalMinor };
}
