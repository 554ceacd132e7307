import 'server-only';
// Members' opt-outs of the optional notices, checked by the outbox itself so that no caller
// can send a notice that its recipient turned off.
import { Op, type Transaction } from 'sequelize';
import { NotificationPreference, User } from '@/models';
import type { OptionalMailKind } from './kinds';

/**
 * The e-mails, among these recipients, of users who turned `kind` off. A recipient given
 * without a user id is matched by e-mail, so a preference cannot be bypassed by omission.
 */
export async function usersWhoTurnedOff(
  kind: OptionalMailKind,
  recipients: { userId?: number; email: string }[],
  transaction?: Transaction,
): Promise<Set<string>> {
  const byEmail = new Map<string, number>();
  const missing = recipients.filter((r) => r.userId === undefined).map((r) => r.email);
  if (missing.length) {
    const users = await User.findAll({
      where: { email: { [Op.in]: missing } },
      attributes: ['id', 'email'],
      transaction,
    });
    for (const u of users) byEmail.set(u.email.toLowerCase(), u.id);
  }
  const idOf = (r: { userId?: number; email: string }) => r.userId ?? byEmail.get(r.email);
  const ids = [...new Set(recipients.map(idOf).filter((id): id is number => id !== undefined))];
  if (!ids.length) return new Set();
  const off = await NotificationPreference.findAll({
    where: { userId: { [Op.in]: ids }, kind, enabled: false },
    attributes: ['userId'],
    transaction,
  });
  const offIds = new Set(off.map((p) => p.userId));
  return new Set(recipients.filter((r) => offIds.has(idOf(r) ?? -1)).map((r) => r.email));
}
