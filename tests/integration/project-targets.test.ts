// A project's cost and finish targets: saved with the project's settings (version rule included),
// checked with clear messages, audited, and left alone by a change that does not send them.
import { afterAll, describe, expect, it } from 'vitest';
import { newOrganisation } from './helpers/http';
import { closeDb, rows } from './helpers/db';

afterAll(closeDb);

const settings = (code: string) => ({
  name: 'Outfall tunnel',
  code,
  currency: 'EUR',
  estimateClass: 3,
  stage: 'Feasibility',
  baseDate: '2027-03-01',
});

describe('project targets', () => {
  it('round-trip through the project settings, blank clears them, absent keeps them', async () => {
    const { client } = await newOrganisation('project-targets');
    const created = await client.post('/api/projects', {
      ...settings('OT-1'),
      costTarget: '48,500,000',
      finishTarget: '2030-06-28',
    });
    expect(created.status).toBe(201);
    const { id, version } = created.json.project;
    expect(created.json.project).toMatchObject({ costTarget: 48_500_000, finishTarget: '2030-06-28' });
    expect((await client.get(`/api/projects/${id}`)).json.project).toMatchObject({
      costTarget: 48_500_000,
      finishTarget: '2030-06-28',
    });

    const changed = await client.put(`/api/projects/${id}`, {
      ...settings('OT-1'),
      costTarget: 51_000_000,
      finishTarget: '2030-09-30',
      version,
    });
    expect(changed.status).toBe(200);
    expect(changed.json.project).toMatchObject({ costTarget: 51_000_000, finishTarget: '2030-09-30' });
    const [audit] = await rows<{ before: object; after: object }>(
      "SELECT `before`, `after` FROM AuditEntries WHERE projectId = ? AND entity = 'project' AND action = 'update'",
      [id],
    );
    expect(audit.before).toMatchObject({ costTarget: 48_500_000, finishTarget: '2030-06-28' });
    expect(audit.after).toMatchObject({ costTarget: 51_000_000, finishTarget: '2030-09-30' });

    // A client that knows nothing of targets (e.g. a script renaming the project) keeps them.
    const renamed = await client.put(`/api/projects/${id}`, {
      ...settings('OT-1'),
      name: 'Outfall tunnel, stage 2',
      version: changed.json.project.version,
    });
    expect(renamed.json.project).toMatchObject({ costTarget: 51_000_000, finishTarget: '2030-09-30' });

    const cleared = await client.put(`/api/projects/${id}`, {
      ...settings('OT-1'),
      costTarget: '',
      finishTarget: '',
      version: renamed.json.project.version,
    });
    expect(cleared.status).toBe(200);
    expect(cleared.json.project).toMatchObject({ costTarget: null, finishTarget: null });

    // The version rule holds for the targets as for the other settings.
    const stale = await client.put(`/api/projects/${id}`, {
      ...settings('OT-1'),
      costTarget: 1,
      version,
    });
    expect(stale.status).toBe(409);
    expect((await client.get(`/api/projects/${id}`)).json.project.costTarget).toBeNull();
  });

  it('refuses a target that is not an amount above 0 or a finish before the base date, saving nothing', async () => {
    const { client } = await newOrganisation('project-targets-bad');
    const res = await client.post('/api/projects', {
      ...settings('OT-2'),
      costTarget: -5,
      finishTarget: '2026-12-31',
    });
    expect(res.status).toBe(400);
    const issues = Object.fromEntries(
      res.json.error.issues.map((i: { path: string; message: string }) => [i.path, i.message]),
    );
    expect(issues.costTarget).toBe('Enter the cost target as an amount greater than 0, or leave it blank.');
    expect(issues.finishTarget).toBe('The finish target must be on or after the base date, 2027-03-01.');
    const listed = (await client.get('/api/projects')).json.projects as { code: string }[];
    expect(listed.map((p) => p.code)).not.toContain('OT-2');
  });
});
