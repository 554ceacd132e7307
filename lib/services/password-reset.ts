import 'server-only';
// Password reset by e-mailed link. The link carries a random token; only its SHA-256 is
// stored. A link works once and for one hour, and asking for one says the same thing
// whether or not the address has an account.
import crypto from 'node:crypto';
import { z } from 'zod';
import { RateLimiterRes } from 'rate-limiter-flexible';
import { addressLimits } from '@/lib/limits/rate-limiter';
import { PasswordResetToken, User, sequelize } from '@/models';
import { badRequest, notFound, tooMany } from '@/lib/errors';
import { parseOrThrow } from '@/lib/validation/parse';
import { emailSchema, passwordSchema } from '@/lib/validation/auth';
import { recordSuccessfulSignIn } from '@/lib/auth/sign-in-limit';
import { enqueueMail } from '@/lib/mail';
import { appUrl } from '@/lib/mail/links';
import { hashPassword } from './accounts';

export const RESET_LINK_MINUTES = 60;
export const NEUTRAL_RESET_REPLY =
  'If an Outturn account uses this address, a link to set a new password is on its way. It works once, for one hour.';

// Shared by every web instance in queue mode (lib/limits/rate-limiter.ts).
const limits = addressLimits(
  'outturnResetLimits',
  { keyPrefix: 'reset-email', points: 5, duration: 60 * 60 },
  { keyPrefix: 'reset-ip', points: 30, duration: 15 * 60 },
);

const requestSchema = z.object({ email: emailSchema });
const resetSchema = z.object({ password: passwordSchema });

export const hashResetToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** Counts the request against both limits, whether or not the account exists. */
async function consumeLimits(email: string, address: string) {
  const { perEmail, perAddress } = limits();
  try {
    await Promise.all([perEmail.consume(email), perAddress.consume(address)]);
  } catch (e) {
    if (!(e instanceof RateLimiterRes)) throw e;
    const minutes = Math.max(1, Math.ceil(e.msBeforeNext / 60_000));
    throw tooMany(
      `Too many requests for a reset link. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
    );
  }
}

/**
 * Checks the request and counts it against both limits; returns the address to send a link to.
 * The caller answers NEUTRAL_RESET_REPLY at once and sends the link after replying
 * (sendResetLinkIfAccount), so the reply takes the same time whether or not the account exists.
 */
export async function requestPasswordReset(input: unknown, address: string): Promise<string> {
  const { email } = parseOrThrow(requestSchema, input);
  await consumeLimits(email, address);
  return email;
}

/**
 * For a sign-up with an address that already has an account: the owner gets a reset link,
 * within the per-address hourly limit so that sign-ups cannot flood an inbox.
 */
export async function offerResetLink(email: string): Promise<void> {
  try {
    await limits().perEmail.consume(email);
  } catch (e) {
    if (e instanceof RateLimiterRes) return;
    throw e;
  }
  await sendResetLinkIfAccount(email);
}

/** Sends a reset link when the address has an account, and does nothing otherwise. */
export async function sendResetLinkIfAccount(email: string): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (!user) return;
  const token = crypto.randomBytes(32).toString('base64url');
  await sequelize.transaction(async (transaction) => {
    // Only the newest link works: an older mail left in an inbox is no way in.
    await PasswordResetToken.update(
      { usedAt: new Date() },
      { where: { userId: user.id, usedAt: null }, transaction },
    );
    await PasswordResetToken.create(
      {
        userId: user.id,
        tokenHash: hashResetToken(token),
        expiresAt: new Date(Date.now() + RESET_LINK_MINUTES * 60_000),
      },
      { transaction },
    );
    await enqueueMail(
      'password_reset',
      [{ userId: user.id, email: user.email, name: user.name }],
      { resetUrl: appUrl(`/reset-password/${token}`), expiresInMinutes: RESET_LINK_MINUTES },
      transaction,
    );
  });
}

export type ResetLinkState = 'valid' | 'expired' | 'used' | 'unknown';

const plausible = (token: string) => /^[A-Za-z0-9_-]{20,128}$/.test(token);

/** What the reset page shows before the new password is entered. */
export async function resetLinkState(token: string): Promise<ResetLinkState> {
  if (!plausible(token)) return 'unknown';
  const row = await PasswordResetToken.findOne({ where: { tokenHash: hashResetToken(token) } });
  if (!row) return 'unknown';
  if (row.usedAt) return 'used';
  return row.expiresAt <= new Date() ? 'expired' : 'valid';
}

/** Sets the new password and spends the link, in one transaction. */
export async function resetPassword(token: string, input: unknown): Promise<{ email: string }> {
  const { password } = parseOrThrow(resetSchema, input);
  if (!plausible(token)) throw notFound('Reset link');
  const passwordHash = await hashPassword(password);
  const email = await sequelize.transaction(async (transaction) => {
    const row = await PasswordResetToken.findOne({
      where: { tokenHash: hashResetToken(token) },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    if (!row) throw notFound('Reset link');
    if (row.usedAt) throw badRequest('This link was already used. Ask for a new one if you still need it.');
    if (row.expiresAt <= new Date()) throw badRequest('This link has expired. Ask for a new one.');
    const user = await User.findByPk(row.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('Reset link');
    // A new session version ends every session issued before the reset.
    await user.update({ passwordHash, sessionVersion: user.sessionVersion + 1 }, { transaction });
    await PasswordResetToken.update(
      { usedAt: new Date() },
      { where: { userId: user.id, usedAt: null }, transaction },
    );
    return user.email;
  });
  // Failed attempts before the reset should not keep the owner of the account out.
  await recordSuccessfulSignIn(email);
  return { email };
}
