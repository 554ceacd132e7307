import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, Client, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';

describe('members and roles', () => {
  let owner: Client;
  let ownerEmail: string;
  let estimator: Client;
  let sponsor: Client;
  let billing: Client;

  beforeAll(async () => {
    const org = await newOrganisation('members');
    owner = org.client;
    ownerEmail = org.email;
    estimator = (await addMember(owner, 'estimator')).client;
    sponsor = (await addMember(owner, 'sponsor')).client;
    billing = (await addMember(owner, 'billing')).client;
  });
  afterAll(closeDb);

  it('lets an owner invite, and stores the invitation with a token and an expiry', async () => {
    const email = uniqueEmail('invitee');
    const res = await owner.post('/api/invitations', { email, role: 'sponsor' });
    expect(res.status).toBe(201);
    expect(res.json.invitation.link).toMatch(/\/invitations\/[A-Za-z0-9_-]{20,}$/);
    const [stored] = await rows<{ role: string; expiresAt: Date }>(
      'SELECT role, expiresAt FROM Invitations WHERE email = ?',
      [email],
    );
    expect(stored.role).toBe('sponsor');
    expect(new Date(stored.expiresAt).getTime()).toBeGreaterThan(Date.now() + 6 * 24 * 3600 * 1000);
  });

  it.each([
    ['estimator', () => estimator],
    ['sponsor', () => sponsor],
    ['billing', () => billing],
  ])('refuses member management to a %s with 403', async (_role, who) => {
    const client = who();
    expect(
      (await client.post('/api/invitations', { email: uniqueEmail('x'), role: 'estimator' })).status,
    ).toBe(403);
    expect((await client.get('/api/members')).status).toBe(403);
    const members = await owner.get('/api/members');
    const someone = members.json.members[0].id;
    expect((await client.patch(`/api/members/${someone}`, { role: 'sponsor' })).status).toBe(403);
    expect((await client.del(`/api/members/${someone}`)).status).toBe(403);
  });

  it('answers 401 to a signed-out caller', async () => {
    const anonymous = new Client();
    expect((await anonymous.get('/api/members')).status).toBe(401);
    expect(
      (await anonymous.post('/api/invitations', { email: uniqueEmail('x'), role: 'owner' })).status,
    ).toBe(401);
  });

  it('rejects an invitation with a bad role or e-mail, naming the field', async () => {
    const res = await owner.post('/api/invitations', { email: 'not-an-email', role: 'admin' });
    expect(res.status).toBe(400);
    const paths = res.json.error.issues.map((i: { path: string }) => i.path).sort();
    expect(paths).toEqual(['email', 'role']);
  });

  it('never removes or demotes the last owner', async () => {
    const members = (await owner.get('/api/members')).json.members as { id: number; email: string }[];
    const self = members.find((m) => m.email === ownerEmail)!;
    const removal = await owner.del(`/api/members/${self.id}`);
    expect(removal.status).toBe(400);
    expect(removal.json.error.message).toMatch(/last owner/);
    const demotion = await owner.patch(`/api/members/${self.id}`, { role: 'estimator' });
    expect(demotion.status).toBe(400);
    expect(await count('Memberships', 'id = ? AND role = ?', [self.id, 'owner'])).toBe(1);
  });

  it('changes a role and removes a member, and writes both to the audit trail', async () => {
    const { email } = await addMember(owner, 'sponsor', 'promoted');
    const members = (await owner.get('/api/members')).json.members as { id: number; email: string }[];
    const target = members.find((m) => m.email === email)!;
    const change = await owner.patch(`/api/members/${target.id}`, { role: 'estimator' });
    expect(change.status).toBe(200);
    expect(await count('Memberships', 'id = ? AND role = ?', [target.id, 'estimator'])).toBe(1);
    expect((await owner.del(`/api/members/${target.id}`)).status).toBe(204);
    expect(await count('Memberships', 'id = ?', [target.id])).toBe(0);
    expect(await count('AuditEntries', "entity = 'membership' AND entityId = ?", [String(target.id)])).toBe(
      2,
    );
  });

  it('gives 404 for a member of another organisation', async () => {
    const other = await newOrganisation('elsewhere');
    const theirs = (await other.client.get('/api/members')).json.members[0].id;
    expect((await owner.patch(`/api/members/${theirs}`, { role: 'sponsor' })).status).toBe(404);
    expect((await owner.del(`/api/members/${theirs}`)).status).toBe(404);
  });
});
