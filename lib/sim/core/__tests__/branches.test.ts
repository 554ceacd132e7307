// Probabilistic branches ("existence": p): the activity happens in a share p of the iterations
// (a Bernoulli trial, sampled from its own uniform as a risk is); where it does not, its duration
// and its time-dependent costs are 0 and its links still pass through. Checked against the
// Bernoulli distribution with binomial bounds (4 standard errors, √(p(1 − p)/n)), and the
// correlation against the Fréchet–Hoeffding bounds on P(both) (Fréchet 1951).
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import type { Model, ModelActivity } from '../formats';
import { validateModel } from '../validate';
import { fixed } from './helpers';

const N = 20_000;
const fourSe = (p: number) => 4 * Math.sqrt((p * (1 - p)) / N);

const chain = (existence: number, lag = 0, extra: Partial<Model> = {}): Model => ({
  format: 'outturn-model',
  version: 2,
  items: [],
  activities: [
    { id: 'A1', duration: fixed(10) },
    { id: 'A2', duration: fixed(5), existence, predecessors: [{ id: 'A1', lag }] },
    { id: 'A3', duration: fixed(10), predecessors: ['A2'] },
  ] as ModelActivity[],
  ...extra,
});

describe('a branch with probability p', () => {
  it('puts a step of height p in the finish S-curve', () => {
    // 10 + 10 = 20 days without A2, 25 with it: P(T ≤ 20) = 1 − p and P(T ≤ 25) = 1, a step of
    // height p = 0.3 at 25 days (Bernoulli(p)).
    const res = simulateSync(chain(0.3, 0, { targets: { duration: 24.99 } }), {
      iterations: N,
      seed: 11,
      sampling: 'mc',
    });
    const below = res.duration!.probabilityWithinTarget!.value;
    expect(Math.abs(1 - below - 0.3)).toBeLessThan(fourSe(0.3));
    expect(res.duration!.min).toBe(20);
    expect(res.duration!.max).toBe(25);
    expect(res.duration!.percentiles.P60).toBe(20);
    expect(res.duration!.percentiles.P80).toBe(25);
    // Left out of the base, as a risk event is.
    expect(res.duration!.base).toBe(20);
  });

  it('lets its links pass through where it is absent: the lag still counts', () => {
    // With A2 absent, A3 starts at 10 + 2 (FS+2 into A2) + 0: T = 22; with it, 27.
    const res = simulateSync(chain(0.5, 2), { iterations: 2000, seed: 3 });
    expect(res.duration!.min).toBe(22);
    expect(res.duration!.max).toBe(27);
  });

  it('zeroes its time-dependent costs and the delays of risks on it where it is absent', () => {
    // C1 costs 100 a day of A2 (5 days, plus a sure 3-day delay from R1): 800 when A2 happens,
    // 0 otherwise, so the mean cost is 0.4 × 800 = 320 (Bernoulli mean, ± 4 standard errors).
    const res = simulateSync(
      chain(0.4, 0, {
        items: [{ id: 'C1', ratePerDay: 100, activity: 'A2' }],
        risks: [{ id: 'R1', probability: 1, delay: fixed(3), activities: ['A2'] }],
      }),
      { iterations: N, seed: 4, sampling: 'mc' },
    );
    expect(Math.abs(res.cost.mean - 320)).toBeLessThan(800 * fourSe(0.4));
    expect(res.duration!.min).toBe(20);
    expect(res.duration!.max).toBe(28);
  });

  it('is correlated with a risk through the name "A2 (existence)"', () => {
    // R1 (p = 0.3, costs 1,000) and the branch A2 (p = 0.3, 500 of time-dependent cost) with
    // ρ = 0.95: independent they would both happen with P = 0.09; the Fréchet–Hoeffding upper
    // bound is min(p, p) = 0.3, and a strong positive dependence comes close to it.
    const model = chain(0.3, 0, {
      items: [{ id: 'C1', ratePerDay: 100, activity: 'A2' }],
      risks: [{ id: 'R1', probability: 0.3, cost: fixed(1000) }],
      correlations: [{ a: 'R1', b: 'A2 (existence)', rho: 0.95 }],
      targets: { cost: 1499 },
    });
    const res = simulateSync(model, { iterations: N, seed: 5, sampling: 'mc' });
    const both = 1 - res.cost.probabilityWithinTarget!.value;
    expect(both).toBeGreaterThan(0.22);
    expect(both).toBeLessThanOrEqual(0.3 + fourSe(0.3));
    const uncorrelated = simulateSync(
      { ...model, correlations: [] },
      { iterations: N, seed: 5, sampling: 'mc' },
    );
    expect(Math.abs(1 - uncorrelated.cost.probabilityWithinTarget!.value - 0.09)).toBeLessThan(fourSe(0.09));
  });

  it('never happens at 0 and always at 1 (with a warning at 0)', () => {
    const never = simulateSync(chain(0), { iterations: 500, seed: 1 });
    expect(never.duration!.max).toBe(20);
    expect(never.warnings).toContain('A2: existence 0, so the activity never happens (0 days).');
    const always = simulateSync(chain(1), { iterations: 500, seed: 1 });
    expect(always.duration!.min).toBe(25);
  });

  it('refuses an existence outside [0, 1], naming the activity', () => {
    const res = validateModel(chain(1.5));
    expect(res.ok).toBe(false);
    if (!res.ok) expect(res.issues[0].path).toBe('activities[1] (A2).existence');
  });
});
