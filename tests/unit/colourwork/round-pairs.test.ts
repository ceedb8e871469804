import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { ColourworkError } from "@/lib/core/colourwork/colourwork-error";
import {
  chooseRoundPairs,
  chooseSinglePair,
  planRoundPairs,
  resolveRoundPiece,
  RoundPairCosts,
  type HeldPair,
  type RoundPairsOptions,
  type RoundPairsPlan,
} from "@/lib/core/colourwork/round-pairs";
import { readFileSync } from "node:fs";
import { parseChart } from "@/lib/core/chart/format";
import { planColours } from "@/lib/core/colourwork/colour-plan";
import { HALF_CM_GAUGE, HEX } from "./chart-from-rows";

const KEYS = ["A", "B", "C", "D"];
const palette = (keys: string[] = KEYS) => keys.map((key) => ({ key, hex: HEX[key] }));
/** Rounds drawn bottom round first, one key per stitch in knitting order. */
const piece = (rounds: string[], keys: string[] = KEYS) => ({ rounds: rounds.map((r) => Array.from(r)), palette: palette(keys), gauge: HALF_CM_GAUGE });

// Default rates: 30 s per duplicate stitch, 3 min per end, 5 s per cm carried, 3 s per catch.
// Gauge 20 × 20 per 10 cm: stitches and rounds 0.5 cm, carry limit 2.5 cm = 5 stitches.
describe("planRoundPairs: worked by hand", () => {
  const rounds = ["AAAAAAAA", "ABBAABBA", "ACCAACCA", "ABCAABCA", "AAAAAAAA"];

  test("changes the pair where a new colour takes over and darns only in three-colour rounds", () => {
    const plan = planRoundPairs(piece(rounds, ["A", "B", "C"]));
    expect(plan.rounds.map((r) => r.pair.join(""))).toEqual(["AB", "AB", "AC", "AC", "AC"]);
    expect(plan.rounds.map((r) => r.knit.join(""))).toEqual(["A", "AB", "AC", "AC", "A"]);
    expect(plan.rounds[2].reason).toBe("pair changes here: C appears; only two colours: knitted, nothing darned");
    expect(plan.rounds[2].joined).toEqual(["C"]);
    expect(plan.rounds[2].cut).toEqual(["B"]);
    // Round 4 darns its two B (stitches 2 and 6) instead of joining B again (6 min for two ends):
    // 2 × 30 s + one strand (2 ends, 6 min) + 2 cm carried (4 stitches apart, 10 s) = 7.17 min.
    expect(plan.rounds[3].darned).toEqual([
      { stitch: 2, colour: "B", onto: expect.any(String) },
      { stitch: 6, colour: "B", onto: expect.any(String) },
    ]);
    // Totals: A and B joined in round 1, C in round 3, each cut once (6 ends, 18 min); B idle in
    // round 1 and C in round 5 are carried up the inside (0.5 cm each, 5 s); darning 7.17 min.
    // 18 + 5/60 + 7.1667 = 25.25 min.
    expect(plan.totals).toEqual({
      rounds: 5,
      stitches: 40,
      darnedStitches: 2,
      joins: 3,
      cuts: 3,
      knitEnds: 6,
      darningEnds: 2,
      ends: 8,
      carryCm: 3,
      catches: 0,
      minutes: 25.3,
    });
    expect(plan.plannedMinutes).toBe(25.3);
    expect(plan.darning).toEqual([{ key: "B", stitches: 2, strands: 1, ends: 2, carryCm: 2 }]);
    // The old model holds A and B throughout: 12 min of ends, four C darned in round 3 (one strand:
    // 2 min + 6 min + 1.5 cm) and two in round 4 continuing it (1 min + 2 cm), idle B 2 × 0.5 cm:
    // 12 + 8.125 + 1.1667 + 0.0833 = 21.375 min — cheaper, but it darns in a two-colour round.
    expect(plan.singlePair).toEqual({ pair: ["A", "B"], minutes: 21.4, keepsRules: false });
  });

  test("a pin fixes the pair for its rounds and says so", () => {
    const plan = planRoundPairs(piece(rounds, ["A", "B", "C"]), { pins: [{ fromRound: 3, toRound: 4, pair: ["B", "A"] }] });
    expect(plan.rounds.map((r) => r.pair.join(""))).toEqual(["AB", "AB", "AB", "AB", "AB"]);
    expect(plan.rounds[2].reason).toBe("pinned by the maker; 4 C darned");
    expect(plan.rounds[2].pinned).toBe(true);
    expect(plan.totals.darnedStitches).toBe(6);
  });

  test("a colour the maker wants darned is darned even in a two-colour round", () => {
    const plan = planRoundPairs(piece(["AAAA", "ABBA", "AAAA"], ["A", "B", "C"]), { darn: ["B"] });
    expect(plan.rounds[1].darned.map((d) => d.colour)).toEqual(["B", "B"]);
    expect(plan.rounds[1].reason).toBe("darned as the maker asked: 2 B");
    expect(plan.rounds.every((r) => !r.pair.includes("B"))).toBe(true);
  });

  test("a two-colour piece is knitted throughout, nothing darned", () => {
    const plan = planRoundPairs(piece(["AAAA", "ABAB", "BBAA"], ["A", "B"]));
    expect(plan.totals.darnedStitches).toBe(0);
    expect(plan.rounds[1].reason).toBe("only two colours: knitted, nothing darned");
    expect(plan.totals.knitEnds).toBe(4);
  });

  test("rounds of different lengths (shaping) and an empty piece", () => {
    const plan = planRoundPairs(piece(["ABABABAB", "ABCABC", "AAAA"], ["A", "B", "C"]));
    expect(plan.rounds.map((r) => r.stitches)).toEqual([8, 6, 4]);
    expect(plan.totals.stitches).toBe(18);
    const none = planRoundPairs(piece([], ["A", "B"]));
    expect(none.rounds).toEqual([]);
    expect(none.totals.minutes).toBe(0);
  });

  test("reasons name colours by their palette names when given", () => {
    const named = piece(rounds, ["A", "B", "C"]);
    named.palette = named.palette.map((p, i) => ({ ...p, name: ["cream", "navy", "blue"][i] }));
    expect(planRoundPairs(named).rounds[2].reason).toBe("pair changes here: blue appears; only two colours: knitted, nothing darned");
  });

  test("one colour left to knit: it is held alone and everything else is darned over it", () => {
    const plan = planRoundPairs(piece(["AAAA", "ABBA", "", "BBBB"], ["A", "B"]), { darn: ["B"] });
    expect(plan.rounds.map((r) => r.pair.join(""))).toEqual(["A", "A", "A", "A"]);
    expect(plan.rounds.map((r) => r.darned.length)).toEqual([0, 2, 0, 4]);
    expect(plan.rounds[3].darned.every((d) => d.onto === "A")).toBe(true);
    expect(plan.totals).toMatchObject({ joins: 1, cuts: 1, darnedStitches: 6 });
  });

  test("route: false skips the whole-piece route; the totals keep the estimate", () => {
    const plan = planRoundPairs(piece(rounds, ["A", "B", "C"]), { route: false });
    expect(plan.darning).toEqual([]);
    expect(plan.totals.darningEnds).toBe(plan.planned.darningEnds);
    expect(plan.totals.minutes).toBe(plan.plannedMinutes);
  });

  test("palette indices work as colour names", () => {
    const plan = planRoundPairs({ rounds: [[0, 1, 0, 1]], palette: palette(["A", "B"]), gauge: HALF_CM_GAUGE }, { pins: [{ fromRound: 1, toRound: 1, pair: [1, 0] }] });
    expect(plan.rounds[0].pair).toEqual(["A", "B"]);
  });
});

