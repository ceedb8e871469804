import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { chooseRowUnderlay, getUnderlayValue, type UnderlayRow } from "@/lib/core/colourwork/choose-underlay";

/**
 * A row in knitting order: 'a'/'b' knitted, 'l' darned in a colour close to a (ΔE 1 to a, 9 to b),
 * 'd' darned in a colour close to b (ΔE 9 to a, 1 to b), 'e' darned, equally far from both.
 */
function parseRow(text: string): UnderlayRow {
  const n = text.length;
  const r: UnderlayRow = { fixed: new Int8Array(n), cost0: new Float64Array(n), cost1: new Float64Array(n) };
  Array.from(text).forEach((ch, i) => {
    r.fixed[i] = ch === "a" ? 0 : ch === "b" ? 1 : -1;
    r.cost0[i] = ch === "l" ? 1 : ch === "d" ? 9 : 5;
    r.cost1[i] = ch === "l" ? 9 : ch === "d" ? 1 : 5;
  });
  return r;
}
const show = (c: Uint8Array) => Array.from(c, (v) => (v === 0 ? "a" : "b")).join("");

describe("chooseRowUnderlay (limit 5)", () => {
  test.each([
    // Short row, no catch either way: the closer colour wins (l under a, d under b).
    ["aalab", false, "aaaab"],
    ["aadab", false, "aabab"],
    // Floats before colour: l next to six a would make a float of 11 a (2 catches) behind which b
    // is carried; knitted in b it splits the run into 5 and 5 (0 catches), though b is further.
    ["baaaaalaaaaa", false, "baaaaabaaaaa"],
    // The same row in the round: 5 + 5 wrap-free runs split by the b at stitch 1 and the l → b.
    ["baaaaalaaaaa", true, "baaaaabaaaaa"],
    // A row with no b at all: l under a keeps the row one colour, so b is not carried (no float).
    ["aaaaaalaaaaaa", true, "aaaaaaaaaaaaa"],
    // d in a row of a: under a nothing floats (b not carried); under b the a-runs are 6 and 6
    // (flat: 2 catches; colour saves only 8) → a.
    ["aaaaaadaaaaaa", false, "aaaaaaaaaaaaa"],
    // Round: three a, d, three a → under b the a-runs join into 6 across the seam (1 catch),
    // under a no float at all: a wins although d is closer to b.
    ["aaadaaa", true, "aaaaaaa"],
    // Flat, the same row: under b the runs are 3 and 3 (no catch), and b is closer → b.
    ["aaadaaa", false, "aaabaaa"],
  ])("%s (round: %s) → %s", (text, round, expected) => {
    expect(show(chooseRowUnderlay(parseRow(text), 5, round))).toBe(expected);
  });

  test("the choice is optimal: fewest catches, then least colour difference (checked against every assignment)", () => {
    const cell = fc.constantFrom("a", "b", "l", "d", "e");
    fc.assert(
      fc.property(
        fc.array(cell, { minLength: 1, maxLength: 14 }).filter((cells) => cells.filter((c) => c !== "a" && c !== "b").length <= 10),
        fc.integer({ min: 1, max: 6 }),
        fc.boolean(),
        (cells, limit, round) => {
          const r = parseRow(cells.join(""));
          const chosen = chooseRowUnderlay(r, limit, round);
          // knitted stitches keep their colour
          r.fixed.forEach((f, i) => {
            if (f >= 0) expect(chosen[i]).toBe(f);
          });
          const got = getUnderlayValue(r, chosen, limit, round);
          const free = [...r.fixed.keys()].filter((i) => r.fixed[i] < 0);
          let best = { catches: Infinity, colourCost: Infinity };
          for (let mask = 0; mask < 1 << free.length; mask++) {
            const c = Uint8Array.from(r.fixed, (f) => Math.max(0, f));
            free.forEach((i, k) => (c[i] = (mask >> k) & 1));
            const v = getUnderlayValue(r, c, limit, round);
            if (v.catches < best.catches || (v.catches === best.catches && v.colourCost < best.colourCost - 1e-9)) best = v;
          }
          expect(got.catches).toBe(best.catches);
          expect(got.colourCost).toBeCloseTo(best.colourCost, 9);
        },
      ),
      { numRuns: 300 },
    );
  });
});
