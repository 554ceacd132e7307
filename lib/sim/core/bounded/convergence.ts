/**
 * A bounded run's convergence series: the P50 and P80 of each prefix of whole chunks, with their
 * distribution-free intervals (../stats/order-statistics), read from the chunks' coarse
 * histograms added up in chunk order (the middle of the bucket that holds each rank, 2⁻¹² of the
 * value wide); the last checkpoint is the whole run, with its exact P-values.
 */

import type { Interval, TotalSummary } from '../formats';
import { CHECKPOINTS } from '../stats/convergence';
import { percentileRank, quantileIntervalRanks } from '../stats/order-statistics';
import { Histogram } from './histogram';
import { bucketMiddle, COARSE_SHIFT } from './keys';
import type { MergedFirst } from './merge';

/** Chunk ends to read the convergence at: every chunk's, or CHECKPOINTS of them spread evenly. */
function checkpointChunks(chunks: number): number[] {
  if (chunks <= CHECKPOINTS) return Array.from({ length: chunks }, (_, c) => c);
  const out: number[] = [];
  for (let k = 1; k <= CHECKPOINTS; k++) {
    const c = Math.round((chunks * k) / CHECKPOINTS) - 1;
    if (c !== out[out.length - 1]) out.push(c);
  }
  return out;
}

export function convergenceOf(merged: MergedFirst, which: 'cost' | 'duration', exact: TotalSummary) {
  const series = {
    P50: [] as number[],
    P50ci95: [] as Interval[],
    P80: [] as number[],
    P80ci95: [] as Interval[],
  };
  const iterations: number[] = [];
  const running = new Histogram();
  let m = 0;
  let c = 0;
  for (const at of checkpointChunks(merged.chunks.length)) {
    for (; c <= at; c++) {
      running.merge(merged.chunks[c].coarse[which]!);
      m += merged.chunks[c].n;
    }
    iterations.push(m);
    // The last checkpoint is the whole run, whose P-values are known exactly.
    const h = m === merged.n ? null : running.toJSON();
    for (const [p, est, ci, name] of [
      [0.5, series.P50, series.P50ci95, 'P50'],
      [0.8, series.P80, series.P80ci95, 'P80'],
    ] as const) {
      if (!h) {
        est.push(exact.percentiles[name]);
        ci.push(exact.percentileCI95[name]);
        continue;
      }
      const value = (rank: number) => {
        let left = rank;
        for (let j = 0; j < h.keys.length; j++) {
          left -= h.counts[j];
          if (left <= 0) return bucketMiddle(h.keys[j], COARSE_SHIFT);
        }
        return bucketMiddle(h.keys[h.keys.length - 1], COARSE_SHIFT);
      };
      est.push(value(percentileRank(m, p)));
      ci.push(quantileIntervalRanks(m, p).map(value) as Interval);
    }
  }
  return { iterations, series };
}
