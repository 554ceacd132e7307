/**
 * Rolls a run up into the result file. Every reduction runs over the iterations in iteration
 * order, or over per-block sums in block order, so the result depends only on the blocks.
 */

import type { BlockSummary } from './block';
import type { Plan } from './compile';
import { midRanks, sortedPositions } from './math/ranks';
import { checkpointsFor, convergenceSeries } from './stats/convergence';
import { rankCorrelations, tornado } from './stats/sensitivity';
import { summarizeTotal } from './stats/summary';
import { wilsonInterval } from './stats/wilson';
import type { AchievedCorrelation, Sampling, SimulationResult } from './formats';

export interface RunInfo {
  seed: number | string;
  sampling: Sampling;
  elapsedMs: number;
  warnings?: string[];
}

/** The totals of a run with their sorted copies and mid-ranks. */
export interface RankedTotals {
  cost: Float64Array;
  costSorted: Float64Array;
  costRanks: Float64Array;
  duration: Float64Array | null;
  durationSorted: Float64Array | null;
  durationRanks: Float64Array | null;
}

/** `shared`: put the ranks on SharedArrayBuffers, for worker threads to read. */
export function rankTotals(cost: Float64Array, duration: Float64Array | null, shared = false): RankedTotals {
  const ranksArray = (n: number) =>
    new Float64Array(shared ? new SharedArrayBuffer(8 * n) : new ArrayBuffer(8 * n));
  const costSorted = cost.slice().sort();
  const durationSorted = duration ? duration.slice().sort() : null;
  return {
    cost,
    costSorted,
    costRanks: midRanks(cost, costSorted, ranksArray(cost.length)),
    duration,
    durationSorted,
    durationRanks:
      duration && durationSorted ? midRanks(duration, durationSorted, ranksArray(duration.length)) : null,
  };
}

function achievedCorrelations(plan: Plan, blocks: BlockSummary[], n: number): AchievedCorrelation[] {
  return plan.correlations.map((c, k) => {
    if (c.va < 0) return { a: c.a, b: c.b, target: c.target, used: c.used, achieved: null };
    let sa = 0;
    let sb = 0;
    let saa = 0;
    let sbb = 0;
    let sab = 0;
    for (const b of blocks) {
      const s = b.pairSums;
      sa += s[k * 5];
      sb += s[k * 5 + 1];
      saa += s[k * 5 + 2];
      sbb += s[k * 5 + 3];
      sab += s[k * 5 + 4];
    }
    // Pearson correlation of the pair's grades u = F(x): Spearman's ρ on the probability scale.
    const cov = sab - (sa * sb) / n;
    const va = saa - (sa * sa) / n;
    const vb = sbb - (sb * sb) / n;
    return {
      a: c.a,
      b: c.b,
      target: c.target,
      used: c.used,
      achieved: va > 0 && vb > 0 ? cov / Math.sqrt(va * vb) : 0,
    };
  });
}

/**
 * `blocks` in block order; `cross[k]` the rank cross sums of blocks[k] (blockCrossSums).
 */
export function rollUp(
  plan: Plan,
  blocks: BlockSummary[],
  totals: RankedTotals,
  cross: Float64Array[],
  info: RunInfo,
): SimulationResult {
  const { cost, costSorted, duration, durationSorted } = totals;
  const n = cost.length;
  const costSummary = summarizeTotal(cost, costSorted, plan.base.cost, plan.targets.cost);
  const durationSummary =
    duration && durationSorted
      ? summarizeTotal(duration, durationSorted, plan.base.duration ?? 0, plan.targets.duration)
      : undefined;

  let joint: SimulationResult['joint'];
  if (duration && plan.targets.cost !== undefined && plan.targets.duration !== undefined) {
    let both = 0;
    const tc = plan.targets.cost;
    const td = plan.targets.duration;
    for (let i = 0; i < n; i++) if (cost[i] <= tc && duration[i] <= td) both++;
    joint = { probability: both / n, ci95: wilsonInterval(both, n) };
  }

  // Tornado.
  const rho = rankCorrelations(plan.sensitivity, blocks, cross, totals.costRanks, totals.durationRanks);
  const pick = (which: 'cost' | 'duration') => {
    const idx = plan.sensitivity.map((s, i) => (s[which] ? i : -1)).filter((i) => i >= 0);
    return tornado(
      idx.map((i) => plan.sensitivity[i].id),
      idx.map((i) => rho[which][i]),
    );
  };

  // Criticality index.
  const critical = new Float64Array(plan.activities.length);
  for (const b of blocks) for (let a = 0; a < critical.length; a++) critical[a] += b.critical[a];
  const criticality: Record<string, number> = {};
  plan.activities.forEach((a, i) => (criticality[a.id] = critical[i] / n));

  // Convergence.
  const checkpoints = checkpointsFor(n);
  const convergence: SimulationResult['convergence'] = {
    iterations: checkpoints,
    cost: convergenceSeries(sortedPositions(cost, costSorted), costSorted, checkpoints),
  };
  if (duration && durationSorted) {
    convergence.duration = convergenceSeries(
      sortedPositions(duration, durationSorted),
      durationSorted,
      checkpoints,
    );
  }

  // Keys in the order docs/result-format.md lists them (JSON keeps insertion order).
  return {
    format: 'outturn-result',
    version: 1,
    iterations: n,
    seed: info.seed,
    sampling: info.sampling,
    elapsedMs: info.elapsedMs,
    cost: costSummary,
    ...(durationSummary ? { duration: durationSummary } : {}),
    ...(joint ? { joint } : {}),
    sensitivity: { cost: pick('cost'), duration: totals.durationRanks ? pick('duration') : [] },
    criticality,
    achievedCorrelations: achievedCorrelations(plan, blocks, n),
    warnings: [...plan.warnings, ...(info.warnings ?? [])],
    convergence,
  };
}
