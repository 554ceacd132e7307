/**
 * Contingency: the amount to hold over the base estimate to reach a confidence level.
 *
 *   contingency at P_p = P_p − base          share of base = (P_p − base) / base
 *
 * (common practice in quantitative cost risk analysis: the funded level is a percentile of the
 * simulated total, the contingency its distance from the deterministic base). The outcome page,
 * the brief (page and PDF), the trend of baselines and the projects list all take it from here,
 * so that one figure never reads differently in two places.
 */
import type { PercentileKey, TotalSummary } from '@/lib/sim';
import { contingencyOf } from './engine';

export type Contingency = {
  level: PercentileKey;
  /** The total at the level (P_p). */
  value: number;
  /** P_p − base. */
  amount: number;
  /** amount / base; null when the base is 0 (no share of nothing). */
  shareOfBase: number | null;
};

/** Contingency of a value at a level over a base. */
export function contingencyOver(base: number, level: PercentileKey, value: number): Contingency {
  const amount = value - base;
  return { level, value, amount, shareOfBase: base ? amount / base : null };
}

/** Contingency at a level of a simulated total (its base and percentiles). */
export function contingencyAt(
  summary: Pick<TotalSummary, 'base' | 'percentiles'>,
  level: PercentileKey,
): Contingency {
  const value = summary.percentiles[level];
  const amount = contingencyOf(summary, level);
  return { level, value, amount, shareOfBase: summary.base ? amount / summary.base : null };
}
