// The outbox and its sender, called directly: vitest has the test database's settings, and
// the app server's own sender delivers whatever these tests leave due.
import { closedPort } from './helpers/ports';
import { afterAll, describe, expect, it } from 'vitest';
import { uniqueEmail } from './helpers/http';
import { closeDb, count } from './helpers/db';
import { waitForMail, mailTo } from '@/scripts/fakes/mail/client';
import { deliverPending, enqueueMail, MAX_ATTEMPTS } from '@/lib/mail';
import { createMailTransport } from '@/lib/mail/transport';
import { OutboundMessage, sequelize } from '@/models';

// Rows due only on a day the app server's clock has not reached, so that only these tests send them.
const FUTURE = new Date(Date.now() + 3 * 24 * 3600_000);
const at = (seconds: number) => new Date(FUTURE.getTime() + seconds * 1000);

async function futureRow(extra: Partial<{ attempts: number }> = {}) {
  const to = uniqueEmail('outbox');
  const row = await OutboundMessage.create({
    kind: 'run_finished',
    toAddress: to,
    subject: 'Outbox test',
    html: '<p>Outbox test</p>',
    text: 'Outbox test',
    nextAttemptAt: FUTURE,
    ...extra,
  });
  return { id: row.id, to };
}

describe('the mail outbox', () => {
  afterAll(async () => {
    await closeDb();
    await sequelize.close();
  });

  it('keeps a failed send pending with its error, retries it later and then sends it', async () => {
    const { id, to } = await futureRow();
    const down = createMailTransport(await closedPort());

    expect(await deliverPending({ ids: [id], now: at(1), transport: down })).toEqual({
      sent: 0,
      retrying: 1,
      failed: 0,
    });
    let row = (await OutboundMessage.findByPk(id))!;
    expect(row.status).toBe('pending');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toMatch(/ECONNREFUSED|connect/i);
    // First retry 15 s after the failure (lib/mail/retry.ts); DATETIME keeps whole seconds.
    expect(Math.abs(row.nextAttemptAt.getTime() - at(16).getTime())).toBeLessThanOrEqual(1000);

    // Not due yet: the sender leaves it alone.
    const up = createMailTransport();
    expect(await deliverPending({ ids: [id], now: at(10), transport: up })).toEqual({
      sent: 0,
      retrying: 0,
      failed: 0,
    });

    expect(await deliverPending({ ids: [id], now: at(17), transport: up })).toEqual({
      sent: 1,
      retrying: 0,
      failed: 0,
    });
    row = (await OutboundMessage.findByPk(id))!;
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(2);
    expect(row.lastError).toBeNull();
    expect(row.sentAt).toBeInstanceOf(Date);
    const [mail] = await waitForMail(to, { kind: 'run_finished' });
    expect(mail.subject).toBe('Outbox test');
    up.close();
  });

  it('marks a mail failed after the last attempt', async () => {
    const { id } = await futureRow({ attempts: MAX_ATTEMPTS - 1 });
    const report = await deliverPending({
      ids: [id],
      now: at(1),
      transport: createMailTransport(await closedPort()),
    });
    expect(report.failed).toBe(1);
    const row = (await OutboundMessage.findByPk(id))!;
    expect(row.status).toBe('failed');
    expect(row.attempts).toBe(MAX_ATTEMPTS);
  });

  it('sends a mail once even when two senders reach it at the same moment', async () => {
    const { id, to } = await futureRow();
    const reports = await Promise.all([
      deliverPending({ ids: [id], now: at(1) }),
      deliverPending({ ids: [id], now: at(1) }),
    ]);
    expect(reports.reduce((n, r) => n + r.sent, 0)).toBe(1);
    await waitForMail(to);
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailTo(to)).toHaveLength(1);
  });

  it('delivers each mail of a batch once when two senders (two web instances) work through it together', async () => {
    const rows = await Promise.all(Array.from({ length: 12 }, () => futureRow()));
    const ids = rows.map((r) => r.id);
    // Each sender reads the same due rows, then claims them one by one: every claim is one
    // conditional UPDATE, so a row goes to whichever sender's UPDATE the database runs first.
    const reports = await Promise.all([
      deliverPending({ ids, now: at(1) }),
      deliverPending({ ids, now: at(1) }),
    ]);
    expect(reports[0].sent + reports[1].sent).toBe(rows.length);
    expect(
      await count('OutboundMessages', `id IN (${ids.join(',')}) AND status = 'sent' AND attempts = 1`),
    ).toBe(rows.length);
    for (const { to } of rows) await waitForMail(to);
    await new Promise((r) => setTimeout(r, 500));
    for (const { to } of rows) expect(await mailTo(to)).toHaveLength(1);
  });

  it('writes the mail with the action: rolled back together, committed together', async () => {
    const data = {
      organizationName: 'Outbox Ltd',
      invitedByName: 'Test Owner',
      roleLabel: 'Sponsor',
      acceptUrl: 'http://localhost/invitations/x',
      expiresAt: new Date(),
    };
    const lost = uniqueEmail('rolledback');
    await expect(
      sequelize.transaction(async (transaction) => {
        expect(await enqueueMail('invitation', [{ email: lost }], data, transaction)).toBe(1);
        throw new Error('the action failed after queueing its mail');
      }),
    ).rejects.toThrow('the action failed');
    expect(await count('OutboundMessages', 'toAddress = ?', [lost])).toBe(0);

    const kept = uniqueEmail('committed');
    await sequelize.transaction((transaction) =>
      enqueueMail('invitation', [{ email: kept }, { email: kept.toUpperCase() }], data, transaction),
    );
    expect(await count('OutboundMessages', 'toAddress = ?', [kept])).toBe(1);
    // Delivered by the app server's sender, which polls the outbox.
    const [mail] = await waitForMail(kept, { kind: 'invitation' });
    expect(mail.subject).toContain('Outbox Ltd');
  });
});
