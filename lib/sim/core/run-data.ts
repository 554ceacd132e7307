// Where a run's per-iteration outputs live. Each round of blocks gets one store of typed arrays
// (on SharedArrayBuffers when worker threads fill it): cost and duration per iteration, and the
// tornado grades, block after block. Threads write their blocks in place, so nothing large is
// copied or moved between threads, and the roll-up reads the totals in iteration order.

import { BLOCK_SIZE, type BlockSink } from './block';
import type { Plan } from './compile';
import type { Sampling } from './formats';
import {
  type AllocationWindow,
  allocationLevel,
  allocationSlots,
  blockAllocationSums,
} from './stats/allocation';
import { bandCapacity, type BandRoom, keepsBands } from './stats/allocation-band';

export interface RoundStore {
  /** First iteration of the round (a multiple of BLOCK_SIZE) and the end of the round. */
  start: number;
  total: number;
  /** Tornado inputs (rows of grades). */
  rows: number;
  cost: Float64Array;
  duration: Float64Array;
  /** The other mitigation scenario's totals (empty without a post block). */
  altCost: Float64Array;
  altDuration: Float64Array;
  /** Block b's grades start at (b − start/BLOCK_SIZE)·rows·BLOCK_SIZE, row r at r·n within. */
  grades: Uint16Array;
  /** The P-level around which blocks keep their allocation band, when the run keeps bands. */
  band?: number;
  /** Room for the bands, block after block (empty when the run keeps none): see bandRoom. */
  bandIndex: Int32Array;
  bandCosts: Float64Array;
}

export function allocateRound(plan: Plan, start: number, total: number, shared: boolean): RoundStore {
  const n = total - start;
  const rows = plan.sensitivity.length;
  const blocks = Math.ceil(n / BLOCK_SIZE);
  const buffer = (bytes: number) => (shared ? new SharedArrayBuffer(bytes) : new ArrayBuffer(bytes));
  const durationLength = plan.network ? n : 0;
  const slots = allocationSlots(plan);
  const bands = keepsBands(blocks, BLOCK_SIZE, slots);
  const capacity = bands ? bandCapacity(BLOCK_SIZE) : 0;
  return {
    start,
    total,
    rows,
    cost: new Float64Array(buffer(8 * n)),
    duration: new Float64Array(buffer(8 * durationLength)),
    altCost: new Float64Array(buffer(plan.hasPost ? 8 * n : 0)),
    altDuration: new Float64Array(buffer(plan.hasPost ? 8 * durationLength : 0)),
    grades: new Uint16Array(buffer(2 * rows * blocks * BLOCK_SIZE)),
    bandIndex: new Int32Array(buffer(4 * blocks * capacity)),
    bandCosts: new Float64Array(buffer(8 * blocks * capacity * slots)),
    ...(bands ? { band: allocationLevel(plan) } : {}),
  };
}

/** Block b's room for its band in the store (empty views when the run keeps no bands). */
export function bandRoom(store: RoundStore, block: number): BandRoom {
  const k = block - store.start / BLOCK_SIZE;
  const capacity = store.bandIndex.length / Math.ceil((store.total - store.start) / BLOCK_SIZE);
  const slots = store.bandCosts.length / (store.bandIndex.length || 1);
  return {
    index: store.bandIndex.subarray(k * capacity, (k + 1) * capacity),
    costs: store.bandCosts.subarray(k * capacity * slots, (k + 1) * capacity * slots),
  };
}

export function blockSink(store: RoundStore, block: number, n: number): BlockSink {
  const local = block * BLOCK_SIZE - store.start;
  const g = (local / BLOCK_SIZE) * store.rows * BLOCK_SIZE;
  return {
    cost: store.cost.subarray(local, local + n),
    duration: store.duration.length ? store.duration.subarray(local, local + n) : store.duration,
    altCost: store.altCost.length ? store.altCost.subarray(local, local + n) : store.altCost,
    altDuration: store.altDuration.length ? store.altDuration.subarray(local, local + n) : store.altDuration,
    grades: store.grades.subarray(g, g + store.rows * n),
    ...(store.band !== undefined ? { band: { level: store.band, room: bandRoom(store, block) } } : {}),
  };
}

/** The per-iteration totals of all rounds, in iteration order. */
export function concatRounds(stores: RoundStore[], pick: (s: RoundStore) => Float64Array): Float64Array {
  if (stores.length === 1) return pick(stores[0]);
  let n = 0;
  for (const s of stores) n += pick(s).length;
  const out = new Float64Array(n);
  let off = 0;
  for (const s of stores) {
    out.set(pick(s), off);
    off += pick(s).length;
  }
  return out;
}

/**
 * Σ k·R over the block for every tornado row, k its stored grades and R the mid-ranks of cost
 * (rows feeding the cost tornado) and of duration: [cost₀, duration₀, cost₁, …]. The part of
 * Spearman's coefficient that needs the ranks of the whole run, computed per block so threads
 * can share it and the sum over blocks keeps its order.
 */
export function blockCrossSums(
  plan: Plan,
  store: RoundStore,
  block: number,
  n: number,
  costRanks: Float64Array,
  durationRanks: Float64Array | null,
): Float64Array {
  const { grades } = blockSink(store, block, n);
  const rows = plan.sensitivity.length;
  const out = new Float64Array(2 * rows);
  const off = block * BLOCK_SIZE;
  for (let r = 0; r < rows; r++) {
    const input = plan.sensitivity[r];
    const base = r * n;
    if (input.cost) {
      let acc = 0;
      for (let i = 0; i < n; i++) acc += grades[base + i] * costRanks[off + i];
      out[2 * r] = acc;
    }
    if (durationRanks && input.duration) {
      let acc = 0;
      for (let i = 0; i < n; i++) acc += grades[base + i] * durationRanks[off + i];
      out[2 * r + 1] = acc;
    }
  }
  return out;
}

/**
 * What the second pass over a block gives: its rank cross sums and its allocation sums (empty
 * when the block's band covers the window: the caller reads them from the band).
 */
export interface BlockSecondPass {
  cross: Float64Array;
  allocation: Float64Array;
}

/** Everything the second pass needs besides the plan and the round: the run and the ranked totals. */
export interface SecondPassInput {
  key: Uint32Array;
  sampling: Sampling;
  costRanks: Float64Array;
  durationRanks: Float64Array | null;
  window: AllocationWindow;
}

/** The second pass over one block, once the run's totals are ranked; `recompute` its allocation. */
export function blockSecondPass(
  plan: Plan,
  store: RoundStore,
  block: number,
  n: number,
  input: SecondPassInput,
  recompute: boolean,
): BlockSecondPass {
  return {
    cross: blockCrossSums(plan, store, block, n, input.costRanks, input.durationRanks),
    allocation: recompute
      ? blockAllocationSums(plan, input.key, input.sampling, store, block, n, input.window)
      : new Float64Array(0),
  };
}
