/**
 * Ranks without comparator callbacks.
 *
 *  - createRanker: ranks of a short column (a block) as a permutation, by a least-significant-
 *    digit radix sort (Knuth 1998, TAOCP vol. 3, §5.2.5) of 22-bit keys, the values mapped
 *    linearly from [min, max] onto 0…2²²−1, two passes of 11 bits. Values closer than
 *    (max − min)/2²² share a key and keep their order of appearance (for the normal scores of a
 *    block, a swap of neighbours a few millionths apart); all others are ranked exactly.
 *  - sortOrder: the order of a whole run's totals (sorted copy, and each iteration's position in
 *    it, ties by iteration order), by a stable LSD radix sort of the IEEE-754 bits (Knuth 1998,
 *    §5.2.5; a double's bits, the sign bit flipped, and every bit flipped for a negative number,
 *    order as the numbers do), six passes of 11 bits, a pass skipped where all keys share its
 *    digit. The sorted copy is the one Float64Array.prototype.sort gives.
 *  - midRanksOf: average rank of tied values (Kendall & Gibbons 1990, "Rank Correlation
 *    Methods", 5th ed., §3.8), for Spearman's coefficient, from a sort order.
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

/** A column's sorted copy and where each value stands in it. */
export interface SortOrder {
  sorted: Float64Array;
  /** order[j]: the iteration at sorted position j (ties by iteration order). */
  order: Int32Array;
  /** positions[i]: the sorted position of iteration i (the inverse of order). */
  positions: Int32Array;
}

const PASSES = 6;

export function sortOrder(values: Float64Array): SortOrder {
  const n = values.length;
  // Keys as two 32-bit halves: NaN made the one positive NaN (last, as the built-in sort puts it).
  const bits = new Uint32Array(Float64Array.from(values, (x) => (x === x ? x : NaN)).buffer);
  let lo = new Uint32Array(n);
  let hi = new Uint32Array(n);
  let order = new Int32Array(n);
  let lo2 = new Uint32Array(n);
  let hi2 = new Uint32Array(n);
  let order2 = new Int32Array(n);
  const hist = new Int32Array(PASSES * DIGIT);
  const mask = DIGIT - 1;
  for (let i = 0; i < n; i++) {
    const h = bits[2 * i + 1];
    const negative = h >>> 31 === 1;
    const l = negative ? ~bits[2 * i] >>> 0 : bits[2 * i];
    const u = negative ? ~h >>> 0 : (h ^ 0x80000000) >>> 0;
    lo[i] = l;
    hi[i] = u;
    order[i] = i;
    // Digits: bits 0–10, 11–21, 22–32, 33–43, 44–54, 55–63 of the 64 (hi above lo).
    hist[l & mask]++;
    hist[DIGIT + ((l >>> 11) & mask)]++;
    hist[2 * DIGIT + (((l >>> 22) | (u << 10)) & mask)]++;
    hist[3 * DIGIT + ((u >>> 1) & mask)]++;
    hist[4 * DIGIT + ((u >>> 12) & mask)]++;
    hist[5 * DIGIT + (u >>> 23)]++;
  }
  for (let d = 0; d < PASSES; d++) {
    const h = d * DIGIT;
    let trivial = false;
    let sum = 0;
    for (let b = h; b < h + DIGIT; b++) {
      const c = hist[b];
      if (c === n) trivial = true;
      hist[b] = sum;
      sum += c;
    }
    if (trivial) continue;
    for (let j = 0; j < n; j++) {
      const l = lo[j];
      const u = hi[j];
      const k =
        d === 0
          ? l & mask
          : d === 1
            ? (l >>> 11) & mask
            : d === 2
              ? ((l >>> 22) | (u << 10)) & mask
              : d === 3
                ? (u >>> 1) & mask
                : d === 4
                  ? (u >>> 12) & mask
                  : u >>> 23;
      const at = hist[h + k]++;
      lo2[at] = l;
      hi2[at] = u;
      order2[at] = order[j];
    }
    [lo, lo2, hi, hi2, order, order2] = [lo2, lo, hi2, hi, order2, order];
  }
  const sorted = new Float64Array(n);
  for (let j = 0; j < n; j++) sorted[j] = values[order[j]];
  // −0 and +0 are equal values: as ties, in iteration order (the radix put −0 first).
  for (let j = 0; j + 1 < n; j++) {
    if (sorted[j] === 0 && sorted[j + 1] === 0 && !Object.is(sorted[j], sorted[j + 1])) {
      let s = j;
      while (s > 0 && sorted[s - 1] === 0) s--;
      let e = j + 1;
      while (e < n && sorted[e] === 0) e++;
      order.subarray(s, e).sort();
      j = e - 1;
    }
  }
  const positions = order2;
  for (let j = 0; j < n; j++) positions[order[j]] = j;
  return { sorted, order, positions };
}

/** Mid-ranks in 1…n from a sort order . */
export function midRanksOf(
  { sorted, order }: SortOrder,
  out: Float64Array = new Float64Array(sorted.length),
): Float64Array {
  const n = sorted.length;
  for (let s = 0; s < n;) {
    let e = s + 1;
    while (e < n && sorted[e] === sorted[s]) e++;
    const r = (s + e + 1) / 2;
    for (let j = s; j < e; j++) out[order[j]] = r;
    s = e;
  }
  return out;
}
