import { describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';

const project = (code: string) => ({
  name: 'Test bridge',
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-01-04',
});

describe('organisations never see each other', () => {
  it('gives 404, never the data, for a project of another organisation', async () => {
    const a = await newOrganisation('org-a');
    const b = await newOrganisation('org-b');
    const created = await a.client.post('/api/projects', project('BR-1'));
    expect(created.status).toBe(201);
    const id = created.json.project.id;

    const read = await b.client.get(`/api/projects/${id}`);
    expect(read.status).toBe(404);
    expect(read.text).not.toContain('Test bridge');
    expect((await b.client.put(`/api/projects/${id}`, { ...project('BR-1'), version: 1 })).status).toBe(404);
    expect((await b.client.patch(`/api/projects/${id}`, { archived: true })).status).toBe(404);
    expect((await b.client.get('/api/projects')).json.projects).toEqual([]);

    // The owner still sees it, unchanged.
    const own = await a.client.get(`/api/projects/${id}`);
    expect(own.status).toBe(200);
    expect(own.json.project).toMatchObject({ code: 'BR-1', archived: false });
  });

  it('answers 404 to a malformed id rather than failing', async () => {
    const a = await newOrganisation('org-c');
    expect((await a.client.get('/api/projects/not-a-number')).status).toBe(404);
  });
});
