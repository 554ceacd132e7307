/**
 * Inducing a rank correlation among the variables of one group, within one block of n
 * iterations, by the method of Iman & Conover (1982), "A distribution-free approach to inducing
 * rank correlation among input variables", Communications in Statistics – Simulation and
 * Computation 11(3):311–334:
 *
 *   1. S (n × k): each column a random permutation of the van der Waerden scores Φ⁻¹(r/(n+1)).
 *   2. E = corr(S) = Q Qᵀ (Cholesky);  target C = F Fᵀ;  S* = S (F Q⁻¹)ᵀ, so corr(S*) = C exactly.
 *   3. Each variable's values are rearranged so that their ranks are the ranks of its column of S*.
 *
 * The marginals are untouched: with Latin hypercube sampling the value of rank r is still drawn
 * from stratum r, u = (r + v)/n; with plain sampling the column's n uniforms are sorted and dealt
 * out by rank. Each variable draws from its own stream, so the block's result does not depend on
 * which thread computes it.
 */

import { cholesky, invertLower, multiply } from '../math/linalg';
import { normalQuantile } from '../math/normal';
import { createRanker, type Ranker } from '../math/ranks';
import { Sfc32, streamFor } from '../random/sfc32';
import type { Sampling } from '../formats';
import type { CorrelationGroup } from './plan';

export interface InductionScratch {
  capacity: number;
  scores: Float64Array;
  scoresFor: number;
  scoreSumSq: number;
  S: Float64Array;
  column: Float64Array;
  sorted: Float64Array;
  ranker: Ranker;
  rank: Int32Array;
  perm: Int32Array;
  firstPerm: Int32Array;
  rng: Sfc32;
}

export function allocateInduction(maxK: number, capacity: number): InductionScratch {
  return {
    capacity,
    scores: new Float64Array(capacity),
    scoresFor: -1,
    scoreSumSq: 0,
    S: new Float64Array(maxK * capacity),
    column: new Float64Array(capacity),
    sorted: new Float64Array(capacity),
    ranker: createRanker(capacity),
    rank: new Int32Array(capacity),
    perm: new Int32Array(capacity),
    firstPerm: new Int32Array(capacity),
    rng: new Sfc32(),
  };
}

function prepareScores(ws: InductionScratch, n: number): void {
  if (ws.scoresFor === n) return;
  let ss = 0;
  for (let r = 0; r < n; r++) {
    const z = normalQuantile((r + 1) / (n + 1));
    ws.scores[r] = z;
    ss += z * z;
  }
  ws.scoresFor = n;
  ws.scoreSumSq = ss;
}

/** Writes the group's uniforms: member c's n values into columns[c]. */
export function induceGroup(
  group: CorrelationGroup,
  columns: Float64Array[],
  n: number,
  key: Uint32Array,
  block: number,
  sampling: Sampling,
  ws: InductionScratch,
  /** Stream id of each variable (./random/stream-ids). */
  streamIds: Uint32Array,
): void {
  const { k, vars, factor } = group;
  prepareScores(ws, n);
  const { S, scores } = ws;
  for (let c = 0; c < k; c++) {
    // One stream per variable: the score permutation and, from the same draws, the column's
    // LHS jitters or plain uniforms.
    const perm = c === 0 ? ws.firstPerm : ws.perm;
    streamFor(key, block, streamIds[vars[c]], ws.rng).shuffleWithFractions(perm, columns[c], n);
    const off = c * n;
    for (let i = 0; i < n; i++) S[off + i] = scores[perm[i]];
  }
  // E = SᵀS / Σ score², then T = F Q⁻¹ (identity correction when E is singular, e.g. n ≤ k).
  const E = new Float64Array(k * k);
  for (let c = 0; c < k; c++) {
    E[c * k + c] = 1;
    for (let d = 0; d < c; d++) {
      let s = 0;
      const oc = c * n;
      const od = d * n;
      for (let i = 0; i < n; i++) s += S[oc + i] * S[od + i];
      E[c * k + d] = E[d * k + c] = s / ws.scoreSumSq;
    }
  }
  const Q = cholesky(E, k);
  const T = Q ? multiply(factor, invertLower(Q, k), k) : factor;
  const { column, sorted, ranker, rank } = ws;
  const inv = 1 / n;
  let firstIsScaled = T[0] > 0;
  for (let d = 1; d < k; d++) if (T[d] !== 0) firstIsScaled = false;
  for (let c = 0; c < k; c++) {
    let ranks = rank;
    if (c === 0 && firstIsScaled) {
      // S*₀ is a positive multiple of S₀, whose ranks are its permutation (scores increase).
      ranks = ws.firstPerm;
    } else {
      column.fill(0, 0, n);
      for (let d = 0; d < k; d++) {
        const t = T[c * k + d];
        if (t === 0) continue;
        const od = d * n;
        for (let i = 0; i < n; i++) column[i] += t * S[od + i];
      }
      ranker.rank(column, n, rank);
    }
    const u = columns[c];
    if (sampling === 'lhs') {
      for (let i = 0; i < n; i++) u[i] = (ranks[i] + u[i]) * inv;
    } else {
      const s = sorted.subarray(0, n);
      s.set(u.subarray(0, n));
      s.sort();
      for (let i = 0; i < n; i++) u[i] = s[ranks[i]];
    }
  }
}