describe("planRoundPairs on the fixture mitten, read as whole rounds", () => {
  test("one pair for the chart darns 53 stitches, 22 of them in rounds of two colours; round by round none there, and fewer in all", () => {
    const chart = parseChart(JSON.parse(readFileSync("tests/fixtures/charts/mitten-left.json", "utf8")));
    const rounds = Array.from({ length: chart.height }, (_, y) => Array.from({ length: chart.width }, (_, k) => chart.cells[y * chart.width + (chart.width - 1 - k)]));
    const old = planColours(chart);
    const inTwoColourRounds = rounds.reduce((sum, round) => (new Set(round).size > 2 ? sum : sum + round.filter((c) => !old.knit.includes(chart.palette[c].key)).length), 0);
    expect(old.darnedStitches).toBe(53);
    expect(inTwoColourRounds).toBe(22);
    const plan = planRoundPairs({ rounds, palette: chart.palette, gauge: chart.gauge });
    plan.rounds.forEach((r, i) => {
      if (new Set(rounds[i]).size <= 2) expect(r.darned).toEqual([]);
    });
    expect(plan.totals.darnedStitches).toBeLessThanOrEqual(53 - 22);
    expect(plan.plannedMinutes).toBeLessThan(plan.singlePair!.minutes);
  });
});

