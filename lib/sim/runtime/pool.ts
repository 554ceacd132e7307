// A pool of worker threads for one run (piscina). Tasks carry typed arrays on
// SharedArrayBuffers, so a task's data is shared rather than copied; which thread runs a task
// does not change what it computes.

import { setMaxListeners } from 'node:events';
import Piscina from 'piscina';
import type { WorkerData, WorkerReply, WorkerTask } from './worker';

export interface TaskPool {
  run<R extends WorkerReply>(task: WorkerTask, signal?: AbortSignal): Promise<R>;
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

export function createTaskPool(file: string, threads: number, data: WorkerData): TaskPool {
  const pool = new Piscina<WorkerTask, WorkerReply>({
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
  // One internal signal for all tasks (each task listens to it), fed by the callers' signals.
  const tasks = new AbortController();
  setMaxListeners(0, tasks.signal);
  const followed = new WeakSet<AbortSignal>();
  return {
    async run<R extends WorkerReply>(task: WorkerTask, signal?: AbortSignal) {
      if (signal && !followed.has(signal)) {
        followed.add(signal);
        if (signal.aborted) tasks.abort();
        else signal.addEventListener('abort', () => tasks.abort(), { once: true });
      }
      const reply = await pool.run(task, { signal: tasks.signal });
      if (failure && !tasks.signal.aborted) throw failure;
      return reply as R;
    },
    close: () => pool.destroy(),
  };
}
