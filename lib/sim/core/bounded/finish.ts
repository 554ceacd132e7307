/**
 * The finish of a bounded run: the merged parts of both passes into the result file, in the
 * in-memory engine's format (../rollup).
 *
 *  - P-values and their 95% intervals are order statistics (../stats/order-statistics): the
 *    merged fine histogram gives the bucket of each rank, the second pass's kept values the exact
 *    value within it, so they equal a plain sort's for the same iterations.
 *  - mean = Σx/n, sd = √(Σ(x − mean)²/(n − 1)), the sums per chunk, then over chunks in order.
 *  - The allocation window's ends are exact order statistics; its sums add the inner buckets'
 *    chunk sums and the end buckets' iterations that lie within the ends.
 *  - The tornado's rank correlations use the mid-rank of each iteration's fine bucket: ranks
 *    grouped to the histogram's buckets (ties within 2⁻¹⁶ of the value).
 *  - The joint frontier's costs are the middles of coarse buckets (within 2⁻¹³ of the value).
 *  - The convergence series is read at the ends of chunks from the chunks' coarse histograms
 *    (bucket middles), its last point the run's exact P-values.
 */

import type { BlockSummary } from '../block';
import type { PreparedRun } from '../engine';
import type { Interval, PercentileKey, ScenarioSummary, SimulationResult, TotalSummary } from '../formats';
import { achievedCorrelations, resultWarnings, type RunInfo, sensitivityOf } from '../rollup';
import { allocationOf } from '../stats/allocation';
import { CHECKPOINTS } from '../stats/convergence';
import { percentileRank, quantileIntervalRanks } from '../stats/order-statistics';
import { contingencyOf, PERCENTILES } from '../stats/percentiles';
import { rankCorrelationsFromSums, type RankSums } from '../stats/sensitivity';
import { wilsonInterval } from '../stats/wilson';
import { type Cumulative, Histogram } from './histogram';
import { bucketMiddle, COARSE_SHIFT, fineKey } from './keys';
import { JOINT_LEVELS, mergeFirstParts, type MergedFirst, orderedChunks, windowRanks } from './merge';
import type {
  FirstPassChunk,
  FirstPassPart,
  SecondPassChunk,
  SecondPassPart,
  SecondPassRequest,
  TotalName,
} from './parts';

