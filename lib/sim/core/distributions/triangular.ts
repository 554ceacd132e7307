/**
 * Triangular distribution on [a, b] with mode c.
 *
 *   F(x) = (x − a)² / ((b − a)(c − a))          for a ≤ x ≤ c
 *        = 1 − (b − x)² / ((b − a)(b − c))      for c < x ≤ b
 *   Q(u) = a + √(u (b − a)(c − a))              for u < F_c = (c − a)/(b − a)
 *        = b − √((1 − u)(b − a)(b − c))         otherwise
 *   E = (a + b + c)/3;   Var = (a² + b² + c² − ab − ac − bc)/18.
 *
 * With `range: "p10-p90"` the given low/high are the 10th/90th percentiles and the bounds are
 * fitted (./fit-p10-p90), the mode held fixed.
 *
 * References: Kotz & van Dorp (2004), "Beyond Beta", World Scientific, ch. 1; Johnson, Kotz &
 * Balakrishnan (1995), "Continuous Univariate Distributions", vol. 2, 2nd ed., ch. 26 §9.
 */

import { type DistLocation, requireBetween, requireFinite, requireGreater } from './checks';
import { fitBoundsToP10P90 } from './fit-p10-p90';
import { SpreadDistribution } from './spread';
import type { Distribution } from './types';

export interface ThreePointParams {
  low: number;
  mode: number;
  high: number;
  range?: 'min-max' | 'p10-p90';
}

/** Quantile of the triangular on [0, 1] with mode r. */
export function standardTriangularQuantile(r: number, u: number): number {
  return u < r ? Math.sqrt(u * r) : 1 - Math.sqrt((1 - u) * (1 - r));
}

export function checkThreePoint(p: ThreePointParams, at: DistLocation): void {
  requireFinite(at, 'low', p.low);
  requireFinite(at, 'mode', p.mode);
  requireFinite(at, 'high', p.high);
  requireGreater(at, 'high', p.high, 'low', p.low);
  requireBetween(at, 'mode', p.mode, p.low, p.high);
}

class TriangularDistribution extends SpreadDistribution {
  readonly kind = 'triangular';
  private readonly left: number;
  private readonly right: number;
  private readonly fc: number;
  constructor(
    private readonly a: number,
    private readonly c: number,
    private readonly b: number,
  ) {
    super((a + b + c) / 3, (a * a + b * b + c * c - a * b - a * c - b * c) / 18, c, [a, b]);
    this.left = (b - a) * (c - a);
    this.right = (b - a) * (b - c);
    this.fc = (c - a) / (b - a);
  }
  quantile(u: number): number {
    return u < this.fc ? this.a + Math.sqrt(u * this.left) : this.b - Math.sqrt((1 - u) * this.right);
  }
  cdf(x: number): number {
    const { a, b, c, left, right } = this;
    return x <= a ? 0 : x >= b ? 1 : x <= c ? ((x - a) * (x - a)) / left : 1 - ((b - x) * (b - x)) / right;
  }
  quantileInto(u: Float64Array, out: Float64Array, n: number): void {
    const { a, b, fc, left, right } = this;
    // Both sides, one kept by a 0/1 weight: which side a draw falls on is a coin toss, and a
    // branch on it would be mispredicted half the time. The other side's term is ±0, so the kept
    // value is quantile()'s to the bit.
    for (let i = 0; i < n; i++) {
      const v = u[i];
      const lower = +(v < fc);
      const x = a + Math.sqrt(v * left);
      const y = b - Math.sqrt((1 - v) * right);
      out[i] = x * lower + y * (1 - lower);
    }
  }
}

export function createTriangular(p: ThreePointParams, at: DistLocation): Distribution {
  checkThreePoint(p, at);
  if (p.range !== 'p10-p90') return new TriangularDistribution(p.low, p.mode, p.high);
  const { low, high } = fitBoundsToP10P90(p.low, p.mode, p.high, standardTriangularQuantile);
  return new TriangularDistribution(low, p.mode, high);
}