describe("planRoundPairs: bad input names the place", () => {
  test.each<[unknown, unknown, RegExp]>([
    [piece(["AAXA"], ["A", "B"]), {}, /round 1, stitch 3/],
    [piece(["AB"], ["A", "B"]), { pins: [{ fromRound: 1, toRound: 3, pair: ["A", "B"] }] }, /options\.pins\[0\]\.toRound/],
    [piece(["AB"], ["A", "B"]), { pins: [{ fromRound: 1, toRound: 1, pair: ["A", "A"] }] }, /two different colours/],
    [piece(["AB", "AB"], ["A", "B", "C"]), { pins: [{ fromRound: 1, toRound: 2, pair: ["A", "B"] }, { fromRound: 2, toRound: 2, pair: ["A", "C"] }] }, /round 2 is already pinned/],
    [piece(["AB"], ["A", "B"]), { darn: ["A", "B"] }, /at least one colour must be knitted/],
    [piece(["AB"], ["A", "B"]), { darn: ["B"], pins: [{ fromRound: 1, toRound: 1, pair: ["A", "B"] }] }, /'B' is also to be darned/],
    [{ rounds: "x" }, {}, /piece\.rounds/],
    [piece(["AB"], ["A", "B"]), { floatLimitStitches: 0 }, /options\.floatLimitStitches/],
    [piece(Array.from({ length: 251 }, () => "A".repeat(1000)), ["A", "B"]), {}, /251000 stitches; at most 250000/],
  ])("%#", (input, options, message) => {
    expect(() => planRoundPairs(input, options)).toThrow(ColourworkError);
    expect(() => planRoundPairs(input, options)).toThrow(message);
  });
});

// ---------------------------------------------------------------------------------------------
// Exhaustive check and properties on small generated pieces

const smallPiece = fc
  .record({
    colours: fc.integer({ min: 2, max: 4 }),
    rounds: fc.integer({ min: 1, max: 5 }),
    lengths: fc.array(fc.integer({ min: 1, max: 9 }), { minLength: 5, maxLength: 5 }),
    cells: fc.array(fc.integer({ min: 0, max: 99 }), { minLength: 45, maxLength: 45 }),
    skew: fc.integer({ min: 0, max: 3 }),
    limit: fc.integer({ min: 2, max: 5 }),
    inTheRound: fc.boolean(),
  })
  .map(({ colours, rounds, lengths, cells, skew, limit, inTheRound }) => {
    // skew makes colour 0 common, as a main colour is
    const pick = (v: number) => (v < skew * 20 ? 0 : v % colours);
    const rs = Array.from({ length: rounds }, (_, r) => Array.from({ length: lengths[r] }, (_, s) => KEYS[pick(cells[r * 9 + s])]));
    return { input: { rounds: rs, palette: palette(KEYS.slice(0, colours)), gauge: HALF_CM_GAUGE }, options: { floatLimitStitches: limit, inTheRound } as RoundPairsOptions };
  });

