// runSimulation: the engine with threads, progress and cancellation. threads = 1 runs in this
// thread (yielding between blocks so progress and abort get through); more threads use a pool
// of workers loading the bundled worker file, which write their blocks into shared memory, and,
// with computeHere, this thread computes beside them. Either way the blocks and so the result are
// the same to the bit. A bounded run (above BOUNDED_FROM iterations, or when asked) goes to
// ./bounded instead.

import { availableParallelism } from 'node:os';
import { type BlockSummary, blockLength, simulateBlock } from '../core/block';
import { compileModel } from '../core/compile';
import {
  type PackedBetaTables,
  packBetaTables,
  packedBetaTablesBytes,
} from '../core/math/beta-quantile-table';
import { type SortOrder, sortOrder } from '../core/math/ranks';
import {
  blocksBetween,
  inBlockOrder,
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
import { type RankedTotals, rankedTotalsOf, rollUpTotals, type TotalsRollUp } from '../core/rollup';
import { type BlockSecondPass, blockSecondPass, concatRounds } from '../core/run-data';
import { SimulationCancelledError } from '../core/errors';
import { type Claims, claimNext, createClaims, doneSoFar, markDone, stopClaims } from './claims';
import { createTaskPool, type TaskPool } from './pool';
import type { RunOptions } from './options';
import { defaultWorkerFile, requireWorkerFile } from './worker-file';
import type { ClaimedSecondPass } from './worker';
import { allocateRound, blockSink, type RoundStore } from '../core/run-data';
import { nextRound } from '../core/round-plan';
import type { SimulationResult } from '../core/formats';
import { warmUp } from './warm-up';
import { BOUNDED_FROM } from '../core/bounded';
import { runBounded } from './bounded';

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

/** In this thread, warm the engine up (./warm-up) only for runs of at least this many blocks. */
const WARM_UP_FROM = 8;
/** How often progress is read while only the workers compute. */
const PROGRESS_EVERY_MS = 100;

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
  const here = pooled && options.computeHere === true;
  const workers = here ? threads - 1 : threads;
  const rounds: RoundStore[] = [];
  const blocks: BlockSummary[] = [];
  const warnings: string[] = [];
  let pool: TaskPool | null = null;
  /** The pool's closing, once started. */
  let closing: Promise<void> | null = null;
  const workerFile = () => requireWorkerFile(options.workerFile ?? defaultWorkerFile());
  const workerData = { model, key: Array.from(key), sampling: settings.sampling };
  try {
    if (bounded) {
      // Each chunk of a bounded run is a worker task (./bounded), this thread gathering the parts.
      if (pooled) pool = createTaskPool(workerFile(), threads, workerData);
      return await runBounded(resolved, options, pool, started);
    }
    const run: PreparedRun = { ...resolved, plan: compileModel(model) };
    const { plan } = run;
    let tables: PackedBetaTables | null = null;
    // The first round's store and claims exist before the workers do: they get them with their
    // start and begin computing as soon as they have loaded.
    let first: { store: RoundStore; claims: Claims } | null = null;
    let round = nextRound(settings, plan, 0, rounds, warnings);
    if (pooled && round !== null) {
      const file = workerFile();
      first = { store: allocateRound(plan, 0, round, true), claims: createClaims() };
      const todo = blocksBetween(0, round);
      const buffer = new SharedArrayBuffer(packedBetaTablesBytes(plan.betaShapes.length));
      const ready = new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT));
      pool = createTaskPool(file, workers, {
        ...workerData,
        first: {
          ...first,
          blocks: todo,
          warm: todo.length >= WARM_UP_FROM,
          tables: { buffer, shapes: Float64Array.from(plan.betaShapes.flat()) },
          ready,
        },
      });
      // While the workers start and compile their copy: the beta-PERT tables, once for all threads.
      tables = packBetaTables(plan.betaShapes, buffer);
      Atomics.store(ready, 0, 1);
      Atomics.notify(ready, 0);
    }
    let done = 0;
    for (; round !== null;) {
      const total = round;
      const isFirst = done === 0 && first !== null;
      const store = isFirst ? first!.store : allocateRound(plan, done, total, pooled);
      const todo = blocksBetween(done, total);
      const warm = done === 0 && todo.length >= WARM_UP_FROM;
      if (!pool) {
        if (warm) warmUp(plan, settings.sampling);
        let finished = done;
        for (const b of todo) {
          throwIfAborted();
          const n = blockLength(b, total);
          blocks.push(simulateBlock(plan, key, settings.sampling, b, n, blockSink(store, b, n)));
          finished += n;
          onProgress?.({ done: finished, total });
          await yieldToEventLoop();
        }
      } else {
        const p = pool;
        const claims = isFirst ? first!.claims : createClaims();
        const from = done;
        const report = () => onProgress?.({ done: from + doneSoFar(claims), total });
        const tasks = Array.from({ length: workers }, () =>
          p.run<BlockSummary[]>(
            { kind: 'blocks', blocks: todo, claims, store, tables: tables!, warm, first: isFirst },
            signal,
          ),
        );
        const mine: BlockSummary[] = [];
        let warmed = !warm;
        const compute = (k: number) => {
          if (!warmed) warmUp(plan, settings.sampling);
          warmed = true;
          const n = blockLength(todo[k], total);
          mine.push(simulateBlock(plan, key, settings.sampling, todo[k], n, blockSink(store, todo[k], n)));
          markDone(claims, n);
        };
        const theirs = await shareWork(claims, tasks, todo.length, here ? compute : null, report);
        const got = [...mine, ...theirs.flat()];
        // A worker that failed while computing blocks it had claimed leaves them out: never a
        // result without them.
        if (got.length !== todo.length)
          throw new Error(
            `A worker thread failed: ${todo.length - got.length} of ${todo.length} blocks missing.`,
          );
        blocks.push(...got);
        onProgress?.({ done: total, total });
      }
      rounds.push(store);
      done = total;
      round = nextRound(settings, plan, done, rounds, warnings);
    }
    throwIfAborted();
    let second: BlockSecondPass[];
    let totals: RankedTotals;
    let early: TotalsRollUp | undefined;
    if (!pool) {
      totals = rankRun(run, rounds);
      second = secondPassInThread(run, rounds, totals, blocks);
    } else {
      const p = pool;
      totals = await guard(rankPooled(run, rounds, p));
      const input = secondPassInput(run, totals);
      const { costRanks, durationRanks, window } = input;
      const bands = bandsOf(blocks);
      second = [];
      for (const [r, store] of rounds.entries()) {
        const all = blocksBetween(store.start, store.total);
        const recompute = all.map((b) => recomputes(bands, input, b));
        const claims = createClaims();
        const passes: BlockSecondPass[] = new Array(all.length);
        const tasks = Array.from({ length: workers }, () =>
          p.run<ClaimedSecondPass[]>(
            {
              kind: 'second',
              blocks: all,
              claims,
              store,
              input: { costRanks, durationRanks, window },
              recompute,
            },
            signal,
          ),
        );
        // While the workers start on the second pass, the parts of the result that do not need
        // it; then this thread takes its share of what is left (with computeHere).
        if (r === 0) early = rollUpTotals(plan, inBlockOrder(blocks), totals);
        const compute = (k: number) => {
          const b = all[k];
          passes[k] = blockSecondPass(plan, store, b, blockLength(b, store.total), input, recompute[k]);
        };
        for (const list of await shareWork(claims, tasks, all.length, here ? compute : null))
          for (const [k, s] of list) passes[k] = s;
        // (Array.prototype.some would skip the holes a missing block leaves.)
        for (let k = 0; k < all.length; k++)
          if (!passes[k])
            throw new Error(`A worker thread failed: the second pass over block ${all[k]} is missing.`);
        second.push(...passes);
      }
      second = allocationFromBands(run, rounds, second, bands, input);
      // The workers are done: they stop while this thread rolls the result up.
      closing = p.close();
    }
    return resultOf(run, blocks, totals, second, { elapsedMs: performance.now() - started, warnings }, early);
  } finally {
    if (pool) await (closing ?? pool.close());
  }

  async function guard<T>(work: Promise<T>): Promise<T> {
    try {
      return await work;
    } catch (e) {
      if (signal?.aborted) throw new SimulationCancelledError();
      throw e;
    }
  }

  /**
   * The workers' tasks, claiming items of `count` through `claims`, and this thread beside them
   * when `compute` is given (yielding between items, so that the pool's messages, progress and
   * a cancel get through); else progress is read now and then while the workers compute.
   */
  async function shareWork<T>(
    claims: Claims,
    tasks: Promise<T>[],
    count: number,
    compute: ((k: number) => void) | null,
    report?: () => void,
  ): Promise<T[]> {
    const all = guard(Promise.all(tasks));
    // A failed or cancelled worker stops the others' claims, and this thread's.
    all.catch(() => stopClaims(claims));
    let timer: NodeJS.Timeout | undefined;
    try {
      if (compute) {
        for (let k = claimNext(claims, count); k >= 0; k = claimNext(claims, count)) {
          compute(k);
          report?.();
          await yieldToEventLoop();
          throwIfAborted();
        }
      } else if (report) {
        timer = setInterval(report, PROGRESS_EVERY_MS);
      }
      return await all;
    } catch (e) {
      stopClaims(claims);
      throw e;
    } finally {
      if (timer) clearInterval(timer);
    }
  }
}

