import 'server-only';
import bcrypt from 'bcryptjs';
import { Membership, Organization, User, sequelize } from '@/models';
import { badRequest } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { signUpSchema } from '@/lib/validation/auth';
import type { Actor } from '@/lib/auth/actor';
import type { Role } from '@/lib/auth/roles';
import { startTrial } from './billing/subscription-changes';

const HASH_ROUNDS = 10;
let dummyHash: string | undefined;

export const hashPassword = (password: string) => bcrypt.hash(password, HASH_ROUNDS);

/** Creates an organisation, its first owner and its trial subscription in one transaction. */
export async function signUp(input: unknown): Promise<{ userId: number; organizationId: number }> {
  const data = parseOrThrow(signUpSchema, input);
  const passwordHash = await hashPassword(data.password);
  return sequelize.transaction(async (transaction) => {
    const existing = await User.findOne({ where: { email: data.email }, transaction });
    if (existing) {
      throw badRequest('An account with this e-mail already exists. Sign in instead.', [
        { path: 'email', message: 'An account with this e-mail already exists. Sign in instead.' },
      ]);
    }
    const organization = await Organization.create({ name: data.organizationName }, { transaction });
    const user = await User.create({ email: data.email, name: data.name, passwordHash }, { transaction });
    await Membership.create(
      { userId: user.id, organizationId: organization.id, role: 'owner' },
      { transaction },
    );
    await startTrial(organization.id, transaction);
    return { userId: user.id, organizationId: organization.id };
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
  };
}

/** Reloads the actor from the database so a changed or removed role takes effect at once. */
export async function loadActor(userId: number, organizationId: number): Promise<Actor | null> {
  const membership = await Membership.findOne({
    where: { userId, organizationId },
    include: [{ model: User, as: 'user' }],
  });
  if (!membership?.user) return null;
  return {
    userId,
    organizationId,
    role: membership.role as Role,
    email: membership.user.email,
    name: membership.user.name,
  };
}

export async function organizationName(organizationId: number): Promise<string> {
  const org = await Organization.findByPk(organizationId);
  return org?.name ?? '';
}
