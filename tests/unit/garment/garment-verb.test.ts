// The `garment` core verb: its input and output, and every kind of bad input named in a way a
// knitter can find (row from the bottom, stitch from the right), exit code 2 through the CLI.
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, test } from "vitest";
import { parseChart, serializeChart } from "@/lib/core/chart/format";
import { flipHorizontal } from "@/lib/core/chart/ops/flip";
import { placeLettering } from "@/lib/core/chart/ops/place-lettering";
import { areaShape, buildGarment, placeCharts, readGarmentInput } from "@/lib/core/garment";
import { readLettering } from "@/lib/core/garment/lettering-check";
import { sizeGarment } from "@/lib/core/sizing/size-garment";
import { run } from "@/scripts/core-verbs/garment";
import { run as runEstimate } from "@/scripts/core-verbs/estimate";
import { area, chartV1, only, sizeTotal, type VerbOutput } from "./helpers";

const size = { garment: "mittens", size: "child", gauge: { stitchesPer10cm: 28, rowsPer10cm: 32 } };
const sizing = sizeGarment(size);
const back = area(sizing, "back of hand");
const plainBack = chartV1(back, () => "A", sizing);

describe("garment verb output", () => {
  test("pieces, rounds, yarn and labour; labour is the estimate verb's output for the same features", () => {
    const out = run({ size }) as VerbOutput & { garment: string };
    expect(out.garment).toBe("mitten");
    expect(out.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0)).toBe(sizeTotal(sizing));
    // every round of every part, from 1
    expect(out.rounds.filter((r) => r.piece === "left mitten" && r.part === "thumb").map((r) => r.round)).toEqual(
      Array.from({ length: 16 }, (_, i) => i + 1),
    );
    const features = out.pieces.map((p) => {
      const { darnedStitches: _d, ...rest } = p.features as VerbOutput["pieces"][number]["features"] & { darnedStitches: number };
      return rest;
    });
    expect(out.labour).toEqual(runEstimate({ pieces: features }));
    expect(out.yarn.colours.map((c) => c.key)).toEqual(["A"]);
  });

  test("rates and proof rounds reach the labour estimate", () => {
    const out = run({ size, proofRounds: 2, rates: { plainStitchesPerMinute: 30 } }) as VerbOutput;
    expect(out.pieces[0].features.proofRounds).toBe(2);
    // 2 × 3,288 plain stitches at 30 a minute, 21 shaping rounds × 2 min and a thumb (20 min) each
    expect(out.labour.stages.knitting.p50Minutes).toBe(Math.round((2 * 3288) / 30 + 2 * (21 * 2 + 20)));
  });
});

