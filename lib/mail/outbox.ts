import 'server-only';
// Writing mail to the outbox. A mail is a row written in the caller's transaction, so the
// action and its notice are committed (or rolled back) together; the sender delivers it later.
import type { Transaction } from 'sequelize';
import { OutboundMessage } from '@/models';
import { isOptionalKind, type MailKind } from './kinds';
import { usersWhoTurnedOff } from './opt-outs';
import { renderMail, type MailData } from './templates';
import { kickMailSender } from './sender';

export type MailRecipient = { userId?: number; email: string; name?: string };

/**
 * Queues one mail of `kind` for each recipient (duplicates by e-mail are dropped).
 * For the kinds a member may turn off, recipients who turned that kind off are skipped.
 * Returns the number of mails queued. Pass the action's transaction so that a rolled-back
 * action sends nothing and a committed one always sends.
 */
export async function enqueueMail<K extends MailKind>(
  kind: K,
  recipients: MailRecipient[],
  data: MailData[K],
  transaction?: Transaction,
): Promise<number> {
  const unique = new Map<string, MailRecipient>();
  for (const r of recipients) {
    const email = r.email.trim().toLowerCase();
    if (email && !unique.has(email)) unique.set(email, { ...r, email });
  }
  let chosen = [...unique.values()];
  if (isOptionalKind(kind) && chosen.length) {
    const off = await usersWhoTurnedOff(kind, chosen, transaction);
    chosen = chosen.filter((r) => !off.has(r.email));
  }
  if (!chosen.length) return 0;
  const now = new Date();
  await OutboundMessage.bulkCreate(
    chosen.map((r) => {
      const mail = renderMail(kind, data, r.name);
      return {
        kind,
        userId: r.userId ?? null,
        toAddress: r.email,
        subject: mail.subject.slice(0, 250),
        html: mail.html,
        text: mail.text,
        nextAttemptAt: now,
      };
    }),
    { transaction },
  );
  // Deliver at once rather than at the next poll, but only after the rows are visible.
  if (transaction) transaction.afterCommit(() => kickMailSender());
  else kickMailSender();
  return chosen.length;
}
