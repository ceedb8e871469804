// Yarn in one knitted stitch, from gauge alone, by relaxed plain-knit geometry.

// Munden, "The geometry and dimensional properties of plain-knit fabrics", J. Textile Institute,
// 1959: in a fully relaxed plain knit, wales per cm × loop length ≈ Kw ≈ 4.2 and courses per cm ×
// loop length ≈ Kc ≈ 5.5, whatever the yarn. So loop length ≈ 4.2 ÷ wales per cm.
export const MUNDEN_KW = 4.2;
export const MUNDEN_KC = 5.5;
export const MUNDEN_SOURCE = "Munden, J. Textile Institute 1959: relaxed plain knit, wales/cm × loop length ≈ 4.2";

/** Loop length in cm for a gauge in stitches (wales) per 10 cm; ≈ 2.1 cm at 20 sts per 10 cm. */
export function getLoopLengthCm(stitchesPer10cm: number): number {
  if (!Number.isFinite(stitchesPer10cm) || stitchesPer10cm <= 0) {
    throw new Error(`gauge must be more than 0 stitches per 10 cm (got ${String(stitchesPer10cm)})`);
  }
  return MUNDEN_KW / (stitchesPer10cm / 10);
}

/** Width of one stitch in cm: what a float carried past it spans. */
export function getStitchWidthCm(stitchesPer10cm: number): number {
  return 10 / stitchesPer10cm;
}
