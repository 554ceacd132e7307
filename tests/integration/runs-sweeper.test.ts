// Runs never hang and never succeed with figures that are not numbers. The sweeper — the
// function the server calls every minute — is called here, scoped to this test's organisation,
// and a run is executed in this process through the same runner the server uses.
import { afterAll, describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { projectWithRegisters, storedRunSettings } from './runs-fixtures';
import { STALE_REASON, sweepStaleRuns } from '@/lib/services/runs/recover';
import { schedule } from '@/lib/services/runs/executor';
import { isActive } from '@/lib/services/runs/queue';
import { SimulationRun, sequelize } from '@/models';

afterAll(async () => {
  await closeDb();
  await sequelize.close();
});

const settings = storedRunSettings(1_000, 7);

async function runRow(
  organizationId: number,
  projectId: number,
  status: 'running' | 'queued',
  snapshot = {},
) {
  return SimulationRun.create({
    organizationId,
    projectId,
    startedById: null,
    status,
    settings,
    progress: status === 'running' ? 0.5 : 0,
    iterationsDone: 0,
    startedAt: status === 'running' ? new Date(Date.now() - 3_600_000) : null,
    inputSnapshot: JSON.stringify(snapshot),
    inputHash: '7'.repeat(64),
  });
}

const statusOf = async (id: number) =>
  (
    await rows<{ status: string; failureReason: string | null; summary: unknown }>(
      'SELECT status, failureReason, summary FROM SimulationRuns WHERE id = ?',
      [id],
    )
  )[0];

describe('a run whose final write was lost', () => {
  it('is swept to failed with its reason once its row is stale; a live one is left alone', async () => {
    const { client, organizationId } = await newOrganisation('runs-sweeper');
    const projectId = await projectWithRegisters(client);
    const lost = await runRow(organizationId, projectId, 'running');
    const live = await runRow(organizationId, projectId, 'running');
    // What a run looks like when its engine finished during a database outage: no write for an hour.
    await sequelize.query('UPDATE SimulationRuns SET updatedAt = ? WHERE id = ?', {
      replacements: [new Date(Date.now() - 3_600_000), lost.id],
    });

    expect(await sweepStaleRuns({ organizationId })).toEqual({ failed: 1 });
    expect(await statusOf(lost.id)).toMatchObject({ status: 'failed', failureReason: STALE_REASON });
    expect((await statusOf(live.id)).status).toBe('running');
    const api = await client.get(`/api/projects/${projectId}/runs/${lost.id}`);
    expect(api.json.run.status).toBe('failed');
    expect(api.json.run.failureReason).toMatch(/stopped reporting/);
    expect(await sweepStaleRuns({ organizationId })).toEqual({ failed: 0 });
  });
});

/** Runs a snapshot through the server's runner in this process and returns its final row. */
async function executeHere(runId: number, organizationId: number) {
  await schedule({ runId, organizationId });
  for (let i = 0; i < 600 && isActive(runId); i++) await new Promise((resolve) => setTimeout(resolve, 100));
  return statusOf(runId);
}

describe('a run of a snapshot kept from before the magnitude bounds', () => {
  it('fails with a reason naming the entry rather than succeeding with P50 = NaN', async () => {
    const { client, organizationId } = await newOrganisation('runs-nonfinite');
    const projectId = await projectWithRegisters(client);
    const snapshot = {
      format: 'outturn-model',
      version: 1,
      items: [
        { id: 'X1', dist: { type: 'triangular', low: -1e308, mode: 0, high: 1e308 } },
        { id: 'X2', dist: { type: 'triangular', low: -1e308, mode: 0, high: 1e308 } },
      ],
    };
    const run = await runRow(organizationId, projectId, 'queued', snapshot);
    const row = await executeHere(run.id, organizationId);
    expect(row.status).toBe('failed');
    expect(row.failureReason).toMatch(/items\[0\] \(X1\)\.dist\.low: must be ≥ -10000000000000/);
    expect(row.summary).toBeNull();
  });
});
