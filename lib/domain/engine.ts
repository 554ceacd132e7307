/**
 * The engine's pure names that lib/domain builds on, in one place: the base of a distribution,
 * the base of a duration (floored at 0 days as in the simulation), the project's base duration
 * (the network's finish at base durations), the percentiles a result
 * reports, and contingency over the base. They come through the engine's core door, which is
 * safe for the browser (grids and charts run there); the engine owns each rule.
 */
export {
  createDistribution,
  PERCENTILES,
  PERCENTILE_KEYS,
  baseOf,
  baseDurationOf,
  baseFinishOf,
  contingencyOf,
  type DistLocation,
} from '@/lib/sim';
