// Counts every stitch knitted in a piece as it is worked, round by round, for yarn estimates.
// A shaping round counts the stitches it leaves (each new loop is one stitch's worth of yarn).
export class Tally {
  total = 0;
  rows = 0;
  current: number;
  /** stitches of each round, in order (what the garment model reads) */
  counts: number[] = [];
  constructor(start: number) {
    this.current = start;
  }
  /** n rounds on the current count */
  plain(n: number): void {
    if (n <= 0) return;
    this.total += n * this.current;
    this.rows += n;
    for (let i = 0; i < n; i++) this.counts.push(this.current);
  }
  /** one shaping round leaving `after` stitches */
  shape(after: number): void {
    this.current = after;
    this.total += after;
    this.rows += 1;
    this.counts.push(after);
  }
  /** rows that are not whole rounds (short rows), each row's stitches, after which round */
  shortRows: { afterRound: number; stitches: number[] }[] = [];
  /** stitches worked in partial rows (short rows) that are not whole rounds; `rows` lists each row's */
  partial(stitches: number, rows: number[] = [stitches]): void {
    this.total += stitches;
    this.shortRows.push({ afterRound: this.counts.length, stitches: rows });
  }
  /** stitches put on hold or cast on between rounds (no yarn knitted) */
  set(count: number): void {
    this.current = count;
  }
}

/** Top shaping that takes `perRound` stitches a decrease round, every other round while more
 * than half the stitches remain, then every round, until fewer than `perRound + min` remain. */
export function planBandDecreases(start: number, perRound: number, min: number) {
  let cur = start;
  let alternate = 0;
  let everyRound = 0;
  const counts: number[] = [];
  while (cur - perRound >= min) {
    const slow = cur > start / 2;
    cur -= perRound;
    counts.push(cur);
    if (slow) {
      counts.push(cur);
      alternate += 1;
    } else everyRound += 1;
  }
  return { alternate, everyRound, decreases: alternate + everyRound, rows: counts.length, counts, remaining: cur };
}
