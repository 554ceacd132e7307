// Accepting an invitation must never let its sender test passwords of an existing account,
// nor tell them whether the invited address has an account at all.
import { afterAll, describe, expect, it } from 'vitest';
import { Client, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, count } from './helpers/db';

async function inviteToken(owner: Client, email: string, role = 'estimator') {
  const invited = await owner.post('/api/invitations', { email, role });
  expect(invited.status).toBe(201);
  return String(invited.json.invitation.link).split('/').pop()!;
}

async function membershipsIn(organizationId: number, email: string) {
  return count('Memberships', 'organizationId = ? AND userId IN (SELECT id FROM Users WHERE email = ?)', [
    organizationId,
    email,
  ]);
}

describe('invitation acceptance', () => {
  afterAll(closeDb);

  it('gives an invitation sender nothing to learn from guessing the invitee’s password', async () => {
    const victim = await newOrganisation('victim');
    const attacker = await newOrganisation('attacker');
    const token = await inviteToken(attacker.client, victim.email);
    const guess = (client: Client, password: string) =>
      client.post(`/api/invitations/accept/${token}`, { name: 'Anyone', password });
    // Signed in as the sender, and signed out: a right and a wrong password read the same.
    const wrong = await guess(attacker.client, 'a wrong long password');
    const right = await guess(attacker.client, victim.password);
    expect(right.status).toBe(wrong.status);
    expect(right.json).toEqual(wrong.json);
    const wrongOut = await guess(new Client(), 'a wrong long password');
    const rightOut = await guess(new Client(), victim.password);
    expect(rightOut.status).toBe(wrongOut.status);
    expect(rightOut.json).toEqual(wrongOut.json);
    // Knowing the password is not enough: the existing account must be signed in to join.
    expect(await membershipsIn(attacker.organizationId, victim.email)).toBe(0);
  });

  it('answers the same for an address with an account and one without', async () => {
    const existing = await newOrganisation('hasaccount');
    const owner = await newOrganisation('inviter');
    const fresh = uniqueEmail('fresh');
    const toExisting = await inviteToken(owner.client, existing.email);
    const toFresh = await inviteToken(owner.client, fresh);
    const body = { name: 'New Person', password: 'a long new password' };
    const a = await new Client().post(`/api/invitations/accept/${toExisting}`, body);
    const b = await new Client().post(`/api/invitations/accept/${toFresh}`, body);
    expect(a.status).toBe(200);
    expect(b.status).toBe(a.status);
    expect(b.json).toEqual(a.json);
    // The accept pages read the same too: neither asks for a current password.
    const pageA = await new Client().get(`/invitations/${toExisting}`);
    const pageB = await new Client().get(`/invitations/${toFresh}`);
    expect(pageA.text).not.toMatch(/current password/i);
    expect(pageB.text).not.toMatch(/current password/i);
    // The new address got its account and membership; the existing one did not join.
    expect(await membershipsIn(owner.organizationId, fresh)).toBe(1);
    expect(await membershipsIn(owner.organizationId, existing.email)).toBe(0);
  });

  it('lets the invitee, signed in as themselves, accept without a password', async () => {
    const invitee = await newOrganisation('signedinvitee');
    const owner = await newOrganisation('welcoming');
    const token = await inviteToken(owner.client, invitee.email, 'sponsor');
    const res = await invitee.client.post(`/api/invitations/accept/${token}`, {});
    expect(res.status).toBe(200);
    expect(await membershipsIn(owner.organizationId, invitee.email)).toBe(1);
  });

  it('refuses someone signed in with another address, and writes nothing', async () => {
    const invitee = await newOrganisation('otherinvitee');
    const stranger = await newOrganisation('stranger');
    const owner = await newOrganisation('careful');
    const token = await inviteToken(owner.client, invitee.email);
    const res = await stranger.client.post(`/api/invitations/accept/${token}`, {});
    expect(res.status).toBe(403);
    expect(res.json.error.message).toMatch(/another e-mail address/);
    expect(await membershipsIn(owner.organizationId, invitee.email)).toBe(0);
    expect(await membershipsIn(owner.organizationId, stranger.email)).toBe(0);
  });
});
