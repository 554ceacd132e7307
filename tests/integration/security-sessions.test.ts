// A session ends when its owner signs out, when the password is reset, and its rights follow
// the membership on every request.
import crypto from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { addMember, APP_URL, Client, newOrganisation } from './helpers/http';
import { closeDb } from './helpers/db';
import { STAGES } from '@/lib/validation/project';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';

describe('sessions that end', () => {
  afterAll(closeDb);

  it('kills a copied session token when its owner signs out', async () => {
    const { client } = await newOrganisation('signout');
    const copied = client.copy();
    expect((await copied.get('/api/projects')).status).toBe(200);
    const out = await client.signOut();
    expect(out.status).toBe(200);
    expect((await copied.get('/api/projects')).status).toBe(401);
  });

  it('kills sessions issued before a password reset', async () => {
    const { client, email } = await newOrganisation('resetsession');
    expect((await client.get('/api/projects')).status).toBe(200);
    const address = `10.78.${crypto.randomInt(255)}.${crypto.randomInt(255)}`;
    const asked = await new Client().request('/api/password-reset', {
      method: 'POST',
      body: { email },
      headers: { 'x-forwarded-for': address },
    });
    expect(asked.status).toBe(202);
    const [mail] = await waitForMail(email, { kind: 'password_reset' });
    const token = linkIn(mail, `${APP_URL}/reset-password/`).split('/').pop()!;
    const newPassword = 'the password after reset';
    expect((await new Client().post(`/api/password-reset/${token}`, { password: newPassword })).status).toBe(
      200,
    );
    expect((await client.get('/api/projects')).status).toBe(401);
    const again = new Client();
    expect(await again.signIn(email, newPassword)).toBeNull();
    expect((await again.get('/api/projects')).status).toBe(200);
  });

  it('shuts a removed member out on their next request', async () => {
    const owner = await newOrganisation('remover');
    const member = await addMember(owner.client, 'estimator', 'removed');
    expect((await member.client.get('/api/projects')).status).toBe(200);
    const members = await owner.client.get('/api/members');
    const row = members.json.members.find((m: { email: string }) => m.email === member.email);
    expect((await owner.client.del(`/api/members/${row.id}`)).status).toBe(204);
    expect((await member.client.get('/api/projects')).status).toBe(401);
  });

  it('applies a lowered role on the next write', async () => {
    const owner = await newOrganisation('demoter');
    const member = await addMember(owner.client, 'estimator', 'demoted');
    const project = {
      name: 'Harbour wall',
      code: 'HW-1',
      currency: 'GBP',
      estimateClass: 3,
      stage: STAGES[0],
      baseDate: '2026-01-05',
    };
    const before = await member.client.post('/api/projects', project);
    expect(before.status).toBe(201);
    const members = await owner.client.get('/api/members');
    const row = members.json.members.find((m: { email: string }) => m.email === member.email);
    expect((await owner.client.patch(`/api/members/${row.id}`, { role: 'sponsor' })).status).toBe(200);
    expect((await member.client.post('/api/projects', project)).status).toBe(403);
  });
});
