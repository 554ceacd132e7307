/**
 * Continuous uniform distribution on [a, b].
 *
 *   F(x) = (x − a)/(b − a);   Q(u) = a + u(b − a);   E = (a + b)/2;   Var = (b − a)²/12.
 *
 * Reference: Johnson, Kotz & Balakrishnan (1995), "Continuous Univariate Distributions",
 * vol. 2, 2nd ed., ch. 26.
 */

import { type DistLocation, requireFinite, requireGreater } from './checks';
import { SpreadDistribution } from './spread';
import type { Distribution } from './types';

export interface UniformParams {
  low: number;
  high: number;
}

class UniformDistribution extends SpreadDistribution {
  readonly kind = 'uniform';
  constructor(
    private readonly a: number,
    private readonly w: number,
  ) {
    super(a + w / 2, (w * w) / 12, a + w / 2, [a, a + w]);
  }
  quantile(u: number): number {
    return this.a + u * this.w;
  }
  cdf(x: number): number {
    const { a, w } = this;
    return x <= a ? 0 : x >= a + w ? 1 : (x - a) / w;
  }
  quantileInto(u: Float64Array, out: Float64Array, n: number): void {
    const { a, w } = this;
    for (let i = 0; i < n; i++) out[i] = a + u[i] * w;
  }
}

export function createUniform(p: UniformParams, at: DistLocation): Distribution {
  requireFinite(at, 'low', p.low);
  requireFinite(at, 'high', p.high);
  requireGreater(at, 'high', p.high, 'low', p.low);
  return new UniformDistribution(p.low, p.high - p.low);
}
