import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, newOrganisation, type Client } from './helpers/http';
import { closeDb, count } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

let owner: Client;
let sponsor: Client;
let estimator: Client;
let stranger: Client;
let projectId: number;
let runId: number;

beforeAll(async () => {
  const org = await newOrganisation('runs-access');
  owner = org.client;
  sponsor = (await addMember(owner, 'sponsor')).client;
  estimator = (await addMember(owner, 'estimator')).client;
  stranger = (await newOrganisation('runs-stranger')).client;
  projectId = await projectWithRegisters(owner);
  const started = await estimator.post(`/api/projects/${projectId}/runs`, { iterations: 2000, seed: 5 });
  expect(started.status).toBe(201);
  runId = started.json.run.id;
  await waitForRun(estimator, projectId, runId, (r) => r.status === 'succeeded');
});

afterAll(closeDb);

describe('who may start, read and cancel runs', () => {
  it('refuses a sponsor who starts or cancels a run (403), and writes nothing', async () => {
    const before = await count('SimulationRuns', 'projectId = ?', [projectId]);
    const res = await sponsor.post(`/api/projects/${projectId}/runs`, { iterations: 2000 });
    expect(res.status).toBe(403);
    expect((await sponsor.post(`/api/projects/${projectId}/runs/${runId}/cancel`)).status).toBe(403);
    expect(await count('SimulationRuns', 'projectId = ?', [projectId])).toBe(before);
  });

  it('lets a sponsor read the runs, the result and the snapshot', async () => {
    const list = await sponsor.get(`/api/projects/${projectId}/runs`);
    expect(list.status).toBe(200);
    expect(list.json.runs.map((r: { id: number }) => r.id)).toContain(runId);
    expect((await sponsor.get(`/api/projects/${projectId}/runs/${runId}/result`)).status).toBe(200);
    expect((await sponsor.get(`/api/projects/${projectId}/runs/${runId}/snapshot`)).status).toBe(200);
  });

  it('answers 404 to another organisation for every route, and 401 when signed out', async () => {
    const base = `/api/projects/${projectId}/runs`;
    expect((await stranger.get(base)).status).toBe(404);
    expect((await stranger.post(base, { iterations: 2000 })).status).toBe(404);
    expect((await stranger.get(`${base}/${runId}`)).status).toBe(404);
    expect((await stranger.get(`${base}/${runId}/result`)).status).toBe(404);
    expect((await stranger.get(`${base}/${runId}/snapshot`)).status).toBe(404);
    expect((await stranger.post(`${base}/${runId}/cancel`)).status).toBe(404);
    // A run id of another project of the same organisation is not found under this one either.
    const other = await projectWithRegisters(owner);
    expect((await owner.get(`/api/projects/${other}/runs/${runId}`)).status).toBe(404);
    const { Client: Anonymous } = await import('./helpers/http');
    expect((await new Anonymous().get(base)).status).toBe(401);
  });

  it('rejects bad settings with a 400 that names each field, and writes nothing', async () => {
    const before = await count('SimulationRuns', 'projectId = ?', [projectId]);
    const res = await estimator.post(`/api/projects/${projectId}/runs`, {
      iterations: 500,
      sampling: 'random',
      confidence: 'P75',
      finishTarget: '2020-01-01',
      seed: -3,
    });
    expect(res.status).toBe(400);
    const paths = res.json.error.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['confidence', 'iterations', 'sampling', 'seed']);
    // The finish target is checked against the project's base date once the fields are sound.
    const early = await estimator.post(`/api/projects/${projectId}/runs`, { finishTarget: '2020-01-01' });
    expect(early.status).toBe(400);
    expect(early.json.error.issues[0].path).toBe('finishTarget');
    const capped = await estimator.post(`/api/projects/${projectId}/runs`, {
      iterations: 50_000,
      precision: { relativePercent: 0.5, maxIterations: 10_000 },
    });
    expect(capped.status).toBe(400);
    expect(capped.json.error.issues[0].path).toBe('precision.maxIterations');
    expect(await count('SimulationRuns', 'projectId = ?', [projectId])).toBe(before);
  });

  it('says what to do first when the project has nothing to simulate', async () => {
    const created = await owner.post('/api/projects', {
      name: 'Empty project',
      code: `EMPTY${Date.now().toString(36).toUpperCase()}`,
      currency: 'EUR',
      estimateClass: 5,
      stage: 'Concept',
      baseDate: '2027-01-04',
    });
    const res = await estimator.post(`/api/projects/${created.json.project.id}/runs`, {});
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/add line items/);
  });
});
