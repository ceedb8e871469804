import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { cellAt, createChart, type Chart, type Point } from "@/lib/core/chart/model";
import { MOTIFS, getMotif } from "@/lib/core/chart/motifs";
import {
  ANCHORS,
  copyRegion,
  cropChart,
  drawLine,
  drawRect,
  flipHorizontal,
  flipVertical,
  floodFill,
  getLinePoints,
  moveRegion,
  motifToChart,
  paintCell,
  paintCells,
  placeLettering,
  placeMotif,
  replaceColour,
  resizeChart,
  stampChart,
  tileMotif,
  tileRepeat,
} from "@/lib/core/chart/ops";
import { chartArb, sameChart, snapshot } from "./arbitraries";

const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
const palette = [
  { key: ".", name: "Oat", hex: "#EFE6D2" },
  { key: "X", name: "Red", hex: "#9E2B25" },
  { key: "g", name: "Green", hex: "#3F5E3A" },
];

/** A chart from rows written top row first, like the exchange format. */
function chartOf(rows: string[]): Chart {
  const chart = createChart(rows[0].length, rows.length, gauge, palette);
  rows.forEach((row, i) => Array.from(row).forEach((ch, x) => (chart.cells[(rows.length - 1 - i) * chart.width + x] = palette.findIndex((p) => p.key === ch))));
  return chart;
}

function rowsOf(chart: Chart): string[] {
  const rows: string[] = [];
  for (let y = chart.height - 1; y >= 0; y--) rows.push(Array.from({ length: chart.width }, (_, x) => palette[cellAt(chart, x, y)].key).join(""));
  return rows;
}

const pointIn = (c: Chart) => fc.record({ x: fc.integer({ min: 0, max: c.width - 1 }), y: fc.integer({ min: 0, max: c.height - 1 }) });
const anyPoint = fc.record({ x: fc.integer({ min: -4, max: 20 }), y: fc.integer({ min: -4, max: 20 }) });
const anyRect = fc.record({ x: fc.integer({ min: -4, max: 16 }), y: fc.integer({ min: -4, max: 16 }), width: fc.integer({ min: 1, max: 10 }), height: fc.integer({ min: 1, max: 10 }) });

describe("operations never change their input", () => {
  // Each entry draws the operation's arguments for a given chart and returns the call to make.
  type Call = (c: Chart) => Chart;
  const ops: [string, (c: Chart) => fc.Arbitrary<Call>][] = [
    ["paintCells", () => fc.array(anyPoint).map((ps) => (c: Chart) => paintCells(c, ps, 0))],
    ["floodFill", (c) => pointIn(c).map((p) => (x: Chart) => floodFill(x, p, c.palette.length - 1))],
    ["drawLine", () => fc.tuple(anyPoint, anyPoint).map(([a, b]) => (c: Chart) => drawLine(c, a, b, 0))],
    ["drawRect", () => fc.tuple(anyRect, fc.boolean()).map(([r, filled]) => (c: Chart) => drawRect(c, r, 0, { filled }))],
    ["copyRegion", (c) => pointIn(c).map((p) => (x: Chart) => copyRegion(x, { ...p, width: 3, height: 3 }))],
    ["stampChart", () => anyPoint.map((p) => (c: Chart) => stampChart(c, c, p, { transparent: 0 }))],
    ["moveRegion", () => fc.tuple(anyRect, anyPoint).map(([r, p]) => (c: Chart) => moveRegion(c, r, p, { fill: 0 }))],
    ["flipHorizontal", () => fc.option(anyRect, { nil: undefined }).map((r) => (c: Chart) => flipHorizontal(c, r))],
    ["flipVertical", () => fc.option(anyRect, { nil: undefined }).map((r) => (c: Chart) => flipVertical(c, r))],
    ["resizeChart", () => fc.tuple(fc.integer({ min: 1, max: 20 }), fc.integer({ min: 1, max: 20 }), fc.constantFrom(...ANCHORS)).map(([w, h, a]) => (c: Chart) => resizeChart(c, w, h, a))],
    ["tileRepeat", () => fc.tuple(fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 30 })).map(([w, h]) => (c: Chart) => tileRepeat(c, w, h))],
    ["placeMotif", () => fc.tuple(fc.constantFrom(...MOTIFS), anyPoint).map(([m, p]) => (c: Chart) => placeMotif(c, m, p, { pattern: 0 }))],
    ["tileMotif", () => fc.tuple(fc.constantFrom(...MOTIFS), anyRect).map(([m, r]) => (c: Chart) => tileMotif(c, m, r, { pattern: 0 }))],
    ["replaceColour", () => fc.constant((c: Chart) => replaceColour(c, 0, c.palette.length - 1))],
  ];
  test.each(ops)("%s", (_name, callFor) => {
    fc.assert(
      fc.property(
        chartArb().chain((c) => fc.tuple(fc.constant(c), callFor(c))),
        ([chart, call]) => {
          const before = snapshot(chart);
          const out = call(chart);
          expect(out).not.toBe(chart);
          expect(out.cells).not.toBe(chart.cells);
          expect(out.palette).not.toBe(chart.palette);
          expect(snapshot(chart)).toEqual(before);
        },
      ),
      { numRuns: 60 },
    );
  });
});

