import 'server-only';
import crypto from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { Invitation, Membership, Organization, User, sequelize } from '@/models';
import type { Actor } from '@/lib/auth/actor';
import { can, ROLE_LABELS } from '@/lib/auth/roles';
import { badRequest, forbidden, notFound } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { acceptInvitationSchema, changeRoleSchema, inviteSchema } from '@/lib/validation/auth';
import { hashPassword } from './accounts';
import { recordAudit } from './audit';
import { assertSeatAvailable } from './seats';
import { enqueueMail } from '@/lib/mail';
import type { InvitationView, MemberView } from '@/lib/view-types/members';

const INVITATION_DAYS = 7;

function assertManages(actor: Actor) {
  if (!can(actor.role, 'members:manage')) throw forbidden('Only an owner can manage members.');
}

export async function listMembers(actor: Actor): Promise<MemberView[]> {
  if (!can(actor.role, 'members:read')) throw forbidden('Only an owner can see the members.');
  const rows = await Membership.findAll({
    where: { organizationId: actor.organizationId },
    include: [{ model: User, as: 'user' }],
    order: [['id', 'ASC']],
  });
  return rows.map((m) => ({
    id: m.id,
    userId: m.userId,
    name: m.user?.name ?? '',
    email: m.user?.email ?? '',
    role: m.role,
    since: m.createdAt.toISOString(),
  }));
}

async function ownerCount(organizationId: number, transaction: import('sequelize').Transaction) {
  return Membership.count({ where: { organizationId, role: 'owner' }, transaction });
}

