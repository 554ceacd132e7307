/**
 * Ranks of a column without a comparator: sort a copy natively, then place each value by binary
 * search (lower bound), breaking ties by order of appearance so the ranks form a permutation.
 * Also mid-ranks (average rank of tied values, Kendall & Gibbons 1990, "Rank Correlation
 * Methods", 5th ed., §3.8) for Spearman's coefficient.
 */

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

/**
 * rank[i] ∈ 0…n−1, a permutation; `sorted` receives the sorted values; `taken` is scratch (n).
 */
export function uniqueRanks(
  values: Float64Array,
  n: number,
  sorted: Float64Array,
  taken: Int32Array,
  rank: Int32Array,
): void {
  sorted.set(values.subarray(0, n));
  sorted.subarray(0, n).sort();
  taken.fill(0, 0, n);
  for (let i = 0; i < n; i++) {
    const lb = lowerBound(sorted, n, values[i]);
    rank[i] = lb + taken[lb]++;
  }
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