const withExtras = fc
  .tuple(smallPiece, fc.integer({ min: 0, max: 3 }), fc.integer({ min: 0, max: 99 }), fc.integer({ min: 0, max: 99 }), fc.boolean())
  .map(([p, mode, x, y, force]) => {
    const R = p.input.rounds.length;
    const k = p.input.palette.length;
    const options = { ...p.options };
    if (mode === 1 || mode === 3) {
      const from = (x % R) + 1;
      const to = from + (y % (R - from + 1));
      const a = x % k;
      const b = (a + 1 + (y % (k - 1))) % k;
      options.pins = [{ fromRound: from, toRound: to, pair: [KEYS[a], KEYS[b]] }];
    }
    if ((mode === 2 || mode === 3) && force && k >= 3) {
      const pinned = new Set((options.pins ?? []).flatMap((pin) => pin.pair));
      const c = KEYS.slice(0, k).find((key, i) => i > 0 && !pinned.has(key));
      if (c) options.darn = [c];
    }
    return { input: p.input, options };
  });

/** Every sequence of held pairs, checked against the rules independently of the planner. */
function exhaustiveBest(costs: RoundPairCosts, pinsAndRules: (r: number, p: HeldPair) => boolean): number {
  const R = costs.piece.rounds.length;
  let best = Infinity;
  const seq: HeldPair[] = [];
  const walk = (r: number) => {
    if (r === R) {
      best = Math.min(best, costs.sequenceMinutes(seq));
      return;
    }
    for (const p of costs.pairs) {
      if (!pinsAndRules(r, p)) continue;
      seq.push(p);
      walk(r + 1);
      seq.pop();
    }
  };
  walk(0);
  return best;
}

function ruleCheck(input: { rounds: string[][] }, options: RoundPairsOptions, keys: string[]) {
  return (r: number, p: HeldPair): boolean => {
    const pairKeys = p.map((c) => keys[c]);
    for (const pin of options.pins ?? []) {
      if (r + 1 >= pin.fromRound && r + 1 <= pin.toRound) return pairKeys.length === 2 && pin.pair.every((c) => pairKeys.includes(String(c)));
    }
    const forced = new Set((options.darn ?? []).map(String));
    const need = [...new Set(input.rounds[r])].filter((c) => !forced.has(c));
    return need.length > 2 || need.every((c) => pairKeys.includes(c));
  };
}

function checkPlan(plan: RoundPairsPlan, input: { rounds: string[][] }, options: RoundPairsOptions) {
  const forced = new Set((options.darn ?? []).map(String));
  plan.rounds.forEach((round, r) => {
    expect(round.knit.length).toBeLessThanOrEqual(2);
    expect(round.pair.length).toBeLessThanOrEqual(2);
    for (const k of round.knit) expect(round.pair).toContain(k);
    for (const pin of options.pins ?? []) {
      if (r + 1 >= pin.fromRound && r + 1 <= pin.toRound) expect([...round.pair].sort()).toEqual(pin.pair.map(String).sort());
    }
    const darnedAt = new Map(round.darned.map((d) => [d.stitch, d]));
    input.rounds[r].forEach((colour, s) => {
      const d = darnedAt.get(s + 1);
      if (d) {
        expect(d.colour).toBe(colour);
        expect(round.knit).toContain(d.onto);
      } else {
        expect(forced.has(colour)).toBe(false);
        expect(round.knit).toContain(colour);
      }
    });
    const colours = new Set(input.rounds[r].filter((c) => !forced.has(c)));
    if (colours.size <= 2 && !round.pinned) expect(round.darned.filter((d) => !forced.has(d.colour))).toEqual([]);
  });
}

