/**
 * The bounded run's second pass: the same blocks again (a block is a function of the plan, run
 * key, sampling, block index and size, so they are the first pass's iterations to the bit), now
 * that the first parts are merged (./request). Per block it
 *
 *  - keeps the values that fall in the requested buckets (the order statistics' exact values);
 *  - adds Σ(x − mean)² (the standard deviation, two passes as in ../stats/summary);
 *  - adds each tornado row's Σ k·R, R the mid-rank of the total's bucket in the merged histogram;
 *  - sums each input's cost over the iterations inside the allocation window's inner buckets,
 *    and keeps them per iteration for the two end buckets, whose exact ends are known only at the
 *    finish: read from the block's allocation band (../stats/allocation-band) when it holds them
 *    all, else recomputed for those iterations from the run key (../stats/allocation); which way
 *    depends only on the block and the request;
 *  - counts the iterations surely within both joint P-values, keeps the (cost, duration) pairs
 *    on a boundary bucket, and bins the cost of each iteration by frontier duration.
 */

import { BLOCK_SIZE, blockLength, simulateBlock } from '../block';
import type { PreparedRun } from '../engine';
import { allocationLevel, allocationSlots, tappedAllocationSums } from '../stats/allocation';
import { type AllocationBand, bandCapacity, type BandRoom } from '../stats/allocation-band';
import { allocateBlockBuffers, type BlockBuffers, checkChunkRange, chunkBlocksOf, sinkOf } from './chunks';
import { perTotal, totalsOf } from './first-pass';
import { assertFinite } from './finite';
import { Histogram } from './histogram';
import { coarseOfFine, fineKey } from './keys';
import type { PerTotal, SecondPassChunk, SecondPassPart, SecondPassRequest, TotalName } from './parts';

export class SecondPassFold {
  private readonly buffers: BlockBuffers;
  /** Room for a block's allocation band (../stats/allocation-band), reused block after block. */
  private readonly room: BandRoom;
  private readonly slots: number;
  private readonly names: TotalName[];
  private readonly keep: Map<TotalName, Set<number>>;
  private readonly kept: Map<TotalName, Map<number, number>>;
  private readonly costRank: Map<number, number>;
  private readonly durationRank: Map<number, number> | null;
  private readonly ranks: { cost: Float64Array; duration: Float64Array };
  private readonly joint: { sure: number[]; pairs: number[][]; frontier: Histogram[] } | null;
  readonly chunks: SecondPassChunk[] = [];

  constructor(
    private readonly run: PreparedRun,
    private readonly request: SecondPassRequest,
    readonly fromChunk: number,
    readonly toChunk: number,
  ) {
    if (request.format !== 'outturn-bounded-request')
      throw new TypeError('second pass: not a second-pass request');
    if (request.iterations !== run.settings.iterations)
      throw new RangeError(
        `second pass: the request is for ${request.iterations} iterations, the run has ${run.settings.iterations}`,
      );
    checkChunkRange(request.iterations, request.chunkBlocks, fromChunk, toChunk);
    this.buffers = allocateBlockBuffers(run.plan);
    this.slots = allocationSlots(run.plan);
    const capacity = bandCapacity(BLOCK_SIZE);
    this.room = { index: new Int32Array(capacity), costs: new Float64Array(capacity * this.slots) };
    this.names = totalsOf(run);
    this.keep = new Map(this.names.map((t) => [t, new Set(request.keep[t] ?? [])]));
    this.kept = new Map(this.names.map((t) => [t, new Map()]));
    const rankMap = (r: { keys: number[]; midRanks: number[] }) =>
      new Map(r.keys.map((k, j) => [k, r.midRanks[j]]));
    this.costRank = rankMap(request.ranks.cost);
    this.durationRank = request.ranks.duration ? rankMap(request.ranks.duration) : null;
    this.ranks = {
      cost: new Float64Array(this.buffers.cost.length),
      duration: new Float64Array(this.buffers.duration.length),
    };
    this.joint = request.joint
      ? {
          sure: request.joint.levels.map(() => 0),
          pairs: request.joint.levels.map(() => []),
          frontier: request.joint.thresholds.map(() => new Histogram()),
        }
      : null;
  }

