// Every run stores the engine version and block size it was computed with, and its view shows
// them with no notice while the engine is the current one.
import { afterAll, describe, expect, it } from 'vitest';
import { BLOCK_SIZE, ENGINE_VERSION } from '@/lib/sim';
import { newOrganisation } from './helpers/http';
import { closeDb, execute, rows } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

afterAll(closeDb);

describe('the engine a run was computed with', () => {
  it('is stored on the run and shown in its view', async () => {
    const { client } = await newOrganisation('runs-engine');
    const projectId = await projectWithRegisters(client);
    const started = await client.post(`/api/projects/${projectId}/runs`, { iterations: 3_000, seed: 5 });
    expect(started.status).toBe(201);
    const runId = started.json.run.id;
    await waitForRun(client, projectId, runId, (r) => r.status === 'succeeded');

    const [stored] = await rows<{ engineVersion: string | null; blockSize: number | null }>(
      'SELECT engineVersion, blockSize FROM SimulationRuns WHERE id = ?',
      [runId],
    );
    expect(stored).toEqual({ engineVersion: ENGINE_VERSION, blockSize: BLOCK_SIZE });

    const view = (await client.get(`/api/projects/${projectId}/runs/${runId}`)).json.run;
    expect(view.engine).toEqual({ version: ENGINE_VERSION, blockSize: BLOCK_SIZE, notice: null });
    expect((await client.get(`/projects/${projectId}/runs/${runId}`)).text).not.toContain(
      'Made by another engine',
    );

    // The same run as if an older engine had made it: the API and the page both say so.
    await execute('UPDATE SimulationRuns SET engineVersion = ? WHERE id = ?', ['0.9.0', runId]);
    const older = (await client.get(`/api/projects/${projectId}/runs/${runId}`)).json.run;
    expect(older.engine.notice).toContain(ENGINE_VERSION);
    const page = await client.get(`/projects/${projectId}/runs/${runId}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('Made by another engine');
  });
});
