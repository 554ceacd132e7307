/**
 * Rolls a run up into the result file. Every reduction runs over the iterations in iteration
 * order, or over per-block sums in block order, so the result depends only on the blocks.
 */

import type { BlockSummary } from './block';
import type { Plan } from './compile';
import { midRanksOf, type SortOrder, sortOrder } from './math/ranks';
import { checkpointsFor, convergenceSeries } from './stats/convergence';
import { rankCorrelations, tornado } from './stats/sensitivity';
import { jointAtPLevels, jointFrontier } from './stats/joint';
import { allocationOf } from './stats/allocation';
import type { BlockSecondPass } from './run-data';
import { PERCENTILES } from './stats/percentiles';
import { percentileOfSorted, summarizeTotal } from './stats/summary';
import { wilsonInterval } from './stats/wilson';
import type {
  AchievedCorrelation,
  Interval,
  PercentileKey,
  Sampling,
  ScenarioSummary,
  SensitivityEntry,
  SimulationResult,
} from './formats';

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
  /** The cost's sort order (positions of the iterations in costSorted, and the inverse). */
  costOrder: SortOrder;
  duration: Float64Array | null;
  durationSorted: Float64Array | null;
  durationRanks: Float64Array | null;
  durationOrder: SortOrder | null;
  /** The other mitigation scenario's totals, in iteration order (when some risk has a post block). */
  altCost?: Float64Array | null;
  altDuration?: Float64Array | null;
  /** Their sorted copies when already at hand (another thread may have sorted them). */
  altSorted?: { cost: Float64Array; duration: Float64Array | null };
}

/** `shared`: put the ranks on SharedArrayBuffers, for worker threads to read. */
export function rankTotals(cost: Float64Array, duration: Float64Array | null, shared = false): RankedTotals {
  return rankedTotalsOf(cost, duration, sortOrder(cost), duration ? sortOrder(duration) : null, shared);
}

/** rankTotals from sort orders computed elsewhere (each total's may come from another thread). */
export function rankedTotalsOf(
  cost: Float64Array,
  duration: Float64Array | null,
  costOrder: SortOrder,
  durationOrder: SortOrder | null,
  shared = false,
): RankedTotals {
  const ranksArray = (n: number) =>
    new Float64Array(shared ? new SharedArrayBuffer(8 * n) : new ArrayBuffer(8 * n));
  return {
    cost,
    costSorted: costOrder.sorted,
    costRanks: midRanksOf(costOrder, ranksArray(cost.length)),
    costOrder,
    duration,
    durationSorted: durationOrder?.sorted ?? null,
    durationRanks: durationOrder ? midRanksOf(durationOrder, ranksArray(duration!.length)) : null,
    durationOrder,
  };
}

