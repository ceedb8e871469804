// Colour arithmetic for rendering: parse #RRGGBB, relative luminance, a legible mark colour.

export function hexToRgb(hex: string): [number, number, number] {
  const m = /^#([0-9a-fA-F]{6})$/.exec(hex);
  if (!m) throw new RangeError(`'${hex}' is not a colour of the form #RRGGBB`);
  const n = parseInt(m[1], 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** WCAG 2 relative luminance, 0 (black) to 1 (white). */
export function getLuminance(hex: string): number {
  const [r, g, b] = hexToRgb(hex).map((v) => {
    const c = v / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2 contrast ratio between two colours (1 to 21). */
export function getContrast(a: string, b: string): number {
  const la = getLuminance(a);
  const lb = getLuminance(b);
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

/** Black or white, whichever stands out more on `background`. */
export function getMarkColour(background: string): "#000000" | "#FFFFFF" {
  return getContrast(background, "#000000") >= getContrast(background, "#FFFFFF") ? "#000000" : "#FFFFFF";
}

/** The colour scaled towards black by `factor` (0 = unchanged, 1 = black), as #RRGGBB. */
export function darken(hex: string, factor: number): string {
  const out = hexToRgb(hex).map((v) => Math.round(v * (1 - factor)));
  return "#" + out.map((v) => v.toString(16).padStart(2, "0")).join("").toUpperCase();
}
