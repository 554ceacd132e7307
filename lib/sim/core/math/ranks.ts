/**
 * Ranks without comparator callbacks.
 *
 *  - createRanker: ranks of a short column (a block) as a permutation, by a least-significant-
 *    digit radix sort (Knuth 1998, TAOCP vol. 3, §5.2.5) of 22-bit keys, the values mapped
 *    linearly from [min, max] onto 0…2²²−1, two passes of 11 bits. Values closer than
 *    (max − min)/2²² share a key and keep their order of appearance (for the normal scores of a
 *    block, a swap of neighbours a few millionths apart); all others are ranked exactly.
 *  - midRanks: average rank of tied values (Kendall & Gibbons 1990, "Rank Correlation Methods",
 *    5th ed., §3.8), for Spearman's coefficient, by binary search in the sorted copy.
 */

export interface Ranker {
  /** rank[i] ∈ 0…n−1 (a permutation) of values[0…n−1]. */
  rank(values: Float64Array, n: number, rank: Int32Array): void;
}

const DIGIT = 2048;
/** 22-bit keys: two passes of 11 bits. */
const KEY_RANGE = DIGIT * DIGIT;

export function createRanker(capacity: number): Ranker {
  const keys = new Uint32Array(capacity);
  const idxA = new Int32Array(capacity);
  const idxB = new Int32Array(capacity);
  const hist = new Int32Array(2 * DIGIT);
  return {
    rank(values, n, rank) {
      let lo = Infinity;
      let hi = -Infinity;
      for (let i = 0; i < n; i++) {
        const v = values[i];
        if (v < lo) lo = v;
        if (v > hi) hi = v;
      }
      const scale = hi > lo ? (KEY_RANGE - 1) / (hi - lo) : 0;
      hist.fill(0);
      for (let i = 0; i < n; i++) {
        const k = Math.floor((values[i] - lo) * scale);
        keys[i] = k;
        hist[k & (DIGIT - 1)]++;
        hist[DIGIT + (k >>> 11)]++;
      }
      for (let h = 0; h < 2 * DIGIT; h += DIGIT) {
        let sum = 0;
        for (let b = h; b < h + DIGIT; b++) {
          const c = hist[b];
          hist[b] = sum;
          sum += c;
        }
      }
      for (let i = 0; i < n; i++) idxA[hist[keys[i] & (DIGIT - 1)]++] = i;
      for (let i = 0; i < n; i++) {
        const j = idxA[i];
        idxB[hist[DIGIT + (keys[j] >>> 11)]++] = j;
      }
      for (let r = 0; r < n; r++) rank[idxB[r]] = r;
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

/** Number of values ≤ x among the first n of a sorted array. */
export function upperBound(sorted: Float64Array, n: number, x: number): number {
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
export function midRanks(
  values: Float64Array,
  sorted: Float64Array,
  out: Float64Array = new Float64Array(values.length),
): Float64Array {
  const n = values.length;
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
