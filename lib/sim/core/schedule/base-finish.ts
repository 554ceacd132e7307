/**
 * The project's base duration: the latest finish of the network with every activity at its base
 * duration (floored at 0 days), by the same forward pass the simulation runs. A probabilistic
 * branch (existence below 1) is left out of the base, as risk events are. A line paid per
 * project day has this many days in the base estimate. Null for a model without activities, or
 * a network the checks refuse (unknown predecessor, cycle).
 */

import { baseDurationOf } from '../distributions/base';
import type { ModelActivity } from '../formats';
import { allocateForwardPass, forwardPass } from './forward-pass';
import { buildNetwork, checkNetwork, type Network } from './network';

export function baseFinishOf(activities: readonly ModelActivity[]): number | null {
  if (activities.length === 0 || checkNetwork([...activities]).length > 0) return null;
  return finishOf(
    buildNetwork([...activities]),
    new Float64Array(activities.map((a) => ((a.existence ?? 1) < 1 ? 0 : baseDurationOf(a.duration)))),
  );
}

/** The latest finish of the network for one set of durations (one forward pass). */
export function finishOf(network: Network, durations: Float64Array): number {
  const total = new Float64Array(1);
  forwardPass(
    network,
    durations,
    1,
    allocateForwardPass(network.size, 1),
    total,
    new Int32Array(network.size),
  );
  return total[0];
}
