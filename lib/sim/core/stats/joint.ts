/**
 * Joint confidence of cost and duration from the iterations (pairs (cost_i, duration_i)):
 *
 *  - atPLevels: P(cost ≤ its Pk and duration ≤ its Pk), the share of iterations meeting both;
 *    for independent totals it is the product of the marginals, k², for comonotone ones k.
 *  - frontier at level L: for durations d from the duration's P(L) to its P99, the smallest cost
 *    c with #{i : cost_i ≤ c and duration_i ≤ d} ≥ ⌈L·n⌉, i.e. P(cost ≤ c and duration ≤ d) = L
 *    (an empirical joint-confidence contour; for d at P99 and beyond it tends to the cost's P(L)).
 *    The iterations are taken in order of duration, each one's cost position inserted into a
 *    Fenwick tree (../math/fenwick), so each point is an order statistic of a prefix: O(n log n)
 *    for all points.
 */

import { PositionTree } from '../math/fenwick';
import type { SortOrder } from '../math/ranks';
import { countAtMost, percentileOfSorted } from './summary';

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
  const [c0, c1, c2, c3] = LEVELS.map(([, p]) => percentileOfSorted(costSorted, p));
  const [d0, d1, d2, d3] = LEVELS.map(([, p]) => percentileOfSorted(durationSorted, p));
  // One sweep for the four levels; counts added as 0 or 1 rather than branched on (which
  // iteration falls inside is a coin toss to the processor).
  let b0 = 0;
  let b1 = 0;
  let b2 = 0;
  let b3 = 0;
  for (let i = 0; i < n; i++) {
    const c = cost[i];
    const d = duration[i];
    b0 += +(c <= c0) & +(d <= d0);
    b1 += +(c <= c1) & +(d <= d1);
    b2 += +(c <= c2) & +(d <= d2);
    b3 += +(c <= c3) & +(d <= d3);
  }
  return { P50: b0 / n, P70: b1 / n, P80: b2 / n, P90: b3 / n };
}

export function jointFrontier(
  cost: SortOrder,
  duration: SortOrder,
  level: number,
): { level: number; points: { duration: number; cost: number }[] } {
  const durationSorted = duration.sorted;
  const n = durationSorted.length;
  const need = Math.ceil(level * n);
  const from = percentileOfSorted(durationSorted, level);
  const to = percentileOfSorted(durationSorted, 0.99);
  const wanted = Array.from(
    { length: FRONTIER_POINTS },
    (_, k) => from + ((to - from) * k) / (FRONTIER_POINTS - 1),
  );
  // The points by duration, each a prefix of the iterations in duration order.
  const byDuration = wanted
    .map((d, k) => ({ d, k, m: countAtMost(durationSorted, d) }))
    .sort((a, b) => a.m - b.m);
  const found: ({ duration: number; cost: number } | null)[] = new Array(FRONTIER_POINTS).fill(null);
  const tree = new PositionTree(n);
  let inserted = 0;
  for (const { d, k, m } of byDuration) {
    for (; inserted < m; inserted++) tree.insert(cost.positions[duration.order[inserted]]);
    if (m >= need) found[k] = { duration: d, cost: cost.sorted[tree.kth(need)] };
  }
  return { level, points: found.filter((p) => p !== null) };
}
