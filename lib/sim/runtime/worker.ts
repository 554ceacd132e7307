// Worker-thread entry, bundled to .build/sim-worker.mjs by scripts/build-worker.mjs (see
// ./worker-file). Each worker compiles the model once from its workerData (while the
// parent builds the beta-PERT tables that the first task brings), then runs tasks: compute
// blocks into the round's shared store, or the second pass over blocks (the tornado's cross sums
// and the allocation's sums), or a bounded run's pass over one chunk (../core/bounded). Only small
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
import {
  firstPassPart,
  type FirstPassPart,
  secondPassPart,
  type SecondPassPart,
  type SecondPassRequest,
} from '../core/bounded';
import type { PreparedRun } from '../core/engine';

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
    }
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

export type WorkerReply = BlockSummary[] | BlockSecondPass[] | FirstPassPart | SecondPassPart;

const data = workerData as WorkerData;
const plan = compileModel(data.model);
const key = Uint32Array.from(data.key);
let warm = false;

function warmOnce(tables: PackedBetaTables): void {
  if (warm) return;
  unpackBetaTables(tables);
  warmUp(plan, data.sampling);
  warm = true;
}

/** The run as the bounded passes take it (the seed only names the result, made by the parent). */
const boundedRun = (iterations: number): PreparedRun => ({
  model: data.model,
  plan,
  key,
  settings: { iterations, seed: 0, sampling: data.sampling, precision: null },
});

export default function runTask(task: WorkerTask): WorkerReply {
  if (task.kind === 'bounded-first') {
    warmOnce(task.tables);
    return firstPassPart(boundedRun(task.iterations), task.chunk, task.chunk + 1, task.chunkBlocks);
  }
  if (task.kind === 'bounded-second') {
    warmOnce(task.tables);
    return secondPassPart(boundedRun(task.request.iterations), task.request, task.chunk, task.chunk + 1);
  }
  const { store } = task;
  if (task.kind === 'blocks') {
    warmOnce(task.tables);
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
