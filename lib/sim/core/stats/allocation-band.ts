/**
 * The allocation band of a block: while a block is computed its inputs' costs per iteration are at
 * hand, so it keeps them for the iterations whose total lies near the block's own P-value
 * (BAND_HALF_WIDTH of the block's iterations on either side). The run's window (./allocation) is
 * about 1% of the iterations around the run's P-value; a block's own P-value is within about
 * 1 percentage point of the run's (binomial: √(0.8·0.2/2000) ≈ 0.9%), so its band nearly always
 * holds every iteration of the block that falls in the window, and the second pass reads them here
 * instead of recomputing the block. When a band does not cover the window, that block is
 * recomputed; either way what is summed depends only on the block and the window.
 *
 * The bands live in the round's store (../run-data), each block's in its own slice of room for
 * bandCapacity iterations, on shared memory when threads fill it: nothing large is allocated per
 * block or sent between threads. A band that would need more room (ties at its ends) is not kept,
 * and its block is recomputed.
 */

import { percentileRank } from './order-statistics';

export const BAND_HALF_WIDTH = 0.04;

/** Above this many bytes of bands over a run, no band is kept (every block is recomputed). */
export const MAX_BAND_BYTES = 64 * 2 ** 20;

export interface AllocationBand {
  /** Totals [lo, hi] of the band: every iteration of the block with its total in it is kept. */
  lo: number;
  hi: number;
  /** Kept iterations: the first m of the block's BandRoom. */
  m: number;
}

/** A block's room for its band (views into the round's store). */
export interface BandRoom {
  /** Kept iterations of the block (0-based, ascending), the first m used. */
  index: Int32Array;
  /** Slot-major: costs[s·m + j], slot s, kept iteration j. */
  costs: Float64Array;
}

/** Iterations a band of a block of n can hold: the 2⌈h·n⌉ + 1 nearest the P-value, and ties. */
export function bandCapacity(n: number): number {
  return 2 * Math.ceil(BAND_HALF_WIDTH * n) + 1 + Math.ceil(n / 64);
}

/** Whether bands are kept for `blocks` blocks of up to `blockSize` iterations and `slots` inputs. */
export function keepsBands(blocks: number, blockSize: number, slots: number): boolean {
  return blocks * bandCapacity(blockSize) * slots * 8 <= MAX_BAND_BYTES;
}

/**
 * The band of a block from its totals and its inputs' costs (slot s at inputCost[s·stride + i]),
 * written into `room`; undefined when it does not fit there.
 */
export function bandOf(
  cost: Float64Array,
  n: number,
  level: number,
  inputCost: Float64Array,
  stride: number,
  slots: number,
  room: BandRoom,
): AllocationBand | undefined {
  const sorted = cost.slice(0, n).sort();
  const r = percentileRank(n, level) - 1;
  const d = Math.ceil(BAND_HALF_WIDTH * n);
  const lo = sorted[Math.max(0, r - d)];
  const hi = sorted[Math.min(n - 1, r + d)];
  // The loops in functions of their own: this one is called once per block and would otherwise
  // be compiled mid-loop, before it ever returned, and thrown away at its return.
  const m = bandIndex(cost, n, lo, hi, room.index);
  if (m < 0) return undefined;
  gatherBand(inputCost, stride, slots, room.index, m, room.costs);
  return { lo, hi, m };
}

/** The iterations with their total in [lo, hi] into index; −1 when they do not fit. */
function bandIndex(cost: Float64Array, n: number, lo: number, hi: number, index: Int32Array): number {
  const capacity = index.length;
  let m = 0;
  for (let i = 0; i < n; i++) {
    if (cost[i] >= lo && cost[i] <= hi) {
      if (m === capacity) return -1;
      index[m++] = i;
    }
  }
  return m;
}

/** costs[s·m + j] = inputCost[s·stride + index[j]]. */
function gatherBand(
  inputCost: Float64Array,
  stride: number,
  slots: number,
  index: Int32Array,
  m: number,
  costs: Float64Array,
): void {
  for (let s = 0; s < slots; s++) {
    const off = s * stride;
    const at = s * m;
    for (let j = 0; j < m; j++) costs[at + j] = inputCost[off + index[j]];
  }
}
