import 'server-only';
/**
 * A capped sample of a finished run's iterations as (cost, duration) pairs, for the histogram
 * and the cost-vs-finish scatter. The result file holds summaries only, so the first blocks of
 * the run are computed again (firstIterationBlocks): these are the run's own first iterations, to
 * the bit, not a new draw, when the engine version and block size are those the run had; any
 * other engine is refused with a message rather than giving other numbers. Each block is a
 * stratified sample of its own, so the first blocks are a fair sample of all.
 */

import { firstIterationBlocks, type Sampling } from '@/lib/sim';
import { conflict } from '@/lib/errors';
import { engineDifference, type RecordedEngine } from './engine-match';

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
  run: { iterations: number; seed: number | string; sampling: Sampling } & RecordedEngine,
  cap = SAMPLE_CAP,
): Promise<RunSample> {
  const differs = engineDifference(run);
  if (differs) throw conflict(`The run's sample cannot be computed again. ${differs}`);
  const cost: number[] = [];
  let duration: number[] | null = null;
  for (const block of firstIterationBlocks(snapshot, run, cap)) {
    if (block.duration) duration ??= [];
    for (let i = 0; i < block.cost.length && cost.length < cap; i++) {
      cost.push(block.cost[i]);
      duration?.push(block.duration![i]);
    }
    // One block at a time, so requests keep being served while this runs in the server.
    await yieldToEventLoop();
  }
  return { n: cost.length, of: run.iterations, cost, duration };
}
