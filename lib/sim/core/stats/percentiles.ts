// The percentiles that a result reports, with their probabilities, and contingency: the amount
// to hold over the base estimate to reach a percentile.
//
//   contingency at P_p = P_p − base

import type { PercentileKey, TotalSummary } from '../formats';

export const PERCENTILES: [PercentileKey, number][] = [
  ['P5', 0.05],
  ['P10', 0.1],
  ['P20', 0.2],
  ['P30', 0.3],
  ['P40', 0.4],
  ['P50', 0.5],
  ['P60', 0.6],
  ['P70', 0.7],
  ['P80', 0.8],
  ['P90', 0.9],
  ['P95', 0.95],
];

export const PERCENTILE_KEYS: PercentileKey[] = PERCENTILES.map(([key]) => key);

/** The contingency of a total at a percentile: its P-value minus its base (may be negative). */
export function contingencyOf(
  summary: Pick<TotalSummary, 'base' | 'percentiles'>,
  level: PercentileKey,
): number {
  return summary.percentiles[level] - summary.base;
}
