// Worker-thread entry, bundled to .build/sim-worker.mjs by scripts/build-worker.mjs (see
// ./worker-file). Each worker compiles the model once from its workerData (while the
// parent builds the beta-PERT tables that the first task brings), then runs tasks: claim and
// compute blocks into the round's shared store, or claim and compute the second pass over blocks
// (the tornado's cross sums and the allocation's sums), or sort one total. Blocks are claimed
// one by one through shared counters (./claims), so a task lasts as long as there is work; only
// small per-block sums travel back.

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

export interface WorkerData {
  model: Model;
  key: number[];
  sampling: Sampling;
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
  | { kind: 'sort'; values: Float64Array };

/** The second pass of the `blocks[k]` this worker claimed: [k, its sums]. */
export type ClaimedSecondPass = [number, BlockSecondPass];

export type WorkerReply = BlockSummary[] | ClaimedSecondPass[] | SortOrder | Float64Array;

const data = workerData as WorkerData;
const plan = compileModel(data.model);
const key = Uint32Array.from(data.key);
let tablesIn = false;
let warm = false;

export default function runTask(task: WorkerTask): WorkerReply {
  if (task.kind === 'order') return sortOrder(task.values);
  if (task.kind === 'sort') return task.values.slice().sort();
  const { store, blocks, claims } = task;
  if (task.kind === 'blocks') {
    if (!tablesIn) {
      unpackBetaTables(task.tables);
      tablesIn = true;
    }
    if (task.warm && !warm) {
      warmUp(plan, data.sampling);
      warm = true;
    }
    const out: BlockSummary[] = [];
    for (let k = claimNext(claims, blocks.length); k >= 0; k = claimNext(claims, blocks.length)) {
      const n = blockLength(blocks[k], store.total);
      out.push(simulateBlock(plan, key, data.sampling, blocks[k], n, blockSink(store, blocks[k], n)));
      markDone(claims, n);
    }
    return out;
  }
  const input: SecondPassInput = { ...task.input, key, sampling: data.sampling };
  const out: ClaimedSecondPass[] = [];
  for (let k = claimNext(claims, blocks.length); k >= 0; k = claimNext(claims, blocks.length)) {
    const b = blocks[k];
    out.push([k, blockSecondPass(plan, store, b, blockLength(b, store.total), input, task.recompute[k])]);
  }
  return out;
}
