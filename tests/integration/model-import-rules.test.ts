// A model file imported into a project meets the same rules as rows typed into the registers:
// code pattern and length limits, durations that are not negative, magnitudes within bounds and
// at most 20,000 rows per register. Every refusal is a 400 naming the entry, and nothing is written.
import { beforeAll, describe, expect, it } from 'vitest';
import { newOrganisation, type Client } from './helpers/http';
import { count } from './helpers/db';

let client: Client;
let projectId: number;

const base = {
  format: 'outturn-model',
  version: 1,
  items: [{ id: 'C1', name: 'Earthworks', dist: { type: 'triangular', low: 90, mode: 100, high: 130 } }],
  activities: [{ id: 'A1', name: 'Dig', duration: { type: 'triangular', low: 5, mode: 10, high: 20 } }],
};

beforeAll(async () => {
  ({ client } = await newOrganisation('model-rules'));
  const created = await client.post('/api/projects', {
    name: 'Model rules',
    code: 'MR-1',
    currency: 'EUR',
    estimateClass: 3,
    stage: 'Feasibility',
    baseDate: '2027-01-04',
  });
  projectId = created.json.project.id;
  // One line saved first: a refused import must leave it in place.
  const first = await client.post(`/api/projects/${projectId}/import`, base);
  expect(first.status).toBe(200);
});

async function refused(model: unknown, entry: RegExp) {
  const res = await client.post(`/api/projects/${projectId}/import`, model);
  expect(res.status).toBe(400);
  expect(res.json.error.issues.map((i: { message: string }) => i.message).join('\n')).toMatch(entry);
  expect(res.json.error.message).toMatch(/^The model file was not imported/);
  expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(1);
  expect(await count('Activities', 'projectId = ?', [projectId])).toBe(1);
  return res;
}

describe('a model file import applies the register rules', () => {
  it('refuses a formula as an item id', async () => {
    const res = await refused(
      { ...base, items: [{ id: '=HYPERLINK("http://evil.example","x")', base: 1 }] },
      /items\[0\] \(=HYPERLINK\(.*\), code: Use letters, digits/,
    );
    expect(res.json.error.issues[0].path).toBe('items[0].code');
  });
  it('refuses an over-long name with a 400 naming the entry, not a 500', async () => {
    await refused(
      { ...base, items: [{ id: 'C9', name: 'n'.repeat(300), base: 1 }] },
      /items\[0\] \(C9\), description: Keep the description under 255 characters/,
    );
  });
  it('refuses a negative duration', async () => {
    await refused(
      {
        ...base,
        activities: [{ id: 'A1', duration: { type: 'triangular', low: -5, mode: 1, high: 3 } }],
      },
      /activities\[0\] \(A1\), low: A duration cannot be negative/,
    );
  });
  it('refuses an over-long risk id', async () => {
    await refused(
      {
        ...base,
        risks: [{ id: 'R'.repeat(41), probability: 0.2, cost: { type: 'fixed', value: 5 } }],
      },
      /risks\[0\] \(R{41}\), code: Keep the code under 40/,
    );
  });
  it('refuses what a risk row cannot hold: a post impact of another type, a P10–P90 impact', async () => {
    await refused(
      {
        ...base,
        version: 2,
        risks: [
          {
            id: 'R1',
            probability: 0.2,
            cost: { type: 'uniform', low: 10, high: 20 },
            post: { cost: { type: 'fixed', value: 5 } },
          },
          { id: 'R2', probability: 0.2, cost: { type: 'pert', low: 1, mode: 2, high: 5, range: 'p10-p90' } },
        ],
      },
      /risks\[0\] \(R1\), post\.cost: the risk register gives the cost after mitigation the type of the cost before it \(uniform, got fixed\)[\s\S]*risks\[1\] \(R2\), cost: the risk register holds low and high as bounds/,
    );
  });
  it('refuses more than 20,000 rows in one register', async () => {
    const items = Array.from({ length: 20_001 }, (_, i) => ({ id: `C${i}`, base: 1 }));
    await refused({ ...base, items }, /items: 20,001 entries; up to 20,000 are accepted in one register/);
  });
  it('still imports a file that meets the rules', async () => {
    const res = await client.post(`/api/projects/${projectId}/import`, {
      ...base,
      items: [...base.items, { id: 'C2', name: 'Fee', dist: { type: 'normal', mean: 300, sd: 20 } }],
      risks: [
        {
          id: 'R1',
          probability: 0.3,
          cost: { type: 'lognormal', p10: 10, p90: 40 },
          delay: { type: 'uniform', low: 1, high: 4 },
          activity: 'A1',
        },
        // An opportunity: a negative delay (version 2) and a normal cost saving.
        {
          id: 'R2',
          probability: 0.4,
          cost: { type: 'normal', mean: -30, sd: 5 },
          delay: { type: 'uniform', low: -3, high: -1 },
          activities: ['A1'],
        },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.json.imported).toEqual({ items: 2, risks: 2, activities: 1, correlations: 0, drivers: 0 });
  });
});
