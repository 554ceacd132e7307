/**
 * The engine's pure names that lib/domain builds on, in one place: the base of a distribution
 * (Distribution.base, computed by each factory), the base of a duration (floored at 0 days as in
 * the simulation), the percentiles a result reports, and contingency over the base.
 *
 * Grids and charts run in the browser, so only the engine's pure modules may be reached from
 * here (never its threaded runner). The other modules of lib/domain take the engine's values
 * from this file, and only its types from the door, lib/sim.
 */
import { createDistribution, type DistLocation } from '@/lib/sim/distributions';
import { PERCENTILES } from '@/lib/sim/stats/summary';
import type { DistSpec, PercentileKey, TotalSummary } from '@/lib/sim/types';

export { createDistribution, PERCENTILES };

export const PERCENTILE_KEYS: PercentileKey[] = PERCENTILES.map(([key]) => key);

/** The base of a distribution; a bad spec throws the factory's InputError, located at `at`. */
export function baseOf(dist: DistSpec, at: DistLocation = { where: 'dist', field: '' }): number {
  return createDistribution(dist, at).base;
}

/** The base of a duration or delay: a value below zero counts as 0 days, as in the simulation. */
export function baseDurationOf(dist: DistSpec, at?: DistLocation): number {
  return Math.max(0, baseOf(dist, at));
}

/** The contingency of a total at a percentile: its P-value minus its base (may be negative). */
export function contingencyOf(
  summary: Pick<TotalSummary, 'base' | 'percentiles'>,
  level: PercentileKey,
): number {
  return summary.percentiles[level] - summary.base;
}