describe("garment verb: bad input", () => {
  test.each<[string, unknown, RegExp]>([
    ["an unknown area lists the known ones", { size, charts: [{ area: "thumb", chart: plainBack }] }, /charts\[0\]\.area: no area 'thumb' on this mitten; its areas are 'cuff', 'back of hand', 'palm'/],
    [
      "a chart that does not fit its area names both sizes",
      { size, charts: [{ area: "palm", chart: { ...plainBack, width: 20, rows: plainBack.rows.map((r) => r.slice(0, 20)) } }] },
      /charts\[0\]\.chart: the chart for 'palm' is 20 × 52 \(stitches × rows\) but the area is 23 × 52/,
    ],
    ["a size input the sizing refuses", { size: { ...size, size: "giant" } }, /no standard mitten size "giant"/],
    ["an unknown field", { size, chart: [] }, /unknown field/],
    ["a colour to darn that no chart has", { size, charts: [{ area: "back of hand", chart: plainBack }], darn: ["Q"] }, /darn\[0\]: colour 'Q' is in no chart's palette/],
    ["the main colour cannot be darned", { size, charts: [{ area: "back of hand", chart: plainBack }], darn: ["A"] }, /darn\[0\]: 'A' is the main colour/],
    ["a chart that is not chart v1", { size, charts: [{ area: "palm", chart: { ...plainBack, version: 2 } }] }, /charts\[0\]\.chart: palm: chart is not valid: version must be 1/],
    ["two charts for one area", { size, charts: [{ area: "palm", chart: plainBack }, { area: "palm", chart: plainBack }] }, /charts\[1\]: a second chart for 'palm'/],
  ])("%s", (_, input, message) => {
    expect(() => run(input)).toThrow(message);
  });

  // The app refuses paint the shape does not knit (placeCharts' default), naming the place; the verb
  // takes a chart drawn over the area's whole rectangle, marks such cells and never counts them.
  const refuseOrMark = (input: { size: unknown; charts: unknown[] }) => {
    const parsed = readGarmentInput(input);
    return () => placeCharts(buildGarment(parsed.size), parsed.placements, parsed.place);
  };

  test("paint above the top decreases: refused by default, naming the row from the bottom and the stitch from the right", () => {
    // row 52 keeps 4 of 23 sts (stitches 10–13 from the right); stitch 1 from the right is outside
    const chart = chartV1(back, (x, y) => (y === 51 && x === 22 ? "B" : "A"), sizing);
    expect(refuseOrMark({ size, charts: [{ area: "back of hand", chart }] })).toThrow(
      /charts\[0\]\.chart: back of hand: row 52, stitch 1 \(row from the bottom, stitch from the right\) is painted 'B' but lies outside the shape/,
    );
    const out = run({ size, charts: [{ area: "back of hand", chart }] }) as VerbOutput & { notKnitted: { area: string; cells: number; first: string }[] };
    expect(out.notKnitted).toEqual([{ area: "back of hand", chartIndex: 0, cells: 1, first: expect.stringMatching(/^back of hand: row 52, stitch 1 .* not knitted, not counted$/) }]);
    // nothing outside the shape is knitted: the lone 'B' adds no stitch and no colour to any round
    expect(out.pieces.every((p) => p.features.strandedStitches === 0)).toBe(true);
    expect(out.pieces.reduce((s, p) => s + p.stitches * p.quantity, 0)).toBe(sizeTotal(sizing));
  });

  test("paint outside a crown sector's narrowing: refused by default, marked and not counted by the verb", () => {
    const hatSize = { garment: "hat", size: "woman", gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 } };
    const hat = sizeGarment(hatSize);
    // row 20 keeps 1 stitch of the 14-st sector (stitch 1 from the right); stitch 14 is gone
    const chart = chartV1(area(hat, "crown"), (x, y) => (y === 19 && x === 0 ? "B" : "A"), hat);
    expect(refuseOrMark({ size: hatSize, charts: [{ area: "crown", chart }] })).toThrow(/crown: row 20, stitch 14 .* outside the shape, outside the sector's narrowing/);
    const out = run({ size: hatSize, charts: [{ area: "crown", chart }] }) as VerbOutput & { notKnitted: { cells: number }[] };
    expect(out.notKnitted.map((n) => n.cells)).toEqual([1]);
    expect(out.pieces[0].features.strandedStitches).toBe(0);
  });

  test("a two-colour chart drawn over the crown's whole rectangle adds only the sector's real stitches, every sector", () => {
    const hatSize = { garment: "hat", size: "woman", gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 } };
    const hat = sizeGarment(hatSize);
    const crown = area(hat, "crown");
    // 'A'/'B' in alternate columns on every row; rows whose sector keeps one stitch knit one colour.
    const chart = chartV1(crown, (x) => (x % 2 ? "B" : "A"), hat);
    const out = run({ size: hatSize, charts: [{ area: "crown", chart }] }) as VerbOutput & { notKnitted: { cells: number }[] };
    // Worked in worked-garments.test.ts: the sector's rows keep 13,13,12,12,…,7,7,6,5,4,3,2,1 stitches,
    // 1,288 in the 8 sectors; every row but the last holds both columns' parities, so 1,288 − 8 = 1,280.
    expect(crown.repeats).toBe(8);
    expect(out.pieces[0].features.strandedStitches).toBe(1280);
    // Outside the shape: the first 14 − k columns of a row keeping k, i.e. 1,1,2,2,…,7,7,8,…,13 cells
    // (119 in all); 'B' on the odd columns of each: ⌊n/2⌋ = 0,0,1,1,1,1,2,2,2,2,3,3,3,3,4,4,5,5,6,6 = 54.
    expect(out.notKnitted[0].cells).toBe(54);
    expect(out.pieces[0].stitches).toBe(sizeTotal(hat));
  });

  test("three colours in one round with nothing darned names the round, the piece and the place", () => {
    const b = chartV1(back, only((x) => (x % 2 ? "B" : "A")), sizing);
    const palm = chartV1(area(sizing, "palm"), only((x, y) => (y === 4 && x === 20 ? "C" : "A")), sizing);
    // chart row 5 is round 17 + 5 = 22 of the hand; stitch 23 − 20 = 3 from the right
    expect(() => run({ size, charts: [{ area: "back of hand", chart: b }, { area: "palm", chart: palm }] })).toThrow(
      /round 22 of the left mitten's hand \(back of hand row 5, palm row 5\) knits three colours, 'A', 'B', 'C'; 'C' first at palm row 5, stitch 3 from the right, and none of them is darned/,
    );
    // darning the gold makes it two colours a round
    expect(() => run({ size, charts: [{ area: "back of hand", chart: b }, { area: "palm", chart: palm }], darn: ["C"] })).not.toThrow();
  });
});

