// A binary min-heap of (priority, item) pairs in typed arrays, reused across searches.

export class MinHeap {
  private keys: Float64Array;
  private items: Int32Array;
  size = 0;

  constructor(capacity = 64) {
    this.keys = new Float64Array(capacity);
    this.items = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  push(key: number, item: number): void {
    if (this.size === this.keys.length) {
      const keys = new Float64Array(this.size * 2);
      keys.set(this.keys);
      const items = new Int32Array(this.size * 2);
      items.set(this.items);
      this.keys = keys;
      this.items = items;
    }
    let i = this.size++;
    const { keys, items } = this;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (keys[parent] <= key) break;
      keys[i] = keys[parent];
      items[i] = items[parent];
      i = parent;
    }
    keys[i] = key;
    items[i] = item;
  }

  /** Priority of the smallest pair; only valid when size > 0. */
  peekKey(): number {
    return this.keys[0];
  }

  /** Removes the smallest pair and returns its item; only valid when size > 0. */
  pop(): number {
    const { keys, items } = this;
    const top = items[0];
    const n = --this.size;
    if (n === 0) return top;
    const key = keys[n];
    const item = items[n];
    let i = 0;
    for (;;) {
      let child = 2 * i + 1;
      if (child >= n) break;
      if (child + 1 < n && keys[child + 1] < keys[child]) child++;
      if (keys[child] >= key) break;
      keys[i] = keys[child];
      items[i] = items[child];
      i = child;
    }
    keys[i] = key;
    items[i] = item;
    return top;
  }
}
