/**
 * Running P50 and P80 (with their distribution-free 95% intervals) after the first m iterations,
 * at about 50 checkpoints, for the convergence chart.
 *
 * Instead of sorting every prefix, each iteration's position in the full sorted order is inserted
 * into a Fenwick tree (../math/fenwick); the k-th smallest of the prefix is then found by
 * descending the tree, O(log n) per query and O(n log n) in all.
 */

import type { ConvergenceSeries } from '../formats';
import { PositionTree } from '../math/fenwick';
import { percentileRank, quantileIntervalRanks } from './order-statistics';

export const CHECKPOINTS = 50;

export function checkpointsFor(n: number, count = CHECKPOINTS): number[] {
  const out: number[] = [];
  for (let k = 1; k <= count; k++) {
    const m = Math.round((n * k) / count);
    if (m >= 1 && m !== out[out.length - 1]) out.push(m);
  }
  return out;
}

/**
 * `positions[i]`: the 0-based position of iteration i in sorted order (a permutation);
 * `sorted`: the sorted values.
 */
export function convergenceSeries(
  positions: Int32Array,
  sorted: Float64Array,
  checkpoints: number[],
): ConvergenceSeries {
  const tree = new PositionTree(positions.length);
  const kth = (k: number): number => sorted[tree.kth(k)];
  const series: ConvergenceSeries = { P50: [], P50ci95: [], P80: [], P80ci95: [] };
  let inserted = 0;
  for (const m of checkpoints) {
    for (; inserted < m; inserted++) tree.insert(positions[inserted]);
    for (const [p, est, ci] of [
      [0.5, series.P50, series.P50ci95],
      [0.8, series.P80, series.P80ci95],
    ] as const) {
      est.push(kth(percentileRank(m, p)));
      const [l, u] = quantileIntervalRanks(m, p);
      ci.push([kth(l), kth(u)]);
    }
  }
  return series;
}
