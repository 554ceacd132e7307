/**
 * The estimate-class check: is the simulated range of total cost as wide as the project's
 * estimate class says a range of that class should be?
 *
 * Source: AACE International Recommended Practice 18R-97, "Cost Estimate Classification System –
 * As Applied in Engineering, Procurement, and Construction for the Process Industries", Table 1
 * (expected accuracy range). The band values below are quoted from memory of the published
 * table and should be checked against the current revision before relying on them:
 *
 *   class   low side          high side
 *   5       −20 % to −50 %    +30 % to +100 %
 *   4       −15 % to −30 %    +20 % to +50 %
 *   3       −10 % to −20 %    +10 % to +30 %
 *   2        −5 % to −15 %     +5 % to +20 %
 *   1        −3 % to −10 %     +3 % to +15 %
 *
 * How the practice reads them (also from memory): the ranges are measured around the point
 * estimate *including* contingency, i.e. the estimate funded at about a 50 % confidence, not
 * around the base; each side has a band from its narrowest to its widest value; and the ranges
 * are read as roughly an 80 % confidence interval, which is why the simulated P10 and P90 are
 * compared with them (common practice):
 *
 *   low  = P10 / P50 − 1        high = P90 / P50 − 1
 *
 * Each side is then "narrow" when it lies inside the class's narrowest band (|low| < |lowBest|),
 * "wide" when it lies beyond the widest (|low| > |lowWorst|), else "within". A narrow range hints
 * at optimistic ranges, missing risks or missing correlation; a wide one at a less mature
 * estimate than its class claims, or at large open risks.
 */
export type AccuracyBand = { lowBest: number; lowWorst: number; highBest: number; highWorst: number };
export type EstimateClass = 1 | 2 | 3 | 4 | 5;

export const ESTIMATE_CLASS_ACCURACY: Record<EstimateClass, AccuracyBand> = {
  1: { lowBest: -0.03, lowWorst: -0.1, highBest: 0.03, highWorst: 0.15 },
  2: { lowBest: -0.05, lowWorst: -0.15, highBest: 0.05, highWorst: 0.2 },
  3: { lowBest: -0.1, lowWorst: -0.2, highBest: 0.1, highWorst: 0.3 },
  4: { lowBest: -0.15, lowWorst: -0.3, highBest: 0.2, highWorst: 0.5 },
  5: { lowBest: -0.2, lowWorst: -0.5, highBest: 0.3, highWorst: 1.0 },
};

export const CLASS_CHECK_SOURCE =
  'AACE International Recommended Practice 18R-97, Table 1 (band values quoted from memory)';

export type SideVerdict = 'narrow' | 'within' | 'wide';

export type ClassCheck = {
  estimateClass: EstimateClass;
  band: AccuracyBand;
  /** The point the range is measured around: the simulated P50 (the estimate with contingency). */
  reference: number;
  /** P10 / P50 − 1 and P90 / P50 − 1 (−0.08 means 8 % below the P50). */
  simulatedLow: number;
  simulatedHigh: number;
  low: SideVerdict;
  high: SideVerdict;
};

/** Shares are compared after rounding to a hundredth of a percent, so a range on a band's edge is within it. */
const EDGE = 1e-4;

function verdict(size: number, best: number, worst: number): SideVerdict {
  if (size < Math.abs(best) - EDGE) return 'narrow';
  if (size > Math.abs(worst) + EDGE) return 'wide';
  return 'within';
}

export function isEstimateClass(n: number): n is EstimateClass {
  return Number.isInteger(n) && n >= 1 && n <= 5;
}

/** The check of a simulated P10, P50 and P90 against the class's bands. */
export function checkAgainstClass(estimateClass: number, p10: number, p50: number, p90: number): ClassCheck {
  if (!isEstimateClass(estimateClass))
    throw new RangeError(`Estimate class must be 1–5 (got ${estimateClass}).`);
  if (!(p50 > 0)) throw new RangeError('The P50 of cost must be positive to measure a range around it.');
  if (!(p10 <= p50 && p50 <= p90)) throw new RangeError('P10 ≤ P50 ≤ P90 is required.');
  const band = ESTIMATE_CLASS_ACCURACY[estimateClass];
  const simulatedLow = p10 / p50 - 1;
  const simulatedHigh = p90 / p50 - 1;
  return {
    estimateClass,
    band,
    reference: p50,
    simulatedLow,
    simulatedHigh,
    low: verdict(-simulatedLow, band.lowBest, band.lowWorst),
    high: verdict(simulatedHigh, band.highBest, band.highWorst),
  };
}
