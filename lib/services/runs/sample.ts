import 'server-only';
/**
 * A capped sample of a finished run's iterations as (cost, duration) pairs, for the histogram
 * and the cost-vs-finish scatter. The result file holds summaries only, so the first blocks of
 * the run are computed again: a block's content depends only on (model, seed, sampling, block
 * index, block size), so these are the run's own first iterations, to the bit, not a new draw.
 * Each block is a stratified sample of its own, so the first blocks are a fair sample of all.
 */

import { prepareRun } from '@/lib/sim';
import { blockLength, BLOCK_SIZE, simulateBlock } from '@/lib/sim/block';
import type { Sampling } from '@/lib/sim/types';

export const SAMPLE_CAP = 5_000;

export type RunSample = {
  /** How many iterations the sample holds, and of how many in the run. */
  n: number;
  of: number;
  cost: number[];
  /** Project duration in working days; null when the model has no schedule. */
  duration: number[] | null;
};

const yieldToEventLoop = () => new Promise<void>((resolve) => setImmediate(resolve));

export async function sampleOfRun(
  snapshot: unknown,
  run: { iterations: number; seed: number | string; sampling: Sampling },
  cap = SAMPLE_CAP,
): Promise<RunSample> {
  const { plan, key, settings } = prepareRun(snapshot, {
    iterations: run.iterations,
    seed: run.seed,
    sampling: run.sampling,
  });
  const hasSchedule = plan.network !== null;
  const cost: number[] = [];
  const duration: number[] | null = hasSchedule ? [] : null;
  const blocks = Math.ceil(Math.min(cap, run.iterations) / BLOCK_SIZE);
  for (let b = 0; b < blocks; b++) {
    const n = blockLength(b, run.iterations);
    // The block writes its iterations into these arrays (the tornado grades are not kept).
    const sink = {
      cost: new Float64Array(n),
      duration: new Float64Array(hasSchedule ? n : 0),
      grades: new Uint16Array(plan.sensitivity.length * n),
    };
    simulateBlock(plan, key, settings.sampling, b, n, sink);
    for (let i = 0; i < n && cost.length < cap; i++) {
      cost.push(sink.cost[i]);
      duration?.push(sink.duration[i]);
    }
    // One block at a time, so requests keep being served while this runs in the server.
    await yieldToEventLoop();
  }
  return { n: cost.length, of: run.iterations, cost, duration };
}
