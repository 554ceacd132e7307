import { afterAll, describe, expect, it } from 'vitest';
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
    // The goal: the 95% interval of P80 (cost and duration) has a relative half-width ≤ 0.25 %.
    for (const total of [result.cost, result.duration]) {
      const [lo, hi] = total.percentileCI95.P80;
      const halfWidth =
        Math.max(total.percentiles.P80 - lo, hi - total.percentiles.P80) / total.percentiles.P80;
      const capped = result.warnings.some((w: string) => w.includes('at the cap'));
      if (!capped) expect(halfWidth).toBeLessThanOrEqual(0.0025 * 1.001);
    }
  });
});
