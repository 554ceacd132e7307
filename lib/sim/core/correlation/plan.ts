/**
 * From the model's pairwise target rank correlations to what the sampler needs.
 *
 * 1. Variables linked by correlations form groups (connected components, union–find), each
 *    correlated on its own so that the cost grows with the groups, not with the whole model.
 * 2. A group's target matrix (unlisted pairs 0) must be a valid correlation matrix (positive
 *    semidefinite, checked by its smallest eigenvalue). If it is not, it is replaced by the
 *    nearest correlation matrix (Higham 2002, ./nearest-correlation) and a warning says how much
 *    each pair moved.
 * 3. The rank matrix is mapped to the normal-score scale, r = 2 sin(πρ/6) (./rank-pearson), and
 *    factored as C = F Fᵀ (Cholesky, or clipped eigenvectors if C is only semidefinite) for the
 *    Iman–Conover step (./iman-conover). `used` is F Fᵀ mapped back to the rank scale.
 */

import { cholesky, clipEigenvalues, gram, minEigenvalue, symmetricEigen } from '../math/linalg';
import { nearestCorrelation } from './nearest-correlation';
import { pearsonToSpearman, spearmanToPearson } from './rank-pearson';

export interface CorrelationRequest {
  /** Variable indices (columns of the sampler). */
  a: number;
  b: number;
  rho: number;
}

export interface CorrelationGroup {
  /** Variables of the group, ascending. */
  vars: Int32Array;
  k: number;
  /** k × k row-major factor F with F Fᵀ = the normal-score correlation matrix. */
  factor: Float64Array;
}

export interface CorrelationPlan {
  groups: CorrelationGroup[];
  /** Rank correlation actually used for each request (same order). */
  used: number[];
  warnings: string[];
}

const PSD_TOLERANCE = -1e-10;

function components(requests: CorrelationRequest[]): number[][] {
  const parent = new Map<number, number>();
  const find = (x: number): number => {
    let r = x;
    while (parent.get(r)! !== r) r = parent.get(r)!;
    while (parent.get(x)! !== r) {
      const nx = parent.get(x)!;
      parent.set(x, r);
      x = nx;
    }
    return r;
  };
  for (const { a, b } of requests) {
    if (!parent.has(a)) parent.set(a, a);
    if (!parent.has(b)) parent.set(b, b);
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) parent.set(Math.max(ra, rb), Math.min(ra, rb));
  }
  const groups = new Map<number, number[]>();
  for (const v of [...parent.keys()].sort((x, y) => x - y)) {
    const r = find(v);
    if (!groups.has(r)) groups.set(r, []);
    groups.get(r)!.push(v);
  }
  return [...groups.values()];
}

/** F with F Fᵀ = C: Cholesky when C is positive definite, else V·√max(Λ, 0) with unit rows. */
function factorCorrelation(C: Float64Array, k: number): Float64Array {
  const L = cholesky(C, k);
  if (L) return L;
  const { values, vectors } = symmetricEigen(C, k);
  const F = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    let norm = 0;
    for (let m = 0; m < k; m++) {
      const f = vectors[i * k + m] * Math.sqrt(Math.max(values[m], 0));
      F[i * k + m] = f;
      norm += f * f;
    }
    const s = norm > 0 ? 1 / Math.sqrt(norm) : 0;
    for (let m = 0; m < k; m++) F[i * k + m] *= s;
  }
  return F;
}

export function planCorrelations(
  requests: CorrelationRequest[],
  label: (variable: number) => string,
): CorrelationPlan {
  const used = requests.map((r) => r.rho);
  const warnings: string[] = [];
  const groups: CorrelationGroup[] = [];
  for (const vars of components(requests)) {
    const k = vars.length;
    const pos = new Map(vars.map((v, i) => [v, i]));
    const mine = requests.map((r, i) => ({ r, i })).filter(({ r }) => pos.has(r.a));
    let target: Float64Array = new Float64Array(k * k);
    for (let i = 0; i < k; i++) target[i * k + i] = 1;
    for (const { r } of mine) {
      const i = pos.get(r.a)!;
      const j = pos.get(r.b)!;
      target[i * k + j] = r.rho;
      target[j * k + i] = r.rho;
    }
    const repaired = minEigenvalue(target, k) < PSD_TOLERANCE;
    if (repaired) target = nearestCorrelation(target, k);
    let normal: Float64Array = target.map((x) => spearmanToPearson(x));
    for (let i = 0; i < k; i++) normal[i * k + i] = 1;
    const normalRepaired = minEigenvalue(normal, k) < PSD_TOLERANCE;
    if (normalRepaired) normal = nearestCorrelation(normal, k);
    if (minEigenvalue(normal, k) < 0) normal = clipEigenvalues(normal, k, 0);
    const factor = factorCorrelation(normal, k);
    const achievedNormal = gram(factor, k);
    const moved: string[] = [];
    for (const { r, i } of mine) {
      const a = pos.get(r.a)!;
      const b = pos.get(r.b)!;
      used[i] = pearsonToSpearman(achievedNormal[a * k + b]);
      if (Math.abs(used[i] - r.rho) > 0.005) {
        moved.push(`${label(r.a)}–${label(r.b)} ${r.rho} → ${used[i].toFixed(2)}`);
      }
    }
    if (!repaired && normalRepaired) {
      warnings.push(
        `The correlations among ${vars.map(label).join(', ')} are valid as rank correlations but ` +
          `not on the normal-score scale the sampler works on; the nearest valid matrix there is ` +
          `used (Higham 2002)` +
          (moved.length ? `: ${moved.join('; ')}.` : '.'),
      );
    }
    if (repaired) {
      warnings.push(
        `The correlations among ${vars.map(label).join(', ')} do not form a valid correlation matrix; ` +
          `the nearest valid one is used (Higham 2002)` +
          (moved.length ? `: ${moved.join('; ')}.` : '.'),
      );
    }
    groups.push({ vars: Int32Array.from(vars), k, factor });
  }
  return { groups, used, warnings };
}
