// Statistics: percentiles and their distribution-free intervals, binomial intervals, the
// iterations a precision needs, risk steps in the S-curve, contingency, convergence and the
// run-until-precise option.
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { BLOCK_SIZE } from '../block';
import { simulateSync } from '../engine';
import { quantileIntervalRanks } from '../stats/order-statistics';
import { iterationsForPrecision, relativeHalfWidth } from '../stats/precision';
import { wilsonInterval } from '../stats/wilson';
import { fixed, item, model, uniform } from './helpers';

describe('order-statistic intervals', () => {
  // P(x_(l) ≤ ξ_p ≤ x_(u)) = P(l ≤ B ≤ u − 1), B ~ Binomial(n, p) (Conover 1999, §3.2), checked
  // with jstat's binomial distribution function.
  it.each([
    [50, 0.5],
    [200, 0.8],
    [1000, 0.1],
    [10_000, 0.9],
    [100_000, 0.8],
  ])('covers at least 95%% and is not needlessly wide (n = %i, p = %f)', (n, p) => {
    const [l, u] = quantileIntervalRanks(n, p);
    const cover = (lo: number, hi: number) =>
      jStat.binomial.cdf(hi - 1, n, p) - jStat.binomial.cdf(lo - 1, n, p);
    expect(cover(l, u)).toBeGreaterThanOrEqual(0.95 - 1e-9);
    // Moving either end inwards would leave a tail above 2.5%.
    expect(jStat.binomial.cdf(l, n, p)).toBeGreaterThan(0.025);
    expect(jStat.binomial.cdf(u - 2, n, p)).toBeLessThan(0.975);
  });

  // Repeated seeded runs: the 95% interval of P80 should contain the true P80 in about 95% of
  // runs. Uniform(0, 1) has P80 = 0.8. 300 runs: binomial sd 1.3%, band 0.90–0.99.
  it('covers the true P80 in about 95% of repeated runs', () => {
    let hits = 0;
    const runs = 300;
    for (let s = 1; s <= runs; s++) {
      const r = simulateSync(model({ items: [item('C1', uniform(0, 1))] }), {
        iterations: 400,
        seed: s,
        sampling: 'mc',
      });
      const [lo, hi] = r.cost.percentileCI95.P80;
      if (lo <= 0.8 && 0.8 <= hi) hits++;
    }
    expect(hits / runs).toBeGreaterThan(0.9);
    expect(hits / runs).toBeLessThan(0.99);
  });

  // Width of a quantile interval ∝ 1/√n: 16 times the iterations, a quarter of the width.
  it('narrows as 1/√n', () => {
    const width = (n: number) => {
      let w = 0;
      for (const seed of [1, 2, 3, 4]) {
        const r = simulateSync(model({ items: [item('C1', { type: 'normal', mean: 0, sd: 1 })] }), {
          iterations: n,
          seed,
          sampling: 'mc',
        });
        w += r.cost.percentileCI95.P80[1] - r.cost.percentileCI95.P80[0];
      }
      return w;
    };
    const ratio = width(1000) / width(16_000);
    expect(ratio).toBeGreaterThan(3.4);
    expect(ratio).toBeLessThan(4.6);
  });
});

describe('binomial intervals and precision', () => {
  // Wilson intervals from Newcombe (1998), Statistics in Medicine 17:857–872, table II.
  it.each([
    [81, 263, 0.2553, 0.3662],
    [15, 148, 0.0624, 0.1605],
    [0, 20, 0, 0.1611],
    [1, 29, 0.0061, 0.1718],
  ])('Wilson interval of %i/%i', (k, n, lo, hi) => {
    const [a, b] = wilsonInterval(k, n);
    expect(a).toBeCloseTo(lo, 4);
    expect(b).toBeCloseTo(hi, 4);
  });

  // n = ⌈z² p(1 − p)/ε²⌉ (Cochran 1977, §4.4): the textbook 9,604 for p = 0.5, ε = 1%.
  it('iterationsForPrecision', () => {
    expect(iterationsForPrecision(0.5, 0.01)).toBe(9604);
    expect(iterationsForPrecision(0.8, 0.01)).toBe(Math.ceil((1.959963984540054 ** 2 * 0.16) / 1e-4));
    expect(iterationsForPrecision(0.8, 0.01, 0.9)).toBe(Math.ceil((1.6448536269514722 ** 2 * 0.16) / 1e-4));
    expect(() => iterationsForPrecision(0.5, 0)).toThrow(/eps/);
  });
});

