// Worker-thread entry, bundled to .build/sim-worker.mjs by scripts/build-worker.mjs (see
// ./worker-file). Each worker compiles the model once from its workerData (while the
// parent builds the beta-PERT tables that the first task brings), then runs tasks: compute
// blocks into the round's shared store, or the second pass over blocks (the tornado's cross sums
// and the allocation's sums). Only small
// per-block sums travel back.

import { workerData } from 'node:worker_threads';
import { type BlockSummary, blockLength, simulateBlock } from '../core/block';
import { compileModel } from '../core/compile';
import { type PackedBetaTables, unpackBetaTables } from '../core/math/beta-quantile-table';
import {
  type BlockSecondPass,
  blockSecondPass,
  blockSink,
  type RoundStore,
  type SecondPassInput,
} from '../core/run-data';
import type { Model, Sampling } from '../core/formats';
import { warmUp } from './warm-up';

export interface WorkerData {
  model: Model;
  key: number[];
  sampling: Sampling;
}

export type WorkerTask =
  | {
      kind: 'blocks';
      blocks: number[];
      store: RoundStore;
      /** Beta-PERT quantile tables built by the parent thread, so that no worker rebuilds them. */
      tables: PackedBetaTables;
    }
  | {
      /** The second pass, once the totals are ranked: cross sums and allocation sums. */
      kind: 'second';
      blocks: number[];
      store: RoundStore;
      input: Omit<SecondPassInput, 'key' | 'sampling'>;
      /** Per block of `blocks`: recompute its allocation (its band does not cover the window). */
      recompute: boolean[];
    };

export type WorkerReply = BlockSummary[] | BlockSecondPass[];

const data = workerData as WorkerData;
const plan = compileModel(data.model);
const key = Uint32Array.from(data.key);
let warm = false;

export default function runTask(task: WorkerTask): WorkerReply {
  const { store } = task;
  if (task.kind === 'blocks') {
    if (!warm) {
      unpackBetaTables(task.tables);
      warmUp(plan, data.sampling);
      warm = true;
    }
    return task.blocks.map((b) => {
      const n = blockLength(b, store.total);
      return simulateBlock(plan, key, data.sampling, b, n, blockSink(store, b, n));
    });
  }
  const input: SecondPassInput = { ...task.input, key, sampling: data.sampling };
  return task.blocks.map((b, k) =>
    blockSecondPass(plan, store, b, blockLength(b, store.total), input, task.recompute[k]),
  );
}
