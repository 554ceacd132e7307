import { describe, expect, it, beforeAll } from 'vitest';
import { addMember, newOrganisation, type Client } from './helpers/http';
import { count } from './helpers/db';

const projectInput = (code: string) => ({
  name: `Register test ${code}`,
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-01-04',
});

const line = { code: '1.1', description: 'Earthworks', distType: 'pert', low: 100, mode: 120, high: 200 };
const REGISTERS = ['items', 'risks', 'activities', 'correlations'] as const;

describe('who may read and change the registers', () => {
  let owner: Client;
  let sponsor: Client;
  let billing: Client;
  let estimator: Client;
  let outsider: Client;
  let projectId: number;
  let lineId: number;

  beforeAll(async () => {
    const org = await newOrganisation('reg-access');
    owner = org.client;
    estimator = (await addMember(owner, 'estimator')).client;
    sponsor = (await addMember(owner, 'sponsor')).client;
    billing = (await addMember(owner, 'billing')).client;
    outsider = (await newOrganisation('reg-outsider')).client;
    projectId = (await owner.post('/api/projects', projectInput('ACC-1'))).json.project.id;
    const saved = await estimator.post(`/api/projects/${projectId}/items`, {
      upserts: [{ ...line, key: 'k1' }],
    });
    expect(saved.status).toBe(200);
    lineId = saved.json.rows[0].id;
  });

  it('lets sponsors read and download but not change anything', async () => {
    for (const r of REGISTERS)
      expect((await sponsor.get(`/api/projects/${projectId}/${r}`)).status).toBe(200);
    expect((await sponsor.get(`/api/projects/${projectId}/audit`)).status).toBe(200);
    expect((await sponsor.get(`/api/projects/${projectId}/export?format=xlsx`)).status).toBe(200);
    expect((await sponsor.get(`/api/projects/${projectId}/export?format=model`)).status).toBe(200);
    const before = await count('CostItems', 'projectId = ?', [projectId]);
    expect(
      (await sponsor.post(`/api/projects/${projectId}/items`, { upserts: [{ ...line, code: '1.2' }] }))
        .status,
    ).toBe(403);
    expect(
      (await sponsor.put(`/api/projects/${projectId}/items/${lineId}`, { ...line, version: 1, base: 5 }))
        .status,
    ).toBe(403);
    expect((await sponsor.del(`/api/projects/${projectId}/items/${lineId}?version=1`)).status).toBe(403);
    expect(
      (
        await sponsor.request(`/api/projects/${projectId}/import`, {
          method: 'POST',
          body: { format: 'outturn-model', version: 1, items: [] },
        })
      ).status,
    ).toBe(403);
    expect(await count('CostItems', 'projectId = ?', [projectId])).toBe(before);
  });

  it('keeps billing members out of project data', async () => {
    for (const r of REGISTERS)
      expect((await billing.get(`/api/projects/${projectId}/${r}`)).status).toBe(403);
    expect((await billing.get(`/api/projects/${projectId}/audit`)).status).toBe(403);
    expect((await billing.get(`/api/projects/${projectId}/export?format=csv&register=items`)).status).toBe(
      403,
    );
    expect((await billing.post(`/api/projects/${projectId}/items`, { upserts: [] })).status).toBe(403);
  });

  it('answers 404 to another organisation on every register route, and writes nothing', async () => {
    for (const r of REGISTERS) {
      const read = await outsider.get(`/api/projects/${projectId}/${r}`);
      expect(read.status).toBe(404);
      expect((await outsider.post(`/api/projects/${projectId}/${r}`, { upserts: [] })).status).toBe(404);
    }
    const leak = await outsider.get(`/api/projects/${projectId}/items`);
    expect(leak.text).not.toContain('Earthworks');
    expect(
      (await outsider.put(`/api/projects/${projectId}/items/${lineId}`, { ...line, version: 1, base: 1 }))
        .status,
    ).toBe(404);
    expect((await outsider.del(`/api/projects/${projectId}/items/${lineId}?version=1`)).status).toBe(404);
    expect((await outsider.get(`/api/projects/${projectId}/export?format=model`)).status).toBe(404);
    expect((await outsider.get(`/api/projects/${projectId}/audit`)).status).toBe(404);
    expect(
      (
        await outsider.request(`/api/projects/${projectId}/import`, {
          method: 'POST',
          body: { format: 'outturn-model', version: 1, items: [] },
        })
      ).status,
    ).toBe(404);
    expect(await count('CostItems', 'projectId = ? AND base IS NOT NULL', [projectId])).toBe(0);
  });

  it('lets estimators and owners write, and signed-out visitors nothing', async () => {
    const saved = await owner.post(`/api/projects/${projectId}/activities`, {
      upserts: [
        { code: 'A1', name: 'Dig', distType: 'triangular', low: 1, mode: 2, high: 4, predecessors: [] },
      ],
    });
    expect(saved.status).toBe(200);
    const { Client } = await import('./helpers/http');
    const anonymous = new Client();
    expect((await anonymous.get(`/api/projects/${projectId}/items`)).status).toBe(401);
  });
});
