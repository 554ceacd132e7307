/**
 * Tornado data: Spearman's rank correlation of each input with a total, and its share of variance.
 *
 * Rank correlation = Pearson correlation of the input's grade with the total's mid-rank. The grade
 * is the input's value on the probability scale, G = F(X) (for a risk, the mid-distribution value
 * (F(x⁻) + F(x))/2, which is what average ranks give to ties), known from the sampler without
 * sorting the input; the total is ranked once (mid-ranks). The grade equals the empirical rank/n up
 * to O(1/√n), and 12·E[F(X)G(Y)] − 3 is Spearman's coefficient in the population (Kruskal 1958,
 * JASA 53:814–861, §2.4). Grades are stored to 16 bits (error below 2⁻¹⁶); the threads sum them
 * per block, and only the cross products with the ranks are left for the roll-up.
 *
 * Variance share: squared rank correlations normalised to sum to 1 over the listed inputs, a
 * first-order attribution that ignores interactions between inputs and is exact for an additive
 * total of independent inputs on the rank scale.
 */

import { type BlockSummary, GRADE_UNIT } from '../block';
import type { SensitivityInput } from '../compile';
import type { SensitivityEntry } from '../formats';

/**
 * Rank correlation of each input with the ranked cost (inputs with `cost`) and the ranked
 * duration (inputs with `duration`, when there is a schedule); 0 where it does not apply.
 * `blocks` carry Σg and Σg² per input, `cross` the per-block Σ k·R (see blockCrossSums).
 */
export function rankCorrelations(
  inputs: SensitivityInput[],
  blocks: BlockSummary[],
  cross: Float64Array[],
  costRanks: Float64Array,
  durationRanks: Float64Array | null,
): { cost: Float64Array; duration: Float64Array } {
  return rankCorrelationsFromSums(
    inputs,
    blocks,
    cross,
    costRanks.length,
    rankSums(costRanks),
    durationRanks ? rankSums(durationRanks) : null,
  );
}

/** ΣR and ΣR² of ranks, in order. */
export function rankSums(ranks: ArrayLike<number>): RankSums {
  let sr = 0;
  let srr = 0;
  for (let i = 0; i < ranks.length; i++) {
    sr += ranks[i];
    srr += ranks[i] * ranks[i];
  }
  return { sr, srr };
}

export interface RankSums {
  sr: number;
  srr: number;
}

/**
 * As rankCorrelations, from the ranks' sums ΣR and ΣR² over the n iterations instead of the
 * ranks themselves (null: no duration ranks); `blocks` may be any consecutive groups of blocks
 * (chunks) with their sums, `cross` theirs.
 */
export function rankCorrelationsFromSums(
  inputs: SensitivityInput[],
  blocks: Pick<BlockSummary, 'gradeSums'>[],
  cross: ArrayLike<number>[],
  n: number,
  costRanks: RankSums,
  durationRanks: RankSums | null,
): { cost: Float64Array; duration: Float64Array } {
  const m = inputs.length;
  const sg = new Float64Array(m);
  const sgg = new Float64Array(m);
  const sums = { cost: new Float64Array(m), duration: new Float64Array(m) };
  blocks.forEach((b, k) => {
    for (let s = 0; s < m; s++) {
      sg[s] += b.gradeSums[2 * s];
      sgg[s] += b.gradeSums[2 * s + 1];
      sums.cost[s] += cross[k][2 * s];
      sums.duration[s] += cross[k][2 * s + 1];
    }
  });
  const corrWith = (ranks: RankSums | null, kr: Float64Array) => {
    const out = new Float64Array(m);
    if (!ranks) return out;
    const { sr, srr } = ranks;
    const vr = srr - (sr * sr) / n;
    for (let s = 0; s < m; s++) {
      // Σ g·R with g = (k + ½)·2⁻¹⁶: (Σ k·R + ½ ΣR)·2⁻¹⁶.
      const sgr = (kr[s] + 0.5 * sr) * GRADE_UNIT;
      const vg = sgg[s] - (sg[s] * sg[s]) / n;
      const cov = sgr - (sg[s] * sr) / n;
      out[s] = vg > 0 && vr > 0 ? cov / Math.sqrt(vg * vr) : 0;
    }
    return out;
  };
  return { cost: corrWith(costRanks, sums.cost), duration: corrWith(durationRanks, sums.duration) };
}

/** Entries sorted by |rank correlation|, with variance shares ρ²/Σρ². */
export function tornado(ids: string[], rho: ArrayLike<number>): SensitivityEntry[] {
  let total = 0;
  for (let i = 0; i < ids.length; i++) total += rho[i] * rho[i];
  return ids
    .map((id, i) => ({
      id,
      rankCorrelation: rho[i],
      varianceShare: total > 0 ? (rho[i] * rho[i]) / total : 0,
    }))
    .sort((x, y) => Math.abs(y.rankCorrelation) - Math.abs(x.rankCorrelation) || (x.id < y.id ? -1 : 1));
}
