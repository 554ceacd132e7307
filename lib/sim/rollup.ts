/**
 * Rolls the blocks of a run (in block order) up into the result file. Every reduction runs over
 * the concatenated iterations in iteration order, so the result depends only on the blocks.
 */

import type { BlockOutput } from './block';
import type { Plan } from './compile';
import { midRanks, sortedPositions } from './math/ranks';
import { checkpointsFor, convergenceSeries } from './stats/convergence';
import { rankCorrelations, tornado } from './stats/sensitivity';
import { summarizeTotal } from './stats/summary';
import { wilsonInterval } from './stats/wilson';
import type { AchievedCorrelation, Sampling, SimulationResult } from './types';

export interface RunInfo {
  seed: number | string;
  sampling: Sampling;
  elapsedMs: number;
  warnings?: string[];
}

export function concatTotals(blocks: BlockOutput[], pick: (b: BlockOutput) => Float64Array): Float64Array {
  let n = 0;
  for (const b of blocks) n += pick(b).length;
  const out = new Float64Array(n);
  let off = 0;
  for (const b of blocks) {
    out.set(pick(b), off);
    off += pick(b).length;
  }
  return out;
}

function achievedCorrelations(plan: Plan, blocks: BlockOutput[], n: number): AchievedCorrelation[] {
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

/** The result's keys in the order DESIGN.md lists them (JSON keeps insertion order). */
function inFileOrder(r: SimulationResult): SimulationResult {
  const { format, version, iterations, seed, sampling, elapsedMs, cost, duration, joint } = r;
  const { sensitivity, criticality, achievedCorrelations, warnings, convergence } = r;
  return {
    format,
    version,
    iterations,
    seed,
    sampling,
    elapsedMs,
    cost,
    ...(duration ? { duration } : {}),
    ...(joint ? { joint } : {}),
    sensitivity,
    criticality,
    achievedCorrelations,
    warnings,
    convergence,
  };
}

export function rollUp(plan: Plan, blocks: BlockOutput[], info: RunInfo): SimulationResult {
  const ordered = [...blocks].sort((a, b) => a.block - b.block);
  const cost = concatTotals(ordered, (b) => b.cost);
  const n = cost.length;
  const costSorted = cost.slice().sort();
  const hasSchedule = plan.network !== null;
  const duration = hasSchedule ? concatTotals(ordered, (b) => b.duration) : null;
  const durationSorted = duration ? duration.slice().sort() : null;

  const result: SimulationResult = {
    format: 'outturn-result',
    version: 1,
    iterations: n,
    seed: info.seed,
    sampling: info.sampling,
    elapsedMs: info.elapsedMs,
    cost: summarizeTotal(cost, costSorted, plan.base.cost, plan.targets.cost),
    sensitivity: { cost: [], duration: [] },
    criticality: {},
    achievedCorrelations: achievedCorrelations(plan, ordered, n),
    warnings: [...plan.warnings, ...(info.warnings ?? [])],
    convergence: { iterations: [], cost: { P50: [], P50ci95: [], P80: [], P80ci95: [] } },
  };
  if (duration && durationSorted) {
    result.duration = summarizeTotal(
      duration,
      durationSorted,
      plan.base.duration ?? 0,
      plan.targets.duration,
    );
  }
  if (duration && plan.targets.cost !== undefined && plan.targets.duration !== undefined) {
    let both = 0;
    const tc = plan.targets.cost;
    const td = plan.targets.duration;
    for (let i = 0; i < n; i++) if (cost[i] <= tc && duration[i] <= td) both++;
    result.joint = { probability: both / n, ci95: wilsonInterval(both, n) };
  }

  // Tornado.
  const costRanks = midRanks(cost, costSorted);
  const durationRanks = duration && durationSorted ? midRanks(duration, durationSorted) : null;
  const rho = rankCorrelations(plan.sensitivity, ordered, costRanks, durationRanks);
  const pick = (which: 'cost' | 'duration') => {
    const idx = plan.sensitivity.map((s, i) => (s[which] ? i : -1)).filter((i) => i >= 0);
    return tornado(
      idx.map((i) => plan.sensitivity[i].id),
      idx.map((i) => rho[which][i]),
    );
  };
  result.sensitivity.cost = pick('cost');
  result.sensitivity.duration = durationRanks ? pick('duration') : [];

  // Criticality index.
  const critical = new Float64Array(plan.activities.length);
  for (const b of ordered) for (let a = 0; a < critical.length; a++) critical[a] += b.critical[a];
  plan.activities.forEach((a, i) => (result.criticality[a.id] = critical[i] / n));

  // Convergence.
  const checkpoints = checkpointsFor(n);
  result.convergence.iterations = checkpoints;
  result.convergence.cost = convergenceSeries(sortedPositions(cost, costSorted), costSorted, checkpoints);
  if (duration && durationSorted) {
    result.convergence.duration = convergenceSeries(
      sortedPositions(duration, durationSorted),
      durationSorted,
      checkpoints,
    );
  }
  return inFileOrder(result);
}
