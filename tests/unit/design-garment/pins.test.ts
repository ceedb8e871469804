import { describe, expect, test } from "vitest";
import { createChart } from "@/lib/core/chart/model";
import { checkPins, chartDarn, pinParts, readDesignOnGarment, rowShape, storedPins } from "@/lib/core/design-garment";
import { sizeGarment } from "@/lib/core/sizing";

// A child's mitten pair with a back-of-hand chart: two colours (A, B) in every round of the chart,
// and one stitch of a third colour (C) in the chart's third row, so exactly one round holds three.
const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
const sizing = sizeGarment({ garment: "mitten", size: "child", gauge });
const back = sizing.charts.find((c) => c.area === "back of hand")!;
const palette = [
  { key: "A", name: "Oat", hex: "#EFE6D2" },
  { key: "B", name: "Moss", hex: "#6F8A5B" },
  { key: "C", name: "Rowan", hex: "#9E2B25" },
];
const chart = createChart(back.width, back.height, gauge, palette);
for (let y = 0; y < back.height; y++) {
  const mask = rowShape(back, y);
  for (let x = 0; x < back.width; x++) if (mask[x]) chart.cells[y * back.width + x] = x % 2;
}
chart.cells[2 * back.width + rowShape(back, 2).indexOf(true)] = 2;
const entry = { area: "back-of-hand", label: "Back of hand", chart };
const read = readDesignOnGarment(sizing, [entry]);
const rounds = read.reading.rounds;
const first = rounds[0].piece;
const parts = pinParts(rounds);
const part = parts[0];
const threeRound = rounds.find((r) => r.piece === first && (r.colours?.length ?? 0) >= 3)!;
const darn = chartDarn(entry);
const ctx = { rounds, palette, darn };

describe("pinning a pair for a range of rounds", () => {
  test("the garment reading says which colours each round holds; one round holds three and C is darned", () => {
    expect(threeRound).toBeDefined();
    expect(threeRound.colours).toEqual(["A", "B", "C"]);
    expect(darn).toEqual(["C"]);
    expect(part.rounds).toBe(Math.max(...rounds.filter((r) => r.piece === first && r.part === part.part).map((r) => r.round)));
  });

  test("a pin of two knitted colours within the part's rounds is accepted, and the planner keeps it", () => {
    const pin = { part: threeRound.part, fromRound: threeRound.round - 1, toRound: threeRound.round + 1, pair: ["A", "B"] as [string, string] };
    expect(checkPins([pin], ctx)).toEqual([]);
    const pinned = readDesignOnGarment(sizing, [{ ...entry, options: { pins: [pin] } }]);
    expect(pinned.problems).toEqual([]);
    for (const r of pinned.reading.rounds.filter((q) => q.part === pin.part && q.round >= pin.fromRound && q.round <= pin.toRound)) expect(r.knit).toEqual(["A", "B"]);
  });

  test("a darned colour in the pair: the message names the round that would knit three colours with nothing darned", () => {
    const pin = { part: threeRound.part, fromRound: 1, toRound: part.rounds, pair: ["A", "C"] as [string, string] };
    const [p] = checkPins([pin], ctx);
    expect(p.index).toBe(0);
    expect(p.message).toBe(
      `Round ${threeRound.round} of the ${threeRound.part} holds Oat, Moss and Rowan: pinning Oat and Rowan there would knit three colours with nothing darned (Rowan is darned in this design). Pin two of the colours that are knitted, or choose the knitted pair by hand.`,
    );
    // and the core agrees it cannot be placed
    expect(readDesignOnGarment(sizing, [{ ...entry, options: { pins: [pin] } }]).problems).toHaveLength(1);
  });

  test.each([
    [{ fromRound: 1, toRound: 2, pair: ["A", "A"] }, /two different colours/],
    [{ fromRound: 1, toRound: 2, pair: ["A", "Z"] }, /Colour Z is not in the design's palette/],
    [{ fromRound: 0, toRound: 2, pair: ["A", "B"] }, /Rounds 0–2 are not rounds of the/],
    [{ fromRound: 5, toRound: 4, pair: ["A", "B"] }, /the first no higher than the last/],
    [{ fromRound: 1, toRound: 10_000, pair: ["A", "B"] }, new RegExp(`choose from 1 to ${part.rounds}`)],
    [{ fromRound: 1, toRound: 2, pair: ["A", "B", "C"] }, /exactly two colours: at most two colours are knitted in a round/],
    [{ part: "sleeve", fromRound: 1, toRound: 2, pair: ["A", "B"] }, /no part “sleeve”/],
  ])("refused: %j", (pin, message) => {
    const problems = checkPins([pin as never], ctx);
    expect(problems).toHaveLength(1);
    expect(problems[0].message).toMatch(message);
  });

  test("a round keeps one pair: an overlapping pin of another pair names the round", () => {
    const problems = checkPins(
      [
        { fromRound: 3, toRound: 6, pair: ["A", "B"] },
        { fromRound: 6, toRound: 8, pair: ["B", "C"] },
      ],
      { ...ctx, darn: [] },
    );
    expect(problems).toEqual([{ index: 1, message: `Round 6 of the ${part.part} is already pinned by pin 1; a round keeps one pair.` }]);
    // the same pair over overlapping rounds is no conflict
    expect(checkPins([{ fromRound: 3, toRound: 6, pair: ["A", "B"] }, { fromRound: 5, toRound: 8, pair: ["B", "A"] }], ctx)).toEqual([]);
  });

  test("stored pins: only well-formed entries are read back", () => {
    expect(storedPins([{ fromRound: 1, toRound: 2, pair: ["A", "B"], part: "hand" }, { fromRound: "1", toRound: 2, pair: ["A", "B"] }, null, { fromRound: 1, toRound: 2, pair: ["A"] }])).toEqual([
      { fromRound: 1, toRound: 2, pair: ["A", "B"], part: "hand" },
    ]);
    expect(storedPins("nope")).toEqual([]);
  });
});
