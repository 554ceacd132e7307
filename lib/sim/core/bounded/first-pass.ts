/**
 * The bounded run's first pass: every block of the chunks is computed into one reusable set of
 * block buffers, and folded into fine histograms of each total (exact integer counts), the sums
 * of each total, and the blocks' own small sums, per chunk in block order. Nothing per iteration
 * outlives its block.
 */

import { blockLength, type BlockSummary, simulateBlock } from '../block';
import type { PreparedRun } from '../engine';
import {
  allocateBlockBuffers,
  type BlockBuffers,
  checkChunkRange,
  chunkBlocksOf,
  CHUNK_BLOCKS,
  sinkOf,
} from './chunks';
import { assertFinite } from './finite';
import { Histogram } from './histogram';
import { coarseOfFine, fineKey } from './keys';
import type { FirstPassChunk, FirstPassPart, PerTotal, TotalName } from './parts';
import { TOTAL_NAMES } from './parts';

/** The totals the run has (duration with a schedule, the other scenario with a post block). */
export function totalsOf(run: PreparedRun): TotalName[] {
  const { network, hasPost } = run.plan;
  return TOTAL_NAMES.filter(
    (t) =>
      t === 'cost' ||
      (t === 'duration' && network) ||
      (t === 'altCost' && hasPost) ||
      (t === 'altDuration' && hasPost && network),
  );
}

export function perTotal<T>(run: PreparedRun, make: (t: TotalName) => T): PerTotal<T> {
  const has = new Set(totalsOf(run));
  return {
    cost: make('cost'),
    duration: has.has('duration') ? make('duration') : null,
    altCost: has.has('altCost') ? make('altCost') : null,
    altDuration: has.has('altDuration') ? make('altDuration') : null,
  };
}

/** The first pass over a part's chunks, folded as it goes; `addBlock` may be awaited between. */
export class FirstPassFold {
  private readonly buffers: BlockBuffers;
  private readonly names: TotalName[];
  private readonly fine: Map<TotalName, Histogram>;
  private readonly min = new Map<TotalName, number>();
  private readonly max = new Map<TotalName, number>();
  private readonly within = { cost: 0, duration: 0, both: 0 };
  readonly chunks: FirstPassChunk[] = [];
  private current: { chunk: FirstPassChunk; coarse: Histogram; coarseDuration: Histogram | null } | null =
    null;

  constructor(
    private readonly run: PreparedRun,
    readonly fromChunk: number,
    readonly toChunk: number,
    readonly chunkBlocks = CHUNK_BLOCKS,
  ) {
    checkChunkRange(run.settings.iterations, chunkBlocks, fromChunk, toChunk);
    this.buffers = allocateBlockBuffers(run.plan);
    this.names = totalsOf(run);
    this.fine = new Map(this.names.map((t) => [t, new Histogram()]));
    for (const t of this.names) {
      this.min.set(t, Infinity);
      this.max.set(t, -Infinity);
    }
  }

  /** Blocks of the part, in order. */
  blocks(): number[] {
    const out: number[] = [];
    for (let c = this.fromChunk; c < this.toChunk; c++)
      out.push(...chunkBlocksOf(c, this.run.settings.iterations, this.chunkBlocks));
    return out;
  }

  addBlock(b: number): number {
    const { plan, key, settings } = this.run;
    const c = Math.floor(b / this.chunkBlocks);
    if (!this.current || this.current.chunk.chunk !== c) this.openChunk(c);
    const n = blockLength(b, settings.iterations);
    const sink = sinkOf(this.buffers, plan.sensitivity.length, n);
    const summary = simulateBlock(plan, key, settings.sampling, b, n, sink);
    this.fold(sink as unknown as Record<TotalName, Float64Array>, n, summary);
    return n;
  }

