// Photo → chart on synthetic pictures made here, with exact expected charts.
import { describe, expect, test } from "vitest";
import { parseChart } from "@/lib/core/chart/format";
import { hexToLab } from "@/lib/core/colourwork/ciede2000";
import {
  chartToPixels,
  cropForGauge,
  gaugeAspect,
  labToHex,
  linearToLab,
  matchColoursToPalette,
  photoToChart,
  PhotoError,
  removeIsolatedStitches,
  resampleArea,
  type RgbaImage,
} from "@/lib/core/photo";

const gauge = { stitchesPer10cm: 24, rowsPer10cm: 30 };
const OAT = { key: ".", name: "Oat", hex: "#EFE6D2" };
const RED = { key: "X", name: "Rowan red", hex: "#9E2B25" };
const NAVY = { key: "n", name: "Navy", hex: "#22304F" };
const palette = [OAT, RED, NAVY];

/** An image painted by a function of the pixel position, returning [r, g, b]. */
function paint(width: number, height: number, f: (x: number, y: number) => [number, number, number]): RgbaImage {
  const data = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const [r, g, b] = f(x, y);
      data.set([r, g, b, 255], (y * width + x) * 4);
    }
  }
  return { width, height, data };
}

const rgb = (hex: string): [number, number, number] => {
  const n = parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
};

describe("photoToChart with a palette", () => {
  test("a solid picture is one colour everywhere", () => {
    const { chart, report } = photoToChart(paint(37, 23, () => rgb("#9A2D27")), { width: 5, height: 4, gauge, palette });
    expect(chart).toEqual({ version: 1, width: 5, height: 4, gauge, palette, rows: ["XXXXX", "XXXXX", "XXXXX", "XXXXX"] });
    expect(report.colours.map((c) => c.stitches)).toEqual([0, 20, 0]);
    expect(report.notes).toContain("Oat (.) is not used");
    expect(() => parseChart(chart)).not.toThrow();
  });

  test("solid areas: left half oat, right half navy, a red band across the top quarter; rows[0] is the top", () => {
    // 80 × 64 px for 8 stitches × 8 rows: 10 × 8 px per stitch, the gauge's proportions (24 sts, 30 rows).
    const img = paint(80, 64, (x, y) => (y < 16 ? rgb(RED.hex) : x < 40 ? rgb(OAT.hex) : rgb(NAVY.hex)));
    const { chart } = photoToChart(img, { width: 8, height: 8, gauge, palette });
    expect(chart.rows).toEqual(["XXXXXXXX", "XXXXXXXX", ...Array(6).fill("....nnnn")]);
  });

  test("stripes one stitch wide at the gauge's aspect come back stitch for stitch", () => {
    // Vertical stripes 10 px wide and horizontal stripes 8 px tall over a 12 × 10 chart.
    const img = paint(120, 80, (x, y) => (Math.floor(y / 8) % 3 === 2 ? rgb(NAVY.hex) : Math.floor(x / 10) % 2 ? rgb(RED.hex) : rgb(OAT.hex)));
    const { chart } = photoToChart(img, { width: 12, height: 10, gauge, palette });
    const expected = Array.from({ length: 10 }, (_, r) => (r % 3 === 2 ? "n".repeat(12) : ".X".repeat(6)));
    expect(chart.rows).toEqual(expected);
  });

  test("a horizontal gradient from oat to navy splits where the colour is nearer navy by CIEDE2000", () => {
    const [a, b] = [rgb(OAT.hex), rgb(NAVY.hex)];
    const img = paint(100, 10, (x) => a.map((v, i) => Math.round(v + ((b[i] - v) * x) / 99)) as [number, number, number]);
    const { chart } = photoToChart(img, { width: 10, height: 1, gauge, palette: [OAT, NAVY] });
    // Exactly one change from oat to navy, left to right, somewhere in the middle.
    expect(chart.rows[0]).toMatch(/^\.{3,7}n{3,7}$/);
    // With the colours and the same picture, two colours are chosen: one light, one dark.
    const chosen = photoToChart(img, { width: 10, height: 1, gauge, colours: 2 });
    expect(chosen.chart.rows[0]).toMatch(/^A+B+$|^B+A+$/);
  });

  test("the crop picks the part of the image to chart", () => {
    // A red square at pixels 20–39 × 10–29 of a 60 × 40 oat picture.
    const img = paint(60, 40, (x, y) => (x >= 20 && x < 40 && y >= 10 && y < 30 ? rgb(RED.hex) : rgb(OAT.hex)));
    const { chart, report } = photoToChart(img, { width: 4, height: 4, gauge, palette, crop: { x: 10, y: 10, width: 20, height: 20 } });
    expect(chart.rows).toEqual(["..XX", "..XX", "..XX", "..XX"]);
    expect(report.crop).toEqual({ x: 10, y: 10, width: 20, height: 20 });
    expect(report.pixelsPerStitch).toEqual({ x: 5, y: 5 });
    // 4 × 4 stitches at 24 × 30 are 1.67 cm × 1.33 cm: a square crop is 20 % too narrow, and stretched across.
    expect(report.notes.join(" ")).toMatch(/20 % narrower than the area at this gauge, so the knitted picture is stretched across/);
  });

  test("transparent pixels count as white", () => {
    const img = paint(4, 4, () => [0, 0, 0]);
    for (let i = 3; i < img.data.length; i += 4) img.data[i] = 0;
    const white = { key: "w", name: "White", hex: "#FFFFFF" };
    expect(photoToChart(img, { width: 2, height: 2, gauge, palette: [{ key: "k", name: "Black", hex: "#000000" }, white] }).chart.rows).toEqual(["ww", "ww"]);
  });

  test("the palette comes back exactly as given, hex case included", () => {
    const given = [{ key: "♥", name: "Heart red", hex: "#9e2b25" }, { key: "o", name: "Oat", hex: "#efe6d2" }];
    const { chart } = photoToChart(paint(10, 10, () => rgb("#9E2B25")), { width: 2, height: 2, gauge, palette: given });
    expect(chart.palette).toEqual(given);
    expect(chart.rows).toEqual(["♥♥", "♥♥"]);
  });
});

