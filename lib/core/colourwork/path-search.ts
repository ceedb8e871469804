// Local search on an open path (the order of one strand) under a given step cost: 2-opt reverses a
// stretch of the order, or-opt moves a run of 1–3 stitches elsewhere (either way round). Candidate
// moves come from short lists of near stitches; stitches whose steps changed are looked at again
// ("don't-look bits"). An optional kick phase (random double bridges, kept when they lead to a
// cheaper path) escapes local optima. Everything is deterministic for a given seed.

export interface PathProblem {
  /** stitches, numbered 0..m-1 */
  m: number;
  /** carry of the step u → v, or Infinity when the step may not be taken */
  cost(u: number, v: number): number;
  /** near[u * k + t]: candidate stitches for new steps from u, nearest first, -1 padded */
  near: Int32Array;
  k: number;
}

const EPS = 1e-9;

export class PathSearch {
  private readonly p: PathProblem;
  /** position → stitch */
  readonly order: Int32Array;
  private readonly pos: Int32Array;
  /** e[i]: cost of the step order[i] → order[i + 1] */
  private readonly e: Float64Array;
  private readonly queued: Uint8Array;
  private queue: number[] = [];
  total = 0;

  constructor(p: PathProblem, order: Int32Array) {
    this.p = p;
    const m = p.m;
    this.order = Int32Array.from(order);
    this.pos = new Int32Array(m);
    this.e = new Float64Array(Math.max(0, m - 1));
    this.queued = new Uint8Array(m);
    for (let i = 0; i < m; i++) this.pos[this.order[i]] = i;
    for (let i = 0; i < m - 1; i++) {
      this.e[i] = p.cost(this.order[i], this.order[i + 1]);
      this.total += this.e[i];
    }
  }

  private wake(u: number): void {
    if (u < 0 || this.queued[u]) return;
    this.queued[u] = 1;
    this.queue.push(u);
  }

  /** Improves until no listed move pays; starts from every stitch on a costly step. */
  descend(): void {
    const m = this.p.m;
    if (m < 3) return;
    for (let i = 0; i < m - 1; i++) {
      if (this.e[i] > EPS) {
        this.wake(this.order[i]);
        this.wake(this.order[i + 1]);
      }
    }
    this.drain();
  }

  private drain(): void {
    while (this.queue.length > 0) {
      const u = this.queue.pop()!;
      this.queued[u] = 0;
      const i = this.pos[u];
      // Steps on either side of u that cost something are worth removing.
      for (const k of [i - 1, i]) {
        if (k < 0 || k >= this.p.m - 1 || this.e[k] <= EPS) continue;
        if (this.twoOpt(k) || this.orOpt(k)) {
          this.wake(u);
          break;
        }
      }
    }
  }

  private gainOfReverse(l: number, r: number): number {
    const { order: o, e, p } = this;
    const m = p.m;
    if (l < 0 || r >= m || l >= r) return -Infinity;
    let gain = 0;
    if (l > 0) gain += e[l - 1] - p.cost(o[l - 1], o[r]);
    if (r < m - 1) gain += e[r] - p.cost(o[l], o[r + 1]);
    return gain;
  }

  private reverse(l: number, r: number): void {
    const { order: o, e, p, pos } = this;
    const m = p.m;
    const left = l > 0 ? p.cost(o[l - 1], o[r]) : 0;
    const right = r < m - 1 ? p.cost(o[l], o[r + 1]) : 0;
    if (l > 0) this.total += left - e[l - 1];
    if (r < m - 1) this.total += right - e[r];
    for (let a = l, b = r; a < b; a++, b--) {
      const t = o[a];
      o[a] = o[b];
      o[b] = t;
    }
    for (let a = l, b = r - 1; a < b; a++, b--) {
      const t = e[a];
      e[a] = e[b];
      e[b] = t;
    }
    if (l > 0) e[l - 1] = left;
    if (r < m - 1) e[r] = right;
    for (let k = l; k <= r; k++) pos[o[k]] = k;
    this.wake(o[l]);
    this.wake(o[r]);
    if (l > 0) this.wake(o[l - 1]);
    if (r < m - 1) this.wake(o[r + 1]);
  }

