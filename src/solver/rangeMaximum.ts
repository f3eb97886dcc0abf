// Range-maximum tree over positions 0..n-1 (iterative segment tree holding the position of the largest value; ties: the lower position).
export class MaxTree {
  private readonly size: number;
  private readonly best: Int32Array;

  constructor(private readonly values: Float64Array) {
    let size = 1;
    while (size < values.length) size *= 2;
    this.size = size;
    this.best = new Int32Array(2 * size).fill(-1);
    for (let i = 0; i < values.length; i += 1) this.best[size + i] = i;
    for (let node = size - 1; node >= 1; node -= 1) this.best[node] = this.better(this.best[2 * node]!, this.best[2 * node + 1]!);
  }

  /** Position of the largest value in [from, to). */
  argmax(from: number, to: number): number {
    let result = -1;
    let lo = from + this.size;
    let hi = to + this.size;
    while (lo < hi) {
      if (lo & 1) result = this.better(result, this.best[lo++]!);
      if (hi & 1) result = this.better(result, this.best[--hi]!);
      lo >>= 1;
      hi >>= 1;
    }
    return result;
  }

  valueAt(position: number): number {
    return this.values[position]!;
  }

  private better(x: number, y: number): number {
    if (x < 0) return y;
    if (y < 0) return x;
    return this.values[y]! > this.values[x]! || (this.values[y] === this.values[x] && y < x) ? y : x;
  }
}

interface RangeEntry {
  readonly from: number;
  readonly to: number;
  /** Position of the range's largest value. */
  readonly at: number;
  readonly value: number;
}

// Ranges of the sorted second half by their largest value: the next-best candidates for one query.
export class RangeHeap {
  private items: RangeEntry[] = [];

  get size(): number {
    return this.items.length;
  }

  clear(): void {
    this.items = [];
  }

  push(tree: MaxTree, from: number, to: number): void {
    const at = tree.argmax(from, to);
    const entry = { from, to, at, value: tree.valueAt(at) };
    const items = this.items;
    items.push(entry);
    let k = items.length - 1;
    while (k > 0) {
      const parent = (k - 1) >> 1;
      if (items[parent]!.value >= entry.value) break;
      items[k] = items[parent]!;
      k = parent;
    }
    items[k] = entry;
  }

  pop(): RangeEntry {
    const items = this.items;
    const top = items[0]!;
    const last = items.pop()!;
    if (items.length > 0) {
      let k = 0;
      for (;;) {
        const l = 2 * k + 1;
        if (l >= items.length) break;
        const child = l + 1 < items.length && items[l + 1]!.value > items[l]!.value ? l + 1 : l;
        if (items[child]!.value <= last.value) break;
        items[k] = items[child]!;
        k = child;
      }
      items[k] = last;
    }
    return top;
  }
}
