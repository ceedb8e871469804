// Non-negative least squares, Lawson–Hanson active-set method (Lawson & Hanson, "Solving Least
// Squares Problems", 1974, ch. 23), sized for the handful of coefficients a stage model has.

export interface NnlsResult {
  x: number[];
  /** ‖A·x − b‖₂ */
  residualNorm: number;
  iterations: number;
}

/** Solve the square system M·s = r by Gaussian elimination with partial pivoting; null if singular. */
function solveSquare(m: number[][], r: number[]): number[] | null {
  const n = r.length;
  const a = m.map((row, i) => [...row, r[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let row = col + 1; row < n; row++) if (Math.abs(a[row][col]) > Math.abs(a[pivot][col])) pivot = row;
    if (Math.abs(a[pivot][col]) < 1e-12) return null;
    [a[col], a[pivot]] = [a[pivot], a[col]];
    for (let row = col + 1; row < n; row++) {
      const f = a[row][col] / a[col][col];
      for (let k = col; k <= n; k++) a[row][k] -= f * a[col][k];
    }
  }
  const s = new Array<number>(n).fill(0);
  for (let row = n - 1; row >= 0; row--) {
    let sum = a[row][n];
    for (let k = row + 1; k < n; k++) sum -= a[row][k] * s[k];
    s[row] = sum / a[row][row];
  }
  return s;
}

/** Unconstrained least squares on the columns in `set` (normal equations; columns are pre-scaled). */
function solveOnSet(a: number[][], b: number[], set: number[], n: number): number[] | null {
  const k = set.length;
  const ata = Array.from({ length: k }, () => new Array<number>(k).fill(0));
  const atb = new Array<number>(k).fill(0);
  for (let i = 0; i < a.length; i++) {
    for (let p = 0; p < k; p++) {
      const ap = a[i][set[p]];
      atb[p] += ap * b[i];
      for (let q = 0; q < k; q++) ata[p][q] += ap * a[i][set[q]];
    }
  }
  const sub = solveSquare(ata, atb);
  if (!sub) return null;
  const s = new Array<number>(n).fill(0);
  set.forEach((j, p) => (s[j] = sub[p]));
  return s;
}

function gradient(a: number[][], b: number[], x: number[]): number[] {
  const n = x.length;
  const w = new Array<number>(n).fill(0);
  for (let i = 0; i < a.length; i++) {
    let r = b[i];
    for (let j = 0; j < n; j++) r -= a[i][j] * x[j];
    for (let j = 0; j < n; j++) w[j] += a[i][j] * r;
  }
  return w;
}

function residualNorm(a: number[][], b: number[], x: number[]): number {
  let ss = 0;
  for (let i = 0; i < a.length; i++) {
    let r = b[i];
    for (let j = 0; j < x.length; j++) r -= a[i][j] * x[j];
    ss += r * r;
  }
  return Math.sqrt(ss);
}

/** Minimise ‖A·x − b‖₂ subject to x ≥ 0. A is m × n (rows of equal length). */
export function solveNnls(aIn: number[][], b: number[]): NnlsResult {
  const m = aIn.length;
  const n = m === 0 ? 0 : aIn[0].length;
  if (b.length !== m) throw new RangeError(`solveNnls: A has ${m} rows but b has ${b.length}`);
  if (n === 0) return { x: [], residualNorm: Math.sqrt(b.reduce((s, v) => s + v * v, 0)), iterations: 0 };

  // Scale columns to unit length (a positive scaling keeps x ≥ 0): stitches run to thousands, ends to tens.
  const scale = new Array<number>(n).fill(0);
  for (let j = 0; j < n; j++) {
    let ss = 0;
    for (let i = 0; i < m; i++) ss += aIn[i][j] * aIn[i][j];
    scale[j] = ss > 0 ? Math.sqrt(ss) : 0;
  }
  const a = aIn.map((row) => row.map((v, j) => (scale[j] > 0 ? v / scale[j] : 0)));

  const bNorm = Math.sqrt(b.reduce((s, v) => s + v * v, 0));
  const tol = 1e-10 * Math.max(1, bNorm) * Math.max(m, n);
  const passive = new Array<boolean>(n).fill(false);
  // Columns that turned out to depend on the passive ones are not offered again.
  const excluded = new Array<boolean>(n).fill(false);
  let x = new Array<number>(n).fill(0);
  let iterations = 0;
  const maxIterations = 3 * n + 10;

  let w = gradient(a, b, x);
  while (iterations < maxIterations) {
    let t = -1;
    for (let j = 0; j < n; j++) if (!passive[j] && !excluded[j] && scale[j] > 0 && w[j] > tol && (t < 0 || w[j] > w[t])) t = j;
    if (t < 0) break;
    passive[t] = true;
    iterations++;

    for (;;) {
      const set = passive.flatMap((p, j) => (p ? [j] : []));
      const s = solveOnSet(a, b, set, n);
      if (!s) {
        // A column dependent on the others: leave it out and carry on with the rest.
        passive[t] = false;
        excluded[t] = true;
        break;
      }
      if (set.every((j) => s[j] > 0)) {
        x = s;
        break;
      }
      let alpha = Infinity;
      for (const j of set) if (s[j] <= 0) alpha = Math.min(alpha, x[j] / (x[j] - s[j]));
      x = x.map((xj, j) => xj + alpha * (s[j] - xj));
      for (const j of set) {
        if (x[j] <= 1e-15) {
          passive[j] = false;
          x[j] = 0;
        }
      }
      if (!passive.some(Boolean)) break;
    }
    w = gradient(a, b, x);
  }

  const unscaled = x.map((xj, j) => (scale[j] > 0 ? xj / scale[j] : 0));
  return { x: unscaled, residualNorm: residualNorm(aIn, b, unscaled), iterations };
}