describe("planRoundPairs: optimal and within the rules", () => {
  test("pairs sharing a round's pattern of knitted stitches are priced as if each were worked out alone", () => {
    fc.assert(
      fc.property(withExtras, ({ input, options }) => {
        const costs = new RoundPairCosts(resolveRoundPiece(input, options));
        const rates = costs.piece.rates;
        const h = 10 / HALF_CM_GAUGE.rowsPer10cm;
        for (let r = 0; r < input.rounds.length; r++) {
          for (const p of costs.pairs) {
            const w = costs.roundWork(r, p);
            const alone = (w.darned * rates.secondsPerDuplicateStitch + w.catches * rates.secondsPerFloatCatch + w.idle * h * rates.secondsPerCarryCm) / 60;
            expect(costs.roundMinutes(r, p)).toBeCloseTo(alone, 9);
          }
        }
      }),
      { numRuns: 100 },
    );
  });

  test("the dynamic programme finds the same least minutes as trying every sequence of pairs", () => {
    fc.assert(
      fc.property(withExtras, ({ input, options }) => {
        const costs = new RoundPairCosts(resolveRoundPiece(input, options));
        const dp = chooseRoundPairs(costs);
        const best = exhaustiveBest(costs, ruleCheck(input, options, costs.piece.keys));
        expect(dp.minutes).toBeCloseTo(best, 9);
        expect(costs.sequenceMinutes(dp.sequence)).toBeCloseTo(best, 9);
      }),
      { numRuns: 200 },
    );
  });

  test("at most two knitted colours, pins kept, every stitch knitted in its colour or darned over a knitted one", () => {
    fc.assert(
      fc.property(withExtras, ({ input, options }) => {
        checkPlan(planRoundPairs(input, options), input, options);
      }),
      { numRuns: 200 },
    );
  });

  test("never dearer than the best single pair that keeps the rules (the old model)", () => {
    fc.assert(
      fc.property(withExtras, ({ input, options }) => {
        const costs = new RoundPairCosts(resolveRoundPiece(input, options));
        const dp = chooseRoundPairs(costs);
        const single = chooseSinglePair(costs);
        if (single?.bestKeepingRules) expect(dp.minutes).toBeLessThanOrEqual(single.bestKeepingRules.minutes + 1e-9);
        if (single?.keepsRules) expect(dp.minutes).toBeLessThanOrEqual(single.minutes + 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  test("the totals add up, and agree with the minutes planned but for the route and the staggering", () => {
    fc.assert(
      fc.property(withExtras, ({ input, options }) => {
        const plan = planRoundPairs(input, options);
        const costs = new RoundPairCosts(resolveRoundPiece(input, options));
        const rates = costs.piece.rates;
        const t = plan.totals;
        expect(t.joins).toBe(t.cuts);
        expect(t.knitEnds).toBe(t.joins + t.cuts);
        expect(t.ends).toBe(t.knitEnds + t.darningEnds);
        expect(t.darnedStitches).toBe(plan.rounds.reduce((s, r) => s + r.darned.length, 0));
        expect(t.catches).toBe(plan.rounds.reduce((s, r) => s + r.catches, 0));
        expect(t.darningEnds).toBe(plan.darning.reduce((s, d) => s + d.ends, 0));
        const minutes = (ends: number, carry: number, catches: number) =>
          (t.darnedStitches * rates.secondsPerDuplicateStitch + carry * rates.secondsPerCarryCm + catches * rates.secondsPerFloatCatch) / 60 +
          ends * rates.minutesPerEnd;
        expect(Math.abs(minutes(t.ends, t.carryCm, t.catches) - t.minutes)).toBeLessThanOrEqual(0.1);
        const p = plan.planned;
        expect(Math.abs(minutes(t.knitEnds + p.darningEnds, p.carryCm, p.catches) - plan.plannedMinutes)).toBeLessThanOrEqual(0.1);
        // staggering only ever adds catches
        expect(t.catches).toBeGreaterThanOrEqual(p.catches);
      }),
      { numRuns: 100 },
    );
  });
});
