// Choosing n colours for a picture, in CIELAB. A photographed chart is a few dense clusters (the
// yarns) joined by thin trails of stitches mixed with their neighbours by blur, and one yarn often
// covers most of the chart. Plain k-means (kmeans.ts, k-means++ seeding) then splits the big cluster
// or spends a colour on the trails. Instead, by default: the density peaks of A. Rodriguez, A. Laio,
// "Clustering by fast search and find of density peaks", Science 344 (6191), 2014, 1492–1496 (local
// density ρ; distance δ to the nearest denser colour; peaks are far from any denser colour), taken
// densest first, then one trimmed k-means step: each centre becomes the mean of the stitches nearest
// to it and within DENSITY_RADIUS, so mixed stitches do not pull it. Deterministic, no random seed.
// Measured against k-means++ in tests/unit/photo (README.md, "Accuracy").
import { kMeans } from "./kmeans";

/** Lab distance within which two stitches count as the same colour when measuring density. */
export const DENSITY_RADIUS = 3;
/** A peak must lie at least this far (Lab) from any denser colour to be taken before the others. */
export const MIN_PEAK_SEPARATION = 3;
/** At most this many occupied Lab bins are compared pairwise; coarser bins are used beyond it. */
const MAX_BINS = 4000;

interface Bins {
  /** mean Lab per bin, 3 numbers each */
  centre: Float64Array;
  /** stitches per bin */
  count: Float64Array;
}

function binLab(labs: Float64Array, size: number): Bins {
  const n = labs.length / 3;
  const index = new Map<number, number>();
  const sums: number[] = [];
  const counts: number[] = [];
  for (let i = 0; i < n; i++) {
    // L in 0..100, a and b in about −128..128: offset so the key is a non-negative integer.
    const kl = Math.floor(labs[i * 3] / size);
    const ka = Math.floor((labs[i * 3 + 1] + 200) / size);
    const kb = Math.floor((labs[i * 3 + 2] + 200) / size);
    const key = (kl * 1024 + ka) * 1024 + kb;
    let b = index.get(key);
    if (b === undefined) {
      b = counts.length;
      index.set(key, b);
      sums.push(0, 0, 0);
      counts.push(0);
    }
    sums[b * 3] += labs[i * 3];
    sums[b * 3 + 1] += labs[i * 3 + 1];
    sums[b * 3 + 2] += labs[i * 3 + 2];
    counts[b]++;
  }
  const centre = new Float64Array(sums.length);
  for (let b = 0; b < counts.length; b++) for (let c = 0; c < 3; c++) centre[b * 3 + c] = sums[b * 3 + c] / counts[b];
  return { centre, count: Float64Array.from(counts) };
}

function d2(x: Float64Array, i: number, y: Float64Array, j: number): number {
  const dl = x[i * 3] - y[j * 3];
  const da = x[i * 3 + 1] - y[j * 3 + 1];
  const db = x[i * 3 + 2] - y[j * 3 + 2];
  return dl * dl + da * da + db * db;
}

/** Density-peak seeds: k Lab centres (3 numbers each). */
export function densityPeaks(labs: Float64Array, k: number): Float64Array {
  let size = DENSITY_RADIUS / 3;
  let bins = binLab(labs, size);
  while (bins.count.length > MAX_BINS) {
    size *= 1.5;
    bins = binLab(labs, size);
  }
  const B = bins.count.length;
  const r2 = DENSITY_RADIUS * DENSITY_RADIUS;
  const rho = new Float64Array(B);
  for (let p = 0; p < B; p++) {
    let sum = 0;
    for (let q = 0; q < B; q++) if (d2(bins.centre, p, bins.centre, q) <= r2) sum += bins.count[q];
    rho[p] = sum;
  }
  // Densest first; equal densities by bin order, so the result never depends on sort stability.
  const order = Array.from({ length: B }, (_, i) => i).sort((p, q) => rho[q] - rho[p] || p - q);
  const delta = new Float64Array(B);
  for (let i = 0; i < B; i++) {
    const p = order[i];
    let best = Infinity;
    for (let j = 0; j < i; j++) best = Math.min(best, d2(bins.centre, p, bins.centre, order[j]));
    delta[p] = Math.sqrt(best);
  }
  delta[order[0]] = Infinity;
  // Peaks well apart from any denser colour and from the peaks already taken, densest first; if too
  // few, the same with a smaller separation step by step (a small yarn beside a big one sits on the
  // big one's tail, so its δ is smaller), and at last the rest by ρ·δ.
  const chosen: number[] = [];
  const farFromChosen = (p: number, t: number) => chosen.every((c) => d2(bins.centre, p, bins.centre, c) >= t * t);
  for (let t = MIN_PEAK_SEPARATION; t >= 1 && chosen.length < k; t -= 0.5) {
    for (const p of order) if (chosen.length < k && delta[p] >= t && !chosen.includes(p) && farFromChosen(p, t)) chosen.push(p);
  }
  if (chosen.length < k) {
    const rest = order.filter((p) => !chosen.includes(p)).sort((p, q) => rho[q] * delta[q] - rho[p] * delta[p] || p - q);
    for (const p of rest) if (chosen.length < k) chosen.push(p);
  }
  // Fewer distinct bins than colours asked for: repeat the last one (reported as a repeat later).
  while (chosen.length < k) chosen.push(chosen[chosen.length - 1] ?? 0);
  const seeds = new Float64Array(k * 3);
  chosen.forEach((p, j) => seeds.set(bins.centre.subarray(p * 3, p * 3 + 3), j * 3));
  return seeds;
}

export type Seeding = "density-peaks" | "kmeans++";

/** k colour centres (Lab, 3 numbers each) for the stitches' Lab values. */
export function chooseColours(labs: Float64Array, k: number, options: { seeding?: Seeding; seed?: number } = {}): Float64Array {
  if ((options.seeding ?? "density-peaks") === "kmeans++") return kMeans(labs, k, { seed: options.seed }).centres;
  return trimmedMeans(labs, densityPeaks(labs, k), DENSITY_RADIUS);
}

/** Each centre moved to the mean of the stitches nearest to it and within `radius` of it (one step of trimmed k-means). */
export function trimmedMeans(labs: Float64Array, centres: Float64Array, radius: number): Float64Array {
  const k = centres.length / 3;
  const n = labs.length / 3;
  const sums = new Float64Array(k * 3);
  const count = new Float64Array(k);
  const r2 = radius * radius;
  for (let i = 0; i < n; i++) {
    let best = 0;
    let bestD = Infinity;
    for (let j = 0; j < k; j++) {
      const d = d2(labs, i, centres, j);
      if (d < bestD) [best, bestD] = [j, d];
    }
    if (bestD > r2) continue;
    for (let c = 0; c < 3; c++) sums[best * 3 + c] += labs[i * 3 + c];
    count[best]++;
  }
  const out = centres.slice();
  for (let j = 0; j < k; j++) if (count[j] > 0) for (let c = 0; c < 3; c++) out[j * 3 + c] = sums[j * 3 + c] / count[j];
  return out;
}
