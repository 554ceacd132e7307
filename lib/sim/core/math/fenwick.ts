/**
 * A Fenwick tree over sorted positions 0…n−1 (Fenwick 1994, "A new data structure for cumulative
 * frequency tables", Software – Practice and Experience 24(3):327–336): insert a position in
 * O(log n), and find the k-th smallest inserted position by descending the tree in O(log n).
 * Used to read order statistics of growing subsets of a run's iterations without sorting each.
 */

export class PositionTree {
  private readonly tree: Int32Array;
  private readonly n: number;
  private readonly top: number;

  constructor(n: number) {
    this.n = n;
    this.tree = new Int32Array(n + 1);
    let top = 1;
    while (top * 2 <= n) top *= 2;
    this.top = top;
  }

  insert(position: number): void {
    const { tree, n } = this;
    for (let j = position + 1; j <= n; j += j & -j) tree[j]++;
  }

  /** The k-th smallest (1-based) inserted position. */
  kth(k: number): number {
    const { tree, n } = this;
    let pos = 0;
    for (let step = this.top; step > 0; step >>= 1) {
      const next = pos + step;
      if (next <= n && tree[next] < k) {
        pos = next;
        k -= tree[next];
      }
    }
    return pos;
  }
}
