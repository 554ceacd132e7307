// The notices the runs and approvals services send, and each member's choice to receive them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, APP_URL, Client, newOrganisation } from './helpers/http';
import { closeDb, count, rows } from './helpers/db';
import { linkIn, waitForMail } from '@/scripts/fakes/mail/client';
import { notifyBriefReady, notifyDecision, notifyRunFinished } from '@/lib/mail';
import { recipientsWithRole } from '@/lib/services/notifications';
import { sequelize } from '@/models';

const run = {
  projectId: 41,
  projectName: 'Harbour Road',
  runId: 907,
  runNumber: 3,
  outcome: 'succeeded' as const,
};

async function userId(email: string) {
  const [user] = await rows<{ id: number }>('SELECT id FROM Users WHERE email = ?', [email]);
  return user.id;
}

describe('notices by e-mail', () => {
  let organizationId: number;
  let owner: Client;
  let ownerEmail: string;
  let estimator: Client;
  let estimatorEmail: string;
  let sponsor: Client;
  let sponsorEmail: string;
  let billing: Client;

  beforeAll(async () => {
    const org = await newOrganisation('notices');
    ({ organizationId, client: owner, email: ownerEmail } = org);
    ({ client: estimator, email: estimatorEmail } = await addMember(owner, 'estimator'));
    ({ client: sponsor, email: sponsorEmail } = await addMember(owner, 'sponsor'));
    ({ client: billing } = await addMember(owner, 'billing'));
  });
  afterAll(async () => {
    await closeDb();
    await sequelize.close();
  });

  it('sends "run finished" to whoever started the run, with the link to its outcome', async () => {
    const queued = await notifyRunFinished(
      { userId: await userId(ownerEmail), email: ownerEmail },
      { ...run, p80Text: 'EUR 25,340,000' },
    );
    expect(queued).toBe(1);
    const [mail] = await waitForMail(ownerEmail, { kind: 'run_finished' });
    expect(mail.envelope.to).toEqual([ownerEmail]);
    expect(linkIn(mail, `${APP_URL}/projects/`)).toBe(`${APP_URL}/projects/41/runs/907`);
    expect(mail.text).toContain('EUR 25,340,000');
  });

  it('suppresses a notice its recipient turned off, and sends it again once turned back on', async () => {
    const off = await estimator.put('/api/notifications', { kind: 'run_finished', enabled: false });
    expect(off.status).toBe(200);
    expect(off.json.preferences.find((p: { kind: string }) => p.kind === 'run_finished').enabled).toBe(false);
    const id = await userId(estimatorEmail);
    expect(
      await count('NotificationPreferences', 'userId = ? AND kind = ? AND enabled = 0', [id, 'run_finished']),
    ).toBe(1);

    expect(await notifyRunFinished({ userId: id, email: estimatorEmail }, run)).toBe(0);
    // Given by e-mail alone, the recipient is still recognised.
    expect(await notifyRunFinished({ email: estimatorEmail.toUpperCase() }, run)).toBe(0);
    expect(
      await count('OutboundMessages', 'toAddress = ? AND kind = ?', [estimatorEmail, 'run_finished']),
    ).toBe(0);

    // Other kinds stay on.
    const estimators = await recipientsWithRole(organizationId, ['estimator']);
    expect(estimators.map((r) => r.email)).toEqual([estimatorEmail]);
    expect(
      await notifyDecision(estimators, {
        ...run,
        decision: 'returned',
        decidedByName: 'Sponsor Person',
        comment: 'Widen the <b>piling</b> range.',
      }),
    ).toBe(1);
    const [decision] = await waitForMail(estimatorEmail, { kind: 'baseline_decision' });
    expect(decision.subject).toBe('Returned for rework: Harbour Road, run 3');
    expect(decision.text).toContain('> Widen the <b>piling</b> range.');
    expect(decision.html).toContain('Widen the &lt;b&gt;piling&lt;/b&gt; range.');

    expect((await estimator.put('/api/notifications', { kind: 'run_finished', enabled: true })).status).toBe(
      200,
    );
    expect(await notifyRunFinished({ userId: id, email: estimatorEmail }, run)).toBe(1);
    await waitForMail(estimatorEmail, { kind: 'run_finished' });
  });

  it('sends "brief ready" to the sponsors with the link to the brief', async () => {
    const sponsors = await recipientsWithRole(organizationId, ['sponsor']);
    expect(sponsors.map((s) => s.email)).toEqual([sponsorEmail]);
    expect(
      await notifyBriefReady(sponsors, {
        ...run,
        p80Text: 'EUR 25,340,000',
        preparedByName: 'Estimator Person',
      }),
    ).toBe(1);
    const [mail] = await waitForMail(sponsorEmail, { kind: 'brief_ready' });
    expect(linkIn(mail, `${APP_URL}/projects/`)).toBe(`${APP_URL}/projects/41/runs/907/brief`);
    expect(mail.html).toContain(`href="${APP_URL}/projects/41/runs/907/brief"`);
  });

  it('lists for each role only the notices it receives', async () => {
    const kinds = async (client: Client) =>
      ((await client.get('/api/notifications')).json.preferences as { kind: string }[]).map((p) => p.kind);
    expect(await kinds(owner)).toEqual(['run_finished', 'brief_ready', 'baseline_decision']);
    expect(await kinds(estimator)).toEqual(['run_finished', 'baseline_decision']);
    expect(await kinds(sponsor)).toEqual(['brief_ready']);
    expect(await kinds(billing)).toEqual([]);
    const page = await billing.get('/settings/notifications');
    expect(page.status).toBe(200);
    expect(page.text).toContain('No notices for your role');
  });

  it('refuses bad input by field, the always-sent kinds, and a signed-out caller', async () => {
    const always = await owner.put('/api/notifications', { kind: 'password_reset', enabled: false });
    expect(always.status).toBe(400);
    expect(always.json.error.issues.map((i: { path: string }) => i.path)).toEqual(['kind']);
    const notBoolean = await owner.put('/api/notifications', { kind: 'brief_ready', enabled: 'no' });
    expect(notBoolean.status).toBe(400);
    expect(notBoolean.json.error.issues.map((i: { path: string }) => i.path)).toEqual(['enabled']);
    const anonymous = new Client();
    expect((await anonymous.get('/api/notifications')).status).toBe(401);
    expect((await anonymous.put('/api/notifications', { kind: 'brief_ready', enabled: false })).status).toBe(
      401,
    );
  });
});
