// The fake mail server's MIME reader, checked against messages built by nodemailer's own
// composer (the same code that builds the app's mail), in each transfer encoding it uses.
import { describe, expect, it } from 'vitest';
import MailComposer from 'nodemailer/lib/mail-composer';
import { decodeWords, parseMessage } from '@/scripts/fakes/mail/parse-message';

async function compose(options: ConstructorParameters<typeof MailComposer>[0]): Promise<string> {
  const buffer = await new MailComposer(options).compile().build();
  return buffer.toString('utf8');
}

const longLine = `Contingency at P80 — ${'the quick brown fox jumps over the lazy dog '.repeat(6)}end.`;

describe('the fake mail server reads what nodemailer sends', () => {
  it('reads a multipart/alternative mail with a non-ASCII subject and long quoted-printable lines', async () => {
    const raw = await compose({
      from: 'Outturn <no-reply@outturn.local>',
      to: 'Åsa Lind <asa@test.example>, second@test.example',
      subject: 'Baseline approved: Brücke Süd – run 12',
      text: `Hello Åsa,\n\n${longLine}\n\nLink: http://localhost:3100/projects/4/runs/12/brief`,
      html: `<p>Hello Åsa,</p><p>${longLine}</p><a href="http://localhost:3100/projects/4/runs/12/brief">brief</a>`,
      headers: { 'X-Outturn-Kind': 'baseline_decision' },
    });
    expect(raw).toMatch(/=\?UTF-8\?/i); // the subject really is encoded in the raw mail
    expect(raw).toMatch(/=\r?\n/); // and the long line really is soft-wrapped
    const mail = parseMessage(raw);
    expect(mail.subject).toBe('Baseline approved: Brücke Süd – run 12');
    expect(mail.to).toEqual(['asa@test.example', 'second@test.example']);
    expect(mail.headers['x-outturn-kind']).toBe('baseline_decision');
    expect(mail.text).toBe(
      `Hello Åsa,\n\n${longLine}\n\nLink: http://localhost:3100/projects/4/runs/12/brief`,
    );
    expect(mail.html).toContain(`<p>${longLine}</p>`);
    expect(mail.html).toContain('href="http://localhost:3100/projects/4/runs/12/brief"');
  });

  it('reads base64 bodies', async () => {
    const raw = await compose({
      from: 'a@test.example',
      to: 'b@test.example',
      subject: 'Plain',
      text: 'Zürich depot — €1,200,000',
      textEncoding: 'base64',
    });
    expect(raw).toMatch(/Content-Transfer-Encoding: base64/i);
    const mail = parseMessage(raw);
    expect(mail.text).toBe('Zürich depot — €1,200,000');
    expect(mail.html).toBe('');
  });

  it('decodes B and Q encoded words and joins adjacent ones', () => {
    expect(decodeWords('=?UTF-8?B?w4VzYQ==?= Lind')).toBe('Åsa Lind');
    expect(decodeWords('=?UTF-8?Q?Br=C3=BCcke_S?= =?UTF-8?Q?=C3=BCd?=')).toBe('Brücke Süd');
  });
});
