// Floats of one knitted row. After underlay every stitch is one of the knitted pair (0 or 1); each
// run of one colour is a float of the other on the wrong side. Rules, decided here:
// - a colour that does not appear in the row is not carried there, so a row all in one colour has
//   no float at all (the other strand waits at the row's start);
// - flat, runs stop at the row's edges (a run from an edge still counts: the other strand is
//   carried from the edge to where it is next used);
// - in the round the row wraps: the run at the end of the round joins the run at its start.
// A float of n stitches with limit L needs ceil(n / L) - 1 catches, spread evenly.

export interface RowFloat {
  /** 0 or 1: the colour carried behind the run */
  carried: number;
  /** first stitch of the float in knitting order, from 0 (trade stitch - 1) */
  start: number;
  /** stitches spanned */
  length: number;
  /** stitches (from 0, knitting order, wrapped) at which the carried yarn is caught */
  catchAt: number[];
}

export interface RowFloatSummary {
  longest: number;
  catches: number;
  /** floats longer than the limit, with where to catch them */
  long: RowFloat[];
}

/** Catches a float of `length` stitches needs under a limit of `limit` stitches. */
export function getCatchCount(length: number, limit: number): number {
  return length > limit ? Math.ceil(length / limit) - 1 : 0;
}

/** Splits a float into catches + 1 pieces of at most `limit` stitches; returns the offsets of the catches. */
export function getCatchOffsets(length: number, limit: number): number[] {
  const k = getCatchCount(length, limit);
  const out: number[] = [];
  for (let i = 1; i <= k; i++) out.push(Math.round((i * length) / (k + 1)));
  return out;
}

/** `row` lists the knitted colour (0 or 1) of each stitch in knitting order. */
export function getRowFloats(row: ArrayLike<number>, limit: number, inTheRound: boolean): RowFloatSummary {
  const n = row.length;
  const summary: RowFloatSummary = { longest: 0, catches: 0, long: [] };
  if (n === 0) return summary;
  let first = 0;
  while (first < n && row[first] === row[0]) first++;
  if (first === n) return summary; // one colour only: the other is not carried
  // In the round, start counting at a colour change so the wrapped run is seen whole.
  const origin = inTheRound ? first : 0;
  let i = 0;
  while (i < n) {
    const colour = row[(origin + i) % n];
    let j = i;
    while (j < n && row[(origin + j) % n] === colour) j++;
    const length = j - i;
    if (length > summary.longest) summary.longest = length;
    const catches = getCatchCount(length, limit);
    if (catches > 0) {
      const start = (origin + i) % n;
      summary.catches += catches;
      summary.long.push({
        carried: 1 - colour,
        start,
        length,
        catchAt: getCatchOffsets(length, limit).map((o) => (start + o) % n),
      });
    }
    i = j;
  }
  return summary;
}

/** Longest float allowed, in stitches: the stitch limit or the length limit at this gauge, whichever is fewer. */
export function getFloatLimitStitches(stitchesPer10cm: number, limitStitches: number, limitCm: number): number {
  const byLength = Math.floor((limitCm * stitchesPer10cm) / 10 + 1e-9);
  return Math.max(1, Math.min(limitStitches, byLength));
}
