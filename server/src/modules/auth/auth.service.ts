import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { LoginInput, PasswordChangeInput, PublicUser, RegisterInput } from '../../../shared/auth-schemas';
import { getSequelize } from '../../db/sequelize';
import { AppError } from '../../lib/errors';
import { log } from '../../lib/logger';
import { enqueueMail } from '../mail/outbox';
import { EmailTakenError, usersRepository, type UserRecord } from '../users/users.repository';
import { burnTime, hashPassword, isCommonPassword, verifyPassword } from './passwords';
import { clearFailures, reserveAttempt } from './sign-in-throttle';

export function toPublicUser(user: UserRecord): PublicUser {
  return { id: user.id, email: user.email, displayName: user.displayName, role: user.role, emailVerified: user.emailVerified };
}

const COMMON_PASSWORD_MESSAGE = 'That password is on the lists of most-used passwords. Choose another.';

export async function register(input: RegisterInput, publicUrl: string): Promise<UserRecord> {
  if (isCommonPassword(input.password)) {
    throw new AppError(400, 'invalid_input', 'Choose a stronger password.', { password: COMMON_PASSWORD_MESSAGE });
  }
  const passwordHash = await hashPassword(input.password);
  try {
    return await getSequelize().transaction(async (transaction) => {
      const user = await usersRepository.create({ email: input.email, displayName: input.displayName, passwordHash });
      const token = await issueToken(user.id, 'verify_email', 48 * 60, transaction);
      await enqueueMail(
        {
          to: user.email,
          kind: 'verify_email',
          subject: 'Confirm your e-mail for Sporewell',
          text:
            `Hello ${user.displayName},\n\nWelcome to Sporewell. Please confirm this is your e-mail address:\n\n` +
            `${publicUrl}/verify-email?token=${token}\n\nThe link works for 48 hours. If you did not join Sporewell, ignore this e-mail.\n`,
        },
        transaction,
      );
      return user;
    });
  } catch (error) {
    if (error instanceof EmailTakenError) {
      throw new AppError(409, 'email_taken', 'An account with that e-mail already exists.', {
        email: 'An account with that e-mail already exists. Sign in instead?',
      });
    }
    throw error;
  }
}

/** A refused attempt under the per-account throttle: 429, when to try again, and the way round. */
function throttled(wait: number, what: string, otherwise: string): AppError {
  const minutes = Math.ceil(wait / 60);
  return new AppError(429, 'too_many_attempts', `${what}. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}, ${otherwise}.`, undefined, {
    'Retry-After': String(wait),
  });
}

export async function authenticate(input: LoginInput, ip: string | undefined): Promise<UserRecord> {
  const { retryAfter: wait, user } = await reserveAttempt(input.email, ip);
  if (wait !== null) {
    log.security('auth.sign_in_throttled', { email: input.email, ip });
    throw throttled(wait, 'Too many failed sign-ins for this account', 'or reset your password');
  }
  const ok = user ? await verifyPassword(user.passwordHash, input.password) : (await burnTime(input.password), false);
  if (!user || !ok) {
    log.security('auth.sign_in_failed', { email: input.email, ip, known: Boolean(user) });
    throw new AppError(401, 'bad_credentials', 'That e-mail and password do not match.');
  }
  if (user.disabled) {
    log.security('auth.sign_in_disabled', { userId: user.id, ip });
    throw new AppError(403, 'account_disabled', 'This account has been disabled by a steward.');
  }
  await clearFailures(input.email);
  log.security('auth.sign_in', { userId: user.id, ip });
  const { passwordHash: _hash, ...record } = user;
  return record;
}

function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}

async function issueToken(userId: number, purpose: 'verify_email' | 'reset_password', minutes: number, transaction?: import('sequelize').Transaction): Promise<string> {
  const token = crypto.randomBytes(32).toString('base64url');
  await getSequelize().query(
    `INSERT INTO user_tokens (user_id, purpose, token_hash, expires_at) VALUES (:userId, :purpose, :hash, now() + make_interval(mins => :minutes))`,
    { replacements: { userId, purpose, hash: hashToken(token), minutes }, transaction },
  );
  return token;
}

async function consumeToken(token: string, purpose: 'verify_email' | 'reset_password'): Promise<number | null> {
  const rows = await getSequelize().query<{ user_id: number }>(
    `UPDATE user_tokens SET used_at = now()
      WHERE token_hash = :hash AND purpose = :purpose AND used_at IS NULL AND expires_at > now()
      RETURNING user_id`,
    { replacements: { hash: hashToken(token), purpose }, type: QueryTypes.SELECT },
  );
  return rows[0]?.user_id ?? null;
}

export async function verifyEmail(token: string): Promise<UserRecord> {
  const userId = await consumeToken(token, 'verify_email');
  if (!userId) throw new AppError(400, 'invalid_token', 'That link has expired or was already used. Ask for a new one.');
  const user = await usersRepository.update(userId, { emailVerified: true });
  if (!user) throw new AppError(400, 'invalid_token', 'That link has expired or was already used.');
  return user;
}

/**
 * A confirmation or reset link goes to an address at most once in this many seconds: asking
 * again sooner sends nothing, so nobody can fill an inbox with them.
 */
export const LINK_MAIL_GAP_SECONDS = 120;

