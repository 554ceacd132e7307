import { beforeAll, describe, expect, it } from 'vitest';
import { renderMail, type MailData } from '@/lib/mail/templates';
import { MAIL_KINDS, OPTIONAL_KINDS, type MailKind } from '@/lib/mail/kinds';
import { MAX_ATTEMPTS, retryDelayMs } from '@/lib/mail/retry';

const APP = 'https://outturn.test';

const samples: { [K in MailKind]: MailData[K] } = {
  invitation: {
    organizationName: 'Kestrel Vale Infrastructure',
    invitedByName: 'Mara Quist',
    roleLabel: 'Sponsor',
    acceptUrl: `${APP}/invitations/tok123`,
    expiresAt: '2026-12-08T10:00:00Z',
  },
  password_reset: { resetUrl: `${APP}/reset-password/abc`, expiresInMinutes: 60 },
  run_finished: {
    projectId: 4,
    projectName: 'Harbour Road',
    runId: 17,
    runNumber: 4,
    outcome: 'succeeded',
    p80Text: 'EUR 25,340,000',
  },
  brief_ready: {
    projectId: 4,
    projectName: 'Harbour Road',
    runId: 17,
    runNumber: 4,
    p80Text: 'EUR 25,340,000',
    preparedByName: 'Ivo Brandt',
  },
  baseline_decision: {
    projectId: 4,
    projectName: 'Harbour Road',
    runId: 17,
    runNumber: 4,
    decision: 'returned',
    decidedByName: 'Lena Ortiz',
    comment: 'Widen the piling range.',
  },
};

const expectedLink: Record<MailKind, string> = {
  invitation: `${APP}/invitations/tok123`,
  password_reset: `${APP}/reset-password/abc`,
  run_finished: `${APP}/projects/4/runs/17`,
  brief_ready: `${APP}/projects/4/runs/17/brief`,
  baseline_decision: `${APP}/projects/4/runs/17/brief`,
};

describe('mail templates', () => {
  beforeAll(() => {
    process.env.APP_URL = APP;
  });

  it.each(MAIL_KINDS)('%s has a subject, an HTML and a text body, both with its link', (kind) => {
    const mail = renderMail(kind, samples[kind] as never);
    expect(mail.subject.length).toBeGreaterThan(5);
    expect(mail.html).toContain(`href="${expectedLink[kind]}"`);
    expect(mail.text).toContain(expectedLink[kind]);
    expect(mail.text).not.toMatch(/<[a-z]/i);
  });

  it('tells where to turn off only the notices that can be turned off', () => {
    for (const kind of MAIL_KINDS) {
      const mail = renderMail(kind, samples[kind] as never);
      const optional = (OPTIONAL_KINDS as readonly string[]).includes(kind);
      expect(mail.text.includes(`${APP}/settings/notifications`)).toBe(optional);
    }
  });

  it('escapes what members typed, so a comment cannot add markup to the mail', () => {
    const mail = renderMail('baseline_decision', {
      ...samples.baseline_decision,
      projectName: 'Depot <b>North</b>',
      comment: '<script>alert(1)</script> & "quotes"',
    });
    expect(mail.html).not.toContain('<script>');
    expect(mail.html).not.toContain('<b>North</b>');
    expect(mail.html).toContain('&lt;script&gt;alert(1)&lt;/script&gt; &amp; &quot;quotes&quot;');
    expect(mail.text).toContain('> <script>alert(1)</script> & "quotes"');
    expect(mail.subject).toBe('Returned for rework: Depot <b>North</b>, run 4');
  });

  it('says what each run outcome means and gives the P80 only for a finished run', () => {
    const ok = renderMail('run_finished', samples.run_finished);
    expect(ok.text).toContain('EUR 25,340,000');
    const failed = renderMail('run_finished', {
      ...samples.run_finished,
      outcome: 'failed',
      failureText: 'Activity A3 has no duration.',
    });
    expect(failed.subject).toMatch(/did not finish/);
    expect(failed.text).toContain('Activity A3 has no duration.');
    expect(failed.text).not.toContain('EUR 25,340,000');
  });

  it('puts the approval in the subject and the comment in the body', () => {
    const approved = renderMail('baseline_decision', { ...samples.baseline_decision, decision: 'approved' });
    expect(approved.subject).toBe('Baseline approved: Harbour Road, run 4');
    expect(approved.text).toContain('> Widen the piling range.');
  });
});

describe('retry delays', () => {
  it('double from 15 s and stop growing at one hour', () => {
    // The policy stated in lib/mail/retry.ts: 15 s · 2^(attempts − 1), capped at 3 600 s.
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([15_000, 30_000, 60_000, 120_000]);
    expect(retryDelayMs(9)).toBe(3_600_000);
    const total = Array.from({ length: MAX_ATTEMPTS - 1 }, (_, i) => retryDelayMs(i + 1)).reduce(
      (a, b) => a + b,
    );
    // 15 + 30 + 60 + 120 + 240 + 480 + 960 s = 1 905 s: retries span about half an hour before the last try.
    expect(total).toBe(1_905_000);
  });
});
