/**
 * Chunks: a fixed number of blocks, the unit a bounded run is split by. Fixed (not derived from
 * the number of threads or workers), so that the per-chunk sums, and the order they are added
 * in, are the same for any split.
 */

import { BLOCK_SIZE, blockLength, type BlockSink } from '../block';
import type { Plan } from '../compile';

/** Blocks per chunk: 64 blocks of 2,000, 128,000 iterations. */
export const CHUNK_BLOCKS = 64;

export function boundedChunks(iterations: number, chunkBlocks = CHUNK_BLOCKS): number {
  return Math.ceil(Math.ceil(iterations / BLOCK_SIZE) / chunkBlocks);
}

/** Blocks of chunk c in a run of `iterations`. */
export function chunkBlocksOf(c: number, iterations: number, chunkBlocks: number): number[] {
  const last = Math.ceil(iterations / BLOCK_SIZE);
  const out: number[] = [];
  for (let b = c * chunkBlocks; b < Math.min(last, (c + 1) * chunkBlocks); b++) out.push(b);
  return out;
}

/** Iterations in chunk c of a run of `iterations`. */
export function chunkIterations(c: number, iterations: number, chunkBlocks = CHUNK_BLOCKS): number {
  const size = chunkBlocks * BLOCK_SIZE;
  return Math.max(0, Math.min(size, iterations - c * size));
}

export function checkChunkRange(iterations: number, chunkBlocks: number, from: number, to: number): void {
  const chunks = boundedChunks(iterations, chunkBlocks);
  if (!(Number.isInteger(from) && Number.isInteger(to) && from >= 0 && from < to && to <= chunks))
    throw new RangeError(`chunks [${from}, ${to}) are not a range within the run's ${chunks} chunks`);
}

/** One block's buffers, reused block after block: the bounded run's only per-iteration memory. */
export interface BlockBuffers {
  cost: Float64Array;
  duration: Float64Array;
  altCost: Float64Array;
  altDuration: Float64Array;
  grades: Uint16Array;
}

export function allocateBlockBuffers(plan: Plan): BlockBuffers {
  const network = plan.network !== null;
  return {
    cost: new Float64Array(BLOCK_SIZE),
    duration: new Float64Array(network ? BLOCK_SIZE : 0),
    altCost: new Float64Array(plan.hasPost ? BLOCK_SIZE : 0),
    altDuration: new Float64Array(plan.hasPost && network ? BLOCK_SIZE : 0),
    grades: new Uint16Array(plan.sensitivity.length * BLOCK_SIZE),
  };
}

/** The buffers as a block's sink for a block of n iterations. */
export function sinkOf(buffers: BlockBuffers, rows: number, n: number): BlockSink {
  const view = (a: Float64Array) => (a.length ? a.subarray(0, n) : a);
  return {
    cost: view(buffers.cost),
    duration: view(buffers.duration),
    altCost: view(buffers.altCost),
    altDuration: view(buffers.altDuration),
    grades: buffers.grades.subarray(0, rows * n),
  };
}

export { blockLength };
