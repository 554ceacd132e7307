// A project's settings and notes are changed only from the version last read: a change sent from
// an older read answers 409 with the current values and overwrites nothing (as the registers do).
import { describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';

const settings = (code: string) => ({
  name: 'Harbour wall renewal',
  code,
  currency: 'EUR',
  estimateClass: 4,
  stage: 'Concept',
  baseDate: '2027-03-01',
});

describe('project settings and notes from a stale read', () => {
  it('refuses settings sent from an older version with 409 and keeps the newer change', async () => {
    const { client } = await newOrganisation('project-versions');
    const created = await client.post('/api/projects', settings('HW-1'));
    expect(created.status).toBe(201);
    const { id, version } = created.json.project;

    const first = await client.put(`/api/projects/${id}`, {
      ...settings('HW-1'),
      name: 'Harbour wall, stage 1',
      version,
    });
    expect(first.status).toBe(200);
    expect(first.json.project.version).toBe(version + 1);

    const stale = await client.put(`/api/projects/${id}`, {
      ...settings('HW-1'),
      name: 'Overwritten',
      version,
    });
    expect(stale.status).toBe(409);
    expect(stale.json.error.details.current.name).toBe('Harbour wall, stage 1');
    expect((await client.get(`/api/projects/${id}`)).json.project.name).toBe('Harbour wall, stage 1');

    const missing = await client.put(`/api/projects/${id}`, settings('HW-1'));
    expect(missing.status).toBe(400);
    expect(missing.json.error.issues.map((i: { path: string }) => i.path)).toContain('version');
  });

  it('refuses notes sent from an older version with 409 and keeps the newer text', async () => {
    const { client } = await newOrganisation('notes-versions');
    const { id } = (await client.post('/api/projects', settings('HW-2'))).json.project;
    const read = (await client.get(`/api/projects/${id}/notes`)).json.notes;

    const mine = await client.put(`/api/projects/${id}/notes`, {
      assumptions: 'Tidal window in March.',
      version: read.version,
    });
    expect(mine.status).toBe(200);
    expect(mine.json.notes.version).toBe(read.version + 1);

    const stale = await client.put(`/api/projects/${id}/notes`, {
      assumptions: 'Stale text.',
      version: read.version,
    });
    expect(stale.status).toBe(409);
    expect((await client.get(`/api/projects/${id}/notes`)).json.notes.assumptions).toBe(
      'Tidal window in March.',
    );
  });
});
