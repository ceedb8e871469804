// Yarn in one knitted stitch, from gauge alone, by relaxed plain-knit geometry.

// The geometry is Munden's ("The geometry and dimensional properties of plain-knit fabrics",
// J. Textile Institute, 1959): wales per cm × loop length ≈ Kw and courses per cm × loop length ≈ Kc,
// whatever the yarn. The values used here, Kw ≈ 4.2 and Kc ≈ 5.5, are the fully relaxed ones from
// later work (e.g. Knapton et al., 1968), as quoted in textile-engineering texts; Munden's own 1959
// figures were about 3.8 / 5.0 dry-relaxed and 4.1 / 5.3 wet-relaxed (from memory). Hand knits are
// wet-blocked, so the fully relaxed values fit. Loop length ≈ 4.2 ÷ wales per cm.
export const MUNDEN_KW = 4.2;
export const MUNDEN_KC = 5.5;
export const MUNDEN_SOURCE =
  "Plain-knit loop geometry after Munden (J. Textile Institute, 1959); fully relaxed value from later work (e.g. Knapton et al., 1968, as quoted in textile-engineering texts): wales/cm × loop length ≈ 4.2";

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
