// Model validation: every kind of bad input is refused with a message that names the entry
// (its index and id) and the field.
import { describe, expect, it } from 'vitest';
import { validateModel } from '../validate';
import type { Model } from '../formats';

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

  const cases: [string, Edit, string][] = [
    [
      'wrong format',
      (m) => ((m as { format: string }).format = 'other'),
      'format: must be "outturn-model" (got "other")',
    ],
    ['wrong version', (m) => ((m as { version: number }).version = 3), 'version: must be 1 or 2 (got 3)'],
    ['items missing', (m) => delete (m as Partial<Model>).items, 'items: is required'],
    ['unknown top-level field', (m) => (m.extra = 1), ': unknown field "extra"'],
    [
      'unknown distribution type',
      (m) => ((m.items[0].dist as { type: string }).type = 'gamma'),
      'items[0] (C1).dist.type: must be one of fixed, uniform, triangular, pert, normal, lognormal (got "gamma")',
    ],
    [
      'missing parameter',
      (m) => delete (m.items[0].dist as Partial<{ mode: number }>).mode,
      'items[0] (C1).dist.mode: is required',
    ],
    [
      'parameter not a number',
      (m) => ((m.items[0].dist as { low: unknown }).low = '8'),
      'items[0] (C1).dist.low: must be a number (got "8")',
    ],
    [
      'high not above low',
      (m) => (m.items[1].dist = { type: 'uniform', low: 7, high: 4 }),
      'items[1] (C2).dist.high: must be greater than low (got 4 ≤ 7)',
    ],
    [
      'mode outside the range',
      (m) => (m.items[0].dist = { type: 'pert', low: 8, mode: 20, high: 14 }),
      'items[0] (C1).dist.mode: must lie between low and high (got 20 outside 8–14)',
    ],
    [
      'sd not positive',
      (m) => (m.activities![1].duration = { type: 'normal', mean: 20, sd: -2 }),
      'activities[1] (A2).duration.sd: must be greater than 0 (got -2)',
    ],
    [
      'lognormal p10 not positive',
      (m) => (m.items[0].dist = { type: 'lognormal', p10: 0, p90: 3 }),
      'items[0] (C1).dist.p10: must be greater than 0 (got 0)',
    ],
    [
      'lognormal p90 ≤ p10',
      (m) => (m.items[0].dist = { type: 'lognormal', p10: 5, p90: 5 }),
      'items[0] (C1).dist.p90: must be greater than p10 (got 5 ≤ 5)',
    ],
    [
      'lognormal mixed parameters',
      (m) => (m.items[0].dist = { type: 'lognormal', p10: 5, sd: 2 } as never),
      'items[0] (C1).dist: give either p10 and p90, or mean and sd',
    ],
    [
      'bad range',
      (m) => ((m.items[0].dist as { range?: string }).range = 'p5-p95'),
      'items[0] (C1).dist.range: must be "min-max" or "p10-p90" (got "p5-p95")',
    ],
    [
      'unknown field in a distribution',
      (m) => ((m.items[0].dist as Record<string, unknown>).hi = 3),
      'items[0] (C1).dist: unknown field "hi"',
    ],
    [
      'item without amount',
      (m) => (m.items[1] = { id: 'C2' }),
      'items[1] (C2): needs a dist (or a base for a fixed amount), or a ratePerDay with an activity',
    ],
    [
      'item with dist and rate',
      (m) => (m.items[0].ratePerDay = 5),
      'items[0] (C1): give either dist or ratePerDay, not both',
    ],
    [
      'rate without activity',
      (m) => delete m.items[2].activity,
      'items[2] (C3).activity: is required with ratePerDay',
    ],
    [
      'rate on unknown activity',
      (m) => (m.items[2].activity = 'A9'),
      'items[2] (C3).activity: unknown activity "A9"',
    ],
    [
      'rate not a number or distribution',
      (m) => ((m.items[2] as { ratePerDay: unknown }).ratePerDay = 'x'),
      'items[2] (C3).ratePerDay: must be a number or a distribution',
    ],
    [
      'bad rate distribution',
      (m) => (m.items[2].ratePerDay = { type: 'uniform', low: 5, high: 1 }),
      'items[2] (C3).ratePerDay.high: must be greater than low (got 1 ≤ 5)',
    ],
    ['duplicate id', (m) => (m.risks![0].id = 'C2'), 'risks[0] (C2).id: duplicate id "C2" (also items[1])'],
    ['empty id', (m) => (m.items[0].id = ''), 'items[0].id: must not be empty'],
    [
      'probability above 1',
      (m) => (m.risks![0].probability = 1.2),
      'risks[0] (R1).probability: must be ≤ 1 (got 1.2)',
    ],
    [
      'probability below 0',
      (m) => (m.risks![0].probability = -0.1),
      'risks[0] (R1).probability: must be ≥ 0 (got -0.1)',
    ],
    [
      'risk without impact',
      (m) => (m.risks![0] = { id: 'R1', probability: 0.2 }),
      'risks[0] (R1): needs a cost or a delay (or both)',
    ],
    [
      'delay without activity',
      (m) => delete m.risks![0].activity,
      'risks[0] (R1).activity: is required with a delay',
    ],
    [
      'risk on unknown activity',
      (m) => (m.risks![0].activity = 'A7'),
      'risks[0] (R1).activity: unknown activity "A7"',
    ],
    [
      'unknown predecessor',
      (m) => (m.activities![1].predecessors = ['A1', 'A5']),
      'activities[1] (A2).predecessors[1]: unknown activity "A5"',
    ],
    [
      'self predecessor',
      (m) => (m.activities![0].predecessors = ['A1']),
      'activities[0] (A1).predecessors[0]: A1 cannot precede itself',
    ],
    [
      'predecessor twice',
      (m) => (m.activities![1].predecessors = ['A1', 'A1']),
      'activities[1] (A2).predecessors[1]: A1 is listed twice',
    ],
    [
      'cycle',
      (m) => (m.activities![0].predecessors = ['A2']),
      'activities[0] (A1).predecessors: the activities A1 → A2 → A1 form a cycle',
    ],
    [
      'bad lag',
      (m) => (m.activities![1].predecessors = [{ id: 'A1', lag: 'two' as never }]),
      'activities[1] (A2).predecessors[0] (A1).lag: must be a number (got "two")',
    ],
    [
      'correlation with an unknown input',
      (m) => (m.correlations = [{ a: 'C1', b: 'X9', rho: 0.2 }]),
      'correlations[0] (C1–X9).b: unknown input "X9"',
    ],
    [
      'correlation of an input with itself',
      (m) => (m.correlations = [{ a: 'C1', b: 'C1', rho: 0.2 }]),
      'correlations[0] (C1–C1).b: an input cannot be correlated with itself ("C1")',
    ],
    [
      'rho out of range',
      (m) => (m.correlations = [{ a: 'C1', b: 'C2', rho: -1.5 }]),
      'correlations[0] (C1–C2).rho: must be ≥ -1 (got -1.5)',
    ],
    [
      'duplicate pair',
      (m) => m.correlations!.push({ a: 'A2', b: 'C1', rho: 0.1 }),
      'correlations[1] (A2–C1): the pair A2–C1 is already given in correlations[0] (C1–A2)',
    ],
    [
      'iterations not an integer',
      (m) => (m.settings!.iterations = 10.5),
      'settings.iterations: must be an integer (got 10.5)',
    ],
    ['iterations below 1', (m) => (m.settings!.iterations = 0), 'settings.iterations: must be ≥ 1 (got 0)'],
    [
      'bad sampling',
      (m) => ((m.settings as { sampling: string }).sampling = 'sobol'),
      'settings.sampling: must be "mc" or "lhs" (got "sobol")',
    ],
    ['negative duration target', (m) => (m.targets!.duration = -5), 'targets.duration: must be ≥ 0 (got -5)'],
  ];

  it.each(cases)('refuses %s', (_name, edit, expected) => {
    expect(messages(edit)).toContain(expected);
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
