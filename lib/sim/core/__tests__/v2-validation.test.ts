// Model file version 2: every new field is checked, and a bad entry is refused with a message
// that names the entry and its field. A version 1 file keeps its meaning.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { simulateSync } from '../engine';
import { validateModel } from '../validate';
import { applyCase, readCases } from './refusal-cases';

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

  it.each(readCases('tests/fixtures/sim/v2-validation-cases.json'))('refuses $refuses', (c) => {
    expect(messages((m) => applyCase(m, c))).toContain(c.message);
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