async function findMembership(
  actor: Actor,
  membershipId: number,
  transaction: import('sequelize').Transaction,
) {
  const membership = await Membership.findOne({
    where: { id: membershipId, organizationId: actor.organizationId },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!membership) throw notFound('Member');
  return membership;
}

export async function changeRole(
  actor: Actor,
  membershipId: number,
  input: unknown,
): Promise<MemberView['role']> {
  assertManages(actor);
  const { role } = parseOrThrow(changeRoleSchema, input);
  return sequelize.transaction(async (transaction) => {
    const membership = await findMembership(actor, membershipId, transaction);
    const before = membership.role;
    if (before === role) return role;
    if (before === 'owner' && (await ownerCount(actor.organizationId, transaction)) <= 1) {
      throw badRequest('The organisation needs at least one owner: make someone else owner first.');
    }
    await assertSeatAvailable(actor.organizationId, role, before, transaction);
    await membership.update({ role }, { transaction });
    await recordAudit(
      actor,
      {
        entity: 'membership',
        entityId: membership.id,
        action: 'update',
        before: { role: before },
        after: { role },
      },
      transaction,
    );
    return role;
  });
}

export async function removeMember(actor: Actor, membershipId: number): Promise<void> {
  assertManages(actor);
  await sequelize.transaction(async (transaction) => {
    const membership = await findMembership(actor, membershipId, transaction);
    if (membership.role === 'owner' && (await ownerCount(actor.organizationId, transaction)) <= 1) {
      throw badRequest('The last owner cannot be removed: make someone else owner first.');
    }
    await membership.destroy({ transaction });
    await recordAudit(
      actor,
      {
        entity: 'membership',
        entityId: membership.id,
        action: 'delete',
        before: { userId: membership.userId, role: membership.role },
        after: null,
      },
      transaction,
    );
  });
}

export function invitationLink(token: string): string {
  const base = process.env.APP_URL ?? 'http://localhost:3000';
  return `${base}/invitations/${token}`;
}

function toInvitationView(i: Invitation): InvitationView {
  return {
    id: i.id,
    email: i.email,
    role: i.role,
    expiresAt: i.expiresAt.toISOString(),
    link: invitationLink(i.token),
  };
}

export async function listInvitations(actor: Actor): Promise<InvitationView[]> {
  assertManages(actor);
  const rows = await Invitation.findAll({
    where: { organizationId: actor.organizationId, acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
    order: [['id', 'DESC']],
  });
  return rows.map(toInvitationView);
}

export async function invite(actor: Actor, input: unknown): Promise<InvitationView> {
  assertManages(actor);
  const { email, role } = parseOrThrow(inviteSchema, input);
  return sequelize.transaction(async (transaction) => {
    const existingMember = await Membership.findOne({
      where: { organizationId: actor.organizationId },
      include: [{ model: User, as: 'user', where: { email }, required: true }],
      transaction,
    });
    if (existingMember)
      throw badRequest(`${email} is already a member of this organisation.`, [
        { path: 'email', message: 'Already a member.' },
      ]);
    await assertSeatAvailable(actor.organizationId, role, null, transaction);
    const invitation = await Invitation.create(
      {
        organizationId: actor.organizationId,
        email,
        role,
        token: crypto.randomBytes(24).toString('base64url'),
        expiresAt: new Date(Date.now() + INVITATION_DAYS * 24 * 3600 * 1000),
        invitedById: actor.userId,
      },
      { transaction },
    );
    await recordAudit(
      actor,
      {
        entity: 'invitation',
        entityId: invitation.id,
        action: 'create',
        before: null,
        after: { email, role },
      },
      transaction,
    );
    // The mail is queued with the invitation: both are written, or neither.
    const organization = await Organization.findByPk(actor.organizationId, { transaction });
    await enqueueMail(
      'invitation',
      [{ email }],
      {
        organizationName: organization?.name ?? '',
        invitedByName: actor.name,
        roleLabel: ROLE_LABELS[role],
        acceptUrl: invitationLink(invitation.token),
        expiresAt: invitation.expiresAt,
      },
      transaction,
    );
    return toInvitationView(invitation);
  });
}

export async function revokeInvitation(actor: Actor, invitationId: number): Promise<void> {
  assertManages(actor);
  const deleted = await Invitation.destroy({
    where: { id: invitationId, organizationId: actor.organizationId, acceptedAt: null },
  });
  if (!deleted) throw notFound('Invitation');
}

/** What the accept page shows before the invitee answers: never whether the address has an account. */
export async function describeInvitation(token: string) {
  const invitation = await Invitation.findOne({ where: { token }, include: ['organization'] });
  if (!invitation || invitation.acceptedAt || invitation.expiresAt < new Date()) return null;
  return {
    email: invitation.email,
    role: invitation.role,
    organizationName: invitation.organization?.name ?? '',
  };
}

export const ACCEPT_SIGNED_OUT_REPLY =
  'If this address is new to Outturn, your account is ready: sign in with it. If it already has an account, sign in with that account and open the invitation again to accept.';

export type SessionUser = { userId: number; email: string };
export type AcceptOutcome = { message: string };

async function lockOpenInvitation(token: string, transaction: Transaction) {
  const invitation = await Invitation.findOne({
    where: { token },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!invitation) throw notFound('Invitation');
  if (!invitation.acceptedAt && invitation.expiresAt < new Date())
    throw badRequest('This invitation has expired. Ask the owner for a new one.');
  return invitation;
}

async function join(invitation: Invitation, userId: number, transaction: Transaction) {
  const already = await Membership.findOne({
    where: { userId, organizationId: invitation.organizationId },
    transaction,
  });
  if (!already) {
    await assertSeatAvailable(invitation.organizationId, invitation.role, null, transaction);
    await Membership.create(
      { userId, organizationId: invitation.organizationId, role: invitation.role },
      { transaction },
    );
  }
  await invitation.update({ acceptedAt: new Date() }, { transaction });
}

/**
 * Accepts an invitation.
 *
 * Signed in, only as the invited address: that account joins, with no password asked.
 * Signed out: a new account is made with the name and password given. When the address
 * already has an account nothing is written and no password is checked (its owner signs in
 * and accepts); the reply is the same either way, so the invitation's sender learns nothing
 * about the address and has no password to guess against.
 */
export async function acceptInvitation(
  token: string,
  input: unknown,
  signedIn: SessionUser | null,
): Promise<AcceptOutcome> {
  if (signedIn) return acceptAsSignedIn(token, signedIn);
  const data = parseOrThrow(acceptInvitationSchema, input);
  // Hashed before the look-up, so both answers cost the same work.
  const passwordHash = await hashPassword(data.password);
  return sequelize.transaction(async (transaction) => {
    const invitation = await lockOpenInvitation(token, transaction);
    if (invitation.acceptedAt) throw notFound('Invitation');
    // Checked before the look-up, so that a full organisation answers alike for both.
    await assertSeatAvailable(invitation.organizationId, invitation.role, null, transaction);
    const existing = await User.findOne({ where: { email: invitation.email }, transaction });
    if (!existing) {
      const user = await User.create(
        { email: invitation.email, name: data.name, passwordHash },
        { transaction },
      );
      await join(invitation, user.id, transaction);
    }
    return { message: ACCEPT_SIGNED_OUT_REPLY };
  });
}

async function acceptAsSignedIn(token: string, user: SessionUser): Promise<AcceptOutcome> {
  return sequelize.transaction(async (transaction) => {
    const invitation = await lockOpenInvitation(token, transaction);
    if (invitation.email !== user.email.toLowerCase())
      throw forbidden(
        'This invitation is for another e-mail address. Sign out, then open the link again to accept it.',
      );
    if (invitation.acceptedAt) {
      // Accepting twice (a new account signs in and confirms) is fine once the member is in.
      const member = await Membership.findOne({
        where: { userId: user.userId, organizationId: invitation.organizationId },
        transaction,
      });
      if (!member) throw notFound('Invitation');
    } else {
      await join(invitation, user.userId, transaction);
    }
    return { message: 'You have joined the organisation.' };
  });
}