describe("photoToChart choosing colours", () => {
  test("n colours of its own, keys A, B, …, the most used first, close to the colours drawn", () => {
    const img = paint(80, 64, (x, y) => (y < 16 ? rgb(RED.hex) : x < 40 ? rgb(OAT.hex) : rgb(NAVY.hex)));
    const { chart, report } = photoToChart(img, { width: 8, height: 8, gauge, colours: 3, yarns: palette });
    expect(chart.palette.map((p) => p.key)).toEqual(["A", "B", "C"]);
    expect(report.colours.map((c) => c.stitches)).toEqual([24, 24, 16]);
    expect(chart.rows[0]).toBe("CCCCCCCC");
    expect(new Set(report.colours.map((c) => c.nearestYarn?.key))).toEqual(new Set([".", "X", "n"]));
    for (const c of report.colours) expect(c.nearestYarn!.deltaE00).toBeLessThan(0.5);
  });

  test("the same picture always gives the same chart", () => {
    const img = paint(90, 72, (x, y) => rgb(["#123456", "#EFE6D2", "#9E2B25", "#6B7F3A"][(Math.floor(x / 10) * 7 + Math.floor(y / 8) * 3) % 4]));
    const a = photoToChart(img, { width: 9, height: 9, gauge, colours: 4 });
    const b = photoToChart(img, { width: 9, height: 9, gauge, colours: 4 });
    expect(a).toEqual(b);
  });

  test("k-means++ seeding is still available and deterministic", () => {
    const img = paint(40, 40, (x) => (x < 20 ? rgb(OAT.hex) : rgb(NAVY.hex)));
    const out = photoToChart(img, { width: 4, height: 4, gauge, colours: 2, seeding: "kmeans++", seed: 7 });
    expect(new Set(out.chart.rows).size).toBe(1);
    expect(["AABB", "BBAA"]).toContain(out.chart.rows[0]);
  });

  test("a picture with fewer colours than asked for says so", () => {
    const { chart, report } = photoToChart(paint(10, 10, () => rgb(OAT.hex)), { width: 3, height: 3, gauge, colours: 3 });
    expect(chart.palette).toHaveLength(3);
    expect(report.notes.join(" ")).toMatch(/fewer than 3 distinct colours/);
  });
});

