/**
 * Summary of one simulated total (cost or duration): moments, percentiles with their
 * distribution-free intervals (./order-statistics), contingency over the base, and the probability
 * of staying within a target with its Wilson interval (./wilson).
 *
 *   mean = Σx/n,  sd = √(Σ(x − mean)²/(n − 1))  (two passes, in iteration order)
 *   contingency at P_p = P_p − base (./percentiles; its interval: the P-value's, shifted by the base)
 */

import type { Interval, PercentileKey, TotalSummary } from '../formats';
import { upperBound } from '../math/ranks';
import { percentileRank, quantileIntervalRanks } from './order-statistics';
import { contingencyOf, PERCENTILES } from './percentiles';
import { wilsonInterval } from './wilson';

export function percentileOfSorted(sorted: Float64Array, p: number): number {
  return sorted[percentileRank(sorted.length, p) - 1];
}

export function percentileIntervalOfSorted(sorted: Float64Array, p: number): Interval {
  const [l, u] = quantileIntervalRanks(sorted.length, p);
  return [sorted[l - 1], sorted[u - 1]];
}

/** Number of values ≤ x in a sorted array. */
export function countAtMost(sorted: Float64Array, x: number): number {
  return upperBound(sorted, sorted.length, x);
}

export function summarizeTotal(
  values: Float64Array,
  sorted: Float64Array,
  base: number,
  target: number | undefined,
): TotalSummary {
  const n = values.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i];
  const mean = sum / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  const percentiles = Object.fromEntries(
    PERCENTILES.map(([k, p]) => [k, percentileOfSorted(sorted, p)]),
  ) as Record<PercentileKey, number>;
  const summary: TotalSummary = {
    base,
    mean,
    sd: n > 1 ? Math.sqrt(ss / (n - 1)) : 0,
    min: sorted[0],
    max: sorted[n - 1],
    percentiles,
    percentileCI95: Object.fromEntries(
      PERCENTILES.map(([k, p]) => [k, percentileIntervalOfSorted(sorted, p)]),
    ) as Record<PercentileKey, Interval>,
    contingency: {
      P50: contingencyOf({ base, percentiles }, 'P50'),
      P80: contingencyOf({ base, percentiles }, 'P80'),
      P90: contingencyOf({ base, percentiles }, 'P90'),
    },
  };
  // The base is a constant, so the contingency's interval is the P-value's, shifted.
  const shifted = (k: PercentileKey): Interval => {
    const [lo, hi] = summary.percentileCI95[k];
    return [lo - base, hi - base];
  };
  summary.contingencyCI95 = { P50: shifted('P50'), P80: shifted('P80'), P90: shifted('P90') };
  if (target !== undefined) {
    const k = countAtMost(sorted, target);
    summary.probabilityWithinTarget = { value: k / n, ci95: wilsonInterval(k, n) };
  }
  return summary;
}
