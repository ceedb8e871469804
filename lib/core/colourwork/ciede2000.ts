// CIEDE2000 colour difference (CIE 142-2001), written from the formulae as set out in
// G. Sharma, W. Wu, E. N. Dalal, "The CIEDE2000 color-difference formula: implementation notes,
// supplementary test data, and mathematical observations", Color Res. Appl. 30(1), 2005, 21–30.
// Used to pick the knitted colour that shows least under a duplicate stitch.

export interface Lab {
  L: number;
  a: number;
  b: number;
}

const DEG = Math.PI / 180;
const POW25_7 = 25 ** 7;

/** ΔE00 between two CIELAB colours, with the parametric factors kL = kC = kH = 1. */
export function getCiede2000(x: Lab, y: Lab): number {
  const c1 = Math.hypot(x.a, x.b);
  const c2 = Math.hypot(y.a, y.b);
  const cMean7 = ((c1 + c2) / 2) ** 7;
  const g = 0.5 * (1 - Math.sqrt(cMean7 / (cMean7 + POW25_7)));
  const a1 = (1 + g) * x.a;
  const a2 = (1 + g) * y.a;
  const cp1 = Math.hypot(a1, x.b);
  const cp2 = Math.hypot(a2, y.b);
  const hp1 = hueDegrees(x.b, a1);
  const hp2 = hueDegrees(y.b, a2);

  const dL = y.L - x.L;
  const dC = cp2 - cp1;
  let dh = 0;
  if (cp1 * cp2 !== 0) {
    dh = hp2 - hp1;
    if (dh > 180) dh -= 360;
    else if (dh < -180) dh += 360;
  }
  const dH = 2 * Math.sqrt(cp1 * cp2) * Math.sin((dh / 2) * DEG);

  const lMean = (x.L + y.L) / 2;
  const cpMean = (cp1 + cp2) / 2;
  let hMean = hp1 + hp2;
  if (cp1 * cp2 !== 0) {
    if (Math.abs(hp1 - hp2) <= 180) hMean = (hp1 + hp2) / 2;
    else if (hp1 + hp2 < 360) hMean = (hp1 + hp2 + 360) / 2;
    else hMean = (hp1 + hp2 - 360) / 2;
  }
  const t =
    1 -
    0.17 * Math.cos((hMean - 30) * DEG) +
    0.24 * Math.cos(2 * hMean * DEG) +
    0.32 * Math.cos((3 * hMean + 6) * DEG) -
    0.2 * Math.cos((4 * hMean - 63) * DEG);
  const dTheta = 30 * Math.exp(-(((hMean - 275) / 25) ** 2));
  const cpMean7 = cpMean ** 7;
  const rC = 2 * Math.sqrt(cpMean7 / (cpMean7 + POW25_7));
  const l50 = (lMean - 50) ** 2;
  const sL = 1 + (0.015 * l50) / Math.sqrt(20 + l50);
  const sC = 1 + 0.045 * cpMean;
  const sH = 1 + 0.015 * cpMean * t;
  const rT = -Math.sin(2 * dTheta * DEG) * rC;
  const tl = dL / sL;
  const tc = dC / sC;
  const th = dH / sH;
  return Math.sqrt(tl * tl + tc * tc + th * th + rT * tc * th);
}

function hueDegrees(b: number, aPrime: number): number {
  if (b === 0 && aPrime === 0) return 0;
  const h = Math.atan2(b, aPrime) / DEG;
  return h < 0 ? h + 360 : h;
}

/** CIELAB (D65 white) of an sRGB colour written #RRGGBB (IEC 61966-2-1 transfer curve and matrix). */
export function hexToLab(hex: string): Lab {
  const m = /^#?([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new RangeError(`${JSON.stringify(hex)} is not a colour of the form #RRGGBB`);
  const [r, g, b] = [m[1], m[2], m[3]].map((h) => toLinear(parseInt(h, 16) / 255));
  const X = 0.4124564 * r + 0.3575761 * g + 0.1804375 * b;
  const Y = 0.2126729 * r + 0.7151522 * g + 0.072175 * b;
  const Z = 0.0193339 * r + 0.119192 * g + 0.9503041 * b;
  const fx = labF(X / 0.95047);
  const fy = labF(Y / 1.0);
  const fz = labF(Z / 1.08883);
  return { L: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

function toLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function labF(t: number): number {
  const eps = 216 / 24389;
  const kappa = 24389 / 27;
  return t > eps ? Math.cbrt(t) : (kappa * t + 16) / 116;
}

/** ΔE00 between two #RRGGBB colours. */
export function getColourDifference(hexA: string, hexB: string): number {
  return getCiede2000(hexToLab(hexA), hexToLab(hexB));
}
