import { afterAll, describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

afterAll(closeDb);

// Long enough on the small test model to be seen running and cancelled (a few seconds, in bounded
// memory); at 1,000,000 iterations a run can finish between two polls.
const BIG = 10_000_000;

describe('cancelling and queueing runs', () => {
  it('cancel stops a running run: it ends cancelled, short of its iterations, with no result', async () => {
    const { client } = await newOrganisation('runs-cancel');
    const projectId = await projectWithRegisters(client);
    const started = await client.post(`/api/projects/${projectId}/runs`, { iterations: BIG, seed: 9 });
    expect(started.status).toBe(201);
    const runId = started.json.run.id;
    const running = await waitForRun(
      client,
      projectId,
      runId,
      (r) => r.status === 'running' && r.iterationsDone > 0,
    );
    expect(running.iterationsDone).toBeLessThan(BIG);

    const cancelled = await client.post(`/api/projects/${projectId}/runs/${runId}/cancel`);
    expect(cancelled.status).toBe(200);
    expect(cancelled.json.run.status).toBe('cancelled');
    const [after] = await rows<{
      status: string;
      iterationsDone: number;
      result: string | null;
      finishedAt: Date;
    }>('SELECT status, iterationsDone, result, finishedAt FROM SimulationRuns WHERE id = ?', [runId]);
    // Stays stopped: a second later nothing has moved.
    await new Promise((r) => setTimeout(r, 1000));
    const [later] = await rows<{ status: string; iterationsDone: number }>(
      'SELECT status, iterationsDone FROM SimulationRuns WHERE id = ?',
      [runId],
    );
    expect(after.status).toBe('cancelled');
    expect(after.result).toBeNull();
    expect(after.finishedAt).not.toBeNull();
    expect(later).toEqual({ status: 'cancelled', iterationsDone: after.iterationsDone });
    expect(after.iterationsDone).toBeLessThan(BIG);
    expect((await client.get(`/api/projects/${projectId}/runs/${runId}/result`)).status).toBe(409);
    // A finished run cannot be cancelled again.
    expect((await client.post(`/api/projects/${projectId}/runs/${runId}/cancel`)).status).toBe(409);
  });

  it('runs two of an organisation at once and queues the third with its place shown', async () => {
    const { client } = await newOrganisation('runs-queue');
    const projectId = await projectWithRegisters(client);
    const ids: number[] = [];
    for (let i = 0; i < 3; i++) {
      const res = await client.post(`/api/projects/${projectId}/runs`, { iterations: BIG, seed: 100 + i });
      expect(res.status).toBe(201);
      ids.push(res.json.run.id);
    }
    await waitForRun(client, projectId, ids[1], (r) => r.status === 'running');
    const third = await client.get(`/api/projects/${projectId}/runs/${ids[2]}`);
    expect(third.json.run.status).toBe('queued');
    expect(third.json.run.queuePosition).toBe(1);
    const list = await client.get(`/api/projects/${projectId}/runs`);
    const statuses = Object.fromEntries(
      list.json.runs.map((r: { id: number; status: string }) => [r.id, r.status]),
    );
    expect([statuses[ids[0]], statuses[ids[1]]]).toEqual(['running', 'running']);

    // Cancelling a running one lets the queued one start; a queued run can be cancelled too.
    await client.post(`/api/projects/${projectId}/runs/${ids[0]}/cancel`);
    await waitForRun(client, projectId, ids[2], (r) => r.status === 'running');
    for (const id of [ids[1], ids[2]]) {
      const res = await client.post(`/api/projects/${projectId}/runs/${id}/cancel`);
      expect(res.json.run.status).toBe('cancelled');
    }
    const queued = await client.post(`/api/projects/${projectId}/runs`, { iterations: BIG, seed: 7 });
    const alsoQueued = await client.post(`/api/projects/${projectId}/runs`, { iterations: BIG, seed: 8 });
    const waiting = await client.post(`/api/projects/${projectId}/runs`, { iterations: BIG, seed: 9 });
    expect(waiting.json.run.status).toBe('queued');
    const res = await client.post(`/api/projects/${projectId}/runs/${waiting.json.run.id}/cancel`);
    expect(res.json.run.status).toBe('cancelled');
    expect(res.json.run.iterationsDone).toBe(0);
    for (const r of [queued, alsoQueued])
      await client.post(`/api/projects/${projectId}/runs/${r.json.run.id}/cancel`);
  });
});
