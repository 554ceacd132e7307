/**
 * How many iterations a wanted precision needs. A probability p estimated from n independent
 * iterations has standard error √(p(1 − p)/n), so a ±ε interval at the given confidence needs
 *
 *   n = ⌈ z² · p(1 − p) / ε² ⌉,   z = Φ⁻¹(1 − (1 − confidence)/2)
 *
 * (Cochran 1977, "Sampling Techniques", 3rd ed., §4.4). For a percentile P_p the same n makes
 * the empirical share of outcomes below the estimate known to ±ε.
 */

import { zForConfidence } from '../math/normal';

export function iterationsForPrecision(p: number, eps: number, confidence = 0.95): number {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`p must lie in [0, 1] (got ${p})`);
  if (!(eps > 0)) throw new RangeError(`eps must be greater than 0 (got ${eps})`);
  if (!(confidence > 0 && confidence < 1))
    throw new RangeError(`confidence must lie in (0, 1) (got ${confidence})`);
  const z = zForConfidence(confidence);
  return Math.ceil((z * z * p * (1 - p)) / (eps * eps));
}

/** Half-width of the interval relative to the estimate: (hi − lo) / 2 / |estimate|. */
export function relativeHalfWidth(estimate: number, interval: [number, number]): number {
  return (interval[1] - interval[0]) / 2 / Math.abs(estimate || 1);
}
