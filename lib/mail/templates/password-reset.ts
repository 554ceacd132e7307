import { renderMessage, type RenderedMail } from '../layout';

export type PasswordResetMail = { resetUrl: string; expiresInMinutes: number };

export function passwordResetMail(d: PasswordResetMail, recipientName?: string): RenderedMail {
  return renderMessage({
    subject: 'Set a new Outturn password',
    heading: 'Set a new password',
    paragraphs: [
      recipientName ? `Hello ${recipientName},` : 'Hello,',
      'Someone, probably you, asked to set a new password for the Outturn account of this e-mail address. Follow the link to choose one.',
      'If you did not ask, ignore this e-mail: your password stays as it is.',
    ],
    action: { label: 'Choose a new password', url: d.resetUrl },
    note: `The link works once and expires ${d.expiresInMinutes} minutes after it was sent.`,
    optional: false,
  });
}
