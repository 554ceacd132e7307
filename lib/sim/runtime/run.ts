// runSimulation: the engine with threads, progress and cancellation. threads = 1 runs in this
// thread (yielding between blocks so progress and abort get through); more threads use a pool
// of workers loading the bundled worker file, which write their blocks into shared memory.
// Either way the blocks and so the result are the same to the bit.

import { availableParallelism } from 'node:os';
import { type BlockSummary, blockLength, simulateBlock } from '../core/block';
import { compileModel } from '../core/compile';
import { packBetaTables } from '../core/math/beta-quantile-table';
import {
  blocksBetween,
  type PreparedRun,
  rankRun,
  resolveRun,
  allocationFromBands,
  bandsOf,
  recomputes,
  resultOf,
  secondPassInput,
  secondPassInThread,
} from '../core/engine';
import type { BlockSecondPass } from '../core/run-data';
import { SimulationCancelledError } from '../core/errors';
import { createTaskPool, type TaskPool } from './pool';
import type { RunOptions } from './options';
import { defaultWorkerFile, requireWorkerFile } from './worker-file';
import { allocateRound, blockSink, type RoundStore } from '../core/run-data';
import { nextRound } from '../core/round-plan';
import type { SimulationResult } from '../core/formats';
import { warmUp } from './warm-up';
import { BOUNDED_FROM } from '../core/bounded';
import { runBounded } from './bounded';

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** Blocks per second-pass task: enough work per message, enough tasks to share. */
const SECOND_CHUNK = 4;
/** In this thread, warm the engine up (./warm-up) only for runs of at least this many blocks. */
const WARM_UP_FROM = 8;

export async function runSimulation(modelJson: unknown, options: RunOptions = {}): Promise<SimulationResult> {
  const started = performance.now();
  const { signal, onProgress } = options;
  const throwIfAborted = () => {
    if (signal?.aborted) throw new SimulationCancelledError();
  };
  throwIfAborted();
  const resolved = resolveRun(modelJson, options);
  const { settings, key, model } = resolved;
  const threads = Math.max(1, Math.floor(options.threads ?? availableParallelism()));
  const bounded = options.bounded ?? (settings.iterations > BOUNDED_FROM && !settings.precision);
  if (bounded && settings.precision)
    throw new RangeError('A run to a precision goal keeps its iterations in memory: it cannot be bounded.');
  // A single block is not worth starting threads for.
  const pooled = threads > 1 && settings.iterations > blockLength(0, settings.iterations);
  const rounds: RoundStore[] = [];
  const blocks: BlockSummary[] = [];
  const warnings: string[] = [];
  let pool: TaskPool | null = null;
  try {
    if (pooled) {
      const file = requireWorkerFile(options.workerFile ?? defaultWorkerFile());
      pool = createTaskPool(file, threads, { model, key: Array.from(key), sampling: settings.sampling });
    }
    if (bounded) return await runBounded(resolved, options, pool, started);
    // While the workers start and compile their copy: the plan here, and the beta-PERT tables
    // once for all threads.
    const run: PreparedRun = { ...resolved, plan: compileModel(model) };
    const { plan } = run;
    const tables = pool ? packBetaTables(plan.betaShapes) : null;
    let done = 0;
    for (let round = nextRound(settings, plan, 0, rounds, warnings); round !== null;) {
      const total = round;
      const store = allocateRound(plan, done, total, pooled);
      let finished = done;
      const progress = (summaries: BlockSummary[]) => {
        for (const b of summaries) {
          blocks.push(b);
          finished += b.n;
        }
        onProgress?.({ done: finished, total });
      };
      const todo = blocksBetween(done, total);
      if (!pool && done === 0 && todo.length >= WARM_UP_FROM) warmUp(plan, settings.sampling);
      if (!pool) {
        for (const b of todo) {
          throwIfAborted();
          const n = blockLength(b, total);
          progress([simulateBlock(plan, key, settings.sampling, b, n, blockSink(store, b, n))]);
          await yieldToEventLoop();
        }
      } else {
        const p = pool;
        await guard(
          Promise.all(
            todo.map((b) =>
              p
                .run<BlockSummary[]>({ kind: 'blocks', blocks: [b], store, tables: tables! }, signal)
                .then(progress),
            ),
          ),
        );
      }
      rounds.push(store);
      done = total;
      round = nextRound(settings, plan, done, rounds, warnings);
    }
    throwIfAborted();
    const totals = rankRun(run, rounds, pooled);
    let second: BlockSecondPass[];
    if (!pool) second = secondPassInThread(run, rounds, totals, blocks);
    else {
      const p = pool;
      const input = secondPassInput(run, totals);
      const { costRanks, durationRanks, window } = input;
      const bands = bandsOf(blocks);
      const tasks = rounds.flatMap((store) => {
        const all = blocksBetween(store.start, store.total);
        const chunks: number[][] = [];
        for (let i = 0; i < all.length; i += SECOND_CHUNK) chunks.push(all.slice(i, i + SECOND_CHUNK));
        return chunks.map((chunk) =>
          p.run<BlockSecondPass[]>(
            {
              kind: 'second',
              blocks: chunk,
              store,
              input: { costRanks, durationRanks, window },
              recompute: chunk.map((b) => recomputes(bands, input, b)),
            },
            signal,
          ),
        );
      });
      second = allocationFromBands(run, rounds, (await guard(Promise.all(tasks))).flat(), bands, input);
    }
    return resultOf(run, blocks, totals, second, { elapsedMs: performance.now() - started, warnings });
  } finally {
    if (pool) await pool.close();
  }

  async function guard<T>(work: Promise<T>): Promise<T> {
    try {
      return await work;
    } catch (e) {
      if (signal?.aborted) throw new SimulationCancelledError();
      throw e;
    }
  }
}
