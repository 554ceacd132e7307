import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { Invitation, Membership, Subscription } from '@/models';
import { PAID_ROLES, ROLE_LABELS, type Role } from '@/lib/auth/roles';
import { seatsFull } from '@/lib/errors';

export const BILLING_LINK = '/settings/billing';
const PAID = [...PAID_ROLES];

export type SeatUsage = { seats: number | null; used: number; pendingInvitations: number };

/**
 * Paid seats in use: owner and estimator memberships. Pending invitations for paid roles are
 * reported but do not hold a seat; the seat is checked again when the invitation is accepted.
 * `seats` is null for an organisation without a subscription record (no limit applies).
 */
export async function seatUsage(organizationId: number, transaction?: Transaction): Promise<SeatUsage> {
  const [subscription, used, pendingInvitations] = await Promise.all([
    Subscription.findOne({ where: { organizationId }, transaction }),
    Membership.count({ where: { organizationId, role: PAID }, transaction }),
    Invitation.count({
      where: { organizationId, role: PAID, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
      transaction,
    }),
  ]);
  return { seats: subscription?.seats ?? null, used, pendingInvitations };
}

/**
 * Checks that giving `role` to one more person (or moving someone from `previousRole`)
 * stays within the organisation's paid seats. The subscription row is locked so that two
 * invitations at once cannot both take the last seat.
 */
export async function assertSeatAvailable(
  organizationId: number,
  role: Role,
  previousRole: Role | null,
  transaction: Transaction,
): Promise<void> {
  if (!PAID_ROLES.has(role)) return;
  if (previousRole && PAID_ROLES.has(previousRole)) return;
  const subscription = await Subscription.findOne({
    where: { organizationId },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!subscription) return;
  const used = await Membership.count({ where: { organizationId, role: PAID }, transaction });
  if (used + 1 <= subscription.seats) return;
  const seats = subscription.seats;
  throw seatsFull(
    `All ${seats} paid seats are taken (owners and estimators take a seat; sponsors and billing members are free). ` +
      `Buy more seats in Billing and seats (${BILLING_LINK}) to add another ${ROLE_LABELS[role].toLowerCase()}.`,
    `All ${seats} paid seats are taken.`,
    { link: BILLING_LINK, seats, used },
  );
}
