/**
 * Beta-PERT distribution on [a, b] with mode c and shape λ = 4.
 *
 *   α = 1 + λ(c − a)/(b − a),   β = 1 + λ(b − c)/(b − a),   X = a + (b − a)·Y,  Y ~ Beta(α, β)
 *   F(x) = I_{(x−a)/(b−a)}(α, β)  (regularized incomplete beta)
 *   E = (a + λc + b)/(λ + 2) = (a + 4c + b)/6;   Var = (E − a)(b − E)/7
 *
 * The quantile uses a per-distribution table (../math/beta-quantile-table), built on first use
 * so that validating a model costs nothing. With `range: "p10-p90"` the given low/high are the
 * 10th/90th percentiles and the bounds are fitted (./fit-p10-p90), the mode held fixed.
 *
 * References: Malcolm, Roseboom, Clark & Fazar (1959), "Application of a technique for research
 * and development program evaluation", Operations Research 7(5):646–669; Vose (2008),
 * "Risk Analysis: A Quantitative Guide", 3rd ed., Wiley, §9 (the PERT distribution).
 */

import jStat from 'jstat';
import { type BetaQuantileTable, createBetaQuantileTable } from '../math/beta-quantile-table';
import type { DistLocation } from './checks';
import { fitBoundsToP10P90 } from './fit-p10-p90';
import { checkThreePoint, type ThreePointParams } from './triangular';
import type { Distribution } from './types';

const LAMBDA = 4;

/** Quantile of the beta-PERT on [0, 1] with mode r (exact inverse, for fitting). */
function standardPertQuantile(r: number, u: number): number {
  return jStat.ibetainv(u, 1 + LAMBDA * r, 1 + LAMBDA * (1 - r));
}

export function createPert(p: ThreePointParams, at: DistLocation): Distribution {
  checkThreePoint(p, at);
  const c = p.mode;
  let a = p.low;
  let b = p.high;
  if (p.range === 'p10-p90')
    ({ low: a, high: b } = fitBoundsToP10P90(p.low, c, p.high, standardPertQuantile));
  const w = b - a;
  const alpha = 1 + (LAMBDA * (c - a)) / w;
  const beta = 1 + (LAMBDA * (b - c)) / w;
  const mean = (a + LAMBDA * c + b) / (LAMBDA + 2);
  let table: BetaQuantileTable | null = null;
  const getTable = () => (table ??= createBetaQuantileTable(alpha, beta));
  return {
    kind: 'pert',
    mean,
    variance: ((mean - a) * (b - mean)) / 7,
    base: c,
    support: [a, b],
    degenerate: false,
    quantile: (u) => a + w * getTable().quantile(u),
    cdf: (x) => (x <= a ? 0 : x >= b ? 1 : jStat.ibeta((x - a) / w, alpha, beta)),
    quantileInto(u, out, n) {
      getTable().scaledQuantileInto(u, out, n, +a, +w);
    },
  };
}
