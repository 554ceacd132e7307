import { afterAll, describe, expect, it } from 'vitest';
import { APP_URL, Client, newOrganisation, uniqueEmail } from './helpers/http';
import { closeDb, rows } from './helpers/db';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';

describe('the invitation e-mail', () => {
  afterAll(closeDb);

  it('reaches the invitee with an accept link that works', async () => {
    const { client: owner } = await newOrganisation('mailinvite');
    const email = uniqueEmail('invitee');
    const invited = await owner.post('/api/invitations', { email, role: 'estimator' });
    expect(invited.status).toBe(201);

    const [mail] = await waitForMail(email, { kind: 'invitation' });
    expect(mail.envelope.to).toEqual([email]);
    expect(mail.subject).toContain('mailinvite Ltd');
    const link = linkIn(mail, `${APP_URL}/invitations/`);
    // The mail carries the same link the owner sees, in both bodies.
    expect(link).toBe(invited.json.invitation.link);
    expect(mail.html).toContain(`href="${link}"`);

    const page = await new Client().get(new URL(link).pathname);
    expect(page.status).toBe(200);
    expect(page.text).toContain('mailinvite Ltd');
    expect(page.text).toContain(email);

    const token = link.split('/').pop();
    const member = new Client();
    const accepted = await member.post(`/api/invitations/accept/${token}`, {
      name: 'Invited Person',
      password: 'a long enough password',
    });
    expect(accepted.status).toBe(200);
    expect(await member.signIn(email, 'a long enough password')).toBeNull();
    expect((await member.get('/api/notifications')).status).toBe(200);

    // The sender marks the row once the SMTP server has said yes, a moment after the fake stored it.
    let row: { status: string; attempts: number } | undefined;
    for (let i = 0; i < 40 && row?.status !== 'sent'; i++) {
      if (i) await new Promise((r) => setTimeout(r, 100));
      [row] = await rows<{ status: string; attempts: number }>(
        'SELECT status, attempts FROM OutboundMessages WHERE toAddress = ? AND kind = ?',
        [email, 'invitation'],
      );
    }
    expect(row).toEqual({ status: 'sent', attempts: 1 });
  });

  it('queues nothing when the invitation is refused', async () => {
    const { client: owner, email: ownerEmail } = await newOrganisation('mailrefused');
    const refused = await owner.post('/api/invitations', { email: ownerEmail, role: 'sponsor' });
    expect(refused.status).toBe(400);
    const queued = await rows('SELECT id FROM OutboundMessages WHERE toAddress = ? AND kind = ?', [
      ownerEmail,
      'invitation',
    ]);
    expect(queued).toHaveLength(0);
  });
});
