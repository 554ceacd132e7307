// Separation of duties on baselines: whoever started a run does not also approve it, unless an
// owner has allowed self-approval for the organisation; such a decision is marked. (Common
// practice in project controls: the person who prepares an estimate is not the one who funds it.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, newOrganisation, type Client } from './helpers/http';
import { count, rows, closeDb } from './helpers/db';
import { closeFixtureDb, projectWithRegisters, succeededRun } from '../e2e/pages/brief-fixture';

let owner: Client;
let estimator: { client: Client; email: string };
let sponsor: { client: Client; email: string };
let projectId: number;
let organizationId: number;

beforeAll(async () => {
  const org = await newOrganisation('duties');
  owner = org.client;
  estimator = await addMember(owner, 'estimator');
  sponsor = await addMember(owner, 'sponsor');
  ({ projectId, organizationId } = await projectWithRegisters(owner));
});

afterAll(async () => {
  await closeDb();
  await closeFixtureDb();
});

const decide = (client: Client, runId: number, decision: 'approved' | 'returned', comment = '') =>
  client.post(`/api/projects/${projectId}/decisions`, { runId, decision, comment });

describe('approving a run one started', () => {
  it('refuses the owner who started the run (403, saying why) and writes nothing', async () => {
    const runId = await succeededRun(owner, projectId);
    const res = await decide(owner, runId, 'approved');
    expect(res.status).toBe(403);
    // Runs are named by their number within the project, not their id.
    const { number } = (await owner.get(`/api/projects/${projectId}/runs/${runId}`)).json.run;
    expect(res.json.error.message).toContain(`You started run ${number}, so someone else must approve it`);
    expect(res.json.error.message).toContain('separation of duties');
    expect(await count('Approvals', 'runId = ?', [runId])).toBe(0);

    // Returning one's own run is no conflict of duties: the run goes back, nothing is funded.
    const returned = await decide(owner, runId, 'returned', 'Missing the ground-investigation risk.');
    expect(returned.status).toBe(201);
    expect(returned.json.decision.selfApproved).toBe(false);
  });

  it('lets another person approve it, unmarked', async () => {
    const runId = await succeededRun(owner, projectId);
    const res = await decide(sponsor.client, runId, 'approved');
    expect(res.status).toBe(201);
    expect(res.json.decision.selfApproved).toBe(false);
    const [row] = await rows<{ selfApproved: number }>('SELECT selfApproved FROM Approvals WHERE runId = ?', [
      runId,
    ]);
    expect(Number(row.selfApproved)).toBe(0);
  });

  it('keeps the switch for owners, and once allowed records the approval as self-approved', async () => {
    expect((await estimator.client.put('/api/organization', { allowSelfApproval: true })).status).toBe(403);
    expect((await sponsor.client.get('/api/organization')).status).toBe(403);
    const bad = await owner.put('/api/organization', { allowSelfApproval: 'yes' });
    expect(bad.status).toBe(400);
    expect(bad.json.error.message).toContain('allowSelfApproval');

    const runId = await succeededRun(owner, projectId);
    const on = await owner.put('/api/organization', { allowSelfApproval: true });
    expect(on.status).toBe(200);
    expect(on.json.organization.allowSelfApproval).toBe(true);
    expect(
      await count('AuditEntries', "organizationId = ? AND entity = 'organization' AND action = 'update'", [
        organizationId,
      ]),
    ).toBe(1);

    const res = await decide(owner, runId, 'approved', 'Small team: approved by its owner.');
    expect(res.status).toBe(201);
    expect(res.json.decision.selfApproved).toBe(true);
    const [row] = await rows<{ selfApproved: number }>('SELECT selfApproved FROM Approvals WHERE runId = ?', [
      runId,
    ]);
    expect(Number(row.selfApproved)).toBe(1);

    // The trend and the brief say so.
    const brief = await owner.get(`/api/projects/${projectId}/brief/${runId}`);
    expect(brief.status).toBe(200);
    expect(brief.json.brief.decision.selfApproved).toBe(true);

    // Switched off again, the rule holds for the next run.
    expect((await owner.put('/api/organization', { allowSelfApproval: false })).status).toBe(200);
    const next = await succeededRun(owner, projectId);
    expect((await decide(owner, next, 'approved')).status).toBe(403);
  });
});
