/**
 * Fixed (degenerate) distribution at `value`.
 *
 *   F(x) = 0 for x < v, 1 for x ≥ v;   Q(u) = v;   E = v;   Var = 0.
 */

import { type DistLocation, requireFinite } from './checks';
import type { Distribution } from './types';

export interface FixedParams {
  value: number;
}

export function createFixed(p: FixedParams, at: DistLocation): Distribution {
  requireFinite(at, 'value', p.value);
  const v = p.value;
  return {
    kind: 'fixed',
    mean: v,
    variance: 0,
    base: v,
    support: [v, v],
    degenerate: true,
    quantile: () => v,
    cdf: (x) => (x < v ? 0 : 1),
    quantileInto(_u, out, n) {
      out.fill(v, 0, n);
    },
  };
}
