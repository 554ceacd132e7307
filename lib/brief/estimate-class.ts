/**
 * Expected accuracy ranges of estimate classes 1–5.
 *
 * Source: AACE International Recommended Practice 18R-97, "Cost Estimate Classification
 * System – As Applied in Engineering, Procurement, and Construction for the Process
 * Industries", Figure 1 / Table 1 (values from memory of the published table). Each class
 * gives a band for the low end and for the high end of the range, as fractions of the point
 * estimate: e.g. Class 3 is −10 % to −20 % on the low side and +10 % to +30 % on the high side.
 * The practice describes these ranges as covering roughly an 80 % confidence interval, which
 * is why they are compared with the simulated P10–P90 range here.
 */
export type AccuracyBand = { lowBest: number; lowWorst: number; highBest: number; highWorst: number };

export const ESTIMATE_CLASS_ACCURACY: Record<1 | 2 | 3 | 4 | 5, AccuracyBand> = {
  1: { lowBest: -0.03, lowWorst: -0.1, highBest: 0.03, highWorst: 0.15 },
  2: { lowBest: -0.05, lowWorst: -0.15, highBest: 0.05, highWorst: 0.2 },
  3: { lowBest: -0.1, lowWorst: -0.2, highBest: 0.1, highWorst: 0.3 },
  4: { lowBest: -0.15, lowWorst: -0.3, highBest: 0.2, highWorst: 0.5 },
  5: { lowBest: -0.2, lowWorst: -0.5, highBest: 0.3, highWorst: 1.0 },
};

export type ClassCheck = {
  estimateClass: number;
  band: AccuracyBand;
  /** The simulated P10 and P90 as fractions of the base estimate (−0.08 means 8 % below base). */
  simulatedLow: number;
  simulatedHigh: number;
  /** Width of the simulated P10–P90 range over the narrowest width the class allows. */
  widthRatio: number;
  warning: string | null;
};

/**
 * Compares a simulated P10–P90 range with the class's accuracy range. A simulated range
 * narrower than the class's narrowest band suggests optimistic ranges or missing correlation.
 */
export function checkAgainstClass(estimateClass: number, base: number, p10: number, p90: number): ClassCheck {
  if (!(estimateClass in ESTIMATE_CLASS_ACCURACY))
    throw new RangeError(`Estimate class must be 1–5 (got ${estimateClass}).`);
  if (!(base > 0)) throw new RangeError('The base estimate must be positive to compare ranges.');
  const band = ESTIMATE_CLASS_ACCURACY[estimateClass as 1 | 2 | 3 | 4 | 5];
  const simulatedLow = p10 / base - 1;
  const simulatedHigh = p90 / base - 1;
  const narrowestWidth = band.highBest - band.lowBest;
  const widthRatio = (simulatedHigh - simulatedLow) / narrowestWidth;
  const pct = (x: number) => `${x >= 0 ? '+' : '−'}${Math.abs(Math.round(x * 100))} %`;
  const warning =
    widthRatio < 1
      ? `The simulated P10–P90 range (${pct(simulatedLow)} to ${pct(simulatedHigh)} of base) is narrower than even the ` +
        `narrowest range expected of a Class ${estimateClass} estimate (${pct(band.lowBest)} to ${pct(band.highBest)}). ` +
        'Check for optimistic ranges, missing risk events or missing correlation.'
      : null;
  return { estimateClass, band, simulatedLow, simulatedHigh, widthRatio, warning };
}
