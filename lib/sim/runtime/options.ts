// Options of the threaded runner: the core's SimulationOptions plus threads, progress, cancel
// and where the worker file lives.

import type { SimulationOptions } from '../core/options';

export interface RunOptions extends SimulationOptions {
  /** Threads computing; 1 runs in this thread without workers. Default: os.availableParallelism(). */
  threads?: number;
  /**
   * This thread computes blocks too, beside threads − 1 workers: for a process with nothing else
   * to do meanwhile, such as the command line. Default false: a server's thread stays free to
   * answer while `threads` workers compute.
   */
  computeHere?: boolean;
  onProgress?: (progress: { done: number; total: number }) => void;
  signal?: AbortSignal;
  /** Path of the bundled worker; default `.build/sim-worker.mjs` under the working directory. */
  workerFile?: string;
}
