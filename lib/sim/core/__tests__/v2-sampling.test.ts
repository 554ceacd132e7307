// Sampling semantics of version 2, checked against outside references: correlated occurrence
// (Sheppard's formula), drivers (uniform and triangular moments), opportunities, project-span
// costs, mitigation on common random numbers, streams keyed by input id.
import { describe, expect, it } from 'vitest';
import { blockLength, simulateBlock } from '../block';
import { prepareRun, simulateSync } from '../engine';
import type { Model } from '../formats';
import { fixed, uniform } from './helpers';

const v2 = (parts: Partial<Model>): Model => ({ format: 'outturn-model', version: 2, items: [], ...parts });

describe('risks from one uniform each', () => {
  it('makes correlated risks occur together: Sheppard’s formula for both above the median', () => {
    // Two risks of probability ½, fixed cost 1 each: both occur when both uniforms exceed ½.
    // The sampler correlates normal scores with r = 2 sin(πρ/6) (Pearson 1907), and for a
    // bivariate normal P(X > 0, Y > 0) = 1/4 + asin(r)/(2π) (Sheppard 1899).
    const rho = 0.6;
    const r = 2 * Math.sin((Math.PI * rho) / 6);
    const expected = 0.25 + Math.asin(r) / (2 * Math.PI);
    const m = v2({
      risks: [
        { id: 'R1', probability: 0.5, cost: fixed(1) },
        { id: 'R2', probability: 0.5, cost: fixed(1) },
      ],
      correlations: [{ a: 'R1', b: 'R2', rho }],
      targets: { cost: 1.5 },
    });
    const res = simulateSync(m, { iterations: 100_000, seed: 4, sampling: 'mc' });
    const both = 1 - res.cost.probabilityWithinTarget!.value;
    // Binomial standard error at n = 100 000 is about 0.0015.
    expect(Math.abs(both - expected)).toBeLessThan(0.006);
    expect(Math.abs(both - 0.25)).toBeGreaterThan(0.08); // not the independent value
    expect(res.warnings.join(' ')).not.toMatch(/no spread/);
    expect(res.achievedCorrelations[0].achieved).not.toBeNull();
  });

  it('sizes a risk by F⁻¹((u − (1 − p))/p): the mean impact is p·E[size]', () => {
    // E[impact] = p·E[size] for a Bernoulli(p) event with an independent size (law of total expectation).
    const res = simulateSync(v2({ risks: [{ id: 'R1', probability: 0.25, cost: uniform(100, 300) }] }), {
      iterations: 40_000,
      seed: 2,
    });
    expect(res.cost.mean).toBeCloseTo(0.25 * 200, 0);
    // P80 of "0 with probability 0.75, else U(100, 300)" = 100 + 200·(0.8 − 0.75)/0.25 = 140.
    expect(res.cost.percentiles.P80).toBeCloseTo(140, -0.5);
  });
});

describe('drivers', () => {
  it('multiply an item by a uniform factor: mean (a + b)/2, sd (b − a)/√12', () => {
    // Uniform moments (any handbook, e.g. Johnson, Kotz & Balakrishnan, vol. 2, ch. 26).
    const res = simulateSync(
      v2({
        items: [{ id: 'C1', dist: fixed(100) }],
        drivers: [{ id: 'D1', factor: uniform(1, 1.5), applies: ['C1'] }],
      }),
      { iterations: 20_000, seed: 3 },
    );
    expect(res.cost.mean).toBeCloseTo(125, 1);
    expect(res.cost.sd).toBeCloseTo((100 * 0.5) / Math.sqrt(12), 1);
    expect(res.cost.base).toBe(100); // drivers act only in the simulation
  });

  it('act only when they occur, and several drivers multiply (triangular moments)', () => {
    // Triangular mean (a + m + b)/3 (Johnson, Kotz & Balakrishnan, vol. 2, ch. 26); a driver of
    // probability q gives E[factor] = 1 − q + q·E[F]; independent drivers multiply their means.
    const tri = { type: 'triangular' as const, low: 0.9, mode: 1, high: 1.4 };
    const res = simulateSync(
      v2({
        items: [{ id: 'C1', dist: fixed(100) }],
        activities: [{ id: 'A1', duration: fixed(10) }],
        drivers: [
          { id: 'D1', probability: 0.4, factor: tri, applies: ['C1', 'A1'] },
          { id: 'D2', factor: uniform(1, 1.5), applies: ['C1'] },
        ],
      }),
      { iterations: 40_000, seed: 8 },
    );
    const eTri = (0.9 + 1 + 1.4) / 3;
    const eD1 = 0.6 + 0.4 * eTri;
    expect(res.cost.mean).toBeCloseTo(100 * eD1 * 1.25, 0);
    expect(res.duration!.mean).toBeCloseTo(10 * eD1, 1);
    expect(res.sensitivity.duration.map((e) => [e.id, e.kind])).toEqual([['D1', 'driver']]);
  });
});

