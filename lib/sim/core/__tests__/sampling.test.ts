// Sampling: the seeded streams, Latin hypercube stratification, and a probability known in
// closed form for a bivariate standard normal.
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import { normalQuantile } from '../math/normal';
import { fillLatinHypercube, fillMonteCarlo } from '../random/columns';
import { runKeyFromSeed } from '../random/run-key';
import { streamFor } from '../random/sfc32';
import { item, model, normal, sampleSd, uniform } from './helpers';

const key = runKeyFromSeed(2024);

describe('streams', () => {
  it('are uniform with mean 1/2 and variance 1/12, and uncorrelated across variables and blocks', () => {
    const n = 100_000;
    const a = new Float64Array(n);
    const b = new Float64Array(n);
    const c = new Float64Array(n);
    fillMonteCarlo(streamFor(key, 0, 0), a, n);
    fillMonteCarlo(streamFor(key, 0, 1), b, n);
    fillMonteCarlo(streamFor(key, 1, 0), c, n);
    const mean = a.reduce((s, x) => s + x, 0) / n;
    const variance = a.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1);
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(0.002);
    const corr = (x: Float64Array, y: Float64Array) => {
      let s = 0;
      for (let i = 0; i < n; i++) s += (x[i] - 0.5) * (y[i] - 0.5);
      return (s / n) * 12;
    };
    expect(Math.abs(corr(a, b))).toBeLessThan(0.015);
    expect(Math.abs(corr(a, c))).toBeLessThan(0.015);
    expect(Math.min(...a)).toBeGreaterThan(0);
    expect(Math.max(...a)).toBeLessThan(1);
  });

  it('depend on the seed, the block and the variable only', () => {
    const draw = (k: Uint32Array, block: number, v: number) => {
      const out = new Float64Array(5);
      fillMonteCarlo(streamFor(k, block, v), out, 5);
      return Array.from(out);
    };
    expect(draw(key, 3, 7)).toEqual(draw(runKeyFromSeed(2024), 3, 7));
    expect(draw(key, 3, 7)).not.toEqual(draw(key, 3, 8));
    expect(draw(key, 3, 7)).not.toEqual(draw(runKeyFromSeed(2025), 3, 7));
  });
});

describe('bivariate standard normal', () => {
  // For independent Z1, Z2 ~ N(0, 1), Z1² + Z2² ~ χ²₂, so P(Z1² + Z2² ≤ r²) = 1 − exp(−r²/2).
  it.each([0.5, 1, 2])('lands within radius %f with probability 1 − exp(−r²/2)', (r) => {
    const n = 1000;
    const blocks = 200;
    const u = new Float64Array(n);
    const v = new Float64Array(n);
    const perm = new Int32Array(n);
    let inside = 0;
    for (let b = 0; b < blocks; b++) {
      fillLatinHypercube(streamFor(key, b, 0), u, n, perm);
      fillLatinHypercube(streamFor(key, b, 1), v, n, perm);
      for (let i = 0; i < n; i++)
        if (normalQuantile(u[i]) ** 2 + normalQuantile(v[i]) ** 2 <= r * r) inside++;
    }
    const p = 1 - Math.exp((-r * r) / 2);
    expect(Math.abs(inside / (n * blocks) - p)).toBeLessThan(4 * Math.sqrt((p * (1 - p)) / (n * blocks)));
  });
});

describe('Latin hypercube', () => {
  it('puts exactly one value in each of the n strata of a block', () => {
    const n = 1000;
    const u = new Float64Array(n);
    fillLatinHypercube(streamFor(key, 5, 2), u, n, new Int32Array(n));
    const strata = new Set(Array.from(u, (x) => Math.floor(x * n)));
    expect(strata.size).toBe(n);
  });

  // Stratification removes the additive part of the variance of an estimated mean (McKay,
  // Beckman & Conover 1979, theorem 2): at the same n its spread is far smaller than plain MC.
  it('estimates the mean with a smaller spread than plain Monte Carlo', () => {
    const m = model({
      items: [
        item('C1', uniform(10, 20)),
        item('C2', normal(30, 5)),
        item('C3', { type: 'pert', low: 1, mode: 4, high: 12 }),
      ],
    });
    const means = (sampling: 'mc' | 'lhs') =>
      Array.from(
        { length: 40 },
        (_, s) => simulateSync(m, { iterations: 500, seed: s + 1, sampling }).cost.mean,
      );
    const lhs = sampleSd(means('lhs'));
    const mc = sampleSd(means('mc'));
    expect(lhs).toBeLessThan(0.3 * mc);
  });
});