/**
 * The run's totals ranked: the cost's order here while a worker finds the duration's, and the
 * other scenario's sorted totals likewise, one here and one there.
 */
async function rankPooled(run: PreparedRun, rounds: RoundStore[], pool: TaskPool): Promise<RankedTotals> {
  const { plan } = run;
  const cost = concatRounds(rounds, (r) => r.cost);
  const duration = plan.network ? concatRounds(rounds, (r) => r.duration) : null;
  const altCost = plan.hasPost ? concatRounds(rounds, (r) => r.altCost) : null;
  const altDuration = plan.hasPost && plan.network ? concatRounds(rounds, (r) => r.altDuration) : null;
  const durationOrder = duration ? pool.run<SortOrder>({ kind: 'order', values: duration }) : null;
  const altDurationSorted = altDuration
    ? pool.run<Float64Array>({ kind: 'sort', values: altDuration })
    : null;
  // Both promises are awaited below; a rejection must not go unhandled meanwhile.
  durationOrder?.catch(() => {});
  altDurationSorted?.catch(() => {});
  const costOrder = sortOrder(cost);
  const altCostSorted = altCost ? altCost.slice().sort() : null;
  const totals = rankedTotalsOf(cost, duration, costOrder, await durationOrder, true);
  if (plan.hasPost) {
    totals.altCost = altCost;
    totals.altDuration = altDuration;
    totals.altSorted = { cost: altCostSorted!, duration: await altDurationSorted };
  }
  return totals;
}
