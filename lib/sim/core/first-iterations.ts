// A run's first iterations, computed again block by block. A block's content depends only on
// (model, seed, sampling, block index, block size), so these are the run's own iterations, to the
// bit, not a new draw, as long as the engine version and BLOCK_SIZE are those the run had.

import { BLOCK_SIZE, blockLength, simulateBlock } from './block';
import { prepareRun } from './engine';
import type { Sampling } from './formats';

export interface IterationBlock {
  /** Total cost per iteration. */
  cost: Float64Array;
  /** Project duration per iteration; null when the model has no schedule. */
  duration: Float64Array | null;
}

/**
 * The blocks of a run of `run.iterations` iterations that cover its first `upTo` iterations
 * (whole blocks, so up to BLOCK_SIZE − 1 more), one at a time, so the caller can yield between.
 */
export function* firstIterationBlocks(
  modelJson: unknown,
  run: { iterations: number; seed: number | string; sampling: Sampling },
  upTo: number,
): Generator<IterationBlock> {
  const { plan, key, settings } = prepareRun(modelJson, run);
  const hasSchedule = plan.network !== null;
  const blocks = Math.ceil(Math.min(upTo, run.iterations) / BLOCK_SIZE);
  for (let b = 0; b < blocks; b++) {
    const n = blockLength(b, run.iterations);
    // The block writes its iterations into these arrays (the tornado grades are not kept).
    const sink = {
      cost: new Float64Array(n),
      duration: new Float64Array(hasSchedule ? n : 0),
      grades: new Uint16Array(plan.sensitivity.length * n),
    };
    simulateBlock(plan, key, settings.sampling, b, n, sink);
    yield { cost: sink.cost, duration: hasSchedule ? sink.duration : null };
  }
}