describe("resampling by area", () => {
  test("fractional coverage: 3 pixels into 2 cells weigh the middle pixel half to each", () => {
    const img = paint(3, 1, (x) => (x === 0 ? [255, 255, 255] : x === 1 ? [0, 0, 0] : [255, 255, 255]));
    const out = resampleArea(img, { x: 0, y: 0, width: 3, height: 1 }, 2, 1, { linear: false });
    // Cell 0 covers pixel 0 fully and half of pixel 1: (1 × 1 + 0.5 × 0) / 1.5 = 2/3.
    expect(Array.from(out).map((v) => Math.round(v * 1000) / 1000)).toEqual([0.667, 0.667, 0.667, 0.667, 0.667, 0.667]);
  });

  test("black and white stitches averaged in linear light give the grey of half the light (IEC 61966-2-1)", () => {
    const img = paint(2, 1, (x) => (x ? [255, 255, 255] : [0, 0, 0]));
    const lin = resampleArea(img, { x: 0, y: 0, width: 2, height: 1 }, 1, 1, { linear: true });
    expect(lin[0]).toBeCloseTo(0.5, 10);
    // 50 % linear light is sRGB 188 (#BCBCBC), not the 128 of averaging the encoded values.
    expect(labToHex(linearToLab(lin[0], lin[1], lin[2]))).toBe("#BCBCBC");
    const enc = resampleArea(img, { x: 0, y: 0, width: 2, height: 1 }, 1, 1, { linear: false });
    expect(enc[0]).toBeCloseTo(0.5, 10);
  });

  test("upscaling: a 2 × 2 picture fills a 6 × 6 chart in four blocks", () => {
    const img = paint(2, 2, (x, y) => rgb(x === y ? RED.hex : OAT.hex));
    const { chart } = photoToChart(img, { width: 6, height: 6, gauge, palette });
    expect(chart.rows).toEqual(["XXX...", "XXX...", "XXX...", "...XXX", "...XXX", "...XXX"]);
  });

  test("Lab of a palette colour round-trips through linear light", () => {
    for (const hex of ["#EFE6D2", "#9E2B25", "#22304F", "#000000", "#FFFFFF"]) {
      const lab = hexToLab(hex);
      expect(labToHex(lab)).toBe(hex);
    }
  });
});

describe("crop for the gauge", () => {
  test("the crop's pixel aspect equals the area's true width ÷ height at the gauge", () => {
    // 60 sts at 24 per 10 cm = 25 cm; 80 rows at 30 per 10 cm = 26.67 cm: width ÷ height = 0.9375.
    expect(gaugeAspect(60, 80, gauge)).toBeCloseTo(0.9375, 12);
    const box = cropForGauge({ width: 4000, height: 3000 }, { width: 60, height: 80, gauge });
    expect(box).toEqual({ x: 594, y: 0, width: 2813, height: 3000 });
    // Inside a box the maker drew, centred on it.
    const inside = cropForGauge({ width: 4000, height: 3000 }, { width: 60, height: 80, gauge }, { x: 100, y: 100, width: 1000, height: 2000 });
    expect(inside).toEqual({ x: 100, y: 567, width: 1000, height: 1067 });
    // A chart drawn from the gauge crop is not reported as stretched.
    const img = paint(300, 320, () => rgb(OAT.hex));
    const crop = cropForGauge(img, { width: 60, height: 80, gauge });
    expect(photoToChart(img, { width: 60, height: 80, gauge, palette, crop }).report.notes.join(" ")).not.toMatch(/area at this gauge/);
  });
});

describe("matching chosen colours to the studio's yarns", () => {
  test("nearest yarn by CIEDE2000 with its difference", () => {
    const m = matchColoursToPalette(["#A02A26", "#F0E8D0"], palette);
    expect(m.map((x) => x.key)).toEqual(["X", "."]);
    expect(m[0].deltaE00).toBeGreaterThan(0);
    expect(m[0].deltaE00).toBeLessThan(2);
    expect(matchColoursToPalette([{ hex: "#22304F" }], palette)[0]).toEqual({ ...NAVY, deltaE00: 0 });
  });
});