describe("flips", () => {
  test("mirroring twice gives back the chart, whole or in a region", () => {
    fc.assert(
      fc.property(chartArb(), fc.option(anyRect, { nil: undefined }), (chart, region) => {
        expect(sameChart(flipHorizontal(flipHorizontal(chart, region), region), chart)).toBe(true);
        expect(sameChart(flipVertical(flipVertical(chart, region), region), chart)).toBe(true);
      }),
    );
  });

  test("a horizontal flip swaps stitch 1 with the last stitch", () => {
    expect(rowsOf(flipHorizontal(chartOf(["XX..g", ".X..."])))).toEqual(["g..XX", "...X."]);
    expect(rowsOf(flipVertical(chartOf(["XX..g", ".X..."])))).toEqual([".X...", "XX..g"]);
  });

  test("a region flip leaves the rest alone", () => {
    // Region: x 1–3 of the top row only (y 1).
    expect(rowsOf(flipHorizontal(chartOf([".Xg..", "XXXXX"]), { x: 1, y: 1, width: 3, height: 1 }))).toEqual(["..gX.", "XXXXX"]);
  });
});

describe("flood fill", () => {
  /** Reference: the 4-connected region around `at` by breadth-first search. */
  function regionOf(chart: Chart, at: Point): Set<number> {
    const target = cellAt(chart, at.x, at.y);
    const seen = new Set<number>([at.y * chart.width + at.x]);
    const queue = [at];
    while (queue.length) {
      const p = queue.shift() as Point;
      for (const q of [{ x: p.x + 1, y: p.y }, { x: p.x - 1, y: p.y }, { x: p.x, y: p.y + 1 }, { x: p.x, y: p.y - 1 }]) {
        const i = q.y * chart.width + q.x;
        if (q.x >= 0 && q.y >= 0 && q.x < chart.width && q.y < chart.height && !seen.has(i) && cellAt(chart, q.x, q.y) === target) {
          seen.add(i);
          queue.push(q);
        }
      }
    }
    return seen;
  }

  test("changes exactly the connected region of the clicked colour", () => {
    fc.assert(
      fc.property(
        chartArb({ minColours: 2, maxColours: 3 }).chain((c) => fc.tuple(fc.constant(c), pointIn(c), fc.integer({ min: 0, max: c.palette.length - 1 }))),
        ([chart, at, colour]) => {
          const out = floodFill(chart, at, colour);
          const region = regionOf(chart, at);
          for (let i = 0; i < chart.cells.length; i++) {
            expect(out.cells[i]).toBe(region.has(i) ? colour : chart.cells[i]);
          }
        },
      ),
    );
  });

  test("does not leak through a diagonal gap", () => {
    const chart = chartOf(["..X", ".X.", "X.."]);
    expect(rowsOf(floodFill(chart, { x: 0, y: 2 }, 2))).toEqual(["ggX", "gX.", "X.."]);
  });

  test("fills a 400 × 400 chart without running out of stack", () => {
    const big = createChart(400, 400, gauge, palette);
    expect(floodFill(big, { x: 200, y: 200 }, 1).cells.every((c) => c === 1)).toBe(true);
  });
});