/** Exact values of ranks from a merged histogram and the values kept in its buckets. */
class OrderStatistics {
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

function totalSummary(
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

/** A chunk's sums in the shape of a block's, for the roll-up's reductions. */
function asBlock(c: FirstPassChunk): BlockSummary {
  return {
    block: c.chunk,
    n: c.n,
    critical: Int32Array.from(c.critical),
    gradeSums: Float64Array.from(c.gradeSums),
    pairSums: Float64Array.from(c.pairSums),
    durationSums: Float64Array.from(c.durationSums),
    swingSums: Float64Array.from(c.swingSums),
  };
}

function rankSumsOf(h: Cumulative): RankSums {
  let sr = 0;
  let srr = 0;
  for (let j = 0; j < h.keys.length; j++) {
    const r = h.midRank(j);
    sr += h.counts[j] * r;
    srr += h.counts[j] * r * r;
  }
  return { sr, srr };
}

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

function convergenceOf(merged: MergedFirst, which: 'cost' | 'duration', exact: TotalSummary) {
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

export function finishBounded(
  run: PreparedRun,
  firstParts: FirstPassPart[],
  request: SecondPassRequest,
  secondParts: SecondPassPart[],
  info: Omit<RunInfo, 'seed' | 'sampling'>,
): SimulationResult {
  const { plan } = run;
  const merged = mergeFirstParts(run.settings.iterations, firstParts);
  const { n } = merged;
  if (request.iterations !== n || request.chunkBlocks !== merged.chunkBlocks)
    throw new RangeError('finish: the request does not belong to these first parts');
  for (const p of secondParts)
    if (p.format !== 'outturn-bounded-second')
      throw new TypeError('finish: a part is not a second-pass part');
  const second: SecondPassChunk[] = orderedChunks(secondParts, n, merged.chunkBlocks, 'second pass');
  const stats = (t: TotalName) =>
    new OrderStatistics(
      merged.fine[t]!,
      secondParts.map((p) => p.kept[t]!),
    );
  const squares = (which: 'cost' | 'duration') => {
    let s = 0;
    for (const c of second) s += c.squares[which]!;
    return s;
  };
  const { targets } = plan;
  const costStats = stats('cost');
  const cost = totalSummary(
    costStats,
    n,
    merged.sums.cost / n,
    squares('cost'),
    [merged.min.cost, merged.max.cost],
    plan.base.cost,
    targets.cost !== undefined ? merged.withinTarget.cost : null,
  );
  const durationStats = merged.fine.duration ? stats('duration') : null;
  const duration = durationStats
    ? totalSummary(
        durationStats,
        n,
        merged.sums.duration! / n,
        squares('duration'),
        [merged.min.duration!, merged.max.duration!],
        plan.base.duration ?? 0,
        targets.duration !== undefined ? merged.withinTarget.duration : null,
      )
    : undefined;

  let joint: SimulationResult['joint'];
  if (duration && request.joint && targets.cost !== undefined && targets.duration !== undefined) {
    const both = merged.withinTarget.both;
    const atPLevels = { P50: 0, P70: 0, P80: 0, P90: 0 };
    JOINT_LEVELS.forEach(([key], l) => {
      const c = cost.percentiles[key];
      const d = duration.percentiles[key];
      let count = 0;
      for (const p of secondParts) {
        const { sure, pairs } = p.joint!.levels[l];
        count += sure;
        for (let i = 0; i < pairs.length; i += 2) if (pairs[i] <= c && pairs[i + 1] <= d) count++;
      }
      atPLevels[key] = count / n;
    });
    const { thresholds, level } = request.joint;
    const need = Math.ceil(level * n);
    const running = new Histogram();
    const points: { duration: number; cost: number }[] = [];
    thresholds.forEach((d, j) => {
      for (const p of secondParts) running.merge(p.joint!.frontier[j]);
      const h = running.toJSON();
      let acc = 0;
      for (let k = 0; k < h.keys.length; k++) {
        acc += h.counts[k];
        if (acc >= need) {
          points.push({ duration: d, cost: bucketMiddle(h.keys[k], COARSE_SHIFT) });
          break;
        }
      }
    });
    joint = { probability: both / n, ci95: wilsonInterval(both, n), atPLevels, frontier: { level, points } };
  }

  // Criticality and the tornado, from the chunks' sums in chunk order.
  const blocks = merged.chunks.map(asBlock);
  const critical = new Float64Array(plan.activities.length);
  for (const b of blocks) for (let a = 0; a < critical.length; a++) critical[a] += b.critical[a];
  const criticality: Record<string, number> = {};
  plan.activities.forEach((a, i) => (criticality[a.id] = critical[i] / n));
  const rho = rankCorrelationsFromSums(
    plan.sensitivity,
    blocks,
    second.map((c) => c.cross),
    n,
    rankSumsOf(merged.fine.cost),
    merged.fine.duration ? rankSumsOf(merged.fine.duration) : null,
  );
  const sensitivity = sensitivityOf(plan, blocks, rho, critical, n, duration?.sd ?? 0, !!duration);

  // Allocation: the inner buckets' sums, and the end buckets' iterations within the exact window.
  const [wLo, wHi] = windowRanks(plan, n);
  const lo = costStats.at(wLo);
  const hi = costStats.at(wHi);
  const sums: ArrayLike<number>[] = [];
  for (const c of second) {
    if (c.allocation.length) sums.push(c.allocation);
    for (const e of c.edges) if (e.cost >= lo && e.cost <= hi) sums.push(e.sums);
  }

  let mitigation: SimulationResult['mitigation'];
  if (plan.hasPost) {
    const headline: ScenarioSummary = {
      cost: { mean: cost.mean, percentiles: cost.percentiles },
      ...(duration ? { duration: { mean: duration.mean, percentiles: duration.percentiles } } : {}),
    };
    const scenario = (t: TotalName) => {
      const s = stats(t);
      return {
        mean: merged.sums[t]! / n,
        percentiles: Object.fromEntries(
          PERCENTILES.map(([k, p]) => [k, s.at(percentileRank(n, p))]),
        ) as Record<PercentileKey, number>,
      };
    };
    const other: ScenarioSummary = {
      cost: scenario('altCost'),
      ...(merged.fine.altDuration ? { duration: scenario('altDuration') } : {}),
    };
    mitigation =
      plan.headline === 'post'
        ? { used: 'post', pre: other, post: headline }
        : { used: 'pre', pre: headline, post: other };
  }

  const costSeries = convergenceOf(merged, 'cost', cost);
  const convergence: SimulationResult['convergence'] = {
    iterations: costSeries.iterations,
    cost: costSeries.series,
  };
  if (duration) convergence.duration = convergenceOf(merged, 'duration', duration).series;

  const { seed, sampling } = run.settings;
  return {
    format: 'outturn-result',
    version: 2,
    iterations: n,
    seed,
    sampling,
    elapsedMs: info.elapsedMs,
    cost,
    ...(duration ? { duration } : {}),
    ...(joint ? { joint } : {}),
    ...(mitigation ? { mitigation } : {}),
    allocation: allocationOf(
      plan,
      sums.map((s) => Float64Array.from(s)),
      cost,
    ),
    sensitivity,
    criticality,
    achievedCorrelations: achievedCorrelations(plan, blocks, n),
    warnings: resultWarnings(plan, { sampling, ...info }),
    convergence,
  };
}
