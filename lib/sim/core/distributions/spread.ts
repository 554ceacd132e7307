// What every distribution with a spread shares: its moments, base value and support, computed
// once by the subclass's constructor and handed up here.

import type { Distribution, DistributionKind } from './types';

export abstract class SpreadDistribution implements Distribution {
  abstract readonly kind: DistributionKind;
  readonly degenerate = false;
  constructor(
    readonly mean: number,
    readonly variance: number,
    readonly base: number,
    readonly support: readonly [number, number],
  ) {}
  abstract quantile(u: number): number;
  abstract cdf(x: number): number;
  abstract quantileInto(u: Float64Array, out: Float64Array, n: number): void;
}
