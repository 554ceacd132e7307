// The shape every distribution factory returns. Factories validate their parameters once and
// precompute constants; `quantileInto` is the batch form used by the engine's hot loop (one
// monomorphic loop per distribution instead of one call per sample).

export type DistributionKind = 'fixed' | 'uniform' | 'triangular' | 'pert' | 'normal' | 'lognormal';

export interface Distribution {
  readonly kind: DistributionKind;
  /** Expected value. */
  readonly mean: number;
  /** Variance (0 for fixed). */
  readonly variance: number;
  /** The deterministic "base" value by the product's convention (mode, midpoint, mean, median, value). */
  readonly base: number;
  /** Smallest and largest possible values (±Infinity when unbounded). */
  readonly support: readonly [number, number];
  /** For beta-based distributions, the shape (α, β) whose quantile table it samples from. */
  readonly betaShape?: readonly [number, number];
  /** True when the distribution has no spread (it needs no random number). */
  readonly degenerate: boolean;
  /** Inverse distribution function, u in (0, 1). */
  quantile(u: number): number;
  /** Distribution function P(X ≤ x). */
  cdf(x: number): number;
  /** out[i] = quantile(u[i]) for i < n. */
  quantileInto(u: Float64Array, out: Float64Array, n: number): void;
}