  /** Best 2-opt move that removes step i, applied if it pays. */
  private twoOpt(i: number): boolean {
    const { order: o, pos, p } = this;
    const m = p.m;
    const a = o[i];
    const b = o[i + 1];
    this.bestGain = EPS;
    this.bestS = -1;
    this.considerReverse(i + 1, m - 1);
    this.considerReverse(0, i);
    for (let t = 0; t < p.k; t++) {
      const c = p.near[a * p.k + t];
      if (c < 0) break;
      const j = pos[c];
      if (j > i + 1) this.considerReverse(i + 1, j);
      else if (j < i - 1) this.considerReverse(j + 1, i);
    }
    for (let t = 0; t < p.k; t++) {
      const c = p.near[b * p.k + t];
      if (c < 0) break;
      const j = pos[c];
      if (j < i) this.considerReverse(j, i);
      else if (j > i + 2) this.considerReverse(i + 1, j - 1);
    }
    if (this.bestS < 0) return false;
    this.reverse(this.bestS, this.bestT);
    return true;
  }

  private considerReverse(l: number, r: number): void {
    const g = this.gainOfReverse(l, r);
    if (g > this.bestGain) {
      this.bestGain = g;
      this.bestS = l;
      this.bestT = r;
    }
  }

  // Best or-opt move found so far (fields rather than an object: this runs in the inner loop).
  private bestGain = 0;
  private bestS = -1;
  private bestT = -1;
  private bestAt = -2;
  private bestFlip = false;

  /** Or-opt around step i: move a run next to it elsewhere, or move a run from elsewhere into it. */
  private orOpt(i: number): boolean {
    const { order: o, pos, p } = this;
    const m = p.m;
    this.bestGain = EPS;
    this.bestS = -1;
    // Runs that start or end at step i, moved next to stitches near their ends.
    for (let len = 1; len <= 3; len++) {
      for (let side = 0; side < 2; side++) {
        const s = side === 0 ? i + 1 : i - len + 1;
        const t = s + len - 1;
        const removal = this.removalGain(s, t);
        if (removal === -Infinity) continue;
        for (let end = 0; end < 2; end++) {
          const u = end === 0 ? o[s] : o[t];
          for (let k = 0; k < p.k; k++) {
            const c = p.near[u * p.k + k];
            if (c < 0) break;
            this.tryPlace(s, t, removal, pos[c]);
            this.tryPlace(s, t, removal, pos[c] - 1);
          }
        }
      }
    }
    // Runs near either end of step i, moved into it.
    for (let end = 0; end < 2; end++) {
      const u = o[i + end];
      for (let k = 0; k < p.k; k++) {
        const c = p.near[u * p.k + k];
        if (c < 0) break;
        const j = pos[c];
        for (let len = 1; len <= 3; len++) {
          for (let side = 0; side < 2; side++) {
            const s = side === 0 ? j : j - len + 1;
            const t = s + len - 1;
            if (s < 0 || t >= m) continue;
            const removal = this.removalGain(s, t);
            if (removal !== -Infinity) this.tryPlace(s, t, removal, i);
          }
        }
      }
    }
    if (this.bestS < 0) return false;
    this.moveRun(this.bestS, this.bestT, this.bestAt, this.bestFlip);
    return true;
  }

  /** Cost saved by taking order[s..t] out (joining its neighbours), or -Infinity when not possible. */
  private removalGain(s: number, t: number): number {
    const { order: o, p, e } = this;
    const m = p.m;
    if (s < 0 || t >= m || s > t || (s === 0 && t === m - 1)) return -Infinity;
    let removal = (s > 0 ? e[s - 1] : 0) + (t < m - 1 ? e[t] : 0);
    if (s > 0 && t < m - 1) removal -= p.cost(o[s - 1], o[t + 1]);
    return removal;
  }

  /** Considers putting order[s..t] just after position `at` (-1: at the front), either way round. */
  private tryPlace(s: number, t: number, removal: number, at: number): void {
    const { order: o, p, e } = this;
    const m = p.m;
    if (at < -1 || at > m - 1 || (at >= s - 1 && at <= t)) return;
    const x = at >= 0 ? o[at] : -1;
    const y = at + 1 < m ? o[at + 1] : -1;
    const old = x >= 0 && y >= 0 ? e[at] : 0;
    const u = o[s];
    const v = o[t];
    const straight = (x >= 0 ? p.cost(x, u) : 0) + (y >= 0 ? p.cost(v, y) : 0);
    const flipped = (x >= 0 ? p.cost(x, v) : 0) + (y >= 0 ? p.cost(u, y) : 0);
    const gainStraight = removal + old - straight;
    const gainFlipped = removal + old - flipped;
    if (gainStraight > this.bestGain) {
      this.bestGain = gainStraight;
      this.bestS = s;
      this.bestT = t;
      this.bestAt = at;
      this.bestFlip = false;
    }
    if (gainFlipped > this.bestGain) {
      this.bestGain = gainFlipped;
      this.bestS = s;
      this.bestT = t;
      this.bestAt = at;
      this.bestFlip = true;
    }
  }

