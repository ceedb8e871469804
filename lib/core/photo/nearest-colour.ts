// The nearest of a few colours by CIEDE2000 for many stitches. The same formula as getCiede2000
// (lib/core/colourwork/ciede2000.ts, after Sharma, Wu, Dalal 2005) written out on plain numbers with
// each target's chroma worked out once, about three times faster than calling it per pair; a test
// holds the two to the same values.
import type { Lab } from "../colourwork/ciede2000";

const DEG = Math.PI / 180;
const POW25_7 = 6103515625; // 25^7

function pow7(x: number): number {
  const x2 = x * x;
  return x2 * x2 * x2 * x;
}

function hue(b: number, ap: number): number {
  if (b === 0 && ap === 0) return 0;
  const h = Math.atan2(b, ap) / DEG;
  return h < 0 ? h + 360 : h;
}

/** ΔE00 between (L1, a1, b1) with chroma c1 and (L2, a2, b2) with chroma c2 (kL = kC = kH = 1). */
export function ciede2000(L1: number, a1: number, b1: number, c1: number, L2: number, a2: number, b2: number, c2: number): number {
  const cMean7 = pow7((c1 + c2) / 2);
  const g = 0.5 * (1 - Math.sqrt(cMean7 / (cMean7 + POW25_7)));
  const ap1 = (1 + g) * a1;
  const ap2 = (1 + g) * a2;
  const cp1 = Math.sqrt(ap1 * ap1 + b1 * b1);
  const cp2 = Math.sqrt(ap2 * ap2 + b2 * b2);
  const hp1 = hue(b1, ap1);
  const hp2 = hue(b2, ap2);
  const dL = L2 - L1;
  const dC = cp2 - cp1;
  const cc = cp1 * cp2;
  let dh = 0;
  if (cc !== 0) {
    dh = hp2 - hp1;
    if (dh > 180) dh -= 360;
    else if (dh < -180) dh += 360;
  }
  const dH = 2 * Math.sqrt(cc) * Math.sin((dh / 2) * DEG);
  const lMean = (L1 + L2) / 2;
  const cpMean = (cp1 + cp2) / 2;
  let hMean = hp1 + hp2;
  if (cc !== 0) {
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
  const x = (hMean - 275) / 25;
  const dTheta = 30 * Math.exp(-(x * x));
  const cpMean7 = pow7(cpMean);
  const rC = 2 * Math.sqrt(cpMean7 / (cpMean7 + POW25_7));
  const l50 = (lMean - 50) * (lMean - 50);
  const sL = 1 + (0.015 * l50) / Math.sqrt(20 + l50);
  const sC = 1 + 0.045 * cpMean;
  const sH = 1 + 0.015 * cpMean * t;
  const rT = -Math.sin(2 * dTheta * DEG) * rC;
  const tl = dL / sL;
  const tc = dC / sC;
  const th = dH / sH;
  return Math.sqrt(tl * tl + tc * tc + th * th + rT * tc * th);
}

/** For each stitch (Lab, 3 numbers each) the index of the nearest target by CIEDE2000 and that difference. */
export function nearestByCiede2000(labs: Float64Array, targets: readonly Lab[]): { labels: Uint8Array; distance: Float64Array } {
  const n = labs.length / 3;
  const k = targets.length;
  const tL = targets.map((t) => t.L);
  const ta = targets.map((t) => t.a);
  const tb = targets.map((t) => t.b);
  const tc = targets.map((t) => Math.hypot(t.a, t.b));
  const labels = new Uint8Array(n);
  const distance = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const L = labs[i * 3];
    const a = labs[i * 3 + 1];
    const b = labs[i * 3 + 2];
    const c = Math.sqrt(a * a + b * b);
    let best = 0;
    let bestD = Infinity;
    for (let j = 0; j < k; j++) {
      const d = ciede2000(L, a, b, c, tL[j], ta[j], tb[j], tc[j]);
      if (d < bestD) {
        bestD = d;
        best = j;
      }
    }
    labels[i] = best;
    distance[i] = bestD;
  }
  return { labels, distance };
}
