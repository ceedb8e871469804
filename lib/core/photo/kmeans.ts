// k-means in CIELAB with k-means++ seeding (D. Arthur, S. Vassilvitskii, "k-means++: the advantages
// of careful seeding", Proc. 18th ACM-SIAM SODA, 2007, 1027–1035) driven by a fixed-seed PRNG, so
// the same photo always gives the same colours. Several seedings are tried and the one with the
// least total squared distance is kept.

/** mulberry32: a small 32-bit PRNG (public domain, common practice); returns numbers in [0, 1). */
export function seededRandom(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface KMeansOptions {
  seed?: number;
  /** seedings tried (default 6) */
  restarts?: number;
  /** Lloyd iterations per seeding at most (default 40) */
  maxIterations?: number;
  /** weight per point (default 1 each) */
  weights?: Float64Array;
  /** start from these centres (3 numbers each) instead of k-means++ seedings */
  initial?: Float64Array;
}

export interface KMeansResult {
  /** k centres, 3 numbers each (L, a, b) */
  centres: Float64Array;
  /** centre index per point */
  labels: Int32Array;
  /** weighted sum of squared distances */
  cost: number;
}

/** Clusters `points` (3 numbers per point) into k groups; k must not exceed the number of points. */
export function kMeans(points: Float64Array, k: number, options: KMeansOptions = {}): KMeansResult {
  const n = points.length / 3;
  const random = seededRandom(options.seed ?? 0x5eed);
  const restarts = options.restarts ?? 6;
  const maxIterations = options.maxIterations ?? 40;
  const weights = options.weights ?? new Float64Array(n).fill(1);
  if (options.initial) return lloyd(points, weights, options.initial.slice(), maxIterations);
  let best: KMeansResult | null = null;
  for (let attempt = 0; attempt < restarts; attempt++) {
    const centres = seedPlusPlus(points, weights, k, random);
    const result = lloyd(points, weights, centres, maxIterations);
    if (!best || result.cost < best.cost - 1e-9) best = result;
  }
  return best as KMeansResult;
}

function dist2(points: Float64Array, i: number, centres: Float64Array, j: number): number {
  const dl = points[i * 3] - centres[j * 3];
  const da = points[i * 3 + 1] - centres[j * 3 + 1];
  const db = points[i * 3 + 2] - centres[j * 3 + 2];
  return dl * dl + da * da + db * db;
}

function seedPlusPlus(points: Float64Array, weights: Float64Array, k: number, random: () => number): Float64Array {
  const n = points.length / 3;
  const centres = new Float64Array(k * 3);
  const nearest = new Float64Array(n).fill(Infinity);
  let pick = pickWeighted(weights, random);
  for (let j = 0; j < k; j++) {
    centres.set(points.subarray(pick * 3, pick * 3 + 3), j * 3);
    let total = 0;
    for (let i = 0; i < n; i++) {
      const d = dist2(points, i, centres, j);
      if (d < nearest[i]) nearest[i] = d;
      total += weights[i] * nearest[i];
    }
    if (j + 1 === k) break;
    if (total === 0) {
      pick = Math.floor(random() * n); // every point is already a centre: any point will do
      continue;
    }
    let target = random() * total;
    pick = n - 1;
    for (let i = 0; i < n; i++) {
      target -= weights[i] * nearest[i];
      if (target < 0) {
        pick = i;
        break;
      }
    }
  }
  return centres;
}

function pickWeighted(weights: Float64Array, random: () => number): number {
  let total = 0;
  for (const w of weights) total += w;
  let target = random() * total;
  for (let i = 0; i < weights.length; i++) {
    target -= weights[i];
    if (target < 0) return i;
  }
  return weights.length - 1;
}

function lloyd(points: Float64Array, weights: Float64Array, centres: Float64Array, maxIterations: number): KMeansResult {
  const n = points.length / 3;
  const k = centres.length / 3;
  const labels = new Int32Array(n).fill(-1);
  const sums = new Float64Array(k * 3);
  const mass = new Float64Array(k);
  let cost = 0;
  for (let iter = 0; iter < maxIterations; iter++) {
    let changed = 0;
    cost = 0;
    for (let i = 0; i < n; i++) {
      let bestJ = 0;
      let bestD = Infinity;
      for (let j = 0; j < k; j++) {
        const d = dist2(points, i, centres, j);
        if (d < bestD) {
          bestD = d;
          bestJ = j;
        }
      }
      cost += weights[i] * bestD;
      if (labels[i] !== bestJ) {
        labels[i] = bestJ;
        changed++;
      }
    }
    if (changed === 0) break;
    sums.fill(0);
    mass.fill(0);
    for (let i = 0; i < n; i++) {
      const j = labels[i];
      const w = weights[i];
      sums[j * 3] += w * points[i * 3];
      sums[j * 3 + 1] += w * points[i * 3 + 1];
      sums[j * 3 + 2] += w * points[i * 3 + 2];
      mass[j] += w;
    }
    for (let j = 0; j < k; j++) {
      if (mass[j] > 0) {
        centres[j * 3] = sums[j * 3] / mass[j];
        centres[j * 3 + 1] = sums[j * 3 + 1] / mass[j];
        centres[j * 3 + 2] = sums[j * 3 + 2] / mass[j];
      }
      // An empty cluster keeps its centre (a seed that lost all its points); rare with k-means++.
    }
  }
  return { centres, labels, cost };
}
