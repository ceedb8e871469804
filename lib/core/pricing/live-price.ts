// The live price beside the chart editor: the whole garment (every stitch of every piece, from the
// commission's sizing) with the design's charts placed on it, read as the quote builder reads it,
// priced with the studio's policy, and what changed against a baseline. Pure, so the browser
// prices every edit without asking the server.
import type { Chart } from "../chart/model";
import { readDesignOnGarment, type ChartProblem, type ReadDesignOptions } from "../design-garment";
import type { PieceFeatures } from "../labour/piece-features";
import type { SizingResult } from "../sizing/sizing-result";
import { composeQuote, type ComposedQuote, type QuotePolicy } from "./compose-quote";
import { explainChange, type PriceChangeExplanation } from "./explain-change";

export interface ChartPiece {
  /** the entry's area slug ("back-of-hand", "crown" …) */
  area: string;
  label: string;
  chart: Chart;
  options?: Record<string, unknown>;
}

/**
 * The garment's pieces with the charts on it, as the quote builder's first draft reads them (design,
 * blocking and finishing per piece, never per chart), and the charts that could not be placed.
 */
export function piecesFromGarment(sizing: SizingResult, charts: ChartPiece[], opts: ReadDesignOptions = {}): { pieces: PieceFeatures[]; problems: ChartProblem[] } {
  const { pieces, problems } = readDesignOnGarment(sizing, charts, { proofRounds: 1, ...opts });
  return { pieces, problems };
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