  blocks(): number[] {
    const out: number[] = [];
    for (let c = this.fromChunk; c < this.toChunk; c++)
      out.push(...chunkBlocksOf(c, this.request.iterations, this.request.chunkBlocks));
    return out;
  }

  addBlock(b: number): number {
    const { plan, key, settings } = this.run;
    const c = Math.floor(b / this.request.chunkBlocks);
    let chunk = this.chunks[this.chunks.length - 1];
    if (!chunk || chunk.chunk !== c) {
      chunk = {
        chunk: c,
        squares: { cost: 0, duration: plan.network ? 0 : null },
        cross: new Array<number>(2 * plan.sensitivity.length).fill(0),
        allocation: [],
        edges: [],
      };
      this.chunks.push(chunk);
    }
    const n = blockLength(b, settings.iterations);
    const sink = sinkOf(this.buffers, plan.sensitivity.length, n);
    const { band } = simulateBlock(plan, key, settings.sampling, b, n, {
      ...sink,
      band: { level: allocationLevel(plan), room: this.room },
    });
    const values = sink as unknown as Record<TotalName, Float64Array>;
    this.keepValues(values, n);
    this.addSquares(chunk, values, n);
    this.addCross(chunk, sink.grades, values, n);
    this.addAllocation(chunk, b, n, values.cost, band);
    if (this.joint) this.addJoint(values.cost, values.duration, n);
    return n;
  }

  private keepValues(values: Record<TotalName, Float64Array>, n: number): void {
    for (const t of this.names) {
      const want = this.keep.get(t)!;
      const kept = this.kept.get(t)!;
      const x = values[t];
      for (let i = 0; i < n; i++) if (want.has(fineKey(x[i]))) kept.set(x[i], (kept.get(x[i]) ?? 0) + 1);
    }
  }

  private addSquares(chunk: SecondPassChunk, values: Record<TotalName, Float64Array>, n: number): void {
    const squares = (x: Float64Array, mean: number) => {
      let ss = 0;
      for (let i = 0; i < n; i++) ss += (x[i] - mean) ** 2;
      return ss;
    };
    chunk.squares.cost += squares(values.cost, this.request.mean.cost);
    if (chunk.squares.duration !== null)
      chunk.squares.duration += squares(values.duration, this.request.mean.duration!);
  }

  /** As ../run-data blockCrossSums, the ranks those of the total's bucket. */
  private addCross(
    chunk: SecondPassChunk,
    grades: Uint16Array,
    values: Record<TotalName, Float64Array>,
    n: number,
  ): void {
    const { plan } = this.run;
    const costRanks = this.ranks.cost;
    for (let i = 0; i < n; i++) costRanks[i] = this.costRank.get(fineKey(values.cost[i]))!;
    const durationRanks = this.durationRank ? this.ranks.duration : null;
    if (durationRanks)
      for (let i = 0; i < n; i++) durationRanks[i] = this.durationRank!.get(fineKey(values.duration[i]))!;
    for (let r = 0; r < plan.sensitivity.length; r++) {
      const input = plan.sensitivity[r];
      const base = r * n;
      if (input.cost) {
        let acc = 0;
        for (let i = 0; i < n; i++) acc += grades[base + i] * costRanks[i];
        chunk.cross[2 * r] += acc;
      }
      if (durationRanks && input.duration) {
        let acc = 0;
        for (let i = 0; i < n; i++) acc += grades[base + i] * durationRanks[i];
        chunk.cross[2 * r + 1] += acc;
      }
    }
  }

  private addAllocation(
    chunk: SecondPassChunk,
    b: number,
    n: number,
    cost: Float64Array,
    band?: AllocationBand,
  ): void {
    const { loKey, hiKey } = this.request.window;
    const inner: number[] = [];
    const edges: number[] = [];
    for (let i = 0; i < n; i++) {
      const k = fineKey(cost[i]);
      if (k > loKey && k < hiKey) inner.push(i);
      else if (k === loKey || k === hiKey) edges.push(i);
    }
    const inBand = (i: number) => band !== undefined && cost[i] >= band.lo && cost[i] <= band.hi;
    const sums =
      inner.every(inBand) && edges.every(inBand)
        ? this.fromBand(band!, inner, edges, chunk)
        : this.fromTaps(b, n, inner, edges, cost, chunk);
    if (chunk.allocation.length === 0) chunk.allocation = Array.from(sums);
    else for (let s = 0; s < sums.length; s++) chunk.allocation[s] += sums[s];
  }

