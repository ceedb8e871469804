import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { flattenDesign, makeMirroredPair, mirrorBox, mirrorDesign, parseDesign, serializeDesign } from "@/lib/core/chart/layered-design";
import { FONTS, FONT_IDS, LetteringError, letter, measureText, renderText } from "@/lib/core/chart/lettering/letter";
import { INK } from "@/lib/core/chart/lettering/pixel-font";
import { cellAt, createChart, type Chart } from "@/lib/core/chart/model";
import { copyRegion, flipHorizontal, placeMotif } from "@/lib/core/chart/ops";
import { getMotif } from "@/lib/core/chart/motifs";
import { sameChart } from "./arbitraries";

const REQUIRED = Array.from("ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789&.-'♥");
const gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };
const palette = [
  { key: ".", name: "Oat", hex: "#EFE6D2" },
  { key: "X", name: "Red", hex: "#9E2B25" },
  { key: "g", name: "Green", hex: "#3F5E3A" },
];

function maskRows(mask: { width: number; height: number; cells: Uint8Array }): string[] {
  const rows: string[] = [];
  for (let y = mask.height - 1; y >= 0; y--) rows.push(Array.from({ length: mask.width }, (_, x) => (mask.cells[y * mask.width + x] ? INK : ".")).join(""));
  return rows;
}

describe.each(FONT_IDS)("font %s", (id) => {
  const font = FONTS[id];
  test("has every required glyph", () => {
    expect(REQUIRED.filter((ch) => !(ch in font.glyphs))).toEqual([]);
  });

  test.each(Object.keys(font.glyphs))("glyph %s fits the font box and uses only ink and blank", (ch) => {
    const glyph = font.glyphs[ch];
    expect(glyph).toHaveLength(font.height);
    const width = glyph[0].length;
    expect(width).toBeGreaterThanOrEqual(1);
    expect(width).toBeLessThanOrEqual(font.width);
    for (const row of glyph) expect(row).toMatch(new RegExp(`^[#.]{${width}}$`));
    // Every glyph leaves a mark, and letters and digits use the full width so words line up.
    expect(glyph.join("")).toContain(INK);
    if (/[A-Z0-9]/.test(ch)) expect(width).toBe(font.width);
  });

  test("no two letters or digits look the same", () => {
    const shapes = REQUIRED.map((ch) => font.glyphs[ch].join("/"));
    expect(new Set(shapes).size).toBe(shapes.length);
  });

  test("width is the glyph widths plus one kerning column between neighbours", () => {
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...REQUIRED), { minLength: 1, maxLength: 12 }), (chars) => {
        const widths = chars.reduce((sum, ch) => sum + font.glyphs[ch][0].length, 0);
        expect(measureText(chars.join(""), id)).toEqual({ width: widths + chars.length - 1, height: font.height });
      }),
    );
  });
});

describe("setting text", () => {
  test("the brief's example: 7 letters of 5 plus 6 gaps is 41 stitches", () => {
    expect(measureText("ABCDEFG", "5x7")).toEqual({ width: 41, height: 7 });
    expect(() => letter("ABCDEFG", "5x7", { width: 30, height: 9 })).toThrow(new LetteringError("'ABCDEFG' needs 41 × 7 stitches; the box is 30 × 9"));
  });

  test.each<[string, "5x7" | "3x5", number]>([
    ["A B", "5x7", 5 + 1 + 2 + 1 + 5],
    ["A B", "3x5", 3 + 1 + 1 + 1 + 3],
    ["A.B", "5x7", 5 + 1 + 1 + 1 + 5],
    ["A-B", "3x5", 3 + 1 + 2 + 1 + 3],
    ["  jo  ", "3x5", 7],
  ])("'%s' in %s is %i stitches wide", (text, font, width) => {
    expect(measureText(text, font).width).toBe(width);
  });

  test("lower case is set in capitals", () => {
    expect(renderText("anna", "3x5")).toEqual(renderText("ANNA", "3x5"));
  });

  test("a character without a glyph is named", () => {
    expect(() => measureText("JOSÉ!", "5x7")).toThrow("'É', '!' have no glyph in the 5 × 7 font; it has A–Z, 0–9, & . - ' ♥ and space");
    expect(() => measureText("   ", "3x5")).toThrow("the lettering text is empty");
  });

  test("renders glyphs in order with a blank column between", () => {
    expect(maskRows(renderText("I-", "3x5"))).toEqual(["###...", ".#....", ".#..##", ".#....", "###..."]);
  });

  test("centres in the box, an odd stitch to the right and an odd row to the top", () => {
    const chart = letter("I", "3x5", { width: 6, height: 8 });
    // 3 × 5 glyph in 6 × 8: 1 blank column left (2 right), 1 blank row below (2 above).
    const rows: string[] = [];
    for (let y = 7; y >= 0; y--) rows.push(Array.from({ length: 6 }, (_, x) => (cellAt(chart, x, y) ? "#" : ".")).join(""));
    expect(rows).toEqual(["......", "......", ".###..", "..#...", "..#...", "..#...", ".###..", "......"]);
  });

  test("the output chart uses colour 0 for background and 1 for ink", () => {
    const chart = letter("♥", "5x7", { width: 5, height: 7 }, { palette, gauge });
    expect(chart.palette).toEqual(palette);
    expect(new Set(chart.cells)).toEqual(new Set([0, 1]));
  });
});

