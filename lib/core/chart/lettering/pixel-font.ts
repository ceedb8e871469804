// A pixel font of our own: each glyph is drawn as rows of '#' (ink) and '.' (blank), top row first.

export type FontId = "5x7" | "3x5";

export interface PixelFont {
  id: FontId;
  name: string;
  /** every glyph is this many rows tall */
  height: number;
  /** widest glyph; letters and digits all use this width so names line up */
  width: number;
  /** blank columns for a space (kerning still applies on both sides of it) */
  spaceWidth: number;
  /** blank columns between neighbouring glyphs */
  kerning: number;
  glyphs: Readonly<Record<string, readonly string[]>>;
}

export const INK = "#";
