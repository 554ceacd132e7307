// A pool of worker threads for one run (piscina). Blocks are handed out one per task, so the
// threads share the work evenly and progress arrives block by block; which thread computes a
// block does not change its content.

import { setMaxListeners } from 'node:events';
import Piscina from 'piscina';
import type { BlockOutput } from '../block';
import type { BlockTask, WorkerData } from '../worker';

export interface BlockPool {
  run(
    blocks: number[],
    total: number,
    onBlock: (b: BlockOutput) => void,
    signal?: AbortSignal,
  ): Promise<void>;
  close(): Promise<void>;
}

/**
 * The parent's Node flags minus module loaders and preloads: the worker file is plain
 * JavaScript, and a TypeScript loader inherited from tsx or Vitest would slow each worker's
 * start several-fold.
 */
export function workerExecArgv(parent: string[] = process.execArgv): string[] {
  const withValue = new Set([
    '--import',
    '--require',
    '-r',
    '--loader',
    '--experimental-loader',
    '--eval',
    '-e',
    '--print',
    '-p',
  ]);
  const out: string[] = [];
  for (let i = 0; i < parent.length; i++) {
    const arg = parent[i];
    const name = arg.split('=')[0];
    if (withValue.has(name)) {
      if (!arg.includes('=')) i++;
      continue;
    }
    out.push(arg);
  }
  return out;
}

export function createBlockPool(file: string, threads: number, data: WorkerData): BlockPool {
  const pool = new Piscina<BlockTask, BlockOutput[]>({
    filename: file,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 1000,
    workerData: data,
    execArgv: workerExecArgv(),
  });
  // After a cancel, a worker may still answer for an aborted task; piscina reports that as a
  // pool error, which is expected then and must not crash the process.
  let failure: unknown = null;
  pool.on('error', (e) => (failure ??= e));
  return {
    async run(blocks, total, onBlock, signal) {
      // One internal signal for all the tasks (each task listens to it), fed by the caller's.
      const tasks = new AbortController();
      setMaxListeners(0, tasks.signal);
      const forward = () => tasks.abort();
      signal?.addEventListener('abort', forward, { once: true });
      if (signal?.aborted) tasks.abort();
      try {
        await Promise.all(
          blocks.map((b) =>
            pool.run({ blocks: [b], total }, { signal: tasks.signal }).then((outs) => outs.forEach(onBlock)),
          ),
        );
      } finally {
        signal?.removeEventListener('abort', forward);
      }
      if (failure && !tasks.signal.aborted) throw failure;
    },
    close: () => pool.destroy(),
  };
}
