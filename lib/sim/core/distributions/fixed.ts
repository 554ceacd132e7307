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

/** One class per kind, so the engine's call sites see few targets (one method per kind). */
class FixedDistribution implements Distribution {
  readonly kind = 'fixed';
  readonly variance = 0;
  readonly degenerate = true;
  readonly mean: number;
  readonly base: number;
  readonly support: readonly [number, number];
  constructor(private readonly v: number) {
    this.mean = v;
    this.base = v;
    this.support = [v, v];
  }
  quantile(): number {
    return this.v;
  }
  cdf(x: number): number {
    return x < this.v ? 0 : 1;
  }
  quantileInto(_u: Float64Array, out: Float64Array, n: number): void {
    out.fill(this.v, 0, n);
  }
}

export function createFixed(p: FixedParams, at: DistLocation): Distribution {
  requireFinite(at, 'value', p.value);
  return new FixedDistribution(p.value);
}