describe('opportunities and several activities', () => {
  it('shortens an activity by a negative delay, never below zero days', () => {
    // d = max(0, 3 + X), X ~ U(−6, 0) always: P(d = 0) = ½ and E[d] = ∫₋₃⁰ (3 + x)/6 dx = 0.75.
    const res = simulateSync(
      v2({
        activities: [{ id: 'A1', duration: fixed(3) }],
        risks: [{ id: 'R1', probability: 1, delay: uniform(-6, 0), activities: ['A1'] }],
      }),
      { iterations: 20_000, seed: 1 },
    );
    expect(res.duration!.min).toBe(0);
    expect(res.duration!.percentiles.P40).toBe(0);
    expect(res.duration!.mean).toBeCloseTo(0.75, 2);
  });

  it('lengthens each listed activity, and a project-span cost runs with the whole duration', () => {
    // A1 → A2, 10 days each, a certain 5-day delay on both: 30 days; 7 per day over the project.
    const res = simulateSync(
      v2({
        items: [{ id: 'C1', ratePerDay: 7, span: 'project' }],
        activities: [
          { id: 'A1', duration: fixed(10) },
          { id: 'A2', duration: fixed(10), predecessors: ['A1'] },
        ],
        risks: [{ id: 'R1', probability: 1, delay: fixed(5), activities: ['A1', 'A2'] }],
      }),
      { iterations: 2000, seed: 1 },
    );
    expect(res.duration!.mean).toBe(30);
    expect(res.cost.mean).toBe(210);
    expect(res.cost.base).toBe(140);
  });

  it('costs a project-span rate × a uniform duration: mean rate·(a + b)/2', () => {
    const res = simulateSync(
      v2({
        items: [{ id: 'C1', ratePerDay: 10, span: 'project' }],
        activities: [{ id: 'A1', duration: uniform(10, 20) }],
      }),
      { iterations: 20_000, seed: 6 },
    );
    expect(res.cost.mean).toBeCloseTo(150, 1);
    expect(res.sensitivity.cost.map((e) => [e.id, e.kind])).toEqual([['A1', 'activity']]);
  });

  it('lists a delay-only risk in the cost tornado when its activity carries a time-dependent cost', () => {
    const res = simulateSync(
      v2({
        items: [{ id: 'C1', ratePerDay: 10, activity: 'A1' }],
        activities: [{ id: 'A1', duration: fixed(10) }],
        risks: [{ id: 'R1', probability: 0.5, delay: uniform(1, 5), activities: ['A1'] }],
      }),
      { iterations: 5000, seed: 6 },
    );
    const r1 = res.sensitivity.cost.find((e) => e.id === 'R1');
    expect(r1?.kind).toBe('risk');
    expect(r1!.rankCorrelation).toBeGreaterThan(0.8);
  });
});

describe('mitigation on common random numbers', () => {
  // A Bernoulli step: cost 100 with probability 0.3 before, 0.1 after, the response costs 5.
  const m = v2({
    risks: [{ id: 'R1', probability: 0.3, cost: fixed(100), post: { probability: 0.1 }, mitigationCost: 5 }],
  });
  const res = simulateSync(m, { iterations: 10_000, seed: 12 });

  it('reports both scenarios, the post one in the headline', () => {
    const { pre, post, used } = res.mitigation!;
    expect(used).toBe('post');
    // Step distribution: P_k = 0 while k ≤ 1 − p, else the impact (the definition of a quantile).
    expect([pre.cost.percentiles.P50, pre.cost.percentiles.P80]).toEqual([0, 100]);
    expect([post.cost.percentiles.P80, post.cost.percentiles.P95]).toEqual([5, 105]);
    // Latin hypercube strata make the shares exact: E = 0.3·100 before, 0.1·100 + 5 after.
    expect(pre.cost.mean).toBeCloseTo(30, 6);
    expect(post.cost.mean).toBeCloseTo(15, 6);
    expect(res.cost.percentiles).toEqual(post.cost.percentiles);
  });

  it('gives the pre scenario in the headline when the settings ask for it', () => {
    const pre = simulateSync({ ...m, settings: { mitigation: 'pre' } }, { iterations: 10_000, seed: 12 });
    expect(pre.mitigation!.used).toBe('pre');
    expect(pre.cost.mean).toBeCloseTo(30, 6);
    expect(pre.mitigation!.post).toEqual(res.mitigation!.post);
  });
});

describe('streams keyed by input id', () => {
  it('adding a line re-draws no other input: the totals differ by that line alone', () => {
    const base = v2({
      items: [
        { id: 'C1', dist: { type: 'normal', mean: 1000, sd: 100 } },
        { id: 'C2', dist: uniform(50, 80) },
      ],
      risks: [{ id: 'R1', probability: 0.3, cost: uniform(100, 200) }],
    });
    const added = { ...base, items: [{ id: 'C0', dist: uniform(0, 1) }, ...base.items] };
    for (const sampling of ['mc', 'lhs'] as const) {
      const a = prepareRun(base, { iterations: 3000, seed: 21, sampling });
      const b = prepareRun(added, { iterations: 3000, seed: 21, sampling });
      for (let block = 0; block < 2; block++) {
        const n = blockLength(block, 3000);
        const sink = () => ({
          cost: new Float64Array(n),
          duration: new Float64Array(0),
          grades: new Uint16Array(0),
        });
        const sa = { ...sink(), grades: new Uint16Array(a.plan.sensitivity.length * n) };
        const sb = { ...sink(), grades: new Uint16Array(b.plan.sensitivity.length * n) };
        simulateBlock(a.plan, a.key, sampling, block, n, sa);
        simulateBlock(b.plan, b.key, sampling, block, n, sb);
        for (let i = 0; i < n; i++) {
          const d = sb.cost[i] - sa.cost[i];
          expect(d > 0 && d < 1 + 1e-9).toBe(true);
        }
      }
    }
  });
});
