// Our estimates for whole plain garments against published yardage by yarn weight.
// Source of the ranges: Knitting & Crocheting All-in-One For Dummies (Wiley), yardage by weight,
// in yards (TRADE-REFERENCES.md). Each weight is knitted at the middle of its Craft Yarn Council
// gauge range, rows from relaxed proportions (Knapton et al. 1968, after Munden 1959), with the studio's 10 % margin.
import { describe, expect, test } from "vitest";
import { sizeGarment } from "@/lib/core/sizing/size-garment";
import { DEFAULT_MARGIN_PERCENT } from "@/lib/core/yarn/allowances";
import { estimatePlainYarn } from "@/lib/core/yarn/garment-yarn";
import { MUNDEN_KC, MUNDEN_KW } from "@/lib/core/yarn/loop-length";
import { METRES_PER_YARD } from "@/lib/core/yarn/skeins";
import { getTypicalStitchesPer10cm } from "@/lib/core/yarn/yarn-weights";

const PUBLISHED = [
  { category: 1, hat: [300, 375], sweater: [1500, 3200] },
  { category: 2, hat: [250, 350], sweater: [1200, 2500] },
  { category: 3, hat: [200, 300], sweater: [1000, 2000] },
  { category: 4, hat: [150, 250], sweater: [800, 1500] },
  { category: 5, hat: [125, 200], sweater: [600, 1200] },
  { category: 6, hat: [75, 125], sweater: [400, 800] },
];

function gaugeFor(category: number) {
  const s = getTypicalStitchesPer10cm(category);
  return { stitchesPer10cm: s, rowsPer10cm: (s * MUNDEN_KC) / MUNDEN_KW };
}

function yards(sizing: Parameters<typeof estimatePlainYarn>[0]): number {
  return (estimatePlainYarn(sizing).totalCm * (1 + DEFAULT_MARGIN_PERCENT / 100)) / 100 / METRES_PER_YARD;
}

describe("adult sweater (women's M and men's L yoke pullovers, standard ease)", () => {
  test.each(PUBLISHED)("category $category falls within $sweater yd", ({ category, sweater }) => {
    const gauge = gaugeFor(category);
    for (const size of ["women-M", "men-L"]) {
      const y = yards(sizeGarment({ garment: "pullover", size, gauge }));
      expect(y).toBeGreaterThanOrEqual(sweater[0]);
      expect(y).toBeLessThanOrEqual(sweater[1]);
    }
  });
});

describe("adult hat (22 in / 56 cm head, 10 % negative ease, default height)", () => {
  // Measured: our plain hat comes out 20–38 % below the handbook's lower bound at every weight
  // (cat 1: 186 yd against 300–375; cat 4: 112 against 150–250; cat 6: 60 against 75–125).
  // A second published source (the three-gauge pattern below) states amounts for its adult size that
  // are also under the handbook's lower bounds (worsted 140 yd < 150, DK 180 < 200, bulky 88 < 125):
  // the handbook's hat figures are buying guidance for hats of every style (folded brims, slouch)
  // and lie above a fitted beanie. We check that the estimate stays under the handbook's top and at
  // least half its bottom, so a change that doubles or halves the model still fails here.
  test.each(PUBLISHED)("category $category: below $hat yd, by at most half the lower bound", ({ category, hat }) => {
    const y = yards(sizeGarment({ garment: "hat", measurements: { headCircumferenceIn: 22 }, gauge: gaugeFor(category) }));
    expect(y).toBeLessThanOrEqual(hat[1]);
    expect(y).toBeGreaterThanOrEqual(hat[0] * 0.5);
  });

  // A folded-brim hat at the standard's woman's height (CYC hat heights: 11 in as worn) is the kind of hat
  // the handbook's figures describe. Measured: cat 1 297 yd (300–375), cat 2 236 (250–350), cat 3 220,
  // cat 4 173, cat 5 136, cat 6 90: within 0.9 × the lower bound and under the top at every weight.
  test.each(PUBLISHED)("category $category folded-brim hat: within 0.9 × $hat yd", ({ category, hat }) => {
    const y = yards(sizeGarment({ garment: "hat", measurements: { headCircumferenceIn: 22 }, gauge: gaugeFor(category), options: { style: "folded-brim" } }));
    expect(y).toBeGreaterThanOrEqual(hat[0] * 0.9);
    expect(y).toBeLessThanOrEqual(hat[1]);
  });

  test("stranded work (about 25 % more, common practice) brings the worsted hat near the published range", () => {
    const y = yards(sizeGarment({ garment: "hat", measurements: { headCircumferenceIn: 22 }, gauge: gaugeFor(4) })) * 1.25;
    expect(y).toBeGreaterThan(150 * 0.85);
    expect(y).toBeLessThan(250);
  });
});

// Source: a published hat pattern worked at three gauges in five sizes, with the finished
// circumference, finished height, stated gauge (stitches and rows per 4 in) and stated yardage of
// each (knitbot.com/words, read 2026-12-02). Each hat is sized here to its finished measurements
// (no ease) at its stated stitch and row gauge; our estimate with the studio's 10 % margin is compared
// with the stated amount.
// Measured (estimate ÷ stated, with margin): bulky 1.16–1.23, worsted 0.84–1.03, DK 0.84–0.90;
// mean of the 15 is 1.00. Without the margin: 0.76–1.12.
const PATTERN = [
  {
    weight: "bulky",
    gauge: { stitchesPer4in: 14, rowsPer4in: 20 },
    aroundIn: [15, 17, 19, 21, 23],
    heightIn: [6, 6.75, 7.75, 8.75, 9.75],
    yards: [45, 56, 70, 88, 110],
  },
  {
    weight: "worsted",
    gauge: { stitchesPer4in: 20, rowsPer4in: 28 },
    aroundIn: [14.5, 16.75, 19.25, 20.75, 22.5],
    heightIn: [5.5, 6.25, 7.25, 8.5, 9.75],
    yards: [75, 95, 115, 140, 170],
  },
  {
    weight: "DK",
    gauge: { stitchesPer4in: 24, rowsPer4in: 32 },
    aroundIn: [15, 16.25, 18.75, 21, 22.75],
    heightIn: [5.75, 7, 7.25, 8.5, 9.5],
    yards: [92, 116, 144, 180, 215],
  },
];
const PATTERN_ROWS = PATTERN.flatMap((p) =>
  p.yards.map((stated, i) => ({ weight: p.weight, gauge: p.gauge, aroundIn: p.aroundIn[i], heightIn: p.heightIn[i], stated })),
);

function patternRatio(row: (typeof PATTERN_ROWS)[number]): number {
  const sizing = sizeGarment({
    garment: "hat",
    measurements: { headCircumferenceIn: row.aroundIn },
    easeCm: 0,
    gauge: row.gauge,
    options: { hatHeightIn: row.heightIn },
  });
  return yards(sizing) / row.stated;
}

describe("a published three-gauge hat pattern: estimate against its stated yardage", () => {
  test.each(PATTERN_ROWS)("$weight, $aroundIn in around × $heightIn in: within 25 % of $stated yd", (row) => {
    const ratio = patternRatio(row);
    expect(ratio).toBeGreaterThanOrEqual(0.75);
    expect(ratio).toBeLessThanOrEqual(1.25);
  });

  test("over all 15 hats the estimate is within 10 % of the stated amounts on average", () => {
    const mean = PATTERN_ROWS.reduce((s, r) => s + patternRatio(r), 0) / PATTERN_ROWS.length;
    expect(mean).toBeGreaterThan(0.9);
    expect(mean).toBeLessThan(1.1);
  });
});
