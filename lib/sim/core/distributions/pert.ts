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
import { type BetaQuantileTable, betaQuantileTable } from '../math/beta-quantile-table';
import type { DistLocation } from './checks';
import { fitBoundsToP10P90 } from './fit-p10-p90';
import { checkThreePoint, type ThreePointParams } from './triangular';
import { SpreadDistribution } from './spread';
import type { Distribution } from './types';

const LAMBDA = 4;

/** Quantile of the beta-PERT on [0, 1] with mode r (exact inverse, for fitting). */
function standardPertQuantile(r: number, u: number): number {
  return jStat.ibetainv(u, 1 + LAMBDA * r, 1 + LAMBDA * (1 - r));
}

class PertDistribution extends SpreadDistribution {
  readonly kind = 'pert';
  private readonly w: number;
  private readonly alpha: number;
  private readonly beta: number;
  /** (α, β) of the underlying beta distribution, for sharing its quantile table. */
  readonly betaShape: readonly [number, number];
  private table: BetaQuantileTable | null = null;
  constructor(
    private readonly a: number,
    c: number,
    b: number,
  ) {
    const mean = (a + LAMBDA * c + b) / (LAMBDA + 2);
    super(mean, ((mean - a) * (b - mean)) / 7, c, [a, b]);
    const w = b - a;
    this.w = w;
    this.alpha = 1 + (LAMBDA * (c - a)) / w;
    this.beta = 1 + (LAMBDA * (b - c)) / w;
    this.betaShape = [this.alpha, this.beta];
  }
  private getTable(): BetaQuantileTable {
    return (this.table ??= betaQuantileTable(this.alpha, this.beta));
  }
  quantile(u: number): number {
    return this.a + this.w * this.getTable().quantile(u);
  }
  cdf(x: number): number {
    const { a, w } = this;
    return x <= a ? 0 : x >= a + w ? 1 : jStat.ibeta((x - a) / w, this.alpha, this.beta);
  }
  quantileInto(u: Float64Array, out: Float64Array, n: number): void {
    this.getTable().scaledQuantileInto(u, out, n, this.a, this.w);
  }
}

export function createPert(p: ThreePointParams, at: DistLocation): Distribution {
  checkThreePoint(p, at);
  if (p.range !== 'p10-p90') return new PertDistribution(p.low, p.mode, p.high);
  const { low, high } = fitBoundsToP10P90(p.low, p.mode, p.high, standardPertQuantile);
  return new PertDistribution(low, p.mode, high);
}