/** Seconds left before another link of this kind may go to the address (0: it may go now). */
async function secondsUntilNextLink(to: string, kind: 'verify_email' | 'reset_password'): Promise<number> {
  const [row] = await getSequelize().query<{ left: number }>(
    `SELECT ceil(:gap - EXTRACT(EPOCH FROM (now() - max(created_at))))::int AS left
       FROM outbox_mail WHERE to_address = :to AND kind = :kind AND created_at > now() - make_interval(secs => :gap)`,
    { replacements: { to, kind, gap: LINK_MAIL_GAP_SECONDS }, type: QueryTypes.SELECT },
  );
  return Math.max(0, row?.left ?? 0);
}

export async function resendVerification(user: UserRecord, publicUrl: string): Promise<void> {
  if (user.emailVerified) return;
  const wait = await secondsUntilNextLink(user.email, 'verify_email');
  if (wait > 0) {
    throw new AppError(
      429,
      'link_sent_recently',
      `A link went to ${user.email} less than ${LINK_MAIL_GAP_SECONDS / 60} minutes ago. Look for it in your inbox (and the spam folder); you can ask for another in ${wait > 60 ? `about ${Math.ceil(wait / 60)} minutes` : `${wait} seconds`}.`,
      undefined,
      { 'Retry-After': String(wait) },
    );
  }
  const token = await issueToken(user.id, 'verify_email', 48 * 60);
  await enqueueMail({
    to: user.email,
    kind: 'verify_email',
    subject: 'Confirm your e-mail for Sporewell',
    text: `Hello ${user.displayName},\n\nPlease confirm this is your e-mail address:\n\n${publicUrl}/verify-email?token=${token}\n\nThe link works for 48 hours.\n`,
  });
}

export async function requestPasswordReset(email: string, publicUrl: string): Promise<void> {
  const user = await usersRepository.findByEmailWithHash(email);
  // The answer is the same whether or not the account exists.
  if (!user || user.disabled) return;
  // Asked again within the gap: the link sent a moment ago still works; nothing more is sent.
  if ((await secondsUntilNextLink(user.email, 'reset_password')) > 0) return;
  const token = await issueToken(user.id, 'reset_password', 60);
  await enqueueMail({
    to: user.email,
    kind: 'reset_password',
    subject: 'Reset your Sporewell password',
    text:
      `Hello ${user.displayName},\n\nSomeone asked to reset the password of your Sporewell account. To choose a new one, open:\n\n` +
      `${publicUrl}/reset-password?token=${token}\n\nThe link works for one hour. If it was not you, ignore this e-mail; your password stays as it is.\n`,
  });
  log.security('auth.reset_requested', { userId: user.id });
}

/**
 * A signed-in person changes their password: the current one is checked under the same
 * per-account throttle as signing in (a stolen session cannot guess it), and they are mailed
 * that it changed. The caller ends their other sessions.
 */
export async function changePassword(user: UserRecord, input: PasswordChangeInput, ip: string | undefined, publicUrl: string): Promise<void> {
  const { retryAfter: wait, user: found } = await reserveAttempt(user.email, ip);
  if (wait !== null) {
    log.security('auth.password_change_throttled', { userId: user.id, ip });
    throw throttled(wait, 'Too many wrong passwords for this account', 'or reset your password by e-mail');
  }
  if (!found || !(await verifyPassword(found.passwordHash, input.currentPassword))) {
    log.security('auth.password_change_failed', { userId: user.id, ip });
    throw new AppError(400, 'invalid_input', 'Some fields need fixing.', { currentPassword: 'That is not your current password.' });
  }
  // The current password was right: the attempt slot goes, whatever is wrong with the new one.
  await clearFailures(user.email);
  if (isCommonPassword(input.password)) {
    throw new AppError(400, 'invalid_input', 'Choose a stronger password.', { password: COMMON_PASSWORD_MESSAGE });
  }
  if (input.password === input.currentPassword) {
    throw new AppError(400, 'invalid_input', 'Some fields need fixing.', { password: 'That is the password you have now. Choose a new one.' });
  }
  const passwordHash = await hashPassword(input.password);
  await getSequelize().transaction(async (transaction) => {
    await usersRepository.update(user.id, { passwordHash }, transaction);
    await enqueueMail(
      {
        to: user.email,
        kind: 'password_changed',
        subject: 'Your Sporewell password was changed',
        text:
          `Hello ${user.displayName},\n\nThe password of your Sporewell account was changed just now, and every other place where you were signed in was signed out.\n\n` +
          `If that was not you, choose a new password at once: ${publicUrl}/forgot-password\n`,
      },
      transaction,
    );
  });
  log.security('auth.password_changed', { userId: user.id, ip });
}

export async function resetPassword(token: string, password: string): Promise<UserRecord> {
  if (isCommonPassword(password)) {
    throw new AppError(400, 'invalid_input', 'Choose a stronger password.', { password: COMMON_PASSWORD_MESSAGE });
  }
  const userId = await consumeToken(token, 'reset_password');
  if (!userId) throw new AppError(400, 'invalid_token', 'That link has expired or was already used. Ask for a new one.');
  const user = await usersRepository.update(userId, { passwordHash: await hashPassword(password), emailVerified: true });
  if (!user) throw new AppError(400, 'invalid_token', 'That link has expired or was already used.');
  await clearFailures(user.email);
  log.security('auth.password_reset', { userId });
  return user;
}
