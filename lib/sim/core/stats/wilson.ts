/**
 * Wilson score interval for a binomial proportion (Wilson 1927, "Probable inference, the law of
 * succession, and statistical inference", JASA 22(158):209–212):
 *
 *   centre = (p̂ + z²/2n) / (1 + z²/n),   half-width = z/(1 + z²/n) · √(p̂(1 − p̂)/n + z²/4n²)
 *
 * It stays inside [0, 1] and keeps its coverage near 0 and 1, unlike p̂ ± z√(p̂(1−p̂)/n).
 */

import { zForConfidence } from '../math/normal';

export function wilsonInterval(successes: number, n: number, confidence = 0.95): [number, number] {
  if (n <= 0) return [0, 1];
  const z = zForConfidence(confidence);
  const p = successes / n;
  const z2n = (z * z) / n;
  const centre = (p + z2n / 2) / (1 + z2n);
  const half = (z / (1 + z2n)) * Math.sqrt((p * (1 - p)) / n + z2n / (4 * n));
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}