describe("lines and rectangles", () => {
  test.each<[Point, Point, Point[]]>([
    [{ x: 0, y: 0 }, { x: 3, y: 0 }, [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 0 }, { x: 3, y: 0 }]],
    [{ x: 0, y: 0 }, { x: 2, y: 2 }, [{ x: 0, y: 0 }, { x: 1, y: 1 }, { x: 2, y: 2 }]],
    // (0,0)→(5,2): the true line has y = 0.4x, so the nearest cells are y 0,0,1,1,2,2 (no ties).
    [{ x: 0, y: 0 }, { x: 5, y: 2 }, [{ x: 0, y: 0 }, { x: 1, y: 0 }, { x: 2, y: 1 }, { x: 3, y: 1 }, { x: 4, y: 2 }, { x: 5, y: 2 }]],
    [{ x: 2, y: 2 }, { x: 2, y: 2 }, [{ x: 2, y: 2 }]],
  ])("line %o → %o", (a, b, expected) => {
    expect(getLinePoints(a, b)).toEqual(expected);
  });

  test("a line is gap-free, ends on both points and has max(|dx|, |dy|) + 1 cells", () => {
    fc.assert(
      fc.property(anyPoint, anyPoint, (a, b) => {
        const pts = getLinePoints(a, b);
        expect(pts[0]).toEqual(a);
        expect(pts[pts.length - 1]).toEqual(b);
        expect(pts).toHaveLength(Math.max(Math.abs(b.x - a.x), Math.abs(b.y - a.y)) + 1);
        const dx = b.x - a.x;
        const dy = b.y - a.y;
        for (let i = 1; i < pts.length; i++) {
          expect(Math.max(Math.abs(pts[i].x - pts[i - 1].x), Math.abs(pts[i].y - pts[i - 1].y))).toBe(1);
        }
        // Each cell is the nearest to the true line along the minor axis (within half a stitch).
        for (const p of pts) {
          if (Math.abs(dx) >= Math.abs(dy) && dx !== 0) expect(Math.abs(p.y - (a.y + ((p.x - a.x) * dy) / dx))).toBeLessThanOrEqual(0.5);
          if (Math.abs(dy) > Math.abs(dx)) expect(Math.abs(p.x - (a.x + ((p.y - a.y) * dx) / dy))).toBeLessThanOrEqual(0.5);
        }
      }),
    );
  });

  test("drawLine clips to the chart", () => {
    expect(rowsOf(drawLine(chartOf(["...", "...", "..."]), { x: -2, y: 1 }, { x: 5, y: 1 }, 1))).toEqual(["...", "XXX", "..."]);
  });

  test("rectangle outline and fill", () => {
    const blank = chartOf([".....", ".....", ".....", "....."]);
    expect(rowsOf(drawRect(blank, { x: 1, y: 0, width: 4, height: 3 }, 1))).toEqual([".....", ".XXXX", ".X..X", ".XXXX"]);
    expect(rowsOf(drawRect(blank, { x: 1, y: 0, width: 4, height: 3 }, 1, { filled: true }))).toEqual([".....", ".XXXX", ".XXXX", ".XXXX"]);
    // A rectangle running off the chart keeps its own edges: no outline on the clipped side.
    expect(rowsOf(drawRect(blank, { x: 3, y: 1, width: 4, height: 2 }, 1))).toEqual([".....", "...XX", "...XX", "....."]);
  });

  test("a colour outside the palette is refused", () => {
    expect(() => paintCell(chartOf(["..."]), { x: 0, y: 0 }, 3)).toThrow("colour 3 is not in the palette (it has 3 colours)");
  });
});

describe("selections", () => {
  test("copy then stamp at the same place changes nothing", () => {
    fc.assert(
      fc.property(chartArb().chain((c) => fc.tuple(fc.constant(c), pointIn(c), fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 6 }))), ([chart, p, w, h]) => {
        const region = copyRegion(chart, { ...p, width: w, height: h });
        expect(sameChart(stampChart(chart, region, p), chart)).toBe(true);
      }),
    );
  });

  test("stamping with a transparent colour keeps the chart underneath", () => {
    const stamp = chartOf(["X.", ".X"]);
    expect(rowsOf(stampChart(chartOf(["ggg", "ggg"]), stamp, { x: 1, y: 0 }, { transparent: 0 }))).toEqual(["gXg", "ggX"]);
    expect(rowsOf(stampChart(chartOf(["ggg", "ggg"]), stamp, { x: 1, y: 0 }))).toEqual(["gX.", "g.X"]);
  });

  test("move leaves the fill colour behind", () => {
    expect(rowsOf(moveRegion(chartOf(["Xg...", "....."]), { x: 0, y: 1, width: 2, height: 1 }, { x: 3, y: 0 }, { fill: 0 }))).toEqual([".....", "...Xg"]);
  });
});

