// Sponsors' decisions on runs: who may decide, once per run, recorded with who and when, never edited.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, newOrganisation, type Client } from './helpers/http';
import { count, rows, closeDb } from './helpers/db';
import { closeFixtureDb, projectWithRegisters, succeededRun } from '../e2e/pages/brief-fixture';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';

let owner: Client;
let sponsor: { client: Client; email: string };
let estimator: { client: Client; email: string };
let projectId: number;
let runId: number;

beforeAll(async () => {
  const org = await newOrganisation('decide');
  owner = org.client;
  sponsor = await addMember(owner, 'sponsor');
  estimator = await addMember(owner, 'estimator');
  ({ projectId } = await projectWithRegisters(owner));
  runId = await succeededRun(estimator.client, projectId);
});

afterAll(async () => {
  await closeDb();
  await closeFixtureDb();
});

describe('deciding on a run', () => {
  it('refuses an estimator (403) and writes nothing', async () => {
    const res = await estimator.client.post(`/api/projects/${projectId}/decisions`, {
      runId,
      decision: 'approved',
    });
    expect(res.status).toBe(403);
    expect(await count('Approvals', 'runId = ?', [runId])).toBe(0);
  });

  it('answers 404 to another organisation, for the decision and for the brief', async () => {
    const other = await newOrganisation('decide-other');
    const post = await other.client.post(`/api/projects/${projectId}/decisions`, {
      runId,
      decision: 'approved',
    });
    expect(post.status).toBe(404);
    expect((await other.client.get(`/api/projects/${projectId}/brief/${runId}`)).status).toBe(404);
    expect((await other.client.get(`/api/projects/${projectId}/brief/${runId}/pdf`)).status).toBe(404);
    expect((await other.client.get(`/api/projects/${projectId}/decisions`)).status).toBe(404);
    expect(await count('Approvals', 'runId = ?', [runId])).toBe(0);
  });

  it('needs a reason to return a run (400 naming the comment)', async () => {
    const res = await sponsor.client.post(`/api/projects/${projectId}/decisions`, {
      runId,
      decision: 'returned',
    });
    expect(res.status).toBe(400);
    expect(res.json.error.issues.map((i: { path: string }) => i.path)).toContain('comment');
    const bad = await sponsor.client.post(`/api/projects/${projectId}/decisions`, {
      runId,
      decision: 'maybe',
    });
    expect(bad.status).toBe(400);
    expect(bad.json.error.issues.map((i: { path: string }) => i.path)).toContain('decision');
    expect(await count('Approvals', 'runId = ?', [runId])).toBe(0);
  });

  it('lets a sponsor approve, recording who, when, the stage and the class', async () => {
    const before = Date.now();
    const res = await sponsor.client.post(`/api/projects/${projectId}/decisions`, {
      runId,
      decision: 'approved',
      comment: '  Fund at P80.  ',
    });
    expect(res.status).toBe(201);
    expect(res.json.decision).toMatchObject({
      runId,
      decision: 'approved',
      comment: 'Fund at P80.',
      stage: 'Feasibility',
    });
    const [row] = await rows<{ sponsorId: number; createdAt: Date; estimateClass: number; email: string }>(
      'SELECT a.sponsorId, a.createdAt, a.estimateClass, u.email FROM Approvals a JOIN Users u ON u.id = a.sponsorId WHERE a.runId = ?',
      [runId],
    );
    expect(row.email).toBe(sponsor.email);
    expect(row.estimateClass).toBe(3);
    expect(Math.abs(new Date(row.createdAt).getTime() - before)).toBeLessThan(60_000);
    expect(
      await count('AuditEntries', "entity = 'approval' AND action = 'approved' AND projectId = ?", [
        projectId,
      ]),
    ).toBe(1);

    const history = await estimator.client.get(`/api/projects/${projectId}/decisions`);
    expect(history.status).toBe(200);
    expect(history.json.decisions).toHaveLength(1);
    expect(history.json.decisions[0].sponsorName).toBe('sponsor person');
  });

  it('tells the estimators, with a link to the brief', async () => {
    const [mail] = await waitForMail(estimator.email, { kind: 'baseline_decision' });
    expect(mail.subject).toContain('Baseline approved');
    expect(linkIn(mail, process.env.APP_URL!)).toBe(
      `${process.env.APP_URL}/projects/${projectId}/runs/${runId}/brief`,
    );
  });

  it('refuses a second decision on the same run (409), even by the owner', async () => {
    for (const client of [sponsor.client, owner]) {
      const res = await client.post(`/api/projects/${projectId}/decisions`, {
        runId,
        decision: 'returned',
        comment: 'Changed my mind',
      });
      expect(res.status).toBe(409);
    }
    expect(await count('Approvals', 'runId = ?', [runId])).toBe(1);
  });

  it('cannot be edited or removed: PUT, PATCH and DELETE answer 405', async () => {
    const [{ id }] = await rows<{ id: number }>('SELECT id FROM Approvals WHERE runId = ?', [runId]);
    const body = { decision: 'returned', comment: 'edited' };
    const attempts = [
      await sponsor.client.put(`/api/projects/${projectId}/decisions`, body),
      await sponsor.client.patch(`/api/projects/${projectId}/decisions`, body),
      await sponsor.client.put(`/api/projects/${projectId}/decisions/${id}`, body),
      await sponsor.client.patch(`/api/projects/${projectId}/decisions/${id}`, body),
      await owner.del(`/api/projects/${projectId}/decisions/${id}`),
    ];
    expect(attempts.map((a) => a.status)).toEqual([405, 405, 405, 405, 405]);
    const [row] = await rows<{ decision: string; comment: string }>(
      'SELECT decision, comment FROM Approvals WHERE id = ?',
      [id],
    );
    expect(row).toEqual({ decision: 'approved', comment: 'Fund at P80.' });
    const one = await sponsor.client.get(`/api/projects/${projectId}/decisions/${id}`);
    expect(one.json.decision.decision).toBe('approved');
  });

  it('refuses a run that has not succeeded, and a run of another project', async () => {
    const second = await projectWithRegisters(owner, 'Second');
    const otherRun = await succeededRun(owner, second.projectId);
    const wrongProject = await sponsor.client.post(`/api/projects/${projectId}/decisions`, {
      runId: otherRun,
      decision: 'approved',
    });
    expect(wrongProject.status).toBe(404);
    expect(await count('Approvals', 'runId = ?', [otherRun])).toBe(0);
  });
});
