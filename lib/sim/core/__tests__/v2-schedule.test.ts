// Schedule in version 2: the project duration is the latest finish of any activity, and an
// activity is critical when its total float is zero, so tied paths all count whatever the order
// of predecessors; the schedule sensitivity index on a chain.
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import type { Model, ModelActivity } from '../formats';
import { fixed, uniform } from './helpers';

const v2 = (activities: ModelActivity[]): Model => ({
  format: 'outturn-model',
  version: 2,
  items: [],
  activities,
});

describe('criticality by total float', () => {
  it.each([
    ['A2', 'A3'],
    ['A3', 'A2'],
  ])('counts both of two tied parallel paths (predecessors %s, %s)', (first, second) => {
    // Two equal paths between A1 and A4: both have zero total float (critical path method,
    // Kelley & Walker 1959), so both are critical in every iteration.
    const res = simulateSync(
      v2([
        { id: 'A1', duration: uniform(5, 10) },
        { id: 'A2', duration: fixed(7), predecessors: ['A1'] },
        { id: 'A3', duration: fixed(7), predecessors: ['A1'] },
        { id: 'A4', duration: fixed(3), predecessors: [first, second] },
      ]),
      { iterations: 2000, seed: 1 },
    );
    expect(res.criticality).toEqual({ A1: 1, A2: 1, A3: 1, A4: 1 });
  });

  it('takes the latest finish of any activity with a negative lag, and the other path has float', () => {
    // A2 starts 4 days before A1 ends and lasts 2: it finishes at 8 while A1 finishes at 10, so
    // the project lasts 10 days (the latest finish), A1 is critical and A2 has 2 days of float.
    const res = simulateSync(
      v2([
        { id: 'A1', duration: fixed(10) },
        { id: 'A2', duration: fixed(2), predecessors: [{ id: 'A1', lag: -4 }] },
      ]),
      { iterations: 1000, seed: 1 },
    );
    expect(res.duration!.mean).toBe(10);
    expect(res.duration!.base).toBe(10);
    expect(res.criticality).toEqual({ A1: 1, A2: 0 });
  });

  it('shares criticality between paths by how often each is the longest', () => {
    // A1 ~ U(0, 10) and A2 = 5 in parallel: A1 is critical when it exceeds 5, half the time.
    const res = simulateSync(
      v2([
        { id: 'A1', duration: uniform(0, 10) },
        { id: 'A2', duration: fixed(5) },
      ]),
      { iterations: 10_000, seed: 2 },
    );
    expect(res.criticality.A1).toBeCloseTo(0.5, 2);
    expect(res.criticality.A2).toBeCloseTo(0.5, 2);
  });
});

describe('schedule sensitivity index', () => {
  it('on a chain is sd(activity)/sd(project)', () => {
    // SSI = criticality × sd(activity duration)/sd(project duration) (the index's definition).
    // On a chain every activity is critical and var(project) = Σ var(activity), so with
    // U(0, 10) and U(0, 20): SSI = 10/√500 and 20/√500.
    const res = simulateSync(
      v2([
        { id: 'A1', duration: uniform(0, 10) },
        { id: 'A2', duration: uniform(0, 20), predecessors: ['A1'] },
      ]),
      { iterations: 20_000, seed: 3 },
    );
    const ssi = Object.fromEntries(res.sensitivity.duration.map((e) => [e.id, e.ssi]));
    expect(ssi.A1).toBeCloseTo(10 / Math.sqrt(500), 2);
    expect(ssi.A2).toBeCloseTo(20 / Math.sqrt(500), 2);
  });
});

describe('the schedule before and after mitigation', () => {
  // Two parallel paths, A1 (4–10 days) and A2 (fixed 7), both ahead of A3 (fixed 1): in each
  // iteration the longer one is critical (critical path method, Kelley & Walker 1959), so A1's
  // criticality is P(A1 > 7) = 3/6 = 0.5 for a uniform duration, A2's the rest and A3's 1.
  const withRisk = (post: NonNullable<Model['risks']>[number]['post']): Model => ({
    ...v2([
      { id: 'A1', duration: uniform(4, 10) },
      { id: 'A2', duration: fixed(7) },
      { id: 'A3', duration: fixed(1), predecessors: ['A1', 'A2'] },
    ]),
    risks: [{ id: 'R1', probability: 0.4, cost: uniform(100, 200), delay: fixed(2), activity: 'A3', post }],
  });

  it('is the same in both scenarios when the mitigation changes only the cost', () => {
    const res = simulateSync(withRisk({ cost: uniform(10, 20) }), { iterations: 20_000, seed: 5 });
    const { pre, post } = res.mitigation!;
    expect(post.duration).toEqual(pre.duration);
    // A fixed 2-day delay in 40% of the iterations: the mean rises by 0.8 day over the paths'
    // mean max(A1, 7) + 1 = 0.5·7 + 0.5·8.5 + 1 = 8.75 (uniform: E[A1 | A1 > 7] = 8.5).
    expect(pre.duration!.mean).toBeCloseTo(8.75 + 0.8, 1);
    expect(res.criticality.A1).toBeCloseTo(0.5, 2);
    expect(res.criticality.A2).toBeCloseTo(0.5, 2);
    expect(res.criticality.A3).toBe(1);
  });

  it('differs by the mitigated delay when the mitigation changes the delay', () => {
    const res = simulateSync(withRisk({ delay: fixed(1) }), { iterations: 20_000, seed: 5 });
    const { pre, post } = res.mitigation!;
    // The same iterations with the risk (common random numbers): 0.4 × (2 − 1) = 0.4 day less.
    expect(pre.duration!.mean - post.duration!.mean).toBeCloseTo(0.4, 6);
    expect(res.criticality.A3).toBe(1);
  });
});
