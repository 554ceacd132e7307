/**
 * Joint confidence of cost and duration from the iterations (pairs (cost_i, duration_i)):
 *
 *  - atPLevels: P(cost ≤ its Pk and duration ≤ its Pk), the share of iterations meeting both;
 *    for independent totals it is the product of the marginals, k², for comonotone ones k.
 *  - frontier at level L: for durations d from the duration's P(L) to its P99, the smallest cost
 *    c with #{i : cost_i ≤ c and duration_i ≤ d} ≥ ⌈L·n⌉, i.e. P(cost ≤ c and duration ≤ d) = L
 *    (an empirical joint-confidence contour; for d at P99 and beyond it tends to the cost's P(L)).
 */

import { percentileOfSorted } from './summary';

const LEVELS = [
  ['P50', 0.5],
  ['P70', 0.7],
  ['P80', 0.8],
  ['P90', 0.9],
] as const;

/** Points on the frontier. */
export const FRONTIER_POINTS = 12;

export function jointAtPLevels(
  cost: Float64Array,
  costSorted: Float64Array,
  duration: Float64Array,
  durationSorted: Float64Array,
): { P50: number; P70: number; P80: number; P90: number } {
  const n = cost.length;
  const out = { P50: 0, P70: 0, P80: 0, P90: 0 };
  for (const [key, p] of LEVELS) {
    const c = percentileOfSorted(costSorted, p);
    const d = percentileOfSorted(durationSorted, p);
    let both = 0;
    for (let i = 0; i < n; i++) if (cost[i] <= c && duration[i] <= d) both++;
    out[key] = both / n;
  }
  return out;
}

export function jointFrontier(
  cost: Float64Array,
  duration: Float64Array,
  durationSorted: Float64Array,
  level: number,
): { level: number; points: { duration: number; cost: number }[] } {
  const n = cost.length;
  const need = Math.ceil(level * n);
  const from = percentileOfSorted(durationSorted, level);
  const to = percentileOfSorted(durationSorted, 0.99);
  const points: { duration: number; cost: number }[] = [];
  const within = new Float64Array(n);
  for (let k = 0; k < FRONTIER_POINTS; k++) {
    const d = from + ((to - from) * k) / (FRONTIER_POINTS - 1);
    let m = 0;
    for (let i = 0; i < n; i++) if (duration[i] <= d) within[m++] = cost[i];
    if (m < need) continue;
    points.push({ duration: d, cost: kthSmallest(within, m, need - 1) });
  }
  return { level, points };
}

/**
 * The k-th smallest (0-based) of x[0…m), reordering x in place: quickselect with a
 * median-of-three pivot (Hoare 1961, "Algorithm 65: FIND", CACM 4(7):321–322), the same value
 * as sorting and indexing, in linear expected time.
 */
export function kthSmallest(x: Float64Array, m: number, k: number): number {
  let lo = 0;
  let hi = m - 1;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    const a = x[lo];
    const b = x[mid];
    const c = x[hi];
    const pivot = a < b ? (b < c ? b : a < c ? c : a) : a < c ? a : b < c ? c : b;
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (x[i] < pivot) i++;
      while (x[j] > pivot) j--;
      if (i <= j) {
        const t = x[i];
        x[i] = x[j];
        x[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return x[k];
  }
  return x[k];
}
