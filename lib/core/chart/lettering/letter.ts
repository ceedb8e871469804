// Setting text in our pixel fonts: measure, render to a mask, centre in a box.
import { createChart, type Chart, type Gauge, type PaletteColour } from "../model";
import { FONT_3X5 } from "./font-3x5";
import { FONT_5X7 } from "./font-5x7";
import { INK, type FontId, type PixelFont } from "./pixel-font";

export const FONTS: Readonly<Record<FontId, PixelFont>> = { "5x7": FONT_5X7, "3x5": FONT_3X5 };
export const FONT_IDS = Object.keys(FONTS) as FontId[];

export class LetteringError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "LetteringError";
  }
}

export interface Size {
  width: number;
  height: number;
}

/** Ink cells of a line of text: 1 = ink, 0 = blank, row-major from the bottom like Chart.cells. */
export interface TextMask extends Size {
  cells: Uint8Array;
}

export function getFont(font: FontId | PixelFont): PixelFont {
  if (typeof font !== "string") return font;
  const found = FONTS[font];
  if (!found) throw new LetteringError(`unknown font '${String(font)}'; choose ${FONT_IDS.join(" or ")}`);
  return found;
}

/** The characters to set: trimmed and upper-cased, each checked against the font. */
export function normaliseText(text: string, font: FontId | PixelFont): string[] {
  const f = getFont(font);
  const chars = Array.from(text.trim().toUpperCase());
  if (chars.length === 0) throw new LetteringError("the lettering text is empty");
  const missing = [...new Set(chars.filter((ch) => ch !== " " && !(ch in f.glyphs)))];
  if (missing.length > 0) {
    throw new LetteringError(
      `${missing.map((ch) => `'${ch}'`).join(", ")} ${missing.length === 1 ? "has" : "have"} no glyph in the ${f.id.replace("x", " × ")} font; it has A–Z, 0–9, & . - ' ♥ and space`,
    );
  }
  return chars;
}

function glyphWidth(f: PixelFont, ch: string): number {
  return ch === " " ? f.spaceWidth : f.glyphs[ch][0].length;
}

/** Stitches the text needs: glyph widths plus one kerning gap between neighbours; the font's height. */
export function measureText(text: string, font: FontId | PixelFont): Size {
  const f = getFont(font);
  const chars = normaliseText(text, f);
  const width = chars.reduce((sum, ch) => sum + glyphWidth(f, ch), 0) + f.kerning * (chars.length - 1);
  return { width, height: f.height };
}

export function renderText(text: string, font: FontId | PixelFont): TextMask {
  const f = getFont(font);
  const chars = normaliseText(text, f);
  const { width, height } = measureText(text, f);
  const cells = new Uint8Array(width * height);
  let left = 0;
  for (const ch of chars) {
    if (ch !== " ") {
      f.glyphs[ch].forEach((row, i) => {
        const y = height - 1 - i; // glyph rows are drawn top first
        for (let x = 0; x < row.length; x++) if (row[x] === INK) cells[y * width + left + x] = 1;
      });
    }
    left += glyphWidth(f, ch) + f.kerning;
  }
  return { width, height, cells };
}

/**
 * Where text sits when centred in a box: offsets of its bottom-left from the box's bottom-left.
 * An odd leftover stitch goes to the right and an odd leftover row to the top.
 */
export function layoutText(text: string, font: FontId | PixelFont, box: Size): { mask: TextMask; offset: { x: number; y: number } } {
  const mask = renderText(text, font);
  if (mask.width > box.width || mask.height > box.height) {
    throw new LetteringError(`'${text}' needs ${mask.width} × ${mask.height} stitches; the box is ${box.width} × ${box.height}`);
  }
  return { mask, offset: { x: Math.floor((box.width - mask.width) / 2), y: Math.floor((box.height - mask.height) / 2) } };
}

export const LETTER_PALETTE: PaletteColour[] = [
  { key: ".", name: "Background", hex: "#F2EDE3" },
  { key: "X", name: "Lettering", hex: "#7A1F2B" },
];

export const LETTER_GAUGE: Gauge = { stitchesPer10cm: 32, rowsPer10cm: 36 };

/**
 * The text centred in a chart the size of the box: colour 0 is the background, colour 1 the ink.
 * Throws a LetteringError naming both sizes when the text does not fit.
 */
export function letter(
  text: string,
  font: FontId | PixelFont,
  box: Size,
  options: { palette?: PaletteColour[]; gauge?: Gauge } = {},
): Chart {
  const palette = options.palette ?? LETTER_PALETTE;
  if (palette.length < 2) throw new LetteringError("lettering needs a palette of at least two colours (background, then ink)");
  const { mask, offset } = layoutText(text, font, box);
  const chart = createChart(box.width, box.height, options.gauge ?? LETTER_GAUGE, palette);
  for (let y = 0; y < mask.height; y++) {
    for (let x = 0; x < mask.width; x++) {
      if (mask.cells[y * mask.width + x]) chart.cells[(y + offset.y) * box.width + x + offset.x] = 1;
    }
  }
  return chart;
}
