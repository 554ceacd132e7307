// Worker-thread entry, bundled to .build/sim-worker.mjs by scripts/build-worker.mjs (see
// ./worker-file). Each worker compiles the model once from its workerData (while the
// parent builds the beta-PERT tables that the first task brings), then runs tasks: claim and
// compute blocks into the round's shared store, or claim and compute the second pass over blocks
// (the tornado's cross sums and the allocation's sums), or sort one total, or a bounded run's pass
// over one chunk (../core/bounded). Blocks are claimed one by one through shared counters
// (./claims), so a task lasts as long as there is work; only small per-block sums travel back.

import { workerData } from 'node:worker_threads';
import { type BlockSummary, blockLength, simulateBlock } from '../core/block';
import { compileModel } from '../core/compile';
import { type PackedBetaTables, unpackBetaTables } from '../core/math/beta-quantile-table';
import { type SortOrder, sortOrder } from '../core/math/ranks';
import {
  type BlockSecondPass,
  blockSecondPass,
  blockSink,
  type RoundStore,
  type SecondPassInput,
} from '../core/run-data';
import type { Model, Sampling } from '../core/formats';
import { type Claims, claimNext, markDone } from './claims';
import { warmUp } from './warm-up';
// The passes' own modules, not ../core/bounded's door: that door brings the model validator
// (zod and its locales) into every worker's bundle.
import { firstPassPart } from '../core/bounded/first-pass';
import { secondPassPart } from '../core/bounded/second-pass';
import type { FirstPassPart, SecondPassPart, SecondPassRequest } from '../core/bounded';
import type { PreparedRun } from '../core/engine';

export interface WorkerData {
  model: Model;
  key: number[];
  sampling: Sampling;
  /** The first round's work, given at start (see FirstRound). */
  first?: FirstRound;
}

/**
 * The first round's blocks, handed over with the worker's start: it claims them as soon as it
 * has loaded and compiled, instead of waiting for the parent's thread (busy computing blocks
 * itself) to pass it a task. Its first `blocks` task then collects what it computed.
 */
export interface FirstRound {
  blocks: number[];
  claims: Claims;
  store: RoundStore;
  warm: boolean;
  /** Packed by the parent after the worker starts: `ready[0]` turns 1 once they are in. */
  tables: PackedBetaTables;
  ready: Int32Array;
}

export type WorkerTask =
  | {
      kind: 'blocks';
      /** The round's blocks, claimed one by one through `claims`. */
      blocks: number[];
      claims: Claims;
      store: RoundStore;
      /** Beta-PERT quantile tables built by the parent thread, so that no worker rebuilds them. */
      tables: PackedBetaTables;
      /** Run the warm-up blocks first (a run long enough to be worth it). */
      warm: boolean;
      /** The round given at start (WorkerData.first): its blocks computed so far come back too. */
      first: boolean;
    }
  | {
      /** The second pass, once the totals are ranked: cross sums and allocation sums. */
      kind: 'second';
      blocks: number[];
      claims: Claims;
      store: RoundStore;
      input: Omit<SecondPassInput, 'key' | 'sampling'>;
      /** Per block of `blocks`: recompute its allocation (its band does not cover the window). */
      recompute: boolean[];
    }
  /** The sort order of one total (the ranks of the run). */
  | { kind: 'order'; values: Float64Array }
  /** The sorted copy of one total, as Float64Array.prototype.sort gives it. */
  | { kind: 'sort'; values: Float64Array }
  | {
      /** A bounded run's first pass over one chunk. */
      kind: 'bounded-first';
      iterations: number;
      chunk: number;
      chunkBlocks: number;
      tables: PackedBetaTables;
    }
  | {
      /** A bounded run's second pass over one chunk. */
      kind: 'bounded-second';
      chunk: number;
      request: SecondPassRequest;
      tables: PackedBetaTables;
    };

/** The second pass of the `blocks[k]` this worker claimed: [k, its sums]. */
export type ClaimedSecondPass = [number, BlockSecondPass];

export type WorkerReply =
  BlockSummary[] | ClaimedSecondPass[] | SortOrder | Float64Array | FirstPassPart | SecondPassPart;

const data = workerData as WorkerData;
const plan = compileModel(data.model);
const key = Uint32Array.from(data.key);
let tablesIn = false;
let warm = false;

function prepare(tables: PackedBetaTables, warmFirst: boolean): void {
  if (!tablesIn) unpackBetaTables(tables);
  tablesIn = true;
  if (warmFirst && !warm) warmUp(plan, data.sampling);
  warm ||= warmFirst;
}

/** Claims and computes blocks until none is left, into `out`. */
function computeBlocks(
  blocks: number[],
  claims: Claims,
  store: RoundStore,
  out: BlockSummary[],
): BlockSummary[] {
  for (let k = claimNext(claims, blocks.length); k >= 0; k = claimNext(claims, blocks.length)) {
    const n = blockLength(blocks[k], store.total);
    out.push(simulateBlock(plan, key, data.sampling, blocks[k], n, blockSink(store, blocks[k], n)));
    markDone(claims, n);
  }
  return out;
}

/** The first round's blocks this worker computed before any task reached it. */
let firstDone: BlockSummary[] = [];
if (data.first) {
  const { ready, tables, warm: warmFirst, blocks, claims, store } = data.first;
  Atomics.wait(ready, 0, 0);
  prepare(tables, warmFirst);
  firstDone = computeBlocks(blocks, claims, store, []);
}

/** The run as the bounded passes take it (the seed only names the result, made by the parent). */
const boundedRun = (iterations: number): PreparedRun => ({
  model: data.model,
  plan,
  key,
  settings: { iterations, seed: 0, sampling: data.sampling, precision: null },
});

export default function runTask(task: WorkerTask): WorkerReply {
  if (task.kind === 'order') return sortOrder(task.values);
  if (task.kind === 'sort') return task.values.slice().sort();
  if (task.kind === 'bounded-first') {
    prepare(task.tables, true);
    return firstPassPart(boundedRun(task.iterations), task.chunk, task.chunk + 1, task.chunkBlocks);
  }
  if (task.kind === 'bounded-second') {
    prepare(task.tables, true);
    return secondPassPart(boundedRun(task.request.iterations), task.request, task.chunk, task.chunk + 1);
  }
  const { store, blocks, claims } = task;
  if (task.kind === 'blocks') {
    prepare(task.tables, task.warm);
    const out = task.first ? firstDone : [];
    if (task.first) firstDone = [];
    return computeBlocks(blocks, claims, store, out);
  }
  const input: SecondPassInput = { ...task.input, key, sampling: data.sampling };
  const out: ClaimedSecondPass[] = [];
  for (let k = claimNext(claims, blocks.length); k >= 0; k = claimNext(claims, blocks.length)) {
    const b = blocks[k];
    out.push([k, blockSecondPass(plan, store, b, blockLength(b, store.total), input, task.recompute[k])]);
  }
  return out;
}
