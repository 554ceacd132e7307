// Property-based tests (fast-check) against the running app: a valid row or model entry with one
// field replaced by an extreme or hostile value (1e308, a huge string, a formula as a code, a
// negative duration) is refused with a 4xx that names the entry and the field, and nothing is written.
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { newOrganisation, type Client } from './helpers/http';
import { count } from './helpers/db';

/** Cases per property; the two properties below make 2 × CASES requests. */
const CASES = 20;

let client: Client;
let projectId: number;

beforeAll(async () => {
  ({ client } = await newOrganisation('reg-property'));
  const created = await client.post('/api/projects', {
    name: 'Property test',
    code: 'PROP-1',
    currency: 'EUR',
    estimateClass: 3,
    stage: 'Feasibility',
    baseDate: '2027-01-04',
  });
  projectId = created.json.project.id;
});

// Raw JSON text: 1e308 and -1e308 survive JSON, NaN and Infinity cannot be sent at all.
const hostile = fc.constantFrom(
  '1e308',
  '-1e308',
  '1e14',
  '-5',
  JSON.stringify('x'.repeat(5000)),
  JSON.stringify('=HYPERLINK("http://evil.example","x")'),
  JSON.stringify('+cmd|calc'),
  'true',
  '{}',
);
const field = fc.constantFrom('code', 'description', 'low', 'mode', 'high');

const nothingWritten = async () => {
  expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(0);
  expect(await count('Activities', 'projectId = ?', [projectId])).toBe(0);
};

describe('register batch and model import under hostile values', () => {
  it('a batch row with one hostile field is refused naming the row and field', async () => {
    await fc.assert(
      fc.asyncProperty(field, hostile, async (name, value) => {
        // A negative amount is a valid low of a cost; a huge text is a valid description only if short.
        fc.pre(!(name === 'low' && value === '-5'));
        fc.pre(
          !(
            name === 'description' &&
            ['"+cmd|calc"', '"=HYPERLINK(\\"http://evil.example\\",\\"x\\")"'].includes(value)
          ),
        );
        const row: Record<string, string> = {
          code: '"C1"',
          description: '"Earthworks"',
          distType: '"triangular"',
          low: '90',
          mode: '100',
          high: '130',
        };
        row[name] = value;
        const body = `{"upserts":[{${Object.entries(row)
          .map(([k, v]) => `"${k}":${v}`)
          .join(',')}}]}`;
        const res = await client.request(`/api/projects/${projectId}/items`, { method: 'POST', body });
        expect(
          res.status,
          `${name} = ${value.slice(0, 40)}: ${res.text.slice(0, 300)}`,
        ).toBeGreaterThanOrEqual(400);
        expect(res.status).toBeLessThan(500);
        const paths = (res.json.error.issues ?? []).map((i: { path: string }) => i.path).join(' ');
        // A bad parameter may be reported on a sibling cell ("the most likely must lie between low and high").
        const cells = ['low', 'mode', 'high'].includes(name)
          ? /\.(low|mode|high)\b/
          : new RegExp(`\\.${name}\\b`);
        expect(paths).toMatch(cells);
        expect(res.json.error.message).toMatch(/Row 1|C1|line 1/i);
        await nothingWritten();
      }),
      { numRuns: CASES },
    );
  });

  it('a model file with one hostile entry is refused naming the entry, and nothing is written', async () => {
    const where = fc.constantFrom('items-id', 'items-low', 'items-name', 'activities-low', 'activities-id');
    await fc.assert(
      fc.asyncProperty(where, hostile, async (at, value) => {
        fc.pre(!(at === 'items-low' && value === '-5'));
        fc.pre(
          !(
            at === 'items-name' &&
            ['"+cmd|calc"', '"=HYPERLINK(\\"http://evil.example\\",\\"x\\")"'].includes(value)
          ),
        );
        const v = (key: string, fallback: string) => (at === key ? value : fallback);
        const body = `{"format":"outturn-model","version":1,
          "items":[{"id":${v('items-id', '"C1"')},"name":${v('items-name', '"Earthworks"')},
            "dist":{"type":"triangular","low":${v('items-low', '90')},"mode":100,"high":130}}],
          "activities":[{"id":${v('activities-id', '"A1"')},
            "duration":{"type":"triangular","low":${v('activities-low', '5')},"mode":10,"high":20}}]}`;
        const res = await client.request(`/api/projects/${projectId}/import`, { method: 'POST', body });
        expect(res.status, `${at} = ${value.slice(0, 40)}: ${res.text.slice(0, 300)}`).toBe(400);
        const entry = at.startsWith('items') ? 'items[0]' : 'activities[0]';
        expect(res.json.error.issues.map((i: { path: string }) => i.path).join(' ')).toContain(entry);
        await nothingWritten();
      }),
      { numRuns: CASES },
    );
  });
});
