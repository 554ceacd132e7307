// The projects list's base estimate and line count per project, read for every project of the
// organisation at once. The expected figures are worked by hand from the base rule of
// docs/model-format.md: the mode of a triangular or PERT, the midpoint of a uniform, the mean of a
// normal, the value of a fixed amount, a base amount when given; a rate per day times its
// activity's base duration, a rate per project day times the network's finish at base durations
// (the critical-path forward pass, common practice).
import { beforeAll, describe, expect, it } from 'vitest';
import { newOrganisation, type Client } from './helpers/http';

const projectInput = (code: string) => ({
  name: `List test ${code}`,
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-01-04',
});

const line = (code: string, cells: object) => ({ code, description: `Line ${code}`, ...cells });

type Listed = { id: number; code: string; baseEstimate: number; lineCount: number; latestRun: unknown };

describe('the projects list', () => {
  let client: Client;
  let ids: Record<string, number>;

  const list = async (query = '') => {
    const res = await client.get(`/api/projects${query}`);
    expect(res.status).toBe(200);
    return new Map((res.json.projects as Listed[]).map((p) => [p.code, p]));
  };

  beforeAll(async () => {
    client = (await newOrganisation('projects-list')).client;
    ids = {};
    for (const code of ['PL-1', 'PL-2', 'PL-3']) {
      const created = await client.post('/api/projects', projectInput(code));
      expect(created.status).toBe(201);
      ids[code] = created.json.project.id;
    }
    const acts = await client.post(`/api/projects/${ids['PL-1']}/activities`, {
      upserts: [
        { code: 'A1', name: 'Dig', distType: 'triangular', low: 10, mode: 12, high: 20, predecessors: [] },
        {
          code: 'A2',
          name: 'Pour',
          distType: 'uniform',
          low: 4,
          high: 8,
          predecessors: [{ code: 'A1', lag: 2 }],
        },
      ],
    });
    expect(acts.status).toBe(200);
    const items = await client.post(`/api/projects/${ids['PL-1']}/items`, {
      upserts: [
        line('1.1', { distType: 'triangular', low: 100, mode: 120, high: 200 }),
        line('1.2', { distType: 'uniform', low: 100, high: 300 }),
        line('1.3', { distType: 'triangular', low: 100, mode: 120, high: 200, base: 150 }),
        line('1.4', { basis: 'per-day', activityCode: 'A1', distType: 'fixed', mode: 900 }),
        line('1.5', { basis: 'per-project-day', distType: 'normal', mean: 50, sd: 5 }),
      ],
    });
    expect(items.status).toBe(200);
    const other = await client.post(`/api/projects/${ids['PL-3']}/items`, {
      upserts: [line('3.1', { distType: 'pert', low: 1000, mode: 1100, high: 1500 })],
    });
    expect(other.status).toBe(200);
  });

  it('gives each project the base estimate of its own lines, and 0 without lines', async () => {
    const listed = await list();
    // 120 (mode) + 200 (midpoint) + 150 (base given) + 900 × 12 days of A1
    // + 50 (mean) × 20 project days (A1 ends at 12, A2 starts 2 days later and lasts 6).
    expect(listed.get('PL-1')).toMatchObject({ baseEstimate: 12_270, lineCount: 5, latestRun: null });
    expect(listed.get('PL-2')).toMatchObject({ baseEstimate: 0, lineCount: 0, latestRun: null });
    // The mode of the PERT.
    expect(listed.get('PL-3')).toMatchObject({ baseEstimate: 1100, lineCount: 1 });
  });

  it('follows a change of the registers and lists archived projects only when asked', async () => {
    const rows = (await client.get(`/api/projects/${ids['PL-1']}/items`)).json.rows as {
      id: number;
      code: string;
      version: number;
    }[];
    const gone = rows.find((r) => r.code === '1.2')!;
    const deleted = await client.del(`/api/projects/${ids['PL-1']}/items/${gone.id}?version=${gone.version}`);
    expect(deleted.status).toBe(200);
    const archived = await client.patch(`/api/projects/${ids['PL-3']}`, { archived: true });
    expect(archived.status).toBe(200);

    const listed = await list();
    expect(listed.get('PL-1')).toMatchObject({ baseEstimate: 12_070, lineCount: 4 });
    expect(listed.has('PL-3')).toBe(false);
    expect((await list('?archived=1')).get('PL-3')).toMatchObject({ baseEstimate: 1100, lineCount: 1 });
  });

  it('shows no other organisation its projects or their lines', async () => {
    const stranger = (await newOrganisation('projects-list-other')).client;
    const made = await stranger.post('/api/projects', projectInput('PL-1'));
    expect(made.status).toBe(201);
    const theirs = (await stranger.get('/api/projects')).json.projects as Listed[];
    expect(theirs.map((p) => [p.code, p.baseEstimate, p.lineCount])).toEqual([['PL-1', 0, 0]]);
    expect((await list()).get('PL-1')).toMatchObject({ baseEstimate: 12_070, lineCount: 4 });
  });
});
