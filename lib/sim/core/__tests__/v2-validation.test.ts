// Model file version 2: every new field is checked, and a bad entry is refused with a message
// that names the entry and its field. A version 1 file keeps its meaning.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import { validateModel } from '../validate';

const good = () => JSON.parse(readFileSync('tests/fixtures/sim/v2-project.json', 'utf8'));
type M = ReturnType<typeof good>;

function messages(edit: (m: M) => void): string[] {
  const m = good();
  edit(m);
  const r = validateModel(m);
  return r.ok ? [] : r.issues.map((i) => `${i.path}: ${i.message}`);
}

describe('model file version 2', () => {
  it('accepts the version 2 example', () => {
    const r = validateModel(good());
    expect(r.ok ? [] : r.issues).toEqual([]);
  });

  it.each<[string, (m: M) => void, string]>([
    [
      'a driver naming an unknown input',
      (m) => (m.drivers[0].applies = ['C1', 'C9']),
      'drivers[0] (D1).applies[1]: unknown input "C9"',
    ],
    [
      'a driver naming a risk',
      (m) => (m.drivers[0].applies = ['R1']),
      'drivers[0] (D1).applies[0]: "R1" is not a line item or an activity (risks[0]); a driver scales those only',
    ],
    [
      'a driver factor that can go below zero (uniform)',
      (m) => (m.drivers[1].factor = { type: 'uniform', low: -0.1, high: 1.2 }),
      'drivers[1] (D2).factor: can go below zero (lowest value -0.1); a factor must be at least 0',
    ],
    [
      'a driver factor that can go below zero (normal)',
      (m) => (m.drivers[0].factor = { type: 'normal', mean: 1, sd: 0.1 }),
      'drivers[0] (D1).factor: can go below zero (lowest value −∞); a factor must be at least 0',
    ],
    [
      'a driver probability above 1',
      (m) => (m.drivers[1].probability = 1.2),
      'drivers[1] (D2).probability: must be ≤ 1 (got 1.2)',
    ],
    [
      'a driver with nothing to apply to',
      (m) => (m.drivers[1].applies = []),
      'drivers[1] (D2).applies: must list at least 1 (got none)',
    ],
    [
      'a risk naming an unknown activity',
      (m) => (m.risks[0].activities = ['A2', 'A9']),
      'risks[0] (R1).activities[1]: unknown activity "A9"',
    ],
    [
      'a risk naming an unknown item',
      (m) => (m.risks[0].items = ['C7']),
      'risks[0] (R1).items[0]: unknown line item "C7"',
    ],
    [
      'a risk with both activity and activities',
      (m) => (m.risks[0].activity = 'A1'),
      'risks[0] (R1).activities: give either activity or activities, not both',
    ],
    [
      'a post-mitigation probability below 0',
      (m) => (m.risks[0].post.probability = -0.1),
      'risks[0] (R1).post.probability: must be ≥ 0 (got -0.1)',
    ],
    [
      'a post cost on a risk without a cost',
      (m) => (m.risks[1].post = { cost: { type: 'fixed', value: 5 } }),
      'risks[1] (R2).post.cost: the risk has no cost before mitigation',
    ],
    [
      'a post delay on a risk without a delay',
      (m) => {
        delete m.risks[2].delay;
        delete m.risks[2].activity;
        m.risks[2].post = { delay: { type: 'fixed', value: 5 } };
      },
      'risks[2] (R3).post.delay: the risk has no delay before mitigation',
    ],
    [
      'a span other than "project"',
      (m) => (m.items[3].span = 'activity'),
      'items[3] (C4).span: must be "project" (got "activity")',
    ],
    [
      'a project-span item with an activity',
      (m) => (m.items[3].activity = 'A1'),
      'items[3] (C4).activity: is not used with span "project" (the rate runs with the whole project)',
    ],
    [
      'an unknown sizes value',
      (m) => (m.risks[2].sizes = 'same'),
      'risks[2] (R3).sizes: must be "linked" or "independent" (got "same")',
    ],
    [
      'an unknown mitigation scenario',
      (m) => (m.settings.mitigation = 'both'),
      'settings.mitigation: must be "pre" or "post" (got "both")',
    ],
    [
      'a joint confidence of 1',
      (m) => (m.settings.jointConfidence = 1),
      'settings.jointConfidence: must be < 1 (got 1)',
    ],
    [
      'an unknown contingency level',
      (m) => (m.settings.contingencyLevel = 'P85'),
      'settings.contingencyLevel: must be "P50" or "P70" or "P80" or "P90" (got "P85")',
    ],
    [
      'a duplicate id between a driver and an item',
      (m) => (m.drivers[0].id = 'C2'),
      'drivers[0] (C2).id: duplicate id "C2" (also items[1])',
    ],
  ])('refuses %s', (_name, edit, expected) => {
    expect(messages(edit)).toContain(expected);
  });

  it('reads a version 1 risk with one activity as a version 2 risk with that activity listed', () => {
    const v1 = {
      format: 'outturn-model',
      version: 1,
      items: [{ id: 'C1', dist: { type: 'uniform', low: 10, high: 20 } }],
      activities: [{ id: 'A1', duration: { type: 'uniform', low: 5, high: 9 } }],
      risks: [
        {
          id: 'R1',
          probability: 0.4,
          cost: { type: 'uniform', low: 1, high: 3 },
          delay: { type: 'uniform', low: 2, high: 4 },
          activity: 'A1',
        },
      ],
    };
    const v2 = { ...v1, version: 2, risks: [{ ...v1.risks[0], activity: undefined, activities: ['A1'] }] };
    delete (v2.risks[0] as { activity?: string }).activity;
    const a = simulateSync(v1, { iterations: 4000, seed: 9 });
    const b = simulateSync(v2, { iterations: 4000, seed: 9 });
    // Same streams (keyed by id) and the same meaning: the same figures to the bit.
    expect(b.cost).toStrictEqual(a.cost);
    expect(b.duration).toStrictEqual(a.duration);
  });
});
