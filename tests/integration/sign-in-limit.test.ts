import { describe, expect, it } from 'vitest';
import { Client, newOrganisation } from './helpers/http';

describe('sign-in rate limit', () => {
  it('blocks an e-mail after five failed attempts, even with the right password', async () => {
    const { email, password } = await newOrganisation('limited');
    const client = new Client();
    for (let i = 0; i < 5; i++) {
      expect(await client.signIn(email, 'wrong password', '10.1.1.1')).toMatch(/do not match/);
    }
    const blocked = await client.signIn(email, password, '10.1.1.2');
    expect(blocked).toMatch(/Too many failed sign-ins/);
    expect(client.signedIn).toBe(false);
  });

  it('blocks an address after many failures across e-mails', async () => {
    const client = new Client();
    const address = '10.9.9.9';
    let last: string | null = null;
    for (let i = 0; i < 51; i++)
      last = await client.signIn(`nobody${i}@test.example`, 'wrong password', address);
    expect(last).toMatch(/Too many failed sign-ins/);
    // Another address is not affected.
    expect(await client.signIn('nobody@test.example', 'wrong password', '10.9.9.10')).toMatch(/do not match/);
  });
});
