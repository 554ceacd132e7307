// A bounded-memory run (../core/bounded) with threads, progress and cancellation. In this thread
// it folds block after block, yielding between blocks; with more threads each chunk is a task,
// and the parts come back as plain objects. Either way the parts, and so the result, are the
// same to the bit. Progress counts both passes: 2 × iterations in all.

import { BLOCK_SIZE } from '../core/block';
import {
  CHUNK_BLOCKS,
  boundedChunks,
  chunkIterations,
  finishBounded,
  FirstPartsGathering,
  FirstPassFold,
  SecondPassFold,
  secondPassRequest,
} from '../core/bounded';
import type { FirstPassPart, SecondPassPart } from '../core/bounded';
import { compileModel } from '../core/compile';
import type { PreparedRun } from '../core/engine';
import { SimulationCancelledError } from '../core/errors';
import type { SimulationResult } from '../core/formats';
import { packBetaTables } from '../core/math/beta-quantile-table';
import type { ResolvedSettings } from '../core/options';
import type { Model } from '../core/formats';
import type { RunOptions } from './options';
import type { TaskPool } from './pool';
import { warmUp } from './warm-up';

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** In this thread, warm the engine up only for runs of at least this many blocks. */
const WARM_UP_FROM = 8;

export async function runBounded(
  resolved: { model: Model; settings: ResolvedSettings; key: Uint32Array },
  options: RunOptions,
  pool: TaskPool | null,
  started: number,
): Promise<SimulationResult> {
  const { signal, onProgress } = options;
  const throwIfAborted = () => {
    if (signal?.aborted) throw new SimulationCancelledError();
  };
  const run: PreparedRun = { ...resolved, plan: compileModel(resolved.model) };
  const n = run.settings.iterations;
  const chunkBlocks = options.chunkBlocks ?? CHUNK_BLOCKS;
  const chunks = boundedChunks(n, chunkBlocks);
  const total = 2 * n;
  let done = 0;
  const progress = (k: number) => {
    done += k;
    onProgress?.({ done, total, iterations: Math.min(done, n) });
  };

  let first: FirstPassPart[];
  let second: SecondPassPart[];
  if (!pool) {
    if (Math.ceil(n / BLOCK_SIZE) >= WARM_UP_FROM) warmUp(run.plan, run.settings.sampling);
    const fold1 = new FirstPassFold(run, 0, chunks, chunkBlocks);
    for (const b of fold1.blocks()) {
      throwIfAborted();
      progress(fold1.addBlock(b));
      await yieldToEventLoop();
    }
    first = [fold1.finish()];
    const request = secondPassRequest(run, first);
    const fold2 = new SecondPassFold(run, request, 0, chunks);
    for (const b of fold2.blocks()) {
      throwIfAborted();
      progress(fold2.addBlock(b));
      await yieldToEventLoop();
    }
    second = [fold2.finish()];
    throwIfAborted();
    return finishBounded(run, first, request, second, { elapsedMs: performance.now() - started });
  }

  const tables = packBetaTables(run.plan.betaShapes);
  const all = Array.from({ length: chunks }, (_, c) => c);
  const guard = async <T>(work: Promise<T>): Promise<T> => {
    try {
      return await work;
    } catch (e) {
      if (signal?.aborted) throw new SimulationCancelledError();
      throw e;
    }
  };
  // Parts arrive per chunk; adjacent ones are combined at once, so the chunks' histograms do not
  // pile up here.
  const gathering = new FirstPartsGathering();
  await guard(
    Promise.all(
      all.map((c) =>
        pool
          .run<FirstPassPart>({ kind: 'bounded-first', iterations: n, chunk: c, chunkBlocks, tables }, signal)
          .then((part) => {
            gathering.add(part);
            progress(chunkIterations(c, n, chunkBlocks));
          }),
      ),
    ),
  );
  first = gathering.parts();
  throwIfAborted();
  const request = secondPassRequest(run, first);
  second = await guard(
    Promise.all(
      all.map((c) =>
        pool
          .run<SecondPassPart>({ kind: 'bounded-second', chunk: c, request, tables }, signal)
          .then((part) => {
            progress(chunkIterations(c, n, chunkBlocks));
            return part;
          }),
      ),
    ),
  );
  throwIfAborted();
  return finishBounded(run, first, request, second, { elapsedMs: performance.now() - started });
}
