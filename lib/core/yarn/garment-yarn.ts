// Plain-knit yarn for a whole garment from its sizing, for the parts no chart covers.
import type { Piece, SizingResult, ChartArea } from "../sizing/sizing-result";
import { DEFAULT_TAIL_CM, getBindOffCm, getCastOnCm } from "./allowances";
import { getLoopLengthCm, getStitchWidthCm } from "./loop-length";

export interface PlainYarnOptions {
  /** chart areas whose stitches a chart estimate covers instead; they are left out here */
  chartedAreas?: string[];
  tailCm?: number;
}

export interface PieceYarn {
  name: string;
  quantity: number;
  /** plain stitches in one piece */
  stitches: number;
  /** lengths in cm for all `quantity` pieces */
  cm: { knitted: number; castOn: number; bindOff: number; tails: number };
}

export interface PlainYarnEstimate {
  loopLengthCm: number;
  pieces: PieceYarn[];
  /** sum of every piece, cm, before any margin */
  totalCm: number;
}

export function estimatePlainYarn(
  sizing: { pieces: Piece[]; charts: ChartArea[]; gauge: Pick<SizingResult["gauge"], "stitchesPer10cm"> },
  options: PlainYarnOptions = {},
): PlainYarnEstimate {
  const loop = getLoopLengthCm(sizing.gauge.stitchesPer10cm);
  const stitchW = getStitchWidthCm(sizing.gauge.stitchesPer10cm);
  const tailCm = options.tailCm ?? DEFAULT_TAIL_CM;
  const charted = new Set(options.chartedAreas ?? []);
  for (const area of charted) {
    if (!sizing.charts.some((c) => c.area === area)) {
      throw new Error(`chartedAreas: no area '${area}' on this garment (${sizing.charts.map((c) => c.area).join(", ")})`);
    }
  }
  const pieces = sizing.pieces.map((p): PieceYarn => {
    const covered = sizing.charts.filter((c) => c.piece === p.name && charted.has(c.area)).reduce((s, c) => s + c.stitches, 0);
    const stitches = Math.max(0, p.stitches - covered);
    return {
      name: p.name,
      quantity: p.quantity,
      stitches,
      cm: {
        knitted: p.quantity * stitches * loop,
        castOn: p.start === "long-tail" ? p.quantity * getCastOnCm(p.castOnWidthCm) : 0,
        bindOff: p.bindOff > 0 ? p.quantity * getBindOffCm(p.bindOff * stitchW) : 0,
        // Two ends a piece: where its yarn is joined and where it is cut.
        tails: p.quantity * 2 * tailCm,
      },
    };
  });
  const totalCm = pieces.reduce((s, p) => s + p.cm.knitted + p.cm.castOn + p.cm.bindOff + p.cm.tails, 0);
  return { loopLengthCm: loop, pieces, totalCm };
}
