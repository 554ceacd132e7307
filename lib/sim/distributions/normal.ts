/**
 * Normal distribution N(μ, σ²).
 *
 *   F(x) = Φ((x − μ)/σ);   Q(u) = μ + σ Φ⁻¹(u);   E = μ;   Var = σ².
 *
 * Φ and Φ⁻¹ are in ../math/normal (Hart 1968 / West 2005; Wichura 1988, AS 241).
 * Reference: Johnson, Kotz & Balakrishnan (1994), "Continuous Univariate Distributions",
 * vol. 1, 2nd ed., ch. 13.
 */

import { normalCdf, normalQuantile } from '../math/normal';
import { type DistLocation, requireFinite, requirePositive } from './checks';
import type { Distribution } from './types';

export interface NormalParams {
  mean: number;
  sd: number;
}

export function createNormal(p: NormalParams, at: DistLocation): Distribution {
  requireFinite(at, 'mean', p.mean);
  requireFinite(at, 'sd', p.sd);
  requirePositive(at, 'sd', p.sd);
  const mu = p.mean;
  const sigma = p.sd;
  return {
    kind: 'normal',
    mean: mu,
    variance: sigma * sigma,
    base: mu,
    support: [-Infinity, Infinity],
    degenerate: false,
    quantile: (u) => mu + sigma * normalQuantile(u),
    cdf: (x) => normalCdf((x - mu) / sigma),
    quantileInto(u, out, n) {
      for (let i = 0; i < n; i++) out[i] = mu + sigma * normalQuantile(u[i]);
    },
  };
}