describe("resize and crop", () => {
  const grid = chartOf(["Xg.", ".X.", "..g"]);
  test.each<[(typeof ANCHORS)[number], string[]]>([
    ["top-left", ["Xg..", ".X..", "..g.", "...."]],
    ["top-right", [".Xg.", "..X.", "...g", "...."]],
    ["bottom-left", ["....", "Xg..", ".X..", "..g."]],
    ["bottom-right", ["....", ".Xg.", "..X.", "...g"]],
    // An odd extra stitch or row goes to the right and the top.
    ["centre", ["....", "Xg..", ".X..", "..g."]],
  ])("grow 3 × 3 to 4 × 4 anchored %s", (anchor, rows) => {
    expect(rowsOf(resizeChart(grid, 4, 4, anchor, 0))).toEqual(rows);
  });

  test.each<[(typeof ANCHORS)[number], string[]]>([
    ["top-left", ["Xg", ".X"]],
    ["bottom-right", ["X.", ".g"]],
    ["top", ["Xg", ".X"]],
  ])("crop 3 × 3 to 2 × 2 anchored %s", (anchor, rows) => {
    expect(rowsOf(resizeChart(grid, 2, 2, anchor))).toEqual(rows);
  });

  test("growing then shrinking back with the same anchor is the identity", () => {
    fc.assert(
      fc.property(chartArb(), fc.integer({ min: 0, max: 7 }), fc.integer({ min: 0, max: 7 }), fc.constantFrom(...ANCHORS), (chart, dw, dh, anchor) => {
        const grown = resizeChart(chart, chart.width + dw, chart.height + dh, anchor, 0);
        expect(sameChart(resizeChart(grown, chart.width, chart.height, anchor), chart)).toBe(true);
      }),
    );
  });

  test("sizes outside 1–400 are refused", () => {
    expect(() => resizeChart(grid, 0, 3, "centre")).toThrow("a chart must be from 1 × 1 to 400 × 400 stitches (asked for 0 × 3)");
    expect(() => resizeChart(grid, 401, 3, "centre")).toThrow(RangeError);
  });
});

describe("tiling", () => {
  test("tiling a repeat then cropping one repeat gives back the repeat", () => {
    fc.assert(
      fc.property(chartArb({ maxSide: 10 }), fc.integer({ min: 1, max: 4 }), fc.integer({ min: 1, max: 4 }), fc.nat(), fc.nat(), (repeat, nx, ny, i, j) => {
        const tiled = tileRepeat(repeat, repeat.width * nx, repeat.height * ny);
        const at = { x: (i % nx) * repeat.width, y: (j % ny) * repeat.height };
        expect(sameChart(cropChart(tiled, { ...at, width: repeat.width, height: repeat.height }), repeat)).toBe(true);
      }),
    );
  });

  test("every library motif tiled then cropped is the motif", () => {
    for (const motif of MOTIFS) {
      const repeat = motifToChart(motif);
      const tiled = tileRepeat(repeat, Math.min(400, motif.width * 3), motif.height * 2);
      expect(sameChart(cropChart(tiled, { x: motif.width, y: motif.height, width: motif.width, height: motif.height }), repeat)).toBe(true);
    }
  });

  test("tileMotif on a chart equals tileRepeat of the motif chart", () => {
    const motif = getMotif("diamond-peerie");
    const chart = tileMotif(createChart(20, 10, gauge, palette), motif, { x: 0, y: 0, width: 20, height: 10 }, { pattern: 1, background: 0 });
    expect(sameChart(chart, tileRepeat(motifToChart(motif, palette), 20, 10))).toBe(true);
  });

  test("an origin shifts the repeat", () => {
    const repeat = chartOf(["X.."]);
    expect(rowsOf(tileRepeat(repeat, 7, 1, { x: 1, y: 0 }))).toEqual([".X..X.."]);
  });
});

describe("motif placement", () => {
  test("places the pattern in the chosen colour; the background stays unless asked", () => {
    const motif = getMotif("crosses"); // rows ".X..", "XXX.", ".X.."
    const base = chartOf(["gggg", "gggg", "gggg"]);
    expect(rowsOf(placeMotif(base, motif, { x: 0, y: 0 }, { pattern: 1 }))).toEqual(["gXgg", "XXXg", "gXgg"]);
    expect(rowsOf(placeMotif(base, motif, { x: 0, y: 0 }, { pattern: 1, background: 0 }))).toEqual([".X..", "XXX.", ".X.."]);
  });

  test("clips at the chart edge", () => {
    expect(rowsOf(placeMotif(chartOf(["...", "..."]), getMotif("crosses"), { x: 1, y: -1 }, { pattern: 2 }))).toEqual(["..g", ".gg"]);
  });
});

describe("lettering placement", () => {
  test("a box off the chart is refused", () => {
    expect(() => placeLettering(chartOf(["....."]), { text: "A", font: "3x5", box: { x: 0, y: 0, width: 5, height: 5 }, colour: 1 })).toThrow(
      "the lettering box for 'A' (5 × 5 at x 0, y 0) does not lie inside the 5 × 1 chart",
    );
  });
});
