// The base (deterministic) value of a distribution, as the engine's compiler uses it for the
// base estimate: the mode of a triangular or PERT (also when it is given as a P10–P90 range),
// the midpoint of a uniform, the mean of a normal, the median of a lognormal, the value of a
// fixed amount. Each factory computes it once (Distribution.base); this is the one way to read it.

import type { DistSpec } from '../formats';
import type { DistLocation } from './checks';
import { createDistribution } from './index';
import type { Distribution } from './types';

const isDistribution = (d: DistSpec | Distribution): d is Distribution => 'quantile' in d;

/**
 * The base of a distribution, from its spec or from a distribution already built. A bad spec
 * throws the factory's InputError, located at `at`.
 */
export function baseOf(
  dist: DistSpec | Distribution,
  at: DistLocation = { where: 'dist', field: '' },
): number {
  return isDistribution(dist) ? dist.base : createDistribution(dist, at).base;
}

/** The base of a duration or delay: a value below zero counts as 0 days, as in the simulation. */
export function baseDurationOf(dist: DistSpec | Distribution, at?: DistLocation): number {
  return Math.max(0, baseOf(dist, at));
}
