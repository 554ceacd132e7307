// Options of the threaded runner: the core's SimulationOptions plus threads, progress, cancel
// and where the worker file lives.

import type { SimulationOptions } from '../core/options';

export interface RunOptions extends SimulationOptions {
  /** Worker threads; 1 runs in this thread without workers. Default: os.availableParallelism(). */
  threads?: number;
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
