/**
 * A bounded run's totals: exact order statistics from the merged fine histogram (the bucket of a
 * rank) and the values the second pass kept in those buckets (the value within it), and each
 * total's summary from them, as ../stats/summary gives it from a sorted copy.
 */

import type { Interval, PercentileKey, TotalSummary } from '../formats';
import { percentileRank, quantileIntervalRanks } from '../stats/order-statistics';
import { contingencyOf, PERCENTILES } from '../stats/percentiles';
import { wilsonInterval } from '../stats/wilson';
import type { Cumulative } from './histogram';
import { fineKey } from './keys';

/** Exact values of ranks from a merged histogram and the values kept in its buckets. */
export class OrderStatistics {
  private readonly byKey = new Map<number, { values: number[]; counts: number[] }>();

  constructor(
    private readonly h: Cumulative,
    kept: { values: number[]; counts: number[] }[],
  ) {
    const merged = new Map<number, number>();
    for (const k of kept)
      for (let j = 0; j < k.values.length; j++)
        merged.set(k.values[j], (merged.get(k.values[j]) ?? 0) + k.counts[j]);
    for (const v of [...merged.keys()].sort((a, b) => a - b)) {
      const key = fineKey(v);
      let bucket = this.byKey.get(key);
      if (!bucket) this.byKey.set(key, (bucket = { values: [], counts: [] }));
      bucket.values.push(v);
      bucket.counts.push(merged.get(v)!);
    }
  }

  /** The value of 1-based rank k. */
  at(k: number): number {
    const j = this.h.bucketOfRank(k);
    const bucket = this.byKey.get(this.h.keys[j]);
    let left = k - this.h.below[j];
    if (bucket)
      for (let i = 0; i < bucket.values.length; i++) {
        left -= bucket.counts[i];
        if (left <= 0) return bucket.values[i];
      }
    throw new Error(`bounded run: rank ${k} lies in a bucket whose values were not kept`);
  }
}

export function totalSummary(
  stats: OrderStatistics,
  n: number,
  mean: number,
  squares: number,
  range: [number, number],
  base: number,
  within: number | null,
): TotalSummary {
  const percentiles = Object.fromEntries(
    PERCENTILES.map(([k, p]) => [k, stats.at(percentileRank(n, p))]),
  ) as Record<PercentileKey, number>;
  const intervals = Object.fromEntries(
    PERCENTILES.map(([k, p]) => [k, quantileIntervalRanks(n, p).map((r) => stats.at(r)) as Interval]),
  ) as Record<PercentileKey, Interval>;
  const shifted = (k: PercentileKey): Interval => [intervals[k][0] - base, intervals[k][1] - base];
  return {
    base,
    mean,
    sd: n > 1 ? Math.sqrt(squares / (n - 1)) : 0,
    min: range[0],
    max: range[1],
    percentiles,
    percentileCI95: intervals,
    contingency: {
      P50: contingencyOf({ base, percentiles }, 'P50'),
      P80: contingencyOf({ base, percentiles }, 'P80'),
      P90: contingencyOf({ base, percentiles }, 'P90'),
    },
    contingencyCI95: { P50: shifted('P50'), P80: shifted('P80'), P90: shifted('P90') },
    ...(within !== null
      ? { probabilityWithinTarget: { value: within / n, ci95: wilsonInterval(within, n) } }
      : {}),
  };
}
