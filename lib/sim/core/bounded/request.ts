/**
 * Between the passes: from the merged first parts, which buckets hold the order statistics the
 * result needs (their values are kept in the second pass), each bucket's mid-rank (the tornado's
 * ranks), the allocation window's end buckets, and the joint confidence's P-value buckets and
 * frontier durations.
 *
 * The frontier's durations run from the duration's P(L) to its P99 as in ../stats/joint, but
 * taken as the tops of the buckets holding those P-values (the next bucket's lower edge, within
 * 2⁻¹⁶ of them, so that at least the level's share of iterations lies at or below the first),
 * since the exact values are only known after the second pass.
 */

import type { PreparedRun } from '../engine';
import { percentileRank } from '../stats/order-statistics';
import { FRONTIER_POINTS } from '../stats/joint';
import { type Cumulative } from './histogram';
import { FINE_SHIFT, lowerEdge } from './keys';
import { JOINT_LEVELS, mergeFirstParts, wantedRanks, windowRanks } from './merge';
import type { BucketRanks, FirstPassPart, PerTotal, SecondPassRequest } from './parts';
import { TOTAL_NAMES } from './parts';

const keyOfRank = (h: Cumulative, k: number) => h.keys[h.bucketOfRank(k)];

function bucketRanks(h: Cumulative): BucketRanks {
  return { keys: h.keys, midRanks: h.keys.map((_, j) => h.midRank(j)) };
}

export function secondPassRequest(run: PreparedRun, firstParts: FirstPassPart[]): SecondPassRequest {
  const { plan } = run;
  const merged = mergeFirstParts(run.settings.iterations, firstParts);
  const { n, fine } = merged;
  const keep = Object.fromEntries(
    TOTAL_NAMES.map((t) => {
      const h = fine[t];
      if (!h) return [t, null];
      const keys = new Set(wantedRanks(plan, n, t).map((k) => keyOfRank(h, k)));
      return [t, [...keys].sort((a, b) => a - b)];
    }),
  ) as PerTotal<number[]>;
  const [wLo, wHi] = windowRanks(plan, n);
  const cost = fine.cost;
  const duration = fine.duration;
  let joint: SecondPassRequest['joint'] = null;
  if (duration && plan.targets.cost !== undefined && plan.targets.duration !== undefined) {
    const level = plan.settings.jointConfidence;
    const from = lowerEdge(keyOfRank(duration, percentileRank(n, level)) + 1, FINE_SHIFT);
    const to = lowerEdge(keyOfRank(duration, percentileRank(n, 0.99)) + 1, FINE_SHIFT);
    joint = {
      levels: JOINT_LEVELS.map(([, p]) => ({
        costKey: keyOfRank(cost, percentileRank(n, p)),
        durationKey: keyOfRank(duration, percentileRank(n, p)),
      })),
      thresholds: Array.from(
        { length: FRONTIER_POINTS },
        (_, k) => from + ((to - from) * k) / (FRONTIER_POINTS - 1),
      ),
      level,
    };
  }
  return {
    format: 'outturn-bounded-request',
    iterations: n,
    chunkBlocks: merged.chunkBlocks,
    mean: { cost: merged.sums.cost / n, duration: duration ? merged.sums.duration! / n : null },
    keep,
    ranks: { cost: bucketRanks(cost), duration: duration ? bucketRanks(duration) : null },
    window: { loKey: keyOfRank(cost, wLo), hiKey: keyOfRank(cost, wHi) },
    joint,
  };
}
