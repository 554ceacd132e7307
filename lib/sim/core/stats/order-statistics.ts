/**
 * Percentiles of a simulated sample and their distribution-free confidence intervals.
 *
 * Percentile: P_p = x₍⌈np⌉₎, the smallest sampled value with at least a share p of the sample at
 * or below it (the inverse of the empirical distribution function; Hyndman & Fan 1996, The
 * American Statistician 50(4):361–365, definition 1), so "80% of outcomes are at most P80".
 *
 * Interval: the number of sampled values at or below the true quantile ξ_p is Binomial(n, p),
 * so P(x₍l₎ ≤ ξ_p ≤ x₍u₎) = P(l ≤ B ≤ u − 1). With l the largest rank with P(B ≤ l − 1) ≤ α/2 and
 * u the smallest with P(B ≤ u − 1) ≥ 1 − α/2, the interval covers ξ_p with probability ≥ 1 − α
 * whatever the distribution (Conover 1999, "Practical Nonparametric Statistics", 3rd ed., §3.2;
 * David & Nagaraja 2003, "Order Statistics", 3rd ed., §7.1).
 */

import jStat from 'jstat';

/** 1-based rank of the percentile P_p in a sample of n. */
export function percentileRank(n: number, p: number): number {
  return Math.min(n, Math.max(1, Math.ceil(n * p - 1e-9)));
}

/** 1-based ranks [l, u] of the distribution-free interval for the p-quantile (clamped to 1…n). */
export function quantileIntervalRanks(n: number, p: number, confidence = 0.95): [number, number] {
  const alpha = 1 - confidence;
  const sd = Math.sqrt(n * p * (1 - p));
  const from = Math.max(0, Math.floor(n * p - 12 * sd - 10));
  const to = Math.min(n, Math.ceil(n * p + 12 * sd + 10));
  // Binomial probabilities over the window that holds all but a negligible mass: the first
  // from its logarithm, the rest by pmf(k+1) = pmf(k) · (n − k)/(k + 1) · p/(1 − p).
  const ratio = p / (1 - p);
  let pmf = Math.exp(
    jStat.gammaln(n + 1) -
      jStat.gammaln(from + 1) -
      jStat.gammaln(n - from + 1) +
      from * Math.log(p) +
      (n - from) * Math.log1p(-p),
  );
  let below = 0; // P(B < from) is negligible by construction, taken as 0.
  let l = 1;
  let u = n;
  let foundU = false;
  for (let k = from; k <= to; k++) {
    // `below` is P(B ≤ k − 1) here.
    if (below <= alpha / 2) l = Math.max(1, k);
    if (!foundU && below >= 1 - alpha / 2) {
      u = Math.min(n, k);
      foundU = true;
    }
    below += pmf;
    pmf *= ((n - k) / (k + 1)) * ratio;
  }
  if (!foundU && below >= 1 - alpha / 2) u = Math.min(n, to + 1);
  return [Math.min(l, n), Math.max(1, u)];
}