  private readonly run = new Int32Array(3);

  private moveRun(s: number, t: number, at: number, flip: boolean): void {
    const { order: o, pos, p, e } = this;
    const m = p.m;
    const len = t - s + 1;
    const run = this.run;
    for (let k = 0; k < len; k++) run[k] = o[flip ? t - k : s + k];
    const w0 = o[s];
    const w1 = o[t];
    const w2 = s > 0 ? o[s - 1] : -1;
    const w3 = t < m - 1 ? o[t + 1] : -1;
    const w4 = at >= 0 ? o[at] : -1;
    const w5 = at + 1 < m ? o[at + 1] : -1;
    let lo: number;
    let hi: number;
    if (at < s) {
      // Shift o[at+1 .. s-1] right by len; the run goes to at+1.
      for (let k = s - 1; k > at; k--) o[k + len] = o[k];
      for (let k = 0; k < len; k++) o[at + 1 + k] = run[k];
      lo = at + 1;
      hi = t;
    } else {
      // Shift o[t+1 .. at] left by len; the run ends at `at`.
      for (let k = t + 1; k <= at; k++) o[k - len] = o[k];
      for (let k = 0; k < len; k++) o[at - len + 1 + k] = run[k];
      lo = s;
      hi = at;
    }
    for (let k = lo; k <= hi; k++) pos[o[k]] = k;
    for (let k = Math.max(0, lo - 1); k <= Math.min(m - 2, hi); k++) {
      const c = p.cost(o[k], o[k + 1]);
      this.total += c - e[k];
      e[k] = c;
    }
    this.wake(w0);
    this.wake(w1);
    this.wake(w2);
    this.wake(w3);
    this.wake(w4);
    this.wake(w5);
  }

  /** Kicks and descents; keeps the cheapest path seen. `random` returns numbers in [0, 1). */
  kick(rounds: number, random: () => number): void {
    const m = this.p.m;
    if (m < 8) return;
    const bestOrder = Int32Array.from(this.order);
    let bestTotal = this.total;
    for (let r = 0; r < rounds; r++) {
      const span = Math.min(m - 2, 30);
      const a = Math.floor(random() * (m - 3));
      const b = Math.min(m - 3, a + 1 + Math.floor(random() * span));
      const c = Math.min(m - 2, b + 1 + Math.floor(random() * span));
      if (!(a < b && b < c)) continue;
      this.doubleBridge(a, b, c);
      this.drain();
      if (this.total < bestTotal - EPS) {
        bestTotal = this.total;
        bestOrder.set(this.order);
      } else {
        this.reset(bestOrder);
      }
    }
    this.reset(bestOrder);
  }

  /** o[0..a] o[b+1..c] o[a+1..b] o[c+1..]: three steps change. */
  private doubleBridge(a: number, b: number, c: number): void {
    const { order: o } = this;
    const seg1 = Array.from(o.subarray(a + 1, b + 1));
    const seg2 = Array.from(o.subarray(b + 1, c + 1));
    o.set(seg2, a + 1);
    o.set(seg1, a + 1 + seg2.length);
    this.refresh(a, c + 1);
    for (const k of [a, a + 1, a + seg2.length, a + seg2.length + 1, c, c + 1]) if (k >= 0 && k < this.p.m) this.wake(o[k]);
  }

  private refresh(lo: number, hi: number): void {
    const { order: o, pos, p, e } = this;
    const m = p.m;
    for (let k = Math.max(0, lo); k <= Math.min(m - 1, hi); k++) pos[o[k]] = k;
    for (let k = Math.max(0, lo); k < Math.min(m - 1, hi + 1); k++) {
      const c = p.cost(o[k], o[k + 1]);
      this.total += c - e[k];
      e[k] = c;
    }
  }

  private reset(order: Int32Array): void {
    this.order.set(order);
    this.queue = [];
    this.queued.fill(0);
    this.total = 0;
    for (let k = 0; k < this.p.m; k++) this.pos[this.order[k]] = k;
    for (let k = 0; k < this.p.m - 1; k++) {
      this.e[k] = this.p.cost(this.order[k], this.order[k + 1]);
      this.total += this.e[k];
    }
  }
}
