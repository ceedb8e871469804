// A live price note for the chart editor: which features changed and what that does to labour
// price, e.g. "+38 duplicate stitches, +4 ends: +£11.20".
import type { LabourRates } from "../labour/default-rates";
import { estimateLabour, type P80Factors } from "../labour/estimate-labour";
import { COUNT_FEATURES, fillPieceFeatures, type CountFeature, type PieceFeatures } from "../labour/piece-features";
import { STAGES, type Stage } from "../labour/stages";
import { DEFAULT_LABOUR_POLICY, getLabourLines, type LabourPolicy } from "./build-quote";
import { formatMoney } from "./format-money";

export interface ExplainChangeOptions {
  currency: string;
  hourlyRateMinor: number;
  hourlyRatesMinor?: Partial<Record<Stage, number>>;
  rates?: Partial<LabourRates>;
  p80Factors?: Partial<P80Factors>;
  labourPolicy?: LabourPolicy;
  locale?: string;
}

export interface FeatureChange {
  feature: CountFeature | "pieces" | "newDesigns";
  delta: number;
}

export interface PriceChangeExplanation {
  changes: FeatureChange[];
  minutesDelta: Record<Stage, number>;
  /** change in the labour lines, before tax when prices exclude tax */
  amountDeltaMinor: number;
  text: string;
}

const NAMES: Record<FeatureChange["feature"], [singular: string, plural: string]> = {
  pieces: ["piece", "pieces"],
  newDesigns: ["new design", "new designs"],
  proofRounds: ["proof round", "proof rounds"],
  plainStitches: ["plain stitch", "plain stitches"],
  strandedStitches: ["stranded stitch", "stranded stitches"],
  floatCatches: ["float catch", "float catches"],
  shapingRounds: ["shaping round", "shaping rounds"],
  thumbs: ["thumb", "thumbs"],
  duplicateStitches: ["duplicate stitch", "duplicate stitches"],
  ends: ["end", "ends"],
  carryCm: ["cm of carry", "cm of carry"],
};

function describeChange(c: FeatureChange): string {
  const [one, many] = NAMES[c.feature];
  const magnitude = Math.abs(c.delta);
  // Carry is a length; show it to a tenth of a centimetre.
  const shown = c.feature === "carryCm" ? String(Math.round(magnitude * 10) / 10) : String(magnitude);
  return `${c.delta > 0 ? "+" : "-"}${shown} ${magnitude === 1 ? one : many}`;
}

function totals(pieces: PieceFeatures[]): Record<FeatureChange["feature"], number> {
  const out = { pieces: pieces.length, newDesigns: 0 } as Record<FeatureChange["feature"], number>;
  for (const key of COUNT_FEATURES) out[key] = 0;
  for (const p of pieces.map(fillPieceFeatures)) {
    if (p.newDesign) out.newDesigns++;
    for (const key of COUNT_FEATURES) out[key] += p[key];
  }
  return out;
}

export function explainChange(prev: PieceFeatures[], next: PieceFeatures[], options: ExplainChangeOptions): PriceChangeExplanation {
  const policy = options.labourPolicy ?? DEFAULT_LABOUR_POLICY;
  const before = estimateLabour({ pieces: prev, rates: options.rates, p80Factors: options.p80Factors });
  const after = estimateLabour({ pieces: next, rates: options.rates, p80Factors: options.p80Factors });
  // Price both sides through the same labour lines a quote uses, so the note matches the quote.
  const price = (stages: typeof before.stages) =>
    getLabourLines({ hourlyRateMinor: options.hourlyRateMinor, hourlyRatesMinor: options.hourlyRatesMinor, labourMinutes: stages, labourPolicy: policy }).reduce(
      (s, l) => s + l.amountMinor,
      0,
    );
  const amountDeltaMinor = price(after.stages) - price(before.stages);

  const a = totals(prev);
  const b = totals(next);
  const changes: FeatureChange[] = (Object.keys(NAMES) as FeatureChange["feature"][]).flatMap((feature) => {
    const delta = b[feature] - a[feature];
    return delta !== 0 ? [{ feature, delta }] : [];
  });
  const minutesDelta = Object.fromEntries(
    STAGES.map((s) => [s, (policy === "p50" ? after.stages[s].p50Minutes - before.stages[s].p50Minutes : after.stages[s].p80Minutes - before.stages[s].p80Minutes)]),
  ) as Record<Stage, number>;

  const money = formatMoney(amountDeltaMinor, options.currency, options.locale ?? "en-GB", { signDisplay: "exceptZero" });
  const text = changes.length === 0 ? `no change: ${money}` : `${changes.map(describeChange).join(", ")}: ${money}`;
  return { changes, minutesDelta, amountDeltaMinor, text };
}
