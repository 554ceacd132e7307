// A run whose engine returns a figure that is not a finite number fails with the reason and
// keeps no summary. Inputs within the bounds cannot overflow, so the engine's result is altered
// here (P50 of the cost set to NaN, what -1e308…1e308 inputs once produced) to reach the check.
import { afterAll, describe, expect, it, vi } from 'vitest';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { projectWithRegisters, FIXTURE_MODEL } from './runs-fixtures';
import { schedule } from '@/lib/services/runs/executor';
import { isActive } from '@/lib/services/runs/queue';
import { SimulationRun, sequelize } from '@/models';

vi.mock('@/lib/sim/runtime', async (importOriginal) => {
  const sim = await importOriginal<typeof import('@/lib/sim/runtime')>();
  return {
    ...sim,
    runSimulation: async (...args: Parameters<typeof sim.runSimulation>) => {
      const result = await sim.runSimulation(...args);
      return { ...result, cost: { ...result.cost, percentiles: { ...result.cost.percentiles, P50: NaN } } };
    },
  };
});

afterAll(async () => {
  await closeDb();
  await sequelize.close();
});

describe('a run whose figures are not finite', () => {
  it('fails with a reason naming the figure rather than succeeding with P50 = NaN', async () => {
    const { client, organizationId } = await newOrganisation('runs-nonfinite');
    const projectId = await projectWithRegisters(client);
    const run = await SimulationRun.create({
      organizationId,
      projectId,
      startedById: null,
      status: 'queued',
      settings: {
        iterations: 1_000,
        seed: 3,
        sampling: 'lhs',
        riskValues: 'pre',
        confidence: 'P80',
        costTarget: null,
        finishTarget: null,
        durationTarget: null,
        precision: null,
      },
      inputSnapshot: JSON.stringify(FIXTURE_MODEL),
      inputHash: '3'.repeat(64),
    });
    await schedule({ runId: run.id, organizationId });
    for (let i = 0; i < 600 && isActive(run.id); i++)
      await new Promise((resolve) => setTimeout(resolve, 100));
    const [row] = await rows<{ status: string; failureReason: string | null; summary: unknown }>(
      'SELECT status, failureReason, summary FROM SimulationRuns WHERE id = ?',
      [run.id],
    );
    expect(row.status).toBe('failed');
    expect(row.failureReason).toMatch(/^The run gave no usable cost figures \(P50 = NaN\)/);
    expect(row.summary).toBeNull();
  });
});
