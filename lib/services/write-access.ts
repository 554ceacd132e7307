import 'server-only';
import type { Transaction } from 'sequelize';
import { Subscription } from '@/models';
import { paymentRequired } from '@/lib/errors';
import { READ_ONLY_MESSAGES, accessOf, type Access } from '@/lib/billing/access';

/** Whether the organisation is read-only now, and why; pages show a banner from this. */
export async function organizationAccess(organizationId: number, transaction?: Transaction): Promise<Access> {
  const subscription = await Subscription.findOne({ where: { organizationId }, transaction });
  return accessOf(subscription);
}

/**
 * Refuses edits and runs while the organisation is read-only (a subscription past due, or
 * cancelled and ended). Every service that writes project data or starts a run calls this;
 * reads and exports do not.
 */
export async function assertWritable(organizationId: number, transaction?: Transaction): Promise<void> {
  const access = await organizationAccess(organizationId, transaction);
  if (access.readOnly && access.reason) {
    throw paymentRequired(READ_ONLY_MESSAGES[access.reason], {
      reason: access.reason,
      link: '/settings/billing',
    });
  }
}
