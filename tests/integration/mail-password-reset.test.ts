import crypto from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { APP_URL, Client, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';
import { PasswordResetToken, sequelize } from '@/models';

/** Asks for a reset from its own client address, so the per-address limit never interferes. */
async function askForReset(email: string) {
  const address = `10.77.${crypto.randomInt(255)}.${crypto.randomInt(255)}`;
  return new Client().request('/api/password-reset', {
    method: 'POST',
    body: { email },
    headers: { 'x-forwarded-for': address },
  });
}

async function resetLink(email: string, count = 1) {
  const mails = await waitForMail(email, { kind: 'password_reset', count });
  return linkIn(mails[0], `${APP_URL}/reset-password/`);
}

describe('password reset', () => {
  afterAll(async () => {
    await closeDb();
    await sequelize.close();
  });

  it('answers the same whether or not the account exists, and mails only a real account', async () => {
    const { email } = await newOrganisation('resetneutral');
    const nobody = uniqueEmail('nobody');
    const known = await askForReset(email);
    const unknown = await askForReset(nobody);
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.json).toEqual(known.json);
    await waitForMail(email, { kind: 'password_reset' });
    expect(await count('OutboundMessages', 'toAddress = ?', [nobody])).toBe(0);
  });

  it('sends a link that sets a new password once, and only a hash of its token is stored', async () => {
    const { email, password } = await newOrganisation('resetonce');
    expect((await askForReset(email)).status).toBe(202);
    const link = await resetLink(email);
    const token = link.split('/').pop()!;
    const stored = await rows<{ tokenHash: string }>(
      'SELECT t.tokenHash FROM PasswordResetTokens t JOIN Users u ON u.id = t.userId WHERE u.email = ?',
      [email],
    );
    expect(stored).toEqual([{ tokenHash: crypto.createHash('sha256').update(token).digest('hex') }]);

    const page = await new Client().get(new URL(link).pathname);
    expect(page.status).toBe(200);
    expect(page.text).toContain('Set a new password');

    const short = await new Client().post(`/api/password-reset/${token}`, { password: 'short' });
    expect(short.status).toBe(400);
    expect(short.json.error.issues[0].path).toBe('password');

    const newPassword = 'a brand new long password';
    const reset = await new Client().post(`/api/password-reset/${token}`, { password: newPassword });
    expect(reset.status).toBe(200);
    expect(await new Client().signIn(email, newPassword)).toBeNull();
    expect(await new Client().signIn(email, password)).toMatch(/do not match/);

    const again = await new Client().post(`/api/password-reset/${token}`, {
      password: 'yet another password',
    });
    expect(again.status).toBe(400);
    expect(again.json.error.message).toMatch(/already used/);
    expect(await new Client().signIn(email, newPassword)).toBeNull();
    expect((await new Client().get(new URL(link).pathname)).text).toContain('already used');
  });

  it('refuses an expired link and leaves the password as it was', async () => {
    const { email, password } = await newOrganisation('resetexpired');
    await askForReset(email);
    const token = (await resetLink(email)).split('/').pop()!;
    await PasswordResetToken.update(
      { expiresAt: new Date(Date.now() - 60_000) },
      { where: { tokenHash: crypto.createHash('sha256').update(token).digest('hex') } },
    );
    const res = await new Client().post(`/api/password-reset/${token}`, {
      password: 'never accepted password',
    });
    expect(res.status).toBe(400);
    expect(res.json.error.message).toMatch(/expired/);
    expect(await new Client().signIn(email, password)).toBeNull();
    expect(await new Client().signIn(email, 'never accepted password')).toMatch(/do not match/);
  });

  it('lets only the newest link work, and answers 404 to a made-up one', async () => {
    const { email } = await newOrganisation('resetnewest');
    await askForReset(email);
    const first = (await resetLink(email)).split('/').pop()!;
    await askForReset(email);
    const second = (await resetLink(email, 2)).split('/').pop()!;
    expect(second).not.toBe(first);
    expect(
      (await new Client().post(`/api/password-reset/${first}`, { password: 'first link password' })).status,
    ).toBe(400);
    expect(
      (await new Client().post(`/api/password-reset/${second}`, { password: 'second link password' })).status,
    ).toBe(200);
    const madeUp = crypto.randomBytes(32).toString('base64url');
    expect(
      (await new Client().post(`/api/password-reset/${madeUp}`, { password: 'whatever password' })).status,
    ).toBe(404);
  });

  it('rejects a bad e-mail by name and limits repeated requests for one address', async () => {
    const bad = await askForReset('not-an-email');
    expect(bad.status).toBe(400);
    expect(bad.json.error.issues[0].path).toBe('email');

    const email = uniqueEmail('flood');
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await askForReset(email)).status);
    // Five requests an hour per e-mail (lib/services/password-reset.ts), counted whether or not the account exists.
    expect(statuses).toEqual([202, 202, 202, 202, 202, 429]);
  });
});
