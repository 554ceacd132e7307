import 'server-only';
import bcrypt from 'bcryptjs';
import { Membership, Organization, User, sequelize } from '@/models';
import { parseOrThrow } from '@/lib/validation/parse';
import { signUpSchema } from '@/lib/validation/auth';
import type { Actor } from '@/lib/auth/actor';
import type { Role } from '@/lib/auth/roles';
import { startTrial } from './billing/subscription-changes';

const HASH_ROUNDS = 10;
let dummyHash: string | undefined;

export const hashPassword = (password: string) => bcrypt.hash(password, HASH_ROUNDS);

export const SIGN_UP_REPLY =
  'Check your mail: if this address already has an Outturn account, we sent it a way back in.';

export type SignUpOutcome = { created: true; email: string } | { created: false; email: string };

/**
 * Creates an organisation, its first owner and its trial subscription in one transaction.
 * A taken address creates nothing; the caller answers SIGN_UP_REPLY either way and mails the
 * existing account, so that sign-up never tells a stranger which addresses have accounts.
 */
export async function signUp(input: unknown): Promise<SignUpOutcome> {
  const data = parseOrThrow(signUpSchema, input);
  // Hashed before the look-up, so both answers cost the same work.
  const passwordHash = await hashPassword(data.password);
  return sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({ where: { email: data.email }, transaction });
    if (existing) return { created: false, email: data.email };
    const organization = await Organization.create({ name: data.organizationName }, { transaction });
    const user = await User.create({ email: data.email, name: data.name, passwordHash }, { transaction });
    await Membership.create(
      { userId: user.id, organizationId: organization.id, role: 'owner' },
      { transaction },
    );
    await startTrial(organization.id, transaction);
    return { created: true, email: data.email };
  });
}

/** Checks e-mail and password; returns the user and their first organisation, or null. */
export async function verifyCredentials(email: string, password: string) {
  const user = await User.findOne({ where: { email: email.trim().toLowerCase() } });
  // Compare against a dummy hash when the user is unknown so timing does not reveal accounts.
  const hash = user?.passwordHash ?? (dummyHash ??= bcrypt.hashSync('no account here', HASH_ROUNDS));
  const ok = await bcrypt.compare(password, hash);
  if (!user || !ok) return null;
  const membership = await Membership.findOne({ where: { userId: user.id }, order: [['id', 'ASC']] });
  if (!membership) return null;
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    organizationId: membership.organizationId,
    role: membership.role as Role,
    sessionVersion: user.sessionVersion,
  };
}

/**
 * Reloads the actor from the database so a changed or removed role takes effect at once, and
 * a session older than the user's last sign-out or password reset ends.
 */
export async function loadActor(
  userId: number,
  organizationId: number,
  sessionVersion: number,
): Promise<Actor | null> {
  const membership = await Membership.findOne({
    where: { userId, organizationId },
    include: [{ model: User, as: 'user' }],
  });
  if (!membership?.user || membership.user.sessionVersion !== sessionVersion) return null;
  return {
    userId,
    organizationId,
    role: membership.role as Role,
    email: membership.user.email,
    name: membership.user.name,
  };
}

/** The signed-in person whatever their organisations, or null when the session has ended. */
export async function loadSessionUser(userId: number, sessionVersion: number) {
  const user = await User.findByPk(userId);
  if (!user || user.sessionVersion !== sessionVersion) return null;
  return { userId: user.id, email: user.email, name: user.name };
}

/** Ends every session of the user, on every device: each carries an older version from now on. */
export async function endSessions(userId: number): Promise<void> {
  await User.increment('sessionVersion', { by: 1, where: { id: userId } });
}

export async function organizationName(organizationId: number): Promise<string> {
  const org = await Organization.findByPk(organizationId);
  return org?.name ?? '';
}
