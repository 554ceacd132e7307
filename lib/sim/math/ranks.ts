/**
 * Ranks without comparator callbacks (native typed-array sorts only).
 *
 *  - createRanker: ranks of a short column as a permutation. Each value's index is written into
 *    the lowest ⌈log₂ n⌉ bits of its mantissa, the keys are sorted natively and the indices read
 *    back in order. The change is below 2⁻⁴² relative for n ≤ 1024, so only values closer than
 *    that can trade places; exact ties are broken by position.
 *  - midRanks: average rank of tied values (Kendall & Gibbons 1990, "Rank Correlation Methods",
 *    5th ed., §3.8), for Spearman's coefficient, by binary search in the sorted copy.
 */

const LOW_WORD = new Uint8Array(Uint32Array.of(1).buffer)[0] === 1 ? 0 : 1;

export interface Ranker {
  /** rank[i] ∈ 0…n−1 (a permutation) of values[0…n−1]. */
  rank(values: Float64Array, n: number, rank: Int32Array): void;
}

export function createRanker(capacity: number): Ranker {
  const keys = new Float64Array(capacity);
  const words = new Uint32Array(keys.buffer);
  return {
    rank(values, n, rank) {
      const bits = Math.max(1, 32 - Math.clz32(n - 1));
      const mask = (1 << bits) - 1;
      const keep = ~mask;
      for (let i = 0; i < n; i++) {
        keys[i] = values[i];
        const w = 2 * i + LOW_WORD;
        words[w] = (words[w] & keep) | i;
      }
      keys.subarray(0, n).sort();
      for (let r = 0; r < n; r++) rank[words[2 * r + LOW_WORD] & mask] = r;
    },
  };
}

function lowerBound(sorted: Float64Array, n: number, x: number): number {
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function upperBound(sorted: Float64Array, n: number, x: number): number {
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Mid-ranks in 1…n given the sorted copy of the values. */
export function midRanks(values: Float64Array, sorted: Float64Array): Float64Array {
  const n = values.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const x = values[i];
    const lb = lowerBound(sorted, n, x);
    const ub = upperBound(sorted, n, x);
    out[i] = (lb + ub + 1) / 2;
  }
  return out;
}

/** Positions 0…n−1 in sorted order (ties by iteration order): a permutation. */
export function sortedPositions(values: Float64Array, sorted: Float64Array): Int32Array {
  const n = values.length;
  const taken = new Int32Array(n);
  const pos = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const lb = lowerBound(sorted, n, values[i]);
    pos[i] = lb + taken[lb]++;
  }
  return pos;
}
