// Correlation: the nearest correlation matrix (Higham 2002), the rank/Pearson conversion, the
// variance of sums of correlated normals, repair warnings and group handling.
import { describe, expect, it } from 'vitest';
import { compileModel } from '../compile';
import { nearestCorrelation } from '../correlation/nearest-correlation';
import { pearsonToSpearman, spearmanToPearson } from '../correlation/rank-pearson';
import { simulateSync } from '../engine';
import { minEigenvalue } from '../math/linalg';
import { parseModel } from '../validate';
import { item, model, normal, uniform } from './helpers';

describe('nearest correlation matrix', () => {
  // Higham (2002), IMA J. Numer. Anal. 22:329–343, §4 example: A = [[1,1,0],[1,1,1],[0,1,1]] has
  // nearest correlation matrix [[1, .7607, .1573], [.7607, 1, .7607], [.1573, .7607, 1]]
  // (values quoted from memory of the paper's example, hence the 1e-3 tolerance).
  it("reproduces Higham's published example", () => {
    const X = nearestCorrelation(Float64Array.of(1, 1, 0, 1, 1, 1, 0, 1, 1), 3);
    const expected = [1, 0.7607, 0.1573, 0.7607, 1, 0.7607, 0.1573, 0.7607, 1];
    expected.forEach((v, i) => expect(Math.abs(X[i] - v)).toBeLessThan(1e-3));
    expect(minEigenvalue(X, 3)).toBeGreaterThan(-1e-8);
  });

  it('leaves a valid correlation matrix as it is', () => {
    const A = Float64Array.of(1, 0.5, 0.2, 0.5, 1, 0.3, 0.2, 0.3, 1);
    const X = nearestCorrelation(A, 3);
    A.forEach((v, i) => expect(X[i]).toBeCloseTo(v, 8));
  });
});

describe('rank and Pearson scales', () => {
  // ρ = (6/π) arcsin(r/2) for the bivariate normal (Pearson 1907; Kruskal 1958).
  it('converts both ways and keeps 0 and ±1', () => {
    for (const rho of [-1, -0.7, -0.2, 0, 0.3, 0.8, 1])
      expect(pearsonToSpearman(spearmanToPearson(rho))).toBeCloseTo(rho, 12);
    expect(spearmanToPearson(1)).toBeCloseTo(1, 15);
    expect(spearmanToPearson(0.5)).toBeCloseTo(2 * Math.sin(Math.PI / 12), 15);
  });
});

describe('sums of normals', () => {
  const n = 40_000;
  const run = (rho: number | null) =>
    simulateSync(
      model({
        items: [item('C1', normal(100, 10)), item('C2', normal(200, 20))],
        correlations: rho === null ? [] : [{ a: 'C1', b: 'C2', rho }],
      }),
      { iterations: n, seed: 3 },
    );

  // Var(X + Y) = σ1² + σ2² + 2rσ1σ2; with normal scores, the Pearson r of two normal inputs is
  // r = 2 sin(πρ/6) for the target rank correlation ρ.
  it.each([null, 0.6, -0.4])('has the variance of the formula (rho %s)', (rho) => {
    const r = rho === null ? 0 : spearmanToPearson(rho);
    const expected = 10 ** 2 + 20 ** 2 + 2 * r * 10 * 20;
    const result = run(rho);
    expect(result.cost.mean).toBeCloseTo(300, 0);
    // sd of a sample variance ≈ σ²√(2/n) ≈ 0.7%; allow 3%.
    expect(Math.abs(result.cost.sd ** 2 / expected - 1)).toBeLessThan(0.03);
    if (rho !== null) {
      expect(result.achievedCorrelations[0].achieved).not.toBeNull();
      expect(Math.abs(result.achievedCorrelations[0].achieved! - rho)).toBeLessThan(0.02);
      expect(result.achievedCorrelations[0].used).toBeCloseTo(rho, 10);
    }
  });
});

describe('invalid coefficient sets', () => {
  const inconsistent = model({
    items: [item('C1', uniform(0, 1)), item('C2', uniform(0, 1)), item('C3', uniform(0, 1))],
    correlations: [
      { a: 'C1', b: 'C2', rho: 0.9 },
      { a: 'C2', b: 'C3', rho: 0.9 },
      { a: 'C1', b: 'C3', rho: -0.9 },
    ],
  });

  it('repairs to the nearest valid matrix, reports used beside target and warns', () => {
    const r = simulateSync(inconsistent, { iterations: 20_000, seed: 9 });
    expect(r.warnings.some((w) => /C1, C2, C3 do not form a valid correlation matrix/.test(w))).toBe(true);
    for (const c of r.achievedCorrelations) {
      expect(Math.abs(c.used - c.target)).toBeGreaterThan(0.05);
      expect(Math.abs(c.achieved! - c.used)).toBeLessThan(0.03);
    }
    // The used coefficients form a valid correlation matrix.
    const [a, b, c] = r.achievedCorrelations.map((x) => spearmanToPearson(x.used));
    expect(minEigenvalue(Float64Array.of(1, a, c, a, 1, b, c, b, 1), 3)).toBeGreaterThan(-1e-8);
  });

  it('keeps unrelated groups apart', () => {
    const plan = compileModel(
      parseModel(
        model({
          items: ['C1', 'C2', 'C3', 'C4', 'C5'].map((id) => item(id, uniform(0, 1))),
          correlations: [
            { a: 'C1', b: 'C2', rho: 0.5 },
            { a: 'C4', b: 'C5', rho: 0.3 },
          ],
        }),
      ),
    );
    expect(plan.groups.map((g) => g.k)).toEqual([2, 2]);
    expect(plan.warnings).toEqual([]);
  });

  it('ignores a correlation with a fixed input, with a warning', () => {
    const r = simulateSync(
      model({
        items: [item('C1', uniform(0, 1)), item('C2', { type: 'fixed', value: 3 })],
        correlations: [{ a: 'C1', b: 'C2', rho: 0.5 }],
      }),
      { iterations: 1000, seed: 1 },
    );
    expect(r.achievedCorrelations[0]).toMatchObject({
      a: 'C1',
      b: 'C2',
      target: 0.5,
      used: 0,
      achieved: null,
    });
    expect(r.warnings).toContain('C1–C2: C2 has no spread, so this correlation is ignored.');
  });

  it('warns when many items have no correlation at all', () => {
    const many = model({ items: Array.from({ length: 10 }, (_, i) => item(`C${i + 1}`, uniform(1, 2))) });
    expect(simulateSync(many, { iterations: 100, seed: 1 }).warnings.join(' ')).toMatch(
      /10 line items and no correlations/,
    );
    const few = model({ items: Array.from({ length: 9 }, (_, i) => item(`C${i + 1}`, uniform(1, 2))) });
    expect(simulateSync(few, { iterations: 100, seed: 1, sampling: 'mc' }).warnings).toEqual([]);
  });
});

describe('correlating risks and activities', () => {
  // A risk id correlates its impact severity (shared by its cost and delay); activities their durations.
  it('induces the rank correlation between an activity and a risk impact', () => {
    const r = simulateSync(
      model({
        activities: [{ id: 'A1', duration: uniform(10, 20) }],
        risks: [
          { id: 'R1', probability: 0.5, cost: uniform(100, 200), delay: uniform(1, 5), activity: 'A1' },
        ],
        correlations: [{ a: 'A1', b: 'R1', rho: 0.7 }],
      }),
      { iterations: 20_000, seed: 4 },
    );
    expect(Math.abs(r.achievedCorrelations[0].achieved! - 0.7)).toBeLessThan(0.02);
  });
});
