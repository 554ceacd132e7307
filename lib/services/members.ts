import 'server-only';
import crypto from 'node:crypto';
import { Op } from 'sequelize';
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

/** What the accept page shows before the invitee answers. */
export async function describeInvitation(token: string) {
  const invitation = await Invitation.findOne({ where: { token }, include: ['organization'] });
  if (!invitation || invitation.acceptedAt || invitation.expiresAt < new Date()) return null;
  const existingUser = await User.findOne({ where: { email: invitation.email } });
  return {
    email: invitation.email,
    role: invitation.role,
    organizationName: invitation.organization?.name ?? '',
    hasAccount: Boolean(existingUser),
  };
}

/**
 * Accepts an invitation: a new user is created with the given name and password; an existing
 * user proves the invitation is theirs with their password and gains the membership.
 */
export async function acceptInvitation(token: string, input: unknown): Promise<{ email: string }> {
  const data = parseOrThrow(acceptInvitationSchema, input);
  return sequelize.transaction(async (transaction) => {
    const invitation = await Invitation.findOne({
      where: { token },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!invitation || invitation.acceptedAt) throw notFound('Invitation');
    if (invitation.expiresAt < new Date())
      throw badRequest('This invitation has expired. Ask the owner for a new one.');
    let user = await User.findOne({ where: { email: invitation.email }, transaction });
    if (user) {
      const bcrypt = (await import('bcryptjs')).default;
      if (!(await bcrypt.compare(data.password, user.passwordHash))) {
        throw badRequest('That password does not match the existing account for this e-mail.', [
          { path: 'password', message: 'Wrong password for this account.' },
        ]);
      }
    } else {
      if (!data.name) throw badRequest('Enter your name.', [{ path: 'name', message: 'Enter your name.' }]);
      user = await User.create(
        { email: invitation.email, name: data.name, passwordHash: await hashPassword(data.password) },
        { transaction },
      );
    }
    const already = await Membership.findOne({
      where: { userId: user.id, organizationId: invitation.organizationId },
      transaction,
    });
    if (!already) {
      await assertSeatAvailable(invitation.organizationId, invitation.role, null, transaction);
      await Membership.create(
        { userId: user.id, organizationId: invitation.organizationId, role: invitation.role },
        { transaction },
      );
    }
    await invitation.update({ acceptedAt: new Date() }, { transaction });
    return { email: user.email };
  });
}
