import 'server-only';
// Members' choices of which notices they receive by e-mail, and the recipients of notices.
import { Op, type Transaction } from 'sequelize';
import { z } from 'zod';
import { Membership, NotificationPreference, User, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can, type Action, type Role } from '@/lib/auth/roles';
import { parseOrThrow } from '@/lib/validation/parse';
import { NOTICE_LABELS, OPTIONAL_KINDS, type OptionalMailKind } from '@/lib/mail/kinds';
import type { NotificationPreferenceView } from '@/lib/view-types/notifications';

/** The action whose holders receive each notice: a billing member never hears about runs. */
const NOTICE_AUDIENCE: Record<OptionalMailKind, Action> = {
  run_finished: 'run:start',
  brief_ready: 'baseline:decide',
  baseline_decision: 'run:start',
};

/** The notices the actor's role receives, each with the actor's choice (on unless turned off). */
export async function listNotificationPreferences(actor: Actor): Promise<NotificationPreferenceView[]> {
  const rows = await NotificationPreference.findAll({ where: { userId: actor.userId } });
  const chosen = new Map(rows.map((r) => [r.kind, r.enabled]));
  return OPTIONAL_KINDS.filter((kind) => can(actor.role, NOTICE_AUDIENCE[kind])).map((kind) => ({
    kind,
    ...NOTICE_LABELS[kind],
    enabled: chosen.get(kind) ?? true,
  }));
}

const preferenceSchema = z.object({
  kind: z.enum(OPTIONAL_KINDS, {
    message: `Choose one of the notices: ${OPTIONAL_KINDS.join(', ')}. Invitations and password resets cannot be turned off.`,
  }),
  enabled: z.boolean({ message: 'Say true to receive this notice or false to stop it.' }),
});

/** Turns one kind of notice on or off for the signed-in member. */
export async function setNotificationPreference(
  actor: Actor,
  input: unknown,
): Promise<NotificationPreferenceView[]> {
  const { kind, enabled } = parseOrThrow(preferenceSchema, input);
  await sequelize.transaction(async (transaction) => {
    const existing = await NotificationPreference.findOne({
      where: { userId: actor.userId, kind },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (existing) await existing.update({ enabled }, { transaction });
    else await NotificationPreference.create({ userId: actor.userId, kind, enabled }, { transaction });
  });
  return listNotificationPreferences(actor);
}

/** The members of an organisation who hold one of the roles, as mail recipients. */
export async function recipientsWithRole(
  organizationId: number,
  roles: Role[],
  transaction?: Transaction,
): Promise<{ userId: number; email: string; name: string }[]> {
  const memberships = await Membership.findAll({
    where: { organizationId, role: { [Op.in]: roles } },
    include: [{ model: User, as: 'user', attributes: ['id', 'email', 'name'] }],
    order: [['id', 'ASC']],
    transaction,
  });
  return memberships
    .filter((m) => m.user)
    .map((m) => ({ userId: m.userId, email: m.user!.email, name: m.user!.name }));
}
