import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { getCatchCount, getCatchOffsets, getCatchStitches, getFloatLimitStitches, getRowFloats, getStaggeredOffsets } from "@/lib/core/colourwork/row-floats";

/** A knitted row in knitting order from a drawing of 'a' and 'b'. */
const row = (s: string) => Array.from(s, (ch) => (ch === "a" ? 0 : 1));

describe("getCatchCount: ceil(n / L) - 1 catches for a float of n stitches", () => {
  test.each([
    [1, 5, 0],
    [5, 5, 0], // exactly at the limit: fine
    [6, 5, 1],
    [10, 5, 1], // two pieces of 5
    [11, 5, 2],
    [15, 5, 2],
    [16, 5, 3],
    [7, 3, 2],
  ])("n=%i, L=%i → %i", (n, limit, catches) => {
    expect(getCatchCount(n, limit)).toBe(catches);
  });

  test("catch offsets split the float into pieces no longer than the limit", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 200 }), fc.integer({ min: 1, max: 12 }), (n, limit) => {
        const offsets = getCatchOffsets(n, limit);
        expect(offsets).toHaveLength(getCatchCount(n, limit));
        const cuts = [0, ...offsets, n];
        for (let i = 1; i < cuts.length; i++) {
          expect(cuts[i] - cuts[i - 1]).toBeGreaterThan(0);
          expect(cuts[i] - cuts[i - 1]).toBeLessThanOrEqual(limit);
        }
      }),
    );
  });
});

describe("getFloatLimitStitches: the stitch limit or 2.5 cm at gauge, whichever is fewer", () => {
  test.each([
    // (common practice: ~1 in / 2.5 cm or 5 stitches)
    [20, 5, 2.5, 5], // 2.5 cm × 2 sts/cm = 5
    [28, 5, 2.5, 5], // 7 stitches in 2.5 cm, but 5 is fewer
    [12, 5, 2.5, 3], // 2.5 × 1.2 = 3
    [14, 5, 2.5, 3], // 2.5 × 1.4 = 3.5 → 3 whole stitches
    [32, 7, 2.5, 7], // a studio setting of 7 stitches at a fine gauge (8 in 2.5 cm)
    [4, 5, 2.5, 1], // jumbo yarn: less than one stitch in 2.5 cm still allows 1
  ])("%d sts/10 cm, %d sts, %d cm → %d", (gauge, stitches, cm, expected) => {
    expect(getFloatLimitStitches(gauge, stitches, cm)).toBe(expected);
  });
});

describe("getRowFloats", () => {
  // Rows are written in knitting order (first character = stitch 1); limit 5 unless stated.
  test.each([
    // one colour only: the other strand is not carried, so nothing floats
    ["aaaaaaaaaaaa", false, 0, 0],
    ["aaaaaaaaaaaa", true, 0, 0],
    // b at stitch 1 then six a: the a-run is a float of 6 → 1 catch, flat or round
    ["baaaaaa", false, 6, 1],
    ["baaaaaa", true, 6, 1],
    // four a, b, three a: flat the runs are 4 and 3; in the round 3 + 4 join into 7 → 1 catch
    ["aaaabaaa", false, 4, 0],
    ["aaaabaaa", true, 7, 1],
    // five a, b, five a: flat 5 and 5 are fine; round 10 → ceil(10/5) - 1 = 1 catch
    ["aaaaabaaaaa", false, 5, 0],
    ["aaaaabaaaaa", true, 10, 1],
    // alternating stitches never float more than one
    ["abababab", true, 1, 0],
    // a run of 12 b behind which a is carried: 2 catches; plus an a-run of 2
    ["aabbbbbbbbbbbb", false, 12, 2],
  ])("%s (round: %s) → longest %i, catches %i", (text, round, longest, catches) => {
    const f = getRowFloats(row(text), 5, round);
    expect(f.longest).toBe(longest);
    expect(f.catches).toBe(catches);
  });

  test("a wrapped float starts after the break and its catches wrap past the end", () => {
    // stitch 1..3 a, 4 b, 5..8 a: the round float starts at stitch 5 (index 4) and runs 7 stitches.
    const f = getRowFloats(row("aaabaaaa"), 5, true);
    expect(f.long).toEqual([{ carried: 1, start: 4, length: 7, catchAt: [0] }]); // round(7/2) = 4 → index (4 + 4) % 8 = 0
  });

  test("the carried colour is the one that is not knitted in the run", () => {
    const f = getRowFloats(row("abbbbbbba"), 5, false);
    expect(f.long).toHaveLength(1);
    expect(f.long[0]).toMatchObject({ carried: 0, start: 1, length: 7 });
  });

  test("catches over the row equal the sum over runs, and flat never needs more than the round", () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 1 }), { minLength: 1, maxLength: 60 }), fc.integer({ min: 1, max: 8 }), (r, limit) => {
        const flat = getRowFloats(r, limit, false);
        const round = getRowFloats(r, limit, true);
        expect(flat.long.reduce((s, f) => s + getCatchCount(f.length, limit), 0)).toBe(flat.catches);
        expect(round.catches).toBeGreaterThanOrEqual(flat.catches);
        expect(round.longest).toBeGreaterThanOrEqual(flat.longest);
        for (const f of [...flat.long, ...round.long]) expect(f.length).toBeGreaterThan(limit);
      }),
    );
  });
});

