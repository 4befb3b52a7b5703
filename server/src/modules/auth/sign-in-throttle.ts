// Throttling per account, not per IP (ASVS 6.3.1): the 11th failure on one e-mail within 15
// minutes is refused whichever address it comes from, until the oldest failure ages out.
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../db/sequelize';
import { userFromRow, USER_WITH_HASH_COLUMNS, type UserWithHash } from '../users/users.repository';

export const MAX_FAILURES = 10;
export const WINDOW_MINUTES = 15;

export type Reservation = { retryAfter: number; user: null } | { retryAfter: null; user: UserWithHash | null };

/**
 * Takes one attempt slot for this account, or says how long to wait, and reads the account in
 * the same round trip. The slot is written as a failure before the password is checked (and
 * removed on success) by `sign_in_reserve` (migration 0800), under a per-account advisory lock,
 * so concurrent attempts through several processes cannot slip past the limit together.
 */
export async function reserveAttempt(email: string, ip: string | undefined): Promise<Reservation> {
  const [row] = await getSequelize().query<{ oldest: Date | null; reserved: boolean } & Partial<UserWithHash>>(
    `SELECT r.oldest, r.reserved, u.*
       FROM sign_in_reserve(:email, :ip, :max, :window) AS r
       LEFT JOIN LATERAL (SELECT ${USER_WITH_HASH_COLUMNS} FROM users WHERE email = :email AND r.reserved) AS u ON true`,
    { replacements: { email, ip: ip ?? null, max: MAX_FAILURES, window: WINDOW_MINUTES }, type: QueryTypes.SELECT },
  );
  if (!row) throw new Error('sign_in_reserve answered no row');
  if (!row.reserved) {
    const until = row.oldest ? new Date(row.oldest).getTime() + WINDOW_MINUTES * 60_000 : Date.now() + 1000;
    return { retryAfter: Math.max(1, Math.ceil((until - Date.now()) / 1000)), user: null };
  }
  return { retryAfter: null, user: row.id == null ? null : userFromRow(row as UserWithHash) };
}

export async function clearFailures(email: string): Promise<void> {
  await getSequelize().query(`DELETE FROM sign_in_failures WHERE email = :email`, { replacements: { email } });
}

export async function pruneFailures(): Promise<void> {
  await getSequelize().query(`DELETE FROM sign_in_failures WHERE created_at < now() - interval '1 day'`);
}
