// Options of the threaded runner: the core's SimulationOptions plus threads, progress, cancel
// and where the worker file lives.

import type { SimulationOptions } from '../core/options';

export interface RunOptions extends SimulationOptions {
  /** Threads computing; 1 runs in this thread without workers. Default: os.availableParallelism(). */
  threads?: number;
  /**
   * This thread computes blocks too, beside threads − 1 workers: for a process with nothing else
   * to do meanwhile, such as the command line. Default false: a server's thread stays free to
   * answer while `threads` workers compute. A bounded run's chunks are all worker tasks: there
   * it changes nothing.
   */
  computeHere?: boolean;
  /**
   * Work done of total. A bounded run goes over its iterations twice, so its total is twice
   * the iterations; `iterations` then says how many distinct iterations have been drawn.
   */
  onProgress?: (progress: { done: number; total: number; iterations?: number }) => void;
  signal?: AbortSignal;
  /**
   * Run in bounded memory (../core/bounded): two passes over the blocks, memory independent of
   * the iterations. Default: for runs of more than BOUNDED_FROM iterations without a precision
   * goal (a precision goal's rounds need every iteration's totals, and its cap keeps them small).
   */
  bounded?: boolean;
  /** Blocks per chunk of a bounded run; the default (CHUNK_BLOCKS) but in tests. */
  chunkBlocks?: number;
  /** Path of the bundled worker; default `.build/sim-worker.mjs` under the working directory. */
  workerFile?: string;
}
