/**
 * A run in bounded memory, split into parts that merge to the bit. Two passes over the same
 * blocks; memory holds one block's buffers, histograms and a few kept values, independent of
 * the number of iterations (apart from small sums per chunk). The parts are plain JSON:
 *
 *   boundedChunks(iterations)                                 → number of chunks
 *   firstPassPart(run, fromChunk, toChunk)                    → FirstPassPart
 *   secondPassRequest(run, firstParts)                        → SecondPassRequest
 *   secondPassPart(run, request, fromChunk, toChunk)          → SecondPassPart
 *   finishBounded(run, firstParts, request, secondParts, info) → SimulationResult
 *   combineFirstParts(a, b)                                   → FirstPassPart over both (adjacent)
 *   simulateBounded(model, options)                           → SimulationResult (all in this thread)
 *
 * `run` is prepareRun(model, { iterations, seed, sampling }) (../engine).
 */

import { prepareRun } from '../engine';
import type { SimulationResult } from '../formats';
import type { SimulationOptions } from '../options';
import { boundedChunks, CHUNK_BLOCKS } from './chunks';
import { firstPassPart } from './first-pass';
import { finishBounded } from './finish';
import { secondPassRequest } from './request';
import { secondPassPart } from './second-pass';

export { boundedChunks, chunkIterations, CHUNK_BLOCKS } from './chunks';
export { firstPassPart, FirstPassFold } from './first-pass';
export { secondPassRequest } from './request';
export { secondPassPart, SecondPassFold } from './second-pass';
export { finishBounded } from './finish';
export { combineFirstParts, FirstPartsGathering } from './merge';
export type * from './parts';
export type { HistogramJson } from './histogram';

/** Runs above this many iterations are bounded by default. */
export const BOUNDED_FROM = 1_000_000;

/** A bounded run in this thread, in one part per pass. */
export function simulateBounded(
  modelJson: unknown,
  options: SimulationOptions = {},
  chunkBlocks = CHUNK_BLOCKS,
): SimulationResult {
  const started = performance.now();
  const run = prepareRun(modelJson, options);
  if (run.settings.precision) throw new RangeError('a run to a precision goal is not run bounded');
  const chunks = boundedChunks(run.settings.iterations, chunkBlocks);
  const first = [firstPassPart(run, 0, chunks, chunkBlocks)];
  const request = secondPassRequest(run, first);
  const second = [secondPassPart(run, request, 0, chunks)];
  return finishBounded(run, first, request, second, { elapsedMs: performance.now() - started, warnings: [] });
}
