// A closed risk event that still has a correlation: the model file and the run leave both out,
// say so, and the run starts and succeeds.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newOrganisation, type Client } from './helpers/http';
import { closeDb } from './helpers/db';
import { FIXTURE_MODEL, projectWithRegisters, waitForRun } from './runs-fixtures';

let client: Client;
let projectId: number;

beforeAll(async () => {
  client = (await newOrganisation('runs-closed-risk')).client;
  projectId = await projectWithRegisters(client, {
    ...FIXTURE_MODEL,
    correlations: [...FIXTURE_MODEL.correlations, { a: 'R1', b: 'C3', rho: 0.4 }],
  });
  const risks = (await client.get(`/api/projects/${projectId}/risks`)).json.rows as Record<string, unknown>[];
  const r1 = risks.find((r) => r.code === 'R1')!;
  const closed = await client.put(`/api/projects/${projectId}/risks/${r1.id}`, { ...r1, status: 'closed' });
  expect(closed.status).toBe(200);
  // The correlation stays in the register: closing a risk is reversible.
  const correlations = (await client.get(`/api/projects/${projectId}/correlations`)).json.rows;
  expect(correlations.map((c: { aCode: string }) => c.aCode)).toContain('R1');
});

afterAll(closeDb);

describe('a closed risk that still has a correlation', () => {
  it('is left out of the model file with its correlation, so no correlation dangles', async () => {
    const res = await client.get(`/api/projects/${projectId}/export?format=model`);
    expect(res.status).toBe(200);
    const model = res.json;
    const ids = new Set(
      [...model.items, ...model.risks, ...model.activities].map((e: { id: string }) => e.id),
    );
    expect(ids.has('R1')).toBe(false);
    expect(model.correlations).toEqual([{ a: 'C2', b: 'A2', rho: 0.5 }]);
    for (const c of model.correlations) expect(ids.has(c.a) && ids.has(c.b)).toBe(true);
  });

  it('does not stop a run: the run starts with a notice and succeeds', async () => {
    const started = await client.post(`/api/projects/${projectId}/runs`, { iterations: 2000, seed: 11 });
    expect(started.status).toBe(201);
    expect(started.json.run.notices).toEqual([
      'Risk R1 (Rock in the trench) is closed: it is left out of the model.',
      'The correlation R1–C3 (ρ 0.4) is left out of the model: risk R1 is closed.',
    ]);
    const run = await waitForRun(client, projectId, started.json.run.id, (r) =>
      ['succeeded', 'failed'].includes(r.status),
    );
    expect(run.status).toBe('succeeded');
    const snapshot = await client.get(`/api/projects/${projectId}/runs/${run.id}/snapshot`);
    expect(snapshot.json.correlations).toEqual([{ a: 'C2', b: 'A2', rho: 0.5 }]);
  });
});