describe("mirrored pair", () => {
  // A base with an asymmetric motif so mirroring is visible.
  const base = (): Chart => placeMotif(createChart(40, 30, gauge, palette), getMotif("reindeer"), { x: 1, y: 0 }, { pattern: 2 });

  test("lettering reads left to right on both pieces while the motif mirrors", () => {
    const textArb = fc.array(fc.constantFrom(..."ABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789&♥"), { minLength: 1, maxLength: 5 }).map((a) => a.join(""));
    fc.assert(
      fc.property(textArb, fc.constantFrom(...FONT_IDS), fc.integer({ min: 0, max: 10 }), fc.integer({ min: 15, max: 21 }), fc.boolean(), (text, font, x, y, withBackground) => {
        const size = measureText(text, font);
        const box = { x, y, width: Math.min(40 - x, size.width + 3), height: font === "5x7" ? 9 : 7 };
        fc.pre(box.width >= size.width);
        const placement = { text, font, box, colour: 1, ...(withBackground ? { background: 0 } : {}) };
        const { left, right, rightLettering } = makeMirroredPair(base(), [placement]);
        const fresh = letter(text, font, box);
        const mirrored = mirrorBox(box, 40);
        expect(rightLettering[0].box).toEqual(mirrored);
        // The right piece's box holds the same upright text as a fresh render (and so does the left's).
        for (const [piece, at] of [[left, box], [right, mirrored]] as const) {
          const region = copyRegion(piece, at);
          for (let i = 0; i < fresh.cells.length; i++) {
            if (fresh.cells[i] === 1) expect(region.cells[i]).toBe(1);
            else if (withBackground) expect(region.cells[i]).toBe(0);
          }
        }
        // Outside the lettering box the right piece is the left's mirror image.
        const leftMirror = flipHorizontal(left);
        for (let yy = 0; yy < 30; yy++) {
          for (let xx = 0; xx < 40; xx++) {
            const inBox = xx >= mirrored.x && xx < mirrored.x + mirrored.width && yy >= box.y && yy < box.y + box.height;
            if (!inBox) expect(cellAt(right, xx, yy)).toBe(cellAt(leftMirror, xx, yy));
          }
        }
      }),
      { numRuns: 60 },
    );
  });

  test("a plain mirror would reverse the text, which is why lettering is re-set", () => {
    const { left, right } = makeMirroredPair(base(), [{ text: "JK", font: "5x7", box: { x: 5, y: 20, width: 11, height: 7 }, colour: 1 }]);
    expect(sameChart(right, flipHorizontal(left))).toBe(false);
  });

  test("mirroring a design twice gives back the design", () => {
    const design = { base: base(), lettering: [{ text: "EVA", font: "3x5" as const, box: { x: 3, y: 20, width: 13, height: 6 }, colour: 1 }] };
    const twice = mirrorDesign(mirrorDesign(design));
    expect(twice.lettering).toEqual(design.lettering);
    expect(sameChart(flattenDesign(twice), flattenDesign(design))).toBe(true);
  });

  test("the stored design form round-trips and checks its keys", () => {
    const design = { base: base(), lettering: [{ text: "EVA", font: "3x5" as const, box: { x: 3, y: 20, width: 13, height: 6 }, colour: 1, background: 0 }] };
    const stored = serializeDesign(design);
    expect(stored.lettering[0]).toEqual({ text: "EVA", font: "3x5", box: { x: 3, y: 20, width: 13, height: 6 }, key: "X", backgroundKey: "." });
    const back = parseDesign(JSON.parse(JSON.stringify(stored)));
    expect(back.lettering).toEqual(design.lettering);
    expect(sameChart(back.base, design.base)).toBe(true);
    expect(() => parseDesign({ ...stored, lettering: [{ ...stored.lettering[0], key: "Q" }] })).toThrow("lettering[0].key 'Q' is not in the palette");
    expect(() => parseDesign({ ...stored, lettering: [{ ...stored.lettering[0], box: { x: 30, y: 20, width: 13, height: 6 } }] })).toThrow(/does not lie inside the 40 × 30 chart/);
  });
});