describe('a risk event in the S-curve', () => {
  // Cost = 100 + 50·1[occurs], p = 0.3: the distribution function steps from 0 to 0.7 at the base
  // (100) and from 0.7 to 1 at 150.
  const m = model({
    items: [item('C1', fixed(100))],
    risks: [{ id: 'R1', probability: 0.3, cost: fixed(50) }],
    targets: { cost: 100 },
  });

  it('steps by 1 − p at the base with Latin hypercube sampling (exactly, per block)', () => {
    const r = simulateSync(m, { iterations: 10_000, seed: 3 });
    expect(r.cost.base).toBe(100);
    expect(r.cost.probabilityWithinTarget!.value).toBe(0.7);
    expect(r.cost.percentiles.P70).toBe(100);
    expect(r.cost.percentiles.P80).toBe(150);
    expect(r.cost.contingency.P80).toBe(50);
    expect(r.cost.contingency.P50).toBe(0);
    expect(r.cost.mean).toBeCloseTo(115, 10);
  });

  it('steps by about 1 − p with plain Monte Carlo, inside its Wilson interval', () => {
    const r = simulateSync(m, { iterations: 10_000, seed: 3, sampling: 'mc' });
    const p = r.cost.probabilityWithinTarget!;
    expect(Math.abs(p.value - 0.7)).toBeLessThan(4 * Math.sqrt(0.21 / 10_000));
    expect(p.ci95[0]).toBeLessThan(p.value);
    expect(p.ci95[1]).toBeGreaterThan(p.value);
  });
});

describe('joint probability', () => {
  // Independent totals: P(both) = P(cost) · P(duration) = 0.5 · 0.5.
  it('multiplies for independent totals and equals the marginal for comonotone ones', () => {
    const parts = (rho?: number) =>
      model({
        items: [item('C1', uniform(0, 1))],
        activities: [{ id: 'A1', duration: uniform(0, 1) }],
        correlations: rho === undefined ? [] : [{ a: 'C1', b: 'A1', rho }],
        targets: { cost: 0.5, duration: 0.5 },
      });
    const ind = simulateSync(parts(), { iterations: 20_000, seed: 8 });
    expect(Math.abs(ind.joint!.probability - 0.25)).toBeLessThan(0.015);
    const same = simulateSync(parts(1), { iterations: 20_000, seed: 8 });
    expect(Math.abs(same.joint!.probability - 0.5)).toBeLessThan(0.01);
    expect(same.joint!.ci95[0]).toBeLessThan(same.joint!.probability);
  });
});

describe('convergence and precision', () => {
  const m = model({
    items: [item('C1', uniform(0, 10)), item('C2', { type: 'triangular', low: 1, mode: 2, high: 9 })],
  });

  it('gives about 50 checkpoints ending at the final estimates', () => {
    const r = simulateSync(m, { iterations: 10_000, seed: 1 });
    const c = r.convergence;
    expect(c.iterations.length).toBe(50);
    expect(c.iterations.at(-1)).toBe(10_000);
    expect(c.cost.P80.at(-1)).toBe(r.cost.percentiles.P80);
    expect(c.cost.P80ci95.at(-1)).toEqual(r.cost.percentileCI95.P80);
    c.cost.P50.forEach((v, i) => {
      expect(c.cost.P50ci95[i][0]).toBeLessThanOrEqual(v);
      expect(c.cost.P50ci95[i][1]).toBeGreaterThanOrEqual(v);
    });
    // The interval narrows with the iterations.
    const width = (k: number) => c.cost.P80ci95[k][1] - c.cost.P80ci95[k][0];
    expect(width(49)).toBeLessThan(width(4));
  });

  it('keeps running until P80 is known to the wanted precision', () => {
    const r = simulateSync(m, {
      iterations: 1000,
      seed: 1,
      sampling: 'mc',
      precision: { relative: 0.005, maxIterations: 200_000 },
    });
    expect(r.iterations % BLOCK_SIZE).toBe(0);
    expect(r.iterations).toBeGreaterThan(1000);
    expect(relativeHalfWidth(r.cost.percentiles.P80, r.cost.percentileCI95.P80)).toBeLessThanOrEqual(0.005);
    // A run of that size gives the same result: rounds extend one another.
    const fixedRun = simulateSync(m, { iterations: r.iterations, seed: 1, sampling: 'mc' });
    expect(fixedRun.cost).toEqual(r.cost);
  });

  it('stops at the cap with a warning', () => {
    const r = simulateSync(m, {
      iterations: 1000,
      seed: 1,
      precision: { relative: 1e-5, maxIterations: 4500 },
    });
    expect(r.iterations).toBe(4500);
    expect(r.warnings.some((w) => /at the cap of 4500 iterations/.test(w))).toBe(true);
  });
});