  private openChunk(c: number): void {
    const { plan } = this.run;
    const zeros = (k: number) => new Array<number>(k).fill(0);
    const rows = plan.sensitivity.length;
    const chunk: FirstPassChunk = {
      chunk: c,
      n: 0,
      sums: perTotal(this.run, () => 0),
      critical: zeros(plan.activities.length),
      gradeSums: zeros(2 * rows),
      pairSums: zeros(5 * plan.correlations.length),
      durationSums: zeros(2 * plan.activities.length),
      swingSums: zeros(6 * rows),
      coarse: { cost: { keys: [], counts: [] }, duration: null },
    };
    this.closeChunk();
    this.current = { chunk, coarse: new Histogram(), coarseDuration: plan.network ? new Histogram() : null };
  }

  private closeChunk(): void {
    if (!this.current) return;
    const { chunk, coarse, coarseDuration } = this.current;
    chunk.coarse = { cost: coarse.toJSON(), duration: coarseDuration?.toJSON() ?? null };
    const { sums } = chunk;
    assertFinite(
      `the first pass of chunk ${chunk.chunk}`,
      sums.cost,
      sums.duration,
      sums.altCost,
      sums.altDuration,
      chunk.gradeSums,
      chunk.pairSums,
      chunk.durationSums,
      chunk.swingSums,
    );
    this.chunks.push(chunk);
    this.current = null;
  }

  private fold(values: Record<TotalName, Float64Array>, n: number, s: BlockSummary): void {
    const { chunk, coarse, coarseDuration } = this.current!;
    chunk.n += n;
    for (const t of this.names) {
      const x = values[t];
      const hist = this.fine.get(t)!;
      const keepCoarse = t === 'cost' ? coarse : t === 'duration' ? coarseDuration : null;
      let sum = 0;
      let lo = this.min.get(t)!;
      let hi = this.max.get(t)!;
      for (let i = 0; i < n; i++) {
        const v = x[i];
        sum += v;
        if (v < lo) lo = v;
        if (v > hi) hi = v;
        const k = fineKey(v);
        hist.add(k);
        keepCoarse?.add(coarseOfFine(k));
      }
      this.min.set(t, lo);
      this.max.set(t, hi);
      chunk.sums[t]! += sum;
    }
    const { cost: tc, duration: td } = this.run.plan.targets;
    if (tc !== undefined || td !== undefined) {
      const cost = values.cost;
      const duration = values.duration;
      for (let i = 0; i < n; i++) {
        const inCost = tc !== undefined && cost[i] <= tc;
        const inDuration = td !== undefined && duration.length > 0 && duration[i] <= td;
        if (inCost) this.within.cost++;
        if (inDuration) this.within.duration++;
        if (inCost && inDuration) this.within.both++;
      }
    }
    const add = (into: number[], from: ArrayLike<number>) => {
      for (let k = 0; k < into.length; k++) into[k] += from[k];
    };
    add(chunk.critical, s.critical);
    add(chunk.gradeSums, s.gradeSums);
    add(chunk.pairSums, s.pairSums);
    add(chunk.durationSums, s.durationSums);
    add(chunk.swingSums, s.swingSums);
  }

  finish(): FirstPassPart {
    this.closeChunk();
    const { run } = this;
    return {
      format: 'outturn-bounded-first',
      iterations: run.settings.iterations,
      chunkBlocks: this.chunkBlocks,
      fromChunk: this.fromChunk,
      toChunk: this.toChunk,
      chunks: this.chunks,
      fine: perTotal(run, (t) => this.fine.get(t)!.toJSON()),
      min: perTotal(run, (t) => this.min.get(t)!),
      max: perTotal(run, (t) => this.max.get(t)!),
      withinTarget: { ...this.within },
    };
  }
}

/** The first pass over chunks [fromChunk, toChunk), in this thread. */
export function firstPassPart(
  run: PreparedRun,
  fromChunk: number,
  toChunk: number,
  chunkBlocks = CHUNK_BLOCKS,
): FirstPassPart {
  const fold = new FirstPassFold(run, fromChunk, toChunk, chunkBlocks);
  for (const b of fold.blocks()) fold.addBlock(b);
  return fold.finish();
}
