// A restart is simulated in this process: a 'running' row with no engine behind it (what a
// server that died mid-run leaves) is inserted, then recoverInterruptedRuns — the function the
// server's instrumentation.ts calls at start — is called here, scoped to this test's organisation
// so that runs of other tests that really are running in the app server are left alone.
import { afterAll, describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { projectWithRegisters, storedRunSettings } from './runs-fixtures';
import { INTERRUPTED_REASON, recoverInterruptedRuns } from '@/lib/services/runs/recover';
import { SimulationRun, sequelize } from '@/models';

afterAll(async () => {
  await closeDb();
  await sequelize.close();
});

describe('a run interrupted by a restart', () => {
  it('is marked failed with the reason at the next start, and the API says so', async () => {
    const { client, organizationId } = await newOrganisation('runs-recover');
    const projectId = await projectWithRegisters(client);
    const settings = storedRunSettings(10_000, 1);
    const interrupted = await SimulationRun.create({
      organizationId,
      projectId,
      startedById: null,
      status: 'running',
      settings,
      progress: 0.4,
      iterationsDone: 4000,
      startedAt: new Date(Date.now() - 60_000),
      inputSnapshot: '{}',
      inputHash: '0'.repeat(64),
    });
    const finished = await SimulationRun.create({
      organizationId,
      projectId,
      startedById: null,
      status: 'succeeded',
      settings,
      progress: 1,
      iterationsDone: 10_000,
      inputSnapshot: '{}',
      inputHash: '1'.repeat(64),
    });

    const outcome = await recoverInterruptedRuns({ organizationId, resumeQueued: false });
    expect(outcome.failed).toBe(1);

    const [row] = await rows<{ status: string; failureReason: string; finishedAt: Date | null }>(
      'SELECT status, failureReason, finishedAt FROM SimulationRuns WHERE id = ?',
      [interrupted.id],
    );
    expect(row.status).toBe('failed');
    expect(row.failureReason).toBe(INTERRUPTED_REASON);
    expect(row.finishedAt).not.toBeNull();
    const [untouched] = await rows<{ status: string }>('SELECT status FROM SimulationRuns WHERE id = ?', [
      finished.id,
    ]);
    expect(untouched.status).toBe('succeeded');

    const api = await client.get(`/api/projects/${projectId}/runs/${interrupted.id}`);
    expect(api.json.run.status).toBe('failed');
    expect(api.json.run.failureReason).toMatch(/server restarted/);
    // Nothing is left running for ever: a second start finds nothing more to do.
    expect((await recoverInterruptedRuns({ organizationId, resumeQueued: false })).failed).toBe(0);
  });
});
