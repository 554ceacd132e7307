// A few throw-away mini blocks before the real work. A fresh thread first runs the engine's
// loops in V8's interpreter and builds each beta-PERT table on first use; on a model of a few
// hundred inputs the first full block then costs many steady ones. Three blocks of 100
// iterations get the tables built and the hot functions optimised at a fraction of that cost.
// They write to their own buffers and leave nothing behind that a real block reads, so results
// do not change. A few sorts of a block's length likewise: the run sorts each total once, and
// its first sort would otherwise run mostly unoptimised, several times slower.

import { BLOCK_SIZE, simulateBlock } from '../core/block';
import { midRanksOf, sortOrder } from '../core/math/ranks';
import type { Plan } from '../core/compile';
import type { Sampling } from '../core/formats';

const ROUNDS = 3;
const SIZE = 100;
/** Sorts of a block's length: the run's one sort of each total then starts from optimised code. */
const SORTS = 5;

export function warmUp(plan: Plan, sampling: Sampling): void {
  const key = Uint32Array.of(0x9e3779b9, 0x7f4a7c15, 0x85ebca6b, 0xc2b2ae35);
  const sink = {
    cost: new Float64Array(SIZE),
    duration: new Float64Array(plan.network ? SIZE : 0),
    grades: new Uint16Array(plan.sensitivity.length * SIZE),
    altCost: new Float64Array(plan.hasPost ? SIZE : 0),
    altDuration: new Float64Array(plan.hasPost && plan.network ? SIZE : 0),
  };
  for (let k = 0; k < ROUNDS; k++) simulateBlock(plan, key, sampling, k, SIZE, sink);
  const values = Float64Array.from({ length: BLOCK_SIZE }, (_, i) => Math.sin(i) * 1e6);
  for (let k = 0; k < SORTS; k++) midRanksOf(sortOrder(values));
}
