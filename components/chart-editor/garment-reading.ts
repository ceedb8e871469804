// Reading the whole garment for the live price: the design's charts placed on the commission's
// garment, every piece's features and the round-by-round reading. Pure (no React, no DOM), so the
// same function runs in the editor's worker (garment-worker.ts) and, where no worker can be
// started, on the page itself.
import type { RoundReading } from "@/lib/core/garment";
import { readDesignOnGarment, type ChartProblem } from "@/lib/core/design-garment";
import type { PieceFeatures } from "@/lib/core/labour/piece-features";
import type { QuotePolicy } from "@/lib/core/pricing/compose-quote";
import type { ChartPiece } from "@/lib/core/pricing/live-price";
import type { SizingResult } from "@/lib/core/sizing";

export interface LivePricing {
  policy: QuotePolicy;
  designFeeMinor: number;
  floatLimitStitches: number;
  floatLimitCm?: number;
  carryLimitCm?: number;
}

export interface GarmentRead {
  pieces: PieceFeatures[];
  problems: ChartProblem[];
  rounds: RoundReading[];
  error: string | null;
}

/** What the page posts to the worker: one reading, numbered so a stale answer can be dropped. */
export interface GarmentRequest {
  seq: number;
  sizing: SizingResult | null;
  charts: ChartPiece[];
  pricing: LivePricing;
}

/** What the worker posts back. */
export interface GarmentAnswer {
  seq: number;
  read: GarmentRead;
}

export function readGarment(sizing: SizingResult | null, charts: ChartPiece[], pricing: LivePricing): GarmentRead {
  if (!sizing) return { pieces: [], problems: [], rounds: [], error: "The design has no garment to price (no commission sizing)." };
  try {
    const r = readDesignOnGarment(sizing, charts, {
      proofRounds: 1,
      rates: pricing.policy.rates,
      floatLimitStitches: pricing.floatLimitStitches,
      ...(pricing.floatLimitCm !== undefined ? { floatLimitCm: pricing.floatLimitCm } : {}),
      ...(pricing.carryLimitCm !== undefined ? { carryLimitCm: pricing.carryLimitCm } : {}),
    });
    return { pieces: r.pieces, problems: r.problems, rounds: r.reading.rounds, error: null };
  } catch (e) {
    return { pieces: [], problems: [], rounds: [], error: e instanceof Error ? e.message : String(e) };
  }
}

/** Answers one request (the worker's whole job). */
export function answer(req: GarmentRequest): GarmentAnswer {
  return { seq: req.seq, read: readGarment(req.sizing, req.charts, req.pricing) };
}
