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
