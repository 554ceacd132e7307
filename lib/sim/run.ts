// runSimulation: the engine with threads, progress and cancellation. threads = 1 runs in this
// thread (yielding between blocks so progress and abort get through); more threads use a pool
// of workers loading the bundled worker file. Either way the blocks and so the result are the
// same to the bit.

import { availableParallelism } from 'node:os';
import { type BlockOutput, blockLength, simulateBlock } from './block';
import { blocksBetween, prepareRun } from './engine';
import { SimulationCancelledError } from './errors';
import { createBlockPool, type BlockPool } from './exec/pool';
import { defaultWorkerFile, ensureWorkerFile } from './exec/worker-file';
import type { RunOptions } from './options';
import { rollUp } from './rollup';
import { nextRound } from './schedule-of-rounds';
import type { SimulationResult } from './types';

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function runSimulation(modelJson: unknown, options: RunOptions = {}): Promise<SimulationResult> {
  const started = performance.now();
  const { signal, onProgress } = options;
  const throwIfAborted = () => {
    if (signal?.aborted) throw new SimulationCancelledError();
  };
  throwIfAborted();
  const { model, plan, settings, key } = prepareRun(modelJson, options);
  const threads = Math.max(1, Math.floor(options.threads ?? availableParallelism()));
  const blocks: BlockOutput[] = [];
  const warnings: string[] = [];
  let pool: BlockPool | null = null;
  try {
    let done = 0;
    let iterationsDone = 0;
    for (let round = nextRound(settings, plan, 0, blocks, warnings); round !== null;) {
      const total = round;
      const todo = blocksBetween(done, total);
      const report = (b: BlockOutput) => {
        blocks.push(b);
        iterationsDone += b.n;
        onProgress?.({ done: iterationsDone, total });
      };
      // A single block is not worth starting threads for.
      if (threads === 1 || (todo.length === 1 && !pool)) {
        for (const b of todo) {
          throwIfAborted();
          report(simulateBlock(plan, key, settings.sampling, b, blockLength(b, total)));
          await yieldToEventLoop();
        }
      } else {
        if (!pool) {
          const file = await ensureWorkerFile(options.workerFile ?? defaultWorkerFile());
          throwIfAborted();
          pool = createBlockPool(file, Math.min(threads, todo.length), {
            model,
            key: Array.from(key),
            sampling: settings.sampling,
          });
        }
        try {
          await pool.run(todo, total, report, signal);
        } catch (e) {
          if (signal?.aborted) throw new SimulationCancelledError();
          throw e;
        }
      }
      done = total;
      round = nextRound(settings, plan, done, blocks, warnings);
    }
  } finally {
    if (pool) await pool.close();
  }
  return rollUp(plan, blocks, {
    seed: settings.seed,
    sampling: settings.sampling,
    elapsedMs: performance.now() - started,
    warnings,
  });
}