  /** The window's iterations read from the block's band (every one of them is in it). */
  private fromBand(
    band: AllocationBand,
    inner: number[],
    edges: number[],
    chunk: SecondPassChunk,
  ): Float64Array {
    const { index, costs } = this.room;
    const { m } = band;
    const slots = this.slots;
    const at = new Map<number, number>();
    for (let j = 0; j < m; j++) at.set(index[j], j);
    const sums = new Float64Array(slots + 1);
    const js = inner.map((i) => at.get(i)!);
    for (let s = 0; s < slots; s++) {
      let acc = 0;
      for (const j of js) acc += costs[s * m + j];
      sums[s] = acc;
    }
    sums[slots] = inner.length;
    for (const i of edges) {
      const j = at.get(i)!;
      const one = new Array<number>(slots + 1);
      for (let s = 0; s < slots; s++) one[s] = costs[s * m + j];
      one[slots] = 1;
      chunk.edges.push({ cost: this.buffers.cost[i], sums: one });
    }
    return sums;
  }

  /** The window's iterations recomputed from the run key (../stats/allocation). */
  private fromTaps(
    b: number,
    n: number,
    inner: number[],
    edges: number[],
    cost: Float64Array,
    chunk: SecondPassChunk,
  ): Float64Array {
    const { plan, key, settings } = this.run;
    for (const i of edges)
      chunk.edges.push({
        cost: cost[i],
        sums: Array.from(tappedAllocationSums(plan, key, settings.sampling, b, n, [i])),
      });
    return tappedAllocationSums(plan, key, settings.sampling, b, n, inner);
  }

  private addJoint(cost: Float64Array, duration: Float64Array, n: number): void {
    const { levels, thresholds } = this.request.joint!;
    const joint = this.joint!;
    const last = thresholds[thresholds.length - 1];
    for (let i = 0; i < n; i++) {
      const c = cost[i];
      const d = duration[i];
      const ck = fineKey(c);
      const dk = fineKey(d);
      for (let l = 0; l < levels.length; l++) {
        const { costKey, durationKey } = levels[l];
        if (ck < costKey && dk < durationKey) joint.sure[l]++;
        else if (ck <= costKey && dk <= durationKey) joint.pairs[l].push(c, d);
      }
      if (d <= last) {
        let j = 0;
        while (d > thresholds[j]) j++;
        joint.frontier[j].add(coarseOfFine(ck));
      }
    }
  }

  finish(): SecondPassPart {
    for (const c of this.chunks)
      assertFinite(
        `the second pass of chunk ${c.chunk}`,
        c.squares.cost,
        c.squares.duration,
        c.cross,
        c.allocation,
        ...c.edges.map((e) => e.sums),
        ...c.edges.map((e) => e.cost),
      );
    const kept = perTotal(this.run, (t) => {
      const m = this.kept.get(t)!;
      const values = [...m.keys()].sort((a, b) => a - b);
      return { values, counts: values.map((v) => m.get(v)!) };
    }) as PerTotal<{ values: number[]; counts: number[] }>;
    return {
      format: 'outturn-bounded-second',
      fromChunk: this.fromChunk,
      toChunk: this.toChunk,
      chunks: this.chunks,
      kept,
      joint: this.joint
        ? {
            levels: this.joint.sure.map((sure, l) => ({ sure, pairs: this.joint!.pairs[l] })),
            frontier: this.joint.frontier.map((h) => h.toJSON()),
          }
        : null,
    };
  }
}

/** The second pass over chunks [fromChunk, toChunk), in this thread. */
export function secondPassPart(
  run: PreparedRun,
  request: SecondPassRequest,
  fromChunk: number,
  toChunk: number,
): SecondPassPart {
  const fold = new SecondPassFold(run, request, fromChunk, toChunk);
  for (const b of fold.blocks()) fold.addBlock(b);
  return fold.finish();
}
