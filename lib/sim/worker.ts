// Worker-thread entry, bundled to .build/sim-worker.mjs (scripts/build-worker.mjs, or on demand
// by ./exec/worker-file). Each worker compiles the model once from its workerData, then computes
// the blocks it is handed and moves their typed arrays back without copying.

import { workerData } from 'node:worker_threads';
import { move, transferableSymbol, valueSymbol } from 'piscina';
import { type BlockOutput, blockLength, simulateBlock } from './block';
import { compileModel } from './compile';
import type { Model, Sampling } from './types';

export interface WorkerData {
  model: Model;
  key: number[];
  sampling: Sampling;
}

export interface BlockTask {
  blocks: number[];
  total: number;
}

const data = workerData as WorkerData;
const plan = compileModel(data.model);
const key = Uint32Array.from(data.key);

export default function runBlocks(task: BlockTask) {
  const outputs: BlockOutput[] = task.blocks.map((b) =>
    simulateBlock(plan, key, data.sampling, b, blockLength(b, task.total)),
  );
  const buffers = outputs.flatMap((o) =>
    [o.cost, o.duration, o.critical, o.grades, o.gradeSums, o.pairSums].map((a) => a.buffer),
  );
  return move({
    get [transferableSymbol]() {
      return buffers;
    },
    get [valueSymbol]() {
      return outputs;
    },
  });
}
