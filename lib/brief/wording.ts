// Sentences the brief prints in more than one place (page, PDF).
import type { ClassCheck } from './estimate-class';
import { signedPercent } from './format';

export const BRIEF_CAUTION =
  'Results are only as good as the ranges entered. They support, and do not replace, professional judgement, ' +
  'your organisation’s contingency policy and the funding body’s rules.';

/** The simulated P10 and P90 as shares of base: ["−8 %", "+21 %"]. */
export function simulatedRangeText(check: ClassCheck): [string, string] {
  return [signedPercent(check.simulatedLow), signedPercent(check.simulatedHigh)];
}

/** The class's range, from its narrowest to its widest band: ["−10 % to −20 %", "+10 % to +30 %"]. */
export function classRangeText(check: ClassCheck): [string, string] {
  const b = check.band;
  return [
    `${signedPercent(b.lowBest)} to ${signedPercent(b.lowWorst)}`,
    `${signedPercent(b.highBest)} to ${signedPercent(b.highWorst)}`,
  ];
}