describe("staggered catches: never on the same stitch two rows running", () => {
  test.each([
    // 7 stitches, limit 5: one catch, at 4 (pieces 4 + 3); the next row keeps off 4 → 3 (3 + 4).
    [7, 5, [4], [3]],
    // 10 stitches, limit 5: the only single catch is at 5; the next row needs two (3 + 3 + 4 → 3, 6).
    [10, 5, [5], [3, 6]],
    // 12 stitches, limit 5: catches at 4 and 8; the next row 3 and 7 (3 + 4 + 4 + 1 is no better).
    [12, 5, [4, 8], [3, 7]],
  ])("a float of %i stitches, limit %i: %j, then %j", (n, limit, first, second) => {
    expect(getCatchOffsets(n, limit)).toEqual(first);
    expect(getStaggeredOffsets(0, n, limit, 40, new Set(first))).toEqual(second);
  });

  test("in a row: the row below's catches of the same colour are kept off, the other colour's are not", () => {
    // a run of 7 a (b carried) from stitch 2 in a 10-stitch round
    const r = row("baaaaaaabb");
    const plain = getRowFloats(r, 5, true);
    expect(plain.long[0]).toMatchObject({ carried: 1, start: 1, length: 7, catchAt: [5] });
    const below = getCatchStitches(plain);
    expect(getRowFloats(r, 5, true, below).long[0].catchAt).toEqual([4]);
    // catches of colour a below do not matter to a float of b
    expect(getRowFloats(r, 5, true, [new Set([5]), new Set()]).long[0].catchAt).toEqual([5]);
  });

  test("the same float row after row: no catch repeats in consecutive rows, every piece within the limit", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 60 }),
        fc.integer({ min: 2, max: 9 }),
        fc.integer({ min: 0, max: 80 }),
        fc.integer({ min: 1, max: 30 }),
        fc.integer({ min: 2, max: 8 }),
        (n, limit, start0, extra, rows) => {
          const rowLength = n + extra;
          const start = start0 % rowLength;
          let below = new Set<number>();
          for (let k = 0; k < rows; k++) {
            const offsets = getStaggeredOffsets(start, n, limit, rowLength, below);
            const cuts = [0, ...offsets, n];
            for (let i = 1; i < cuts.length; i++) {
              expect(cuts[i] - cuts[i - 1]).toBeGreaterThan(0);
              expect(cuts[i] - cuts[i - 1]).toBeLessThanOrEqual(limit);
            }
            const here = new Set(offsets.map((o) => (start + o) % rowLength));
            for (const s of here) expect(below.has(s), `row ${k + 1} catches stitch ${s} again`).toBe(false);
            expect(offsets.length).toBeLessThanOrEqual(getCatchCount(n, limit) + 1);
            below = here;
          }
        },
      ),
      { numRuns: 400 },
    );
  });

  test("whole rows of floats in the round, the same pattern every row: no repeats, pieces within the limit", () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(0, 1), { minLength: 2, maxLength: 60 }), fc.integer({ min: 2, max: 7 }), (cells, limit) => {
        let below: ReturnType<typeof getCatchStitches> = [new Set(), new Set()];
        for (let k = 0; k < 4; k++) {
          const f = getRowFloats(cells, limit, true, below);
          for (const fl of f.long) {
            const cuts = [0, ...fl.catchAt.map((s) => (s - fl.start + cells.length) % cells.length), fl.length];
            for (let i = 1; i < cuts.length; i++) expect(cuts[i] - cuts[i - 1]).toBeLessThanOrEqual(limit);
            for (const s of fl.catchAt) expect(below[fl.carried].has(s)).toBe(false);
          }
          below = getCatchStitches(f);
        }
      }),
      { numRuns: 300 },
    );
  });
});
