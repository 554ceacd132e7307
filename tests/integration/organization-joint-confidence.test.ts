// The organisation's chosen joint confidence: an owner sets it (50–95 %), the change is audited,
// and a run started afterwards carries it in its snapshot and draws its frontier at that level.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, newOrganisation, type Client } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';
import { closeFixtureDb, projectWithRegisters, succeededRun } from '../e2e/pages/brief-fixture';

let owner: Client;
let estimator: Client;
let organizationId: number;
let projectId: number;

beforeAll(async () => {
  const org = await newOrganisation('joint-confidence');
  owner = org.client;
  estimator = (await addMember(owner, 'estimator')).client;
  ({ projectId, organizationId } = await projectWithRegisters(owner, 'Quay apron', { schedule: true }));
});

afterAll(async () => {
  await closeDb();
  await closeFixtureDb();
});

type Stored = {
  cost: { percentiles: Record<string, number> };
  duration: { percentiles: Record<string, number> };
  joint: { frontier: { level: number; points: { duration: number; cost: number }[] } };
};

// The joint result needs both targets; the fixture's run brings the cost target.
const withFinish = { finishTarget: '2026-09-30' };

async function storedRun(runId: number) {
  const [row] = await rows<{ inputSnapshot: string; result: string }>(
    'SELECT inputSnapshot, result FROM SimulationRuns WHERE id = ?',
    [runId],
  );
  return { snapshot: JSON.parse(row.inputSnapshot), result: JSON.parse(row.result) as Stored };
}

describe("the organisation's joint confidence", () => {
  it('is 70 % until an owner changes it, and runs use it', async () => {
    expect((await owner.get('/api/organization')).json.organization.jointConfidence).toBe(70);
    const runId = await succeededRun(owner, projectId, withFinish);
    const { snapshot, result } = await storedRun(runId);
    expect(snapshot.settings.jointConfidence).toBe(0.7);
    expect(result.joint.frontier.level).toBe(0.7);
  });

  it('refuses values outside 50–95 % or not whole, and anyone but an owner, changing nothing', async () => {
    for (const bad of [49, 96, 72.5, '80']) {
      const res = await owner.put('/api/organization', { jointConfidence: bad });
      expect(res.status).toBe(400);
      expect(res.json.error.message).toContain(
        'jointConfidence: The joint confidence is a whole percent from 50 to 95.',
      );
    }
    expect((await estimator.put('/api/organization', { jointConfidence: 80 })).status).toBe(403);
    expect((await owner.get('/api/organization')).json.organization.jointConfidence).toBe(70);
    expect(
      await count('AuditEntries', "organizationId = ? AND entity = 'organization'", [organizationId]),
    ).toBe(0);
  });

  it('round-trips, is audited, and a later run draws its frontier at the new level', async () => {
    const saved = await owner.put('/api/organization', { jointConfidence: 80 });
    expect(saved.status).toBe(200);
    expect(saved.json.organization).toMatchObject({ jointConfidence: 80, allowSelfApproval: false });
    expect((await owner.get('/api/organization')).json.organization.jointConfidence).toBe(80);
    const [audit] = await rows<{ before: { jointConfidence: number }; after: { jointConfidence: number } }>(
      "SELECT `before`, `after` FROM AuditEntries WHERE organizationId = ? AND entity = 'organization' AND action = 'update'",
      [organizationId],
    );
    expect(audit.before.jointConfidence).toBe(70);
    expect(audit.after.jointConfidence).toBe(80);

    const runId = await succeededRun(owner, projectId, withFinish);
    const { snapshot, result } = await storedRun(runId);
    expect(snapshot.settings.jointConfidence).toBe(0.8);
    const frontier = result.joint.frontier;
    expect(frontier.level).toBe(0.8);
    expect(frontier.points.length).toBeGreaterThan(0);
    // Fréchet bound, P(A and B) ≤ min(P(A), P(B)): a pair met together with 80 % confidence has a
    // cost at or above the cost's own P80 and a finish at or above the duration's own P80 (allowing
    // for the step between neighbouring sorted iterations).
    for (const p of frontier.points) {
      expect(p.cost).toBeGreaterThanOrEqual(result.cost.percentiles.P80 * 0.995);
      expect(p.duration).toBeGreaterThanOrEqual(result.duration.percentiles.P80 * 0.995);
    }

    // The self-approval switch alone leaves the joint confidence as it is.
    const other = await owner.put('/api/organization', { allowSelfApproval: true });
    expect(other.json.organization).toMatchObject({ jointConfidence: 80, allowSelfApproval: true });
  });
});
