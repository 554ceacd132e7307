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
 *
 * Every term is a whole grade (< 2¹⁶) times a mid-rank (a multiple of ½ up to the run's
 * iterations), so a block's sum counts fewer than 2⁵³ halves in runs of up to 3·10⁷ iterations:
 * exact, whatever the order of its terms. The loops therefore read two grades per 32-bit word
 * with one sum per half (fewer loads and bounds checks per term: about a third faster), and a
 * row feeding both tornadoes once for both.
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
  const cost = costRanks.subarray(off, off + n);
  const duration = durationRanks ? durationRanks.subarray(off, off + n) : null;
  // Whole words per row: an even block length (every block but maybe a run's last) on a
  // little-endian machine, where a word's low half is the grade stored first.
  const words =
    LITTLE_ENDIAN && n % 2 === 0 && grades.byteOffset % 4 === 0
      ? new Uint32Array(grades.buffer, grades.byteOffset, grades.length / 2)
      : null;
  for (let r = 0; r < rows; r++) {
    const input = plan.sensitivity[r];
    const both = input.cost && duration && input.duration;
    if (words && both) pairedSumsBoth(words, (r * n) / 2, n / 2, cost, duration, out, 2 * r);
    else if (words) {
      if (input.cost) out[2 * r] = pairedSum(words, (r * n) / 2, n / 2, cost);
      if (duration && input.duration) out[2 * r + 1] = pairedSum(words, (r * n) / 2, n / 2, duration);
    } else {
      if (input.cost) out[2 * r] = plainSum(grades, r * n, n, cost);
      if (duration && input.duration) out[2 * r + 1] = plainSum(grades, r * n, n, duration);
    }
  }
  return out;
}

const LITTLE_ENDIAN = new Uint8Array(Uint16Array.of(1).buffer)[0] === 1;

/** Σ grades[from + i]·ranks[i] for i < n. */
function plainSum(grades: Uint16Array, from: number, n: number, ranks: Float64Array): number {
  let acc = 0;
  for (let i = 0; i < n; i++) acc += grades[from + i] * ranks[i];
  return acc;
}

/** plainSum of 2·half grades read as `half` words from words[from]. */
function pairedSum(words: Uint32Array, from: number, half: number, ranks: Float64Array): number {
  let lo = 0;
  let hi = 0;
  for (let j = 0; j < half; j++) {
    const w = words[from + j];
    lo += (w & 0xffff) * ranks[2 * j];
    hi += (w >>> 16) * ranks[2 * j + 1];
  }
  return lo + hi;
}

/** pairedSum against both rankings in one pass: out[at] with `cost`, out[at + 1] with `duration`. */
function pairedSumsBoth(
  words: Uint32Array,
  from: number,
  half: number,
  cost: Float64Array,
  duration: Float64Array,
  out: Float64Array,
  at: number,
): void {
  let cLo = 0;
  let cHi = 0;
  let dLo = 0;
  let dHi = 0;
  for (let j = 0; j < half; j++) {
    const w = words[from + j];
    const lo = w & 0xffff;
    const hi = w >>> 16;
    cLo += lo * cost[2 * j];
    cHi += hi * cost[2 * j + 1];
    dLo += lo * duration[2 * j];
    dHi += hi * duration[2 * j + 1];
  }
  out[at] = cLo + cHi;
  out[at + 1] = dLo + dHi;
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
