// sRGB ↔ linear light ↔ CIELAB (D65), with the transfer curve and matrix of IEC 61966-2-1:1999
// (sRGB) and the CIE 1976 L*a*b* formulae (CIE 15:2004). Same constants as hexToLab in
// lib/core/colourwork/ciede2000.ts, so a palette colour and a photo cell land on the same Lab value.
import type { Lab } from "../colourwork/ciede2000";

/** sRGB byte (0–255) → linear light (0–1), one entry per byte value. */
export const SRGB_TO_LINEAR: Float64Array = (() => {
  const lut = new Float64Array(256);
  for (let v = 0; v < 256; v++) {
    const c = v / 255;
    lut[v] = c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }
  return lut;
})();

/** Linear light (0–1) → sRGB byte, rounded and clamped. */
export function linearToSrgbByte(c: number): number {
  const v = c <= 0.0031308 ? 12.92 * c : 1.055 * Math.max(0, c) ** (1 / 2.4) - 0.055;
  return Math.max(0, Math.min(255, Math.round(v * 255)));
}

const XN = 0.95047;
const YN = 1.0;
const ZN = 1.08883;
const EPS = 216 / 24389;
const KAPPA = 24389 / 27;

function labF(t: number): number {
  return t > EPS ? Math.cbrt(t) : (KAPPA * t + 16) / 116;
}

function labFInv(f: number): number {
  const t = f * f * f;
  return t > EPS ? t : (116 * f - 16) / KAPPA;
}

/** CIELAB of a linear-light sRGB colour. */
export function linearToLab(r: number, g: number, b: number): Lab {
  const X = 0.4124564 * r + 0.3575761 * g + 0.1804375 * b;
  const Y = 0.2126729 * r + 0.7151522 * g + 0.072175 * b;
  const Z = 0.0193339 * r + 0.119192 * g + 0.9503041 * b;
  const fx = labF(X / XN);
  const fy = labF(Y / YN);
  const fz = labF(Z / ZN);
  return { L: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

/** Linear-light sRGB of a CIELAB colour (may fall outside 0–1 for colours outside the sRGB gamut). */
export function labToLinear(lab: Lab): [number, number, number] {
  const fy = (lab.L + 16) / 116;
  const fx = fy + lab.a / 500;
  const fz = fy - lab.b / 200;
  const X = labFInv(fx) * XN;
  const Y = labFInv(fy) * YN;
  const Z = labFInv(fz) * ZN;
  // Inverse of the matrix above (IEC 61966-2-1, XYZ → linear sRGB).
  const r = 3.2404542 * X - 1.5371385 * Y - 0.4985314 * Z;
  const g = -0.969266 * X + 1.8760108 * Y + 0.041556 * Z;
  const b = 0.0556434 * X - 0.2040259 * Y + 1.0572252 * Z;
  return [r, g, b];
}

/** #RRGGBB (upper case) of a CIELAB colour, clamped into the sRGB gamut. */
export function labToHex(lab: Lab): string {
  const [r, g, b] = labToLinear(lab);
  return "#" + [r, g, b].map((c) => linearToSrgbByte(Math.max(0, Math.min(1, c))).toString(16).padStart(2, "0")).join("").toUpperCase();
}
