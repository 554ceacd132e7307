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
import type { PercentileKey, ScenarioSummary, SimulationResult } from '../formats';
import {
  achievedCorrelations,
  criticalityOf,
  resultWarnings,
  type RunInfo,
  scheduleSensitivity,
  sensitivityOf,
  swingOf,
} from '../rollup';
import { allocationOf } from '../stats/allocation';
import { percentileRank } from '../stats/order-statistics';
import { PERCENTILES } from '../stats/percentiles';
import { rankCorrelationsFromSums, type RankSums } from '../stats/sensitivity';
import { wilsonInterval } from '../stats/wilson';
import { type Cumulative, Histogram } from './histogram';
import { bucketMiddle, COARSE_SHIFT } from './keys';
import { convergenceOf } from './convergence';
import { OrderStatistics, totalSummary } from './totals';
import { JOINT_LEVELS, mergeFirstParts, orderedChunks, windowRanks } from './merge';
import type {
  FirstPassChunk,
  FirstPassPart,
  SecondPassChunk,
  SecondPassPart,
  SecondPassRequest,
  TotalName,
} from './parts';

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
  const { critical, criticality } = criticalityOf(plan, blocks, n);
  const rho = rankCorrelationsFromSums(
    plan.sensitivity,
    blocks,
    second.map((c) => c.cross),
    n,
    rankSumsOf(merged.fine.cost),
    merged.fine.duration ? rankSumsOf(merged.fine.duration) : null,
  );
  const swing = swingOf(plan, blocks);
  const ssi = scheduleSensitivity(plan, blocks, critical, n, duration?.sd ?? 0);
  const sensitivity = sensitivityOf(plan, rho, swing, ssi, !!duration);

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
