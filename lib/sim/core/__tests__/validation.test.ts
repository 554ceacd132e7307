// Model validation: every kind of bad input is refused with a message that names the entry
// (its index and id) and the field.
import { describe, expect, it } from 'vitest';
import { validateModel } from '../validate';
import type { Model } from '../formats';
import { applyCase, readCases } from './refusal-cases';

const good = (): Model => ({
  format: 'outturn-model',
  version: 1,
  name: 'Test',
  currency: 'EUR',
  items: [
    { id: 'C1', dist: { type: 'triangular', low: 8, mode: 10, high: 14 } },
    { id: 'C2', base: 5, dist: { type: 'uniform', low: 4, high: 7 } },
    { id: 'C3', ratePerDay: 100, activity: 'A1' },
    { id: 'C4', base: 40 },
  ],
  risks: [
    {
      id: 'R1',
      probability: 0.3,
      cost: { type: 'fixed', value: 5 },
      delay: { type: 'uniform', low: 1, high: 3 },
      activity: 'A2',
    },
  ],
  activities: [
    { id: 'A1', duration: { type: 'pert', low: 5, mode: 8, high: 12 } },
    { id: 'A2', duration: { type: 'normal', mean: 20, sd: 2 }, predecessors: ['A1', { id: 'A0', lag: 2 }] },
    { id: 'A0', duration: { type: 'fixed', value: 3 } },
  ],
  correlations: [{ a: 'C1', b: 'A2', rho: 0.4 }],
  targets: { cost: 100, duration: 40 },
  settings: { iterations: 1000, seed: 'abc', sampling: 'mc' },
});

type Edit = (m: Model & Record<string, unknown>) => void;
const messages = (edit: Edit) => {
  const m = good() as Model & Record<string, unknown>;
  edit(m);
  const r = validateModel(JSON.parse(JSON.stringify(m)));
  return r.ok ? [] : r.issues.map((i) => `${i.path}: ${i.message}`);
};

describe('validateModel', () => {
  it('accepts a good model and returns it typed', () => {
    const r = validateModel(good());
    expect(r.ok).toBe(true);
  });

  it.each(readCases('tests/fixtures/sim/validation-cases.json'))('refuses $refuses', (c) => {
    expect(messages((m) => applyCase(m, c))).toContain(c.message);
  });

  it('reports every problem, not only the first', () => {
    const found = messages((m) => {
      m.items[0].dist = { type: 'uniform', low: 3, high: 1 };
      m.activities![1].predecessors = ['A8'];
    });
    expect(found).toEqual(
      expect.arrayContaining([
        'items[0] (C1).dist.high: must be greater than low (got 1 ≤ 3)',
        'activities[1] (A2).predecessors[0]: unknown activity "A8"',
      ]),
    );
  });

  it('refuses input that is not an object', () => {
    const r = validateModel('nope');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0].message).toMatch(/must be an object/);
  });
});
