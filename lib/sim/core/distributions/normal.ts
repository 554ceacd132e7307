/**
 * Normal distribution N(μ, σ²).
 *
 *   F(x) = Φ((x − μ)/σ);   Q(u) = μ + σ Φ⁻¹(u);   E = μ;   Var = σ².
 *
 * Φ and Φ⁻¹ are in ../math/normal (Hart 1968 / West 2005; Wichura 1988, AS 241); batches of
 * quantiles use the shared table of ../math/normal-quantile-table (within 1e-9·σ).
 * Reference: Johnson, Kotz & Balakrishnan (1994), "Continuous Univariate Distributions",
 * vol. 1, 2nd ed., ch. 13.
 */

import { normalCdf, normalQuantile } from '../math/normal';
import { normalQuantilesInto } from '../math/normal-quantile-table';
import { type DistLocation, requireFinite, requirePositive } from './checks';
import { SpreadDistribution } from './spread';
import type { Distribution } from './types';

export interface NormalParams {
  mean: number;
  sd: number;
}

class NormalDistribution extends SpreadDistribution {
  readonly kind = 'normal';
  constructor(
    mean: number,
    private readonly sigma: number,
  ) {
    super(mean, sigma * sigma, mean, [-Infinity, Infinity]);
  }
  quantile(u: number): number {
    return this.mean + this.sigma * normalQuantile(u);
  }
  cdf(x: number): number {
    return normalCdf((x - this.mean) / this.sigma);
  }
  quantileInto(u: Float64Array, out: Float64Array, n: number): void {
    normalQuantilesInto(u, out, n, this.mean, this.sigma);
  }
}

export function createNormal(p: NormalParams, at: DistLocation): Distribution {
  requireFinite(at, 'mean', p.mean);
  requireFinite(at, 'sd', p.sd);
  requirePositive(at, 'sd', p.sd);
  return new NormalDistribution(p.mean, p.sd);
}
