import { afterAll, describe, expect, it } from 'vitest';
import { Client, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';

const good = () => ({
  name: 'Ada Byrne',
  organizationName: 'Byrne Civils',
  email: uniqueEmail('signup'),
  password: 'long enough password',
});

async function totals() {
  return {
    users: await count('Users'),
    orgs: await count('Organizations'),
    memberships: await count('Memberships'),
  };
}

describe('sign-up', () => {
  afterAll(closeDb);

  it('creates an organisation with its owner', async () => {
    const input = good();
    const res = await new Client().post('/api/sign-up', input);
    expect(res.status).toBe(202);
    const owners = await rows<{ role: string }>(
      'SELECT m.role FROM Memberships m JOIN Users u ON u.id = m.userId WHERE u.email = ?',
      [input.email],
    );
    expect(owners).toEqual([{ role: 'owner' }]);
  });

  it.each([
    ['a short password', { password: 'short' }, 'password', /at least 10 characters/],
    ['an invalid e-mail', { email: 'ada-at-byrne' }, 'email', /valid e-mail/],
    ['an empty organisation name', { organizationName: ' ' }, 'organizationName', /organisation name/],
  ])('refuses %s with a clear message and creates nothing', async (_label, change, field, message) => {
    const before = await totals();
    const res = await new Client().post('/api/sign-up', { ...good(), ...change });
    expect(res.status).toBe(400);
    const issue = res.json.error.issues.find((i: { path: string }) => i.path === field);
    expect(issue.message).toMatch(message);
    expect(await totals()).toEqual(before);
  });

  it('creates nothing for an e-mail already used, and says only to check the mail', async () => {
    const existing = await newOrganisation('taken');
    const before = await totals();
    const res = await new Client().post('/api/sign-up', { ...good(), email: existing.email.toUpperCase() });
    expect(res.status).toBe(202);
    expect(res.json.message).toMatch(/Check your mail/);
    expect(await totals()).toEqual(before);
  });
});