describe("lettering on a pair", () => {
  const layer = { text: "JO", font: "3x5" as const, box: { x: 4, y: 20, width: 15, height: 7 }, key: "B" };
  const base = parseChart(plainBack);
  const lettered = placeLettering(base, { text: layer.text, font: layer.font, box: layer.box, colour: 1 });
  const letteredV1 = serializeChart(lettered);

  test("the same chart on both mittens reads forwards on both", () => {
    const out = run({ size, charts: [{ area: "back of hand", chart: letteredV1, lettering: [layer] }] }) as VerbOutput;
    expect(out.pieces).toHaveLength(2);
  });

  test("a mirrored pair re-sets lettering that has a background; without one it would read backwards", () => {
    expect(() => run({ size, charts: [{ area: "back of hand", chart: letteredV1, lettering: [layer], mirror: true }] })).toThrow(
      /charts\[0\]\.lettering: 'JO' on the back of hand would read backwards on the right mitten \(row \d+, stitch \d+, row from the bottom, stitch from the right\)/,
    );
    const withBackground = { ...layer, backgroundKey: "A" };
    const input = { size, charts: [{ area: "back of hand", chart: letteredV1, lettering: [withBackground], mirror: true }] };
    expect(() => run(input)).not.toThrow();
    const parsed = readGarmentInput(input);
    const placed = placeCharts(buildGarment(parsed.size), parsed.placements, parsed.place);
    expect(placed.placed.filter((p) => p.area === "back of hand").map((p) => [p.piece, p.mirrored])).toEqual([
      ["left mitten", false],
      ["right mitten", true],
    ]);
  });

  test("a right mitten's own chart carrying the text backwards is refused", () => {
    const flipped = serializeChart(flipHorizontal(lettered));
    const mirroredBox = { ...layer.box, x: back.width - layer.box.x - layer.box.width };
    expect(readLettering(parseChart(flipped), { text: "JO", font: "3x5", box: mirroredBox, colour: 1 })).toBe("backwards");
    expect(() =>
      run({ size, charts: [{ area: "back of hand", chart: letteredV1, lettering: [layer] }, { area: "back of hand", piece: "right mitten", chart: flipped, lettering: [{ ...layer, box: mirroredBox }] }] }),
    ).toThrow(/charts\[1\]\.lettering\[0\]: 'JO' reads backwards on the right mitten \(back of hand, box at row 21/);
  });

  test("mirror on a garment with no pair is refused", () => {
    const hatSize = { garment: "hat", size: "woman", gauge: { stitchesPer10cm: 22, rowsPer10cm: 30 } };
    const hat = sizeGarment(hatSize);
    expect(() => run({ size: hatSize, charts: [{ area: "band", chart: chartV1(area(hat, "band"), () => "A", hat), mirror: true }] })).toThrow(/charts\[0\]\.mirror: 'band' is not on a pair/);
  });
});

describe("the CLI", () => {
  test("bad input exits with code 2 and the message on stderr; good input prints JSON", () => {
    const dir = mkdtempSync(path.join(tmpdir(), "garment-verb-"));
    const bad = path.join(dir, "bad.json");
    writeFileSync(bad, JSON.stringify({ size, charts: [{ area: "thumb", chart: plainBack }] }));
    const good = path.join(dir, "good.json");
    writeFileSync(good, JSON.stringify({ size }));
    const tsx = path.resolve("node_modules/.bin/tsx");
    const failed = spawnSync(tsx, ["scripts/core.ts", "garment", bad], { encoding: "utf8" });
    expect(failed.status).toBe(2);
    expect(failed.stderr).toContain("charts[0].area: no area 'thumb' on this mitten");
    const ok = spawnSync(tsx, ["scripts/core.ts", "garment", good], { encoding: "utf8" });
    expect(ok.status).toBe(0);
    expect((JSON.parse(ok.stdout) as VerbOutput).pieces.map((p) => p.name)).toEqual(["left mitten", "right mitten"]);
  }, 60_000);
});

describe("a round is the whole round", () => {
  // A 2-st-wide gold motif either side of the start of the round is one motif: darned as one
  // strand it has 2 ends; cut open at the start of the round it would be two strands and 4 ends.
  test("a darned motif across the start of the round is one strand (cuff)", () => {
    const cuff = area(sizing, "cuff");
    const chart = chartV1(cuff, only((x, y) => ((x < 2 || x >= cuff.width - 2) && (y === 5 || y === 6) ? "C" : "A")), sizing);
    const out = run({ size, charts: [{ area: "cuff", chart }], darn: ["C"] }) as VerbOutput;
    for (const p of out.pieces) expect(p.features).toMatchObject({ duplicateStitches: 8, ends: 2 });
  });

  test("the palm's last stitch meets the back's first: a motif across them is one strand", () => {
    // hand rows 26–27, above the gusset: back stitches 1–2 from the right, palm stitches 22–23
    const b = chartV1(back, only((x, y) => (x >= back.width - 2 && (y === 25 || y === 26) ? "C" : "A")), sizing);
    const palm = chartV1(area(sizing, "palm"), only((x, y) => (x < 2 && (y === 25 || y === 26) ? "C" : "A")), sizing);
    const out = run({ size, charts: [{ area: "back of hand", chart: b }, { area: "palm", chart: palm }], darn: ["C"] }) as VerbOutput;
    for (const p of out.pieces) expect(p.features).toMatchObject({ duplicateStitches: 8, ends: 2 });
  });

  test("back of hand and palm share the round's knitted pair: a colour only on the palm is carried round the back", () => {
    const palm = chartV1(area(sizing, "palm"), only((x) => (x % 4 === 0 ? "B" : "A")), sizing);
    const out = run({ size, charts: [{ area: "palm", chart: palm }] }) as VerbOutput;
    // the red float across the 23-st back needs catches in every round where the palm is red and oat
    const left = out.pieces[0].features;
    expect(left.floatCatches).toBeGreaterThan(0);
    expect(left.strandedStitches).toBe(area(sizing, "palm").stitches);
  });
});

describe("pinned pairs", () => {
  // Three colours in hand rows 5–6 (rounds 22–23): red on the back, gold on one palm stitch.
  const b = chartV1(back, only((x, y) => (y >= 4 && y <= 5 && x % 2 ? "B" : "A")), sizing);
  const palm = chartV1(area(sizing, "palm"), only((x, y) => (y >= 4 && y <= 5 && x === 20 ? "C" : "A")), sizing);
  const charts = [{ area: "back of hand", chart: b }, { area: "palm", chart: palm }];

  test("a pin over the three-colour rounds keeps its pair and darns the rest, on every piece it names", () => {
    const out = run({ size, charts, pins: [{ fromRound: 22, toRound: 23, pair: ["A", "B"] }] }) as VerbOutput;
    for (const p of out.pieces) expect(p.features.duplicateStitches).toBe(2);
    const r22 = out.rounds.find((r) => r.piece === "right mitten" && r.part === "hand" && r.round === 22)!;
    expect(r22).toMatchObject({ knit: ["A", "B"], darned: 1 });
  });

  test("a pin on one piece leaves the other to the three-colour rule", () => {
    expect(() => run({ size, charts, pins: [{ piece: "left mitten", fromRound: 22, toRound: 23, pair: ["A", "B"] }] })).toThrow(/round 22 of the right mitten's hand/);
  });

  test.each<[unknown, RegExp]>([
    [{ piece: "sock", fromRound: 1, toRound: 2, pair: ["A", "B"] }, /pins\[0\]\.piece: no piece 'sock'/],
    [{ part: "cuff", fromRound: 1, toRound: 2, pair: ["A", "B"] }, /pins\[0\]\.part: the left mitten has no part 'cuff'; its parts are 'hand', 'thumb'/],
    [{ part: "thumb", fromRound: 10, toRound: 17, pair: ["A", "B"] }, /pins\[0\]: rounds 10–17 are not rounds of the left mitten's thumb \(1–16\)/],
    [{ fromRound: 1, toRound: 2, pair: ["A", "Z"] }, /pins\[0\]\.pair\[1\]: colour 'Z' is in no chart's palette/],
  ])("a pin that cannot apply is refused: %o", (pin, message) => {
    expect(() => run({ size, charts, pins: [pin] })).toThrow(message);
  });
});

describe("areaShape (what the editor shows)", () => {
  test("a child's back of hand: row 52 keeps 4 of 23 stitches, centred; every real stitch counted once", () => {
    const shape = areaShape(buildGarment(size), "back of hand");
    expect([shape.width, shape.height, shape.repeats]).toEqual([23, 52, 1]);
    const top = Array.from(shape.inShape.slice(51 * 23, 52 * 23)).join("");
    expect(top).toBe("00000000011110000000000");
    expect(shape.inShape.reduce((s, v) => s + v, 0)).toBe(1045);
  });
});

describe("the knitted pair round by round", () => {
  test("red in hand rows 1–10 and navy in rows 21–30: the pair changes between them, two ends each", () => {
    const b = chartV1(back, only((x, y) => (y < 10 && x % 3 === 0 ? "B" : y >= 20 && y < 30 && x % 3 === 1 ? "D" : "A")), sizing);
    const out = run({ size, charts: [{ area: "back of hand", chart: b }] }) as VerbOutput & { rounds: { why?: string }[] };
    const hand = out.rounds.filter((r) => r.piece === "left mitten" && r.part === "hand");
    // hand row 1 is round 18 (after the 17 cuff rounds)
    expect(hand[17].knit).toEqual(["A", "B"]);
    expect(hand[26].knit).toEqual(["A", "B"]);
    expect(hand[37].knit).toEqual(["A", "D"]);
    expect(hand.every((r) => r.knit.length <= 2)).toBe(true);
    // where navy is first knitted, the round says why its pair changed
    const joined = hand.find((r) => r.knit.includes("D")) as { why?: string };
    expect(joined.why).toMatch(/pair changes here/);
    // red joined and cut, navy joined and cut: 4 ends to weave in on each mitten
    for (const p of out.pieces) expect(p.features.ends).toBe(4);
  });
});
