/**
 * Merging parts: checks that they cover the run's chunks once each, orders the chunks, and merges
 * histograms and counts (exact in any order). Also the ranks of the order statistics a result
 * needs, shared by the second pass's request and the finish.
 */

import { allocationLevel } from '../stats/allocation';
import { percentileRank, quantileIntervalRanks } from '../stats/order-statistics';
import { PERCENTILES } from '../stats/percentiles';
import type { Plan } from '../compile';
import { boundedChunks } from './chunks';
import { Cumulative, mergeHistograms } from './histogram';
import type { FirstPassChunk, FirstPassPart, PerTotal, TotalName } from './parts';
import { TOTAL_NAMES } from './parts';

/** The joint P-levels (as ../stats/joint jointAtPLevels). */
export const JOINT_LEVELS = [
  ['P50', 0.5],
  ['P70', 0.7],
  ['P80', 0.8],
  ['P90', 0.9],
] as const;

/** Parts' chunks in chunk order, after checking the parts cover [0, chunks) once each. */
export function orderedChunks<C extends { chunk: number }>(
  parts: { fromChunk: number; toChunk: number; chunks: C[] }[],
  iterations: number,
  chunkBlocks: number,
  what: string,
): C[] {
  const total = boundedChunks(iterations, chunkBlocks);
  const sorted = [...parts].sort((a, b) => a.fromChunk - b.fromChunk);
  let next = 0;
  for (const p of sorted) {
    if (p.fromChunk !== next)
      throw new RangeError(`${what}: chunk ${next} is ${p.fromChunk > next ? 'missing' : 'covered twice'}`);
    next = p.toChunk;
  }
  if (next !== total) throw new RangeError(`${what}: the parts end at chunk ${next}, the run has ${total}`);
  return sorted.flatMap((p) => p.chunks);
}

export interface MergedFirst {
  n: number;
  chunkBlocks: number;
  chunks: FirstPassChunk[];
  fine: PerTotal<Cumulative>;
  min: PerTotal<number>;
  max: PerTotal<number>;
  withinTarget: { cost: number; duration: number; both: number };
  /** Σ of each total over the chunks, in chunk order. */
  sums: PerTotal<number>;
}

export function mergeFirstParts(iterations: number, parts: FirstPassPart[]): MergedFirst {
  if (parts.length === 0) throw new RangeError('first pass: no parts');
  const { chunkBlocks } = parts[0];
  for (const p of parts) {
    if (p.format !== 'outturn-bounded-first')
      throw new TypeError('first pass: a part is not a first-pass part');
    if (p.iterations !== iterations || p.chunkBlocks !== chunkBlocks)
      throw new RangeError(
        `first pass: a part of ${p.iterations} iterations in chunks of ${p.chunkBlocks} blocks does not belong to a run of ${iterations} in chunks of ${chunkBlocks}`,
      );
  }
  const chunks = orderedChunks(parts, iterations, chunkBlocks, 'first pass');
  const per = <T>(make: (t: TotalName) => T | null): PerTotal<T> =>
    Object.fromEntries(TOTAL_NAMES.map((t) => [t, parts[0].fine[t] ? make(t) : null])) as PerTotal<T>;
  const within = { cost: 0, duration: 0, both: 0 };
  for (const p of parts) {
    within.cost += p.withinTarget.cost;
    within.duration += p.withinTarget.duration;
    within.both += p.withinTarget.both;
  }
  return {
    n: iterations,
    chunkBlocks,
    chunks,
    fine: per((t) => new Cumulative(mergeHistograms(parts.map((p) => p.fine[t]))!)),
    min: per((t) => Math.min(...parts.map((p) => p.min[t]!))),
    max: per((t) => Math.max(...parts.map((p) => p.max[t]!))),
    withinTarget: within,
    sums: per((t) => {
      let s = 0;
      for (const c of chunks) s += c.sums[t]!;
      return s;
    }),
  };
}

/** 1-based ranks of the allocation window's ends (../stats/allocation allocationWindow). */
export function windowRanks(plan: Plan, n: number): [number, number] {
  const r = percentileRank(n, allocationLevel(plan)) - 1;
  const h = Math.ceil(n / 200);
  return [Math.max(0, r - h) + 1, Math.min(n - 1, r + h) + 1];
}

/** 1-based ranks of the order statistics the result reads, per total. */
export function wantedRanks(plan: Plan, n: number, total: TotalName): number[] {
  const out: number[] = [];
  for (const [, p] of PERCENTILES) {
    out.push(percentileRank(n, p));
    if (total === 'cost' || total === 'duration') out.push(...quantileIntervalRanks(n, p));
  }
  if (total === 'cost') out.push(...windowRanks(plan, n));
  return out;
}

/**
 * Two first parts over adjacent chunk ranges as one part over both (a ends where b starts): the
 * chunks side by side, histograms and counts merged. Exact, so a run's result does not change;
 * lets a coordinator hold one growing part instead of every chunk's histograms.
 */
export function combineFirstParts(a: FirstPassPart, b: FirstPassPart): FirstPassPart {
  if (a.toChunk !== b.fromChunk || a.iterations !== b.iterations || a.chunkBlocks !== b.chunkBlocks)
    throw new RangeError(
      `first pass: parts [${a.fromChunk}, ${a.toChunk}) and [${b.fromChunk}, ${b.toChunk}) are not adjacent parts of one run`,
    );
  const per = <T>(make: (t: TotalName) => T): PerTotal<T> =>
    Object.fromEntries(TOTAL_NAMES.map((t) => [t, a.fine[t] ? make(t) : null])) as PerTotal<T>;
  return {
    format: 'outturn-bounded-first',
    iterations: a.iterations,
    chunkBlocks: a.chunkBlocks,
    fromChunk: a.fromChunk,
    toChunk: b.toChunk,
    chunks: [...a.chunks, ...b.chunks],
    fine: per((t) => mergeHistograms([a.fine[t], b.fine[t]])!),
    min: per((t) => Math.min(a.min[t]!, b.min[t]!)),
    max: per((t) => Math.max(a.max[t]!, b.max[t]!)),
    withinTarget: {
      cost: a.withinTarget.cost + b.withinTarget.cost,
      duration: a.withinTarget.duration + b.withinTarget.duration,
      both: a.withinTarget.both + b.withinTarget.both,
    },
  };
}

/** Parts gathered as they arrive, in any order, adjacent ones combined (combineFirstParts). */
export class FirstPartsGathering {
  private readonly byStart = new Map<number, FirstPassPart>();
  private readonly byEnd = new Map<number, FirstPassPart>();

  add(part: FirstPassPart): void {
    let p = part;
    const left = this.byEnd.get(p.fromChunk);
    if (left) {
      this.remove(left);
      p = combineFirstParts(left, p);
    }
    const right = this.byStart.get(p.toChunk);
    if (right) {
      this.remove(right);
      p = combineFirstParts(p, right);
    }
    this.byStart.set(p.fromChunk, p);
    this.byEnd.set(p.toChunk, p);
  }

  parts(): FirstPassPart[] {
    return [...this.byStart.values()].sort((a, b) => a.fromChunk - b.fromChunk);
  }

  private remove(p: FirstPassPart): void {
    this.byStart.delete(p.fromChunk);
    this.byEnd.delete(p.toChunk);
  }
}
