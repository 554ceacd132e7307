import { afterAll, describe, expect, it } from 'vitest';
import { BLOCK_SIZE } from '@/lib/sim';
import { newOrganisation } from './helpers/http';
import { closeDb } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

afterAll(closeDb);

describe('a run until P80 is known to a precision', () => {
  it('stops once the P80 interval is narrow enough, within the cap, and stores the goal', async () => {
    const { client } = await newOrganisation('runs-precision');
    const projectId = await projectWithRegisters(client);
    const goal = { relativePercent: 0.25, maxIterations: 400_000 };
    const started = await client.post(`/api/projects/${projectId}/runs`, {
      iterations: 5_000,
      seed: 31,
      precision: goal,
    });
    expect(started.status).toBe(201);
    expect(started.json.run.settings.precision).toEqual(goal);
    const done = await waitForRun(client, projectId, started.json.run.id, (r) => r.status === 'succeeded');
    const { result } = (await client.get(`/api/projects/${projectId}/runs/${done.id}/result`)).json;
    expect(result.iterations).toBeGreaterThan(5_000);
    expect(result.iterations).toBeLessThanOrEqual(goal.maxIterations);
    // This model reaches the goal well before the cap, so no warning of a cap.
    expect(result.warnings.filter((w: string) => w.includes('at the cap'))).toEqual([]);
    // The goal, as the engine states it: the 95% interval of P80 (cost and duration) has a
    // relative half-width (hi − lo) / 2 / P80 of at most 0.25 %.
    for (const total of [result.cost, result.duration]) {
      const [lo, hi] = total.percentileCI95.P80;
      expect((hi - lo) / 2 / total.percentiles.P80).toBeLessThanOrEqual(0.0025);
    }
    // Rounds are whole blocks of the engine, so the run stops at a whole number of blocks.
    expect(result.iterations % BLOCK_SIZE).toBe(0);
  });
});
