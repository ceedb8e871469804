// Font lists for PDF styles: our typeface first, then DejaVu Sans (Latin, Greek, Cyrillic, symbols)
// Droid Sans Fallback (Chinese, Japanese) and Nanum Gothic (Korean) for any letter it lacks; react-pdf takes each
// glyph from the first font of the list that has it. Registered in lib/server/pdf.ts.
export const TEXT_FONTS = ["Atkinson Hyperlegible", "DejaVu Sans", "Droid Sans Fallback", "Nanum Gothic"];
export const TITLE_FONTS = ["Fraunces", "DejaVu Sans", "Droid Sans Fallback", "Nanum Gothic"];
