// Smaller holes at the edge: forged client addresses, foreign origins, non-JSON bodies,
// over-long e-mails, sign-up replies that tell accounts apart, and missing security headers.
import crypto from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { APP_URL, Client, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, count } from './helpers/db';
import { waitForMail } from '@/scripts/fakes/mail/client';

const longEmail = () => `${'a'.repeat(300 - '@test.example'.length)}@test.example`;

describe('security at the edge', () => {
  afterAll(closeDb);

  it('keys the per-address sign-in limit on the address the trusted proxy saw, not on a forged one', async () => {
    // The test server trusts loopback as its proxy: the right-most forwarded entry is the client.
    const client = new Client();
    const seen = `10.66.${crypto.randomInt(255)}.${crypto.randomInt(255)}`;
    let last: string | null = null;
    for (let i = 0; i < 51; i++) {
      const forged = `172.16.${i}.${crypto.randomInt(255)}`;
      last = await client.signIn(uniqueEmail('spray'), 'wrong password', `${forged}, ${seen}`);
    }
    expect(last).toMatch(/Too many failed sign-ins/);
  });

  it('refuses a state-changing request from a foreign origin, and writes nothing', async () => {
    const { client, organizationId } = await newOrganisation('origin');
    const before = await count('Invitations', 'organizationId = ?', [organizationId]);
    const res = await client.request('/api/invitations', {
      method: 'POST',
      body: { email: uniqueEmail('x'), role: 'sponsor' },
      headers: { origin: 'https://evil.example' },
    });
    expect(res.status).toBe(403);
    expect(res.json.error.message).toMatch(/origin/i);
    const del = await client.request('/api/members/1', {
      method: 'DELETE',
      headers: { origin: 'https://evil.example' },
    });
    expect(del.status).toBe(403);
    expect(await count('Invitations', 'organizationId = ?', [organizationId])).toBe(before);
    // The app's own origin passes.
    const own = await client.request('/api/invitations', {
      method: 'POST',
      body: { email: uniqueEmail('y'), role: 'sponsor' },
      headers: { origin: new URL(APP_URL).origin },
    });
    expect(own.status).toBe(201);
  });

  it('lets the signed payment webhook through whatever its origin', async () => {
    const res = await new Client().request('/api/webhooks/payments', {
      method: 'POST',
      body: '{}',
      headers: { origin: 'https://evil.example' },
    });
    expect(res.status).not.toBe(403);
    expect(res.status).toBe(400);
  });

  it('refuses a text/plain body on a JSON route, and writes nothing', async () => {
    const { client, organizationId } = await newOrganisation('plaintext');
    const before = await count('Invitations', 'organizationId = ?', [organizationId]);
    const res = await client.request('/api/invitations', {
      method: 'POST',
      body: JSON.stringify({ email: uniqueEmail('z'), role: 'sponsor' }),
      headers: { 'content-type': 'text/plain' },
    });
    expect(res.status).toBe(415);
    expect(res.json.error.message).toMatch(/application\/json/);
    expect(await count('Invitations', 'organizationId = ?', [organizationId])).toBe(before);
  });

  it('refuses a 300-character e-mail with a clear 400 on sign-up, invitations and reset', async () => {
    const signUp = await new Client().post('/api/sign-up', {
      name: 'Long Mail',
      organizationName: 'Long Mail Ltd',
      email: longEmail(),
      password: 'long enough password',
    });
    expect(signUp.status).toBe(400);
    expect(signUp.json.error.issues[0]).toMatchObject({
      path: 'email',
      message: expect.stringMatching(/254/),
    });
    const { client } = await newOrganisation('longinvite');
    const invite = await client.post('/api/invitations', { email: longEmail(), role: 'sponsor' });
    expect(invite.status).toBe(400);
    expect(invite.json.error.issues[0]).toMatchObject({
      path: 'email',
      message: expect.stringMatching(/254/),
    });
    const reset = await new Client().post('/api/password-reset', { email: longEmail() });
    expect(reset.status).toBe(400);
    expect(reset.json.error.issues[0].path).toBe('email');
  });

  it('answers sign-up the same for a taken address, and mails its owner instead', async () => {
    const existing = await newOrganisation('taken');
    const body = (email: string) => ({
      name: 'Someone',
      organizationName: 'Someone Ltd',
      email,
      password: 'a different long password',
    });
    const organisations = await count('Organizations');
    const taken = await new Client().post('/api/sign-up', body(existing.email.toUpperCase()));
    expect(await count('Organizations')).toBe(organisations);
    const fresh = await new Client().post('/api/sign-up', body(uniqueEmail('fresh')));
    expect(taken.status).toBe(202);
    expect(fresh.status).toBe(taken.status);
    expect(fresh.json).toEqual(taken.json);
    // The owner of the taken address is mailed a way back in, after the reply.
    const [mail] = await waitForMail(existing.email, { kind: 'password_reset' });
    expect(mail).toBeTruthy();
  });

  it('sends the security headers, without HSTS over plain http', async () => {
    const res = await fetch(`${APP_URL}/sign-in`);
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toMatch(/default-src 'self'/);
    expect(csp).toMatch(/frame-ancestors 'none'/);
    expect(csp).toMatch(/object-src 'none'/);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    expect(res.headers.get('permissions-policy')).toMatch(/camera=\(\)/);
    expect(res.headers.get('strict-transport-security')).toBeNull();
    const api = await fetch(`${APP_URL}/api/projects`);
    expect(api.headers.get('x-content-type-options')).toBe('nosniff');
  });
});
