/**
 * Euler allocation of contingency to line items and risks (Tasche 1999, "Risk contributions and
 * performance measurement", TU München; for a quantile risk measure the contribution of input i
 * at level q is E[X_i | S = s_q], S = Σ X_i the total). Estimated, as is common practice, by the
 * mean of each input's cost over the iterations whose total lies nearest the level's P-value:
 *
 *   window   = the iterations whose headline total lies in [x₍r−h₎, x₍r+h₎], r the rank of the
 *              P-value (./order-statistics), h = ⌈n/200⌉ (about 1% of the iterations);
 *   share_i  = mean over the window of input i's cost − its base (a risk's base is 0);
 *   Σ share_i = mean total over the window − base ≈ P-value − base = contingency.
 *
 * A risk that names line items (`items` in the model) is allocated to them, in equal parts.
 *
 * Memory stays bounded: nothing per input and iteration of the whole run is kept. Each block keeps
 * its inputs' costs for the iterations near its own P-value (./allocation-band); once the totals
 * are ranked and the window is known, the second pass sums each input's cost over the window's
 * iterations from the bands, and recomputes from the run key, for the window's iterations only
 * (../block, AllocationTap), any block whose band does not cover the window (or every block, for
 * runs too large to keep bands). Which way a block goes depends on the block and the window only,
 * and the sums are added in block order, so the allocation is the same to the bit for any thread
 * count.
 */

import { type AllocationTap, BLOCK_SIZE, simulateBlock } from '../block';
import type { Plan } from '../compile';
import type { AllocationResult, ContingencyLevel, Sampling } from '../formats';
import { bandRoom, type RoundStore } from '../run-data';
import type { AllocationBand } from './allocation-band';
import { percentileRank } from './order-statistics';

const LEVELS: Record<ContingencyLevel, number> = { P50: 0.5, P70: 0.7, P80: 0.8, P90: 0.9 };

/** The P-level of the allocation, in (0, 1). */
export const allocationLevel = (plan: Plan) => LEVELS[plan.settings.contingencyLevel];

/** Number of allocation slots (cost items, rate items, risks). */
export const allocationSlots = (plan: Plan) =>
  plan.costItems.length + plan.rateItems.length + plan.risks.length;

/** The totals [lo, hi] of the allocation window (headline cost). */
export interface AllocationWindow {
  lo: number;
  hi: number;
}

export function allocationWindow(plan: Plan, costSorted: Float64Array): AllocationWindow {
  const n = costSorted.length;
  const r = percentileRank(n, LEVELS[plan.settings.contingencyLevel]) - 1;
  const h = Math.ceil(n / 200);
  return { lo: costSorted[Math.max(0, r - h)], hi: costSorted[Math.min(n - 1, r + h)] };
}

/** Slots of the sums: cost items, rate items, risks, then the count of window iterations. */
function slotsOf(plan: Plan) {
  const items = plan.costItems.length;
  const rates = plan.rateItems.length;
  const risks = plan.risks.length;
  const range = (from: number, count: number) => Int32Array.from({ length: count }, (_, k) => from + k);
  return {
    itemSlot: range(0, items),
    rateSlot: range(items, rates),
    riskSlot: range(items + rates, risks),
    count: items + rates + risks,
  };
}

/**
 * One block's allocation sums: per slot Σ cost over the block's iterations in the window, and
 * their number last. Recomputes the block (same key, same streams) for those iterations only.
 */
export function blockAllocationSums(
  plan: Plan,
  key: Uint32Array,
  sampling: Sampling,
  store: RoundStore,
  block: number,
  n: number,
  window: AllocationWindow,
): Float64Array {
  const local = block * BLOCK_SIZE - store.start;
  const index: number[] = [];
  for (let i = 0; i < n; i++) {
    const c = store.cost[local + i];
    if (c >= window.lo && c <= window.hi) index.push(i);
  }
  return tappedAllocationSums(plan, key, sampling, block, n, index);
}

/**
 * Allocation sums (as blockAllocationSums) over the given iterations of a block (0-based,
 * ascending), recomputed from the run key for those iterations only.
 */
export function tappedAllocationSums(
  plan: Plan,
  key: Uint32Array,
  sampling: Sampling,
  block: number,
  n: number,
  index: number[],
): Float64Array {
  const slots = slotsOf(plan);
  const sums = new Float64Array(slots.count + 1);
  sums[slots.count] = index.length;
  if (index.length === 0) return sums;
  const tap: AllocationTap = { index: Int32Array.from(index), sums, ...slots };
  simulateBlock(plan, key, sampling, block, n, emptySink, tap);
  return sums;
}

/** Whether a block's band holds every iteration of the block whose total is in the window. */
export function bandCovers(band: AllocationBand | undefined, window: AllocationWindow): boolean {
  return band !== undefined && band.lo <= window.lo && window.hi <= band.hi;
}

/** A block's allocation sums (as blockAllocationSums) from its band, which covers the window. */
export function allocationFromBand(
  plan: Plan,
  store: RoundStore,
  block: number,
  band: AllocationBand,
  window: AllocationWindow,
): Float64Array {
  const slots = allocationSlots(plan);
  const sums = new Float64Array(slots + 1);
  const local = block * BLOCK_SIZE - store.start;
  const { m } = band;
  const { index, costs } = bandRoom(store, block);
  // Plain loops over typed arrays: most blocks have no iteration in the window, and code
  // compiled while the inner loop never ran would be thrown away at the first block that has.
  const inWindow = new Int32Array(m);
  const { cost } = store;
  const { lo, hi } = window;
  let w = 0;
  for (let j = 0; j < m; j++) {
    const c = cost[local + index[j]];
    if (c >= lo && c <= hi) inWindow[w++] = j;
  }
  sums[slots] = w;
  if (w === 0) return sums;
  for (let s = 0; s < slots; s++) {
    const at = s * m;
    let acc = 0;
    for (let k = 0; k < w; k++) acc += costs[at + inWindow[k]];
    sums[s] = acc;
  }
  return sums;
}

const emptySink = {
  cost: new Float64Array(0),
  duration: new Float64Array(0),
  grades: new Uint16Array(0),
};

/** The allocation from the blocks' sums (in block order) and the cost's base and P-values. */
export function allocationOf(
  plan: Plan,
  blockSums: Float64Array[],
  cost: { base: number; percentiles: Record<string, number> },
): AllocationResult {
  const slots = slotsOf(plan);
  const total = new Float64Array(slots.count + 1);
  for (const s of blockSums) for (let k = 0; k < total.length; k++) total[k] += s[k];
  const count = total[slots.count];
  const mean = (slot: number) => (count > 0 ? total[slot] / count : 0);
  const items: Record<string, number> = {};
  const risks: Record<string, number> = {};
  plan.costItems.forEach((c, k) => (items[c.id] = mean(slots.itemSlot[k]) - c.base));
  plan.rateItems.forEach((r, k) => (items[r.id] = mean(slots.rateSlot[k]) - r.base));
  plan.risks.forEach((r, k) => {
    const share = mean(slots.riskSlot[k]);
    if (r.allocateTo.length === 0) risks[r.id] = share;
    else for (const id of r.allocateTo) items[id] += share / r.allocateTo.length;
  });
  const level = plan.settings.contingencyLevel;
  return { level, contingency: cost.percentiles[level] - cost.base, iterations: count, items, risks };
}
