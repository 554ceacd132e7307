// Putting a brief before the sponsors: the e-mail reaches them with the link to the brief.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, newOrganisation, type Client } from './helpers/http';
import { count, closeDb } from './helpers/db';
import { closeFixtureDb, projectWithRegisters, succeededRun } from '../e2e/pages/brief-fixture';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';

let owner: Client;
let sponsor: { client: Client; email: string };
let estimator: { client: Client; email: string };
let projectId: number;
let runId: number;

beforeAll(async () => {
  owner = (await newOrganisation('send')).client;
  ({ projectId } = await projectWithRegisters(owner));
  estimator = await addMember(owner, 'estimator');
  runId = await succeededRun(estimator.client, projectId);
});

afterAll(async () => {
  await closeDb();
  await closeFixtureDb();
});

describe('sending a brief to the sponsors', () => {
  it('says so when there is no sponsor to tell (409)', async () => {
    const res = await estimator.client.post(`/api/projects/${projectId}/brief/${runId}/send`);
    expect(res.status).toBe(409);
    expect(res.json.error.message).toMatch(/no sponsor/i);
  });

  it('e-mails each sponsor a link to the brief', async () => {
    sponsor = await addMember(owner, 'sponsor');
    const res = await estimator.client.post(`/api/projects/${projectId}/brief/${runId}/send`);
    expect(res.status).toBe(200);
    expect(res.json.sponsors).toBe(1);
    const [mail] = await waitForMail(sponsor.email, { kind: 'brief_ready' });
    expect(mail.to).toContain(sponsor.email);
    expect(linkIn(mail, process.env.APP_URL!)).toBe(
      `${process.env.APP_URL}/projects/${projectId}/runs/${runId}/brief`,
    );
    expect(
      await count('AuditEntries', "entity = 'brief' AND action = 'request-decision' AND entityId = ?", [
        String(runId),
      ]),
    ).toBe(1);
    const brief = await sponsor.client.get(`/api/projects/${projectId}/brief/${runId}`);
    expect(brief.json.brief.sentForDecision.byName).toBe('estimator person');
  });

  it('is not for sponsors (403), and not once the run is decided (409)', async () => {
    expect((await sponsor.client.post(`/api/projects/${projectId}/brief/${runId}/send`)).status).toBe(403);
    const decided = await sponsor.client.post(`/api/projects/${projectId}/decisions`, {
      runId,
      decision: 'approved',
    });
    expect(decided.status).toBe(201);
    expect((await estimator.client.post(`/api/projects/${projectId}/brief/${runId}/send`)).status).toBe(409);
  });
});
