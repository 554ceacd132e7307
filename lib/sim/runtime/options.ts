// Options of the threaded runner: the core's SimulationOptions plus threads, progress, cancel
// and where the worker file lives.

import type { SimulationOptions } from '../core/options';

export interface RunOptions extends SimulationOptions {
  /** Worker threads; 1 runs in this thread without workers. Default: os.availableParallelism(). */
  threads?: number;
  onProgress?: (progress: { done: number; total: number }) => void;
  signal?: AbortSignal;
  /** Path of the bundled worker; default `.build/sim-worker.mjs` under the working directory. */
  workerFile?: string;
}
