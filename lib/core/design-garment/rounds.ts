// Rounds read off a garment, merged into runs a maker can follow: consecutive rounds of one part
// that knit the same colours and darn nothing are one line.
import type { RoundReading } from "../garment";

export interface RoundRun {
  piece: string;
  part: string;
  from: number;
  to: number;
  knit: string[];
  darned: number;
  catches: number;
  shaping: number;
  why: string | null;
}

/** Consecutive rounds of one part with the same knitted colours and nothing darned or explained, merged. */
export function roundRuns(rounds: RoundReading[]): RoundRun[] {
  const out: RoundRun[] = [];
  for (const r of rounds) {
    const last = out[out.length - 1];
    const plainRun = r.darned === 0 && !r.why;
    if (last && plainRun && last.why === null && last.darned === 0 && last.piece === r.piece && last.part === r.part && last.to === r.round - 1 && last.knit.join() === r.knit.join()) {
      last.to = r.round;
      last.catches += r.catches;
      last.shaping += r.shaping ? 1 : 0;
      continue;
    }
    out.push({ piece: r.piece, part: r.part, from: r.round, to: r.round, knit: r.knit, darned: r.darned, catches: r.catches, shaping: r.shaping ? 1 : 0, why: r.why ?? null });
  }
  return out;
}
