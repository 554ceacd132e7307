import { afterAll, describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';
import { closeDb } from './helpers/db';
import { projectWithRegisters, waitForRun } from './runs-fixtures';

afterAll(closeDb);

// Common practice: records people name in conversation are numbered within their parent (issue
// 12 of a repository, invoice 3 of an account), not by a database-wide id.
describe('run numbers', () => {
  it('count per project: each project’s first run is Run 1, whatever other projects ran', async () => {
    const { client } = await newOrganisation('runs-numbers');
    const first = await projectWithRegisters(client);
    const second = await projectWithRegisters(client);
    const start = async (projectId: number, seed: number) => {
      const res = await client.post(`/api/projects/${projectId}/runs`, { iterations: 1000, seed });
      expect(res.status).toBe(201);
      return res.json.run as { id: number; number: number };
    };
    // Started at once: the project's lock gives them two numbers, never the same one twice.
    const [a, b] = await Promise.all([start(first, 1), start(first, 2)]);
    const c = await start(second, 3);
    expect([a.number, b.number].sort()).toEqual([1, 2]);
    expect(c.number).toBe(1);
    expect(c.id).toBeGreaterThan(Math.max(a.id, b.id));

    await waitForRun(client, first, b.id, (r) => r.status === 'succeeded');
    const listed = await client.get(`/api/projects/${first}/runs`);
    expect(listed.json.runs.map((r: { number: number }) => r.number)).toEqual(
      [a, b].sort((x, y) => y.id - x.id).map((r) => r.number),
    );
    // The run's page is named by the number, its address keeps the id.
    const page = await client.get(`/projects/${first}/runs/${b.id}`);
    // (React separates "Run " and the number with an empty comment in server-rendered HTML.)
    expect(page.text).toMatch(new RegExp(`Run (<!-- -->)?${b.number}\\b`));
  });
});
