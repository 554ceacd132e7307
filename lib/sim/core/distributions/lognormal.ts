/**
 * Lognormal distribution: ln X ~ N(μ, σ²), given either by its 10th and 90th percentiles or by
 * its mean and standard deviation.
 *
 *   from (p10, p90):  μ = (ln p10 + ln p90)/2,   σ = (ln p90 − ln p10) / (2 z₀.₉),  z₀.₉ = Φ⁻¹(0.9)
 *   from (m, s):      σ² = ln(1 + s²/m²),        μ = ln m − σ²/2
 *   F(x) = Φ((ln x − μ)/σ);  Q(u) = exp(μ + σ Φ⁻¹(u));
 *   E = exp(μ + σ²/2);  Var = (exp(σ²) − 1) exp(2μ + σ²);  median (the base) = exp(μ).
 *
 * Reference: Johnson, Kotz & Balakrishnan (1994), "Continuous Univariate Distributions",
 * vol. 1, 2nd ed., ch. 14.
 */

import { normalCdf, normalQuantile } from '../math/normal';
import { normalQuantilesInto } from '../math/normal-quantile-table';
import { type DistLocation, fail, requireFinite, requireGreater, requirePositive } from './checks';
import { SpreadDistribution } from './spread';
import type { Distribution } from './types';

export type LognormalParams = { p10: number; p90: number } | { mean: number; sd: number };

const Z90 = normalQuantile(0.9);

class LognormalDistribution extends SpreadDistribution {
  readonly kind = 'lognormal';
  constructor(
    private readonly mu: number,
    private readonly sigma: number,
  ) {
    const s2 = sigma * sigma;
    super(Math.exp(mu + s2 / 2), Math.expm1(s2) * Math.exp(2 * mu + s2), Math.exp(mu), [0, Infinity]);
  }
  quantile(u: number): number {
    return Math.exp(this.mu + this.sigma * normalQuantile(u));
  }
  cdf(x: number): number {
    return x <= 0 ? 0 : normalCdf((Math.log(x) - this.mu) / this.sigma);
  }
  quantileInto(u: Float64Array, out: Float64Array, n: number): void {
    normalQuantilesInto(u, out, n, this.mu, this.sigma);
    for (let i = 0; i < n; i++) out[i] = Math.exp(out[i]);
  }
}

export function createLognormal(p: LognormalParams, at: DistLocation): Distribution {
  let mu: number;
  let sigma: number;
  if ('p10' in p && p.p10 !== undefined) {
    requireFinite(at, 'p10', p.p10);
    requireFinite(at, 'p90', p.p90);
    requirePositive(at, 'p10', p.p10);
    requireGreater(at, 'p90', p.p90, 'p10', p.p10);
    mu = (Math.log(p.p10) + Math.log(p.p90)) / 2;
    sigma = (Math.log(p.p90) - Math.log(p.p10)) / (2 * Z90);
  } else if ('mean' in p && p.mean !== undefined) {
    requireFinite(at, 'mean', p.mean);
    requireFinite(at, 'sd', p.sd);
    requirePositive(at, 'mean', p.mean);
    requirePositive(at, 'sd', p.sd);
    const s2 = Math.log1p((p.sd * p.sd) / (p.mean * p.mean));
    sigma = Math.sqrt(s2);
    mu = Math.log(p.mean) - s2 / 2;
  } else {
    fail(at, '', 'a lognormal needs either p10 and p90 or mean and sd');
  }
  return new LognormalDistribution(mu, sigma);
}
