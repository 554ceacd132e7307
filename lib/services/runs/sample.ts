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
    const out = simulateBlock(plan, key, settings.sampling, b, blockLength(b, run.iterations));
    for (let i = 0; i < out.n && cost.length < cap; i++) {
      cost.push(out.cost[i]);
      duration?.push(out.duration[i]);
    }
    // One block at a time, so requests keep being served while this runs in the server.
    await yieldToEventLoop();
  }
  return { n: cost.length, of: run.iterations, cost, duration };
}