describe("isolated stitches", () => {
  test("a stitch whose eight neighbours all differ takes their most common colour; a pair stays", () => {
    // 5 × 4, top row first: a lone 1 at (1, 1); a pair of 2s at (3, 2)–(3, 3) stays.
    const grid = Uint8Array.from([0, 0, 0, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 2, 0, 0, 0, 0, 2, 0]);
    const out = removeIsolatedStitches(grid, 5, 4);
    expect(out.replaced).toBe(1);
    expect(Array.from(out.labels)).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 2, 0, 0, 0, 0, 2, 0]);
  });

  test("clean-up through photoToChart is reported", () => {
    const img = paint(50, 40, (x, y) => (Math.floor(x / 10) === 2 && Math.floor(y / 8) === 2 ? rgb(RED.hex) : rgb(OAT.hex)));
    const kept = photoToChart(img, { width: 5, height: 5, gauge, palette });
    expect(kept.chart.rows[2]).toBe("..X..");
    const cleaned = photoToChart(img, { width: 5, height: 5, gauge, palette, cleanup: { removeIsolated: true } });
    expect(cleaned.chart.rows[2]).toBe(".....");
    expect(cleaned.report.isolatedReplaced).toBe(1);
  });
});

describe("chartToPixels", () => {
  test("draws each stitch as a cellWidth × cellHeight block, top row first", () => {
    const img = chartToPixels({ version: 1, width: 2, height: 1, gauge, palette: [OAT, RED], rows: [".X"] }, 2, 3);
    expect(img.width).toBe(4);
    expect(img.height).toBe(3);
    expect(Array.from(img.data.slice(0, 16))).toEqual([...rgb(OAT.hex), 255, ...rgb(OAT.hex), 255, ...rgb(RED.hex), 255, ...rgb(RED.hex), 255]);
  });
});

describe("refusals name the field", () => {
  const img = paint(40, 30, () => rgb(OAT.hex));
  const base = { width: 10, height: 10, gauge };
  test.each<[string, object, string, RegExp]>([
    ["no colours", { palette: [] }, "palette", /has 0 colours; a chart from a photo needs at least 2/],
    ["one colour", { palette: [OAT] }, "palette", /has 1 colour; .* at least 2/],
    ["colours 0", { colours: 0 }, "colours", /at least 2/],
    ["colours 1", { colours: 1 }, "colours", /at least 2/],
    ["colours 17", { colours: 17 }, "colours", /at most 16, the most a chart allows/],
    ["colours 2.5", { colours: 2.5 }, "colours", /whole number/],
    ["17 palette colours", { palette: Array.from({ length: 17 }, (_, i) => ({ key: String.fromCharCode(65 + i), name: `c${i}`, hex: "#000000" })) }, "palette", /at most 16/],
    ["both", { palette, colours: 3 }, "palette", /either a palette .* or a number of colours/],
    ["neither", {}, "palette", /either a palette/],
    ["duplicate key", { palette: [OAT, { ...RED, key: "." }] }, "palette[1].key", /already used/],
    ["bad hex", { palette: [OAT, { ...RED, hex: "red" }] }, "palette[1].hex", /#RRGGBB/],
    ["crop outside", { palette, crop: { x: 30, y: 0, width: 20, height: 10 } }, "crop", /not inside the image \(40 × 30 pixels\)/],
    ["crop negative", { palette, crop: { x: -1, y: 0, width: 20, height: 10 } }, "crop", /not inside the image/],
    ["crop empty", { palette, crop: { x: 0, y: 0, width: 0, height: 10 } }, "crop", /above 0/],
    ["width 0", { palette, width: 0 }, "width", /from 1 to 400/],
    ["height 401", { palette, height: 401 }, "height", /from 1 to 400/],
    ["width 1.5", { palette, width: 1.5 }, "width", /whole number/],
    ["gauge 0", { palette, gauge: { stitchesPer10cm: 0, rowsPer10cm: 30 } }, "gauge.stitchesPer10cm", /above 0/],
  ])("%s", (_, extra, field, message) => {
    let error: unknown;
    try {
      photoToChart(img, { ...base, ...extra } as Parameters<typeof photoToChart>[1]);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(PhotoError);
    expect((error as PhotoError).field).toBe(field);
    expect((error as PhotoError).message).toMatch(message);
  });

  test("pixels that do not match the size are refused", () => {
    expect(() => photoToChart({ width: 10, height: 10, data: new Uint8Array(12) }, { ...base, palette })).toThrow(/image: must hold 10 × 10 × 4 bytes/);
  });
});