export function achievedCorrelations(
  plan: Plan,
  blocks: Pick<BlockSummary, 'pairSums'>[],
  n: number,
): AchievedCorrelation[] {
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
 * The parts of the result that need only the blocks' sums and the ranked totals, not the second
 * pass: a threaded run computes them while other threads run the second pass.
 */
export interface TotalsRollUp {
  costSummary: SimulationResult['cost'];
  durationSummary: SimulationResult['duration'];
  joint: SimulationResult['joint'];
  criticality: Record<string, number>;
  swing: { cost: Interval[]; duration: Interval[] };
  ssi: Float64Array;
  convergence: SimulationResult['convergence'];
  mitigation: SimulationResult['mitigation'];
  achieved: AchievedCorrelation[];
}

/** `blocks` in block order. */
export function rollUpTotals(plan: Plan, blocks: BlockSummary[], totals: RankedTotals): TotalsRollUp {
  const { cost, costSorted, duration, durationSorted, costOrder, durationOrder } = totals;
  const n = cost.length;
  const costSummary = summarizeTotal(cost, costSorted, plan.base.cost, plan.targets.cost);
  const durationSummary =
    duration && durationSorted
      ? summarizeTotal(duration, durationSorted, plan.base.duration ?? 0, plan.targets.duration)
      : undefined;

  let joint: SimulationResult['joint'];
  if (
    duration &&
    durationSorted &&
    durationOrder &&
    plan.targets.cost !== undefined &&
    plan.targets.duration !== undefined
  ) {
    let both = 0;
    const tc = plan.targets.cost;
    const td = plan.targets.duration;
    // Added as 0 or 1, not branched on: which iteration meets both is a coin toss to the processor.
    for (let i = 0; i < n; i++) both += +(cost[i] <= tc) & +(duration[i] <= td);
    joint = {
      probability: both / n,
      ci95: wilsonInterval(both, n),
      atPLevels: jointAtPLevels(cost, costSorted, duration, durationSorted),
      frontier: jointFrontier(costOrder, durationOrder, plan.settings.jointConfidence),
    };
  }

  const { critical, criticality } = criticalityOf(plan, blocks, n);

  // The tornado's swing, and the schedule sensitivity index.
  const swing = swingOf(plan, blocks);
  const ssi = scheduleSensitivity(plan, blocks, critical, n, durationSummary?.sd ?? 0);

  // Convergence.
  const checkpoints = checkpointsFor(n);
  const convergence: SimulationResult['convergence'] = {
    iterations: checkpoints,
    cost: convergenceSeries(costOrder.positions, costSorted, checkpoints),
  };
  if (durationOrder)
    convergence.duration = convergenceSeries(durationOrder.positions, durationOrder.sorted, checkpoints);

  return {
    costSummary,
    durationSummary,
    joint,
    criticality,
    swing,
    ssi,
    convergence,
    mitigation: plan.hasPost ? mitigationOf(plan, totals) : undefined,
    achieved: achievedCorrelations(plan, blocks, n),
  };
}

/**
 * `blocks` in block order; `second[k]` the second pass over blocks[k] (blockSecondPass): rank
 * cross sums and allocation sums. `early`: rollUpTotals of the same, when computed already.
 */
export function rollUp(
  plan: Plan,
  blocks: BlockSummary[],
  totals: RankedTotals,
  second: BlockSecondPass[],
  info: RunInfo,
  early: TotalsRollUp = rollUpTotals(plan, blocks, totals),
): SimulationResult {
  const n = totals.cost.length;
  const { costSummary, durationSummary, joint, criticality, swing, ssi, convergence, mitigation } = early;

  // Tornado: rank correlation, share, swing, and the schedule sensitivity index.
  const cross = second.map((s) => s.cross);
  const rho = rankCorrelations(plan.sensitivity, blocks, cross, totals.costRanks, totals.durationRanks);
  const sensitivity = sensitivityOf(plan, rho, swing, ssi, !!totals.durationRanks);

  // Keys in the order docs/result-format.md lists them (JSON keeps insertion order).
  return {
    format: 'outturn-result',
    version: 2,
    iterations: n,
    seed: info.seed,
    sampling: info.sampling,
    elapsedMs: info.elapsedMs,
    cost: costSummary,
    ...(durationSummary ? { duration: durationSummary } : {}),
    ...(joint ? { joint } : {}),
    ...(mitigation ? { mitigation } : {}),
    allocation: allocationOf(
      plan,
      second.map((s) => s.allocation),
      costSummary,
    ),
    sensitivity,
    criticality,
    achievedCorrelations: early.achieved,
    warnings: resultWarnings(plan, info),
    convergence,
  };
}

/** The plan's warnings, the run's, and the note on intervals under Latin hypercube sampling. */
export function resultWarnings(plan: Plan, info: Pick<RunInfo, 'sampling' | 'warnings'>): string[] {
  return [
    ...plan.warnings,
    ...(info.warnings ?? []),
    ...(info.sampling === 'lhs'
      ? [
          'Under Latin hypercube sampling the intervals of the P-values (from order statistics) ' +
            'are conservative: the true precision is at least as good as shown.',
        ]
      : []),
  ];
}

/**
 * The tornado's entries from the rank correlations, with each input's swing (swingOf) and, for
 * activities in the duration tornado, the schedule sensitivity index (scheduleSensitivity).
 */
export function sensitivityOf(
  plan: Plan,
  rho: { cost: Float64Array; duration: Float64Array },
  swing: { cost: Interval[]; duration: Interval[] },
  ssi: Float64Array,
  hasDuration: boolean,
): SimulationResult['sensitivity'] {
  const pick = (which: 'cost' | 'duration'): SensitivityEntry[] => {
    const idx = plan.sensitivity.map((s, i) => (s[which] ? i : -1)).filter((i) => i >= 0);
    const byId = new Map(idx.map((i) => [plan.sensitivity[i].id, i]));
    return tornado(
      idx.map((i) => plan.sensitivity[i].id),
      idx.map((i) => rho[which][i]),
    ).map((e) => {
      const i = byId.get(e.id)!;
      const input = plan.sensitivity[i];
      const entry: SensitivityEntry = { ...e, kind: input.kind, swing: swing[which][i] };
      if (which === 'duration' && input.activity >= 0) entry.ssi = ssi[input.activity];
      return entry;
    });
  };
  return { cost: pick('cost'), duration: hasDuration ? pick('duration') : [] };
}

/**
 * Each activity's count of iterations on the critical path and its criticality index (count / n),
 * by id. `blocks` any consecutive groups of blocks (chunks) with their counts, in order.
 */
export function criticalityOf(
  plan: Plan,
  blocks: Pick<BlockSummary, 'critical'>[],
  n: number,
): { critical: Float64Array; criticality: Record<string, number> } {
  const critical = new Float64Array(plan.activities.length);
  for (const b of blocks) for (let a = 0; a < critical.length; a++) critical[a] += b.critical[a];
  const criticality: Record<string, number> = {};
  plan.activities.forEach((a, i) => (criticality[a.id] = critical[i] / n));
  return { critical, criticality };
}

/** Mean total where each input's grade is ≤ 0.1 and where it is ≥ 0.9, from the blocks' sums. */
export function swingOf(
  plan: Plan,
  blocks: Pick<BlockSummary, 'swingSums'>[],
): { cost: Interval[]; duration: Interval[] } {
  const rows = plan.sensitivity.length;
  const sums = new Float64Array(6 * rows);
  for (const b of blocks) for (let k = 0; k < sums.length; k++) sums[k] += b.swingSums[k];
  const cost: Interval[] = [];
  const duration: Interval[] = [];
  for (let r = 0; r < rows; r++) {
    const [nl, cl, dl, nh, ch, dh] = sums.subarray(6 * r, 6 * r + 6);
    cost.push([nl ? cl / nl : NaN, nh ? ch / nh : NaN]);
    duration.push([nl ? dl / nl : NaN, nh ? dh / nh : NaN]);
  }
  return { cost, duration };
}

/**
 * Schedule sensitivity index of each activity: criticality × sd(activity duration) / sd(project
 * duration) (the activity's sampled duration, drivers and risk delays included).
 */
export function scheduleSensitivity(
  plan: Plan,
  blocks: Pick<BlockSummary, 'durationSums'>[],
  critical: Float64Array,
  n: number,
  projectSd: number,
): Float64Array {
  const acts = plan.activities.length;
  const out = new Float64Array(acts);
  for (let a = 0; a < acts; a++) {
    let s1 = 0;
    let s2 = 0;
    for (const b of blocks) {
      s1 += b.durationSums[2 * a];
      s2 += b.durationSums[2 * a + 1];
    }
    const sd = n > 1 ? Math.sqrt(Math.max(0, (s2 - (s1 * s1) / n) / (n - 1))) : 0;
    out[a] = projectSd > 0 ? (critical[a] / n) * (sd / projectSd) : 0;
  }
  return out;
}

/** Mean and percentiles of each total; `sorted` the sorted copies when already at hand. */
function scenarioOf(
  cost: Float64Array,
  duration: Float64Array | null | undefined,
  sorted?: { cost: Float64Array; duration: Float64Array | null },
): ScenarioSummary {
  const part = (x: Float64Array, given?: Float64Array | null) => {
    const sorted = given ?? x.slice().sort();
    let sum = 0;
    for (let i = 0; i < x.length; i++) sum += x[i];
    const percentiles = Object.fromEntries(
      PERCENTILES.map(([k, p]) => [k, percentileOfSorted(sorted, p)]),
    ) as Record<PercentileKey, number>;
    return { mean: sum / x.length, percentiles };
  };
  return {
    cost: part(cost, sorted?.cost),
    ...(duration && duration.length ? { duration: part(duration, sorted?.duration) } : {}),
  };
}

/** Both scenarios, before and after mitigation, from the same iterations. */
function mitigationOf(plan: Plan, totals: RankedTotals): NonNullable<SimulationResult['mitigation']> {
  const headline = scenarioOf(totals.cost, totals.duration, {
    cost: totals.costSorted,
    duration: totals.durationSorted,
  });
  const other = scenarioOf(totals.altCost!, totals.altDuration, totals.altSorted);
  return plan.headline === 'post'
    ? { used: 'post', pre: other, post: headline }
    : { used: 'pre', pre: headline, post: other };
}
