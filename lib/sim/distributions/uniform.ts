/**
 * Continuous uniform distribution on [a, b].
 *
 *   F(x) = (x − a)/(b − a);   Q(u) = a + u(b − a);   E = (a + b)/2;   Var = (b − a)²/12.
 *
 * Reference: Johnson, Kotz & Balakrishnan (1995), "Continuous Univariate Distributions",
 * vol. 2, 2nd ed., ch. 26.
 */

import { type DistLocation, requireFinite, requireGreater } from './checks';
import type { Distribution } from './types';

export interface UniformParams {
  low: number;
  high: number;
}

export function createUniform(p: UniformParams, at: DistLocation): Distribution {
  requireFinite(at, 'low', p.low);
  requireFinite(at, 'high', p.high);
  requireGreater(at, 'high', p.high, 'low', p.low);
  const a = p.low;
  const w = p.high - p.low;
  return {
    kind: 'uniform',
    mean: a + w / 2,
    variance: (w * w) / 12,
    base: a + w / 2,
    support: [a, a + w],
    degenerate: false,
    quantile: (u) => a + u * w,
    cdf: (x) => (x <= a ? 0 : x >= a + w ? 1 : (x - a) / w),
    quantileInto(u, out, n) {
      for (let i = 0; i < n; i++) out[i] = a + u[i] * w;
    },
  };
}
