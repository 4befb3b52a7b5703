// Throttling per account, not per IP (ASVS 6.3.1): the 11th failure on one e-mail within 15
// minutes is refused whichever address it comes from, until the oldest failure ages out.
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../db/sequelize';

export const MAX_FAILURES = 10;
export const WINDOW_MINUTES = 15;

/**
 * Takes one attempt slot for this account, or says how long to wait. The slot is written as a
 * failure before the password is checked (and removed on success), under a per-account advisory
 * lock, so concurrent attempts through several processes cannot slip past the limit together.
 */
export async function reserveAttempt(email: string, ip: string | undefined): Promise<{ retryAfter: number } | { retryAfter: null }> {
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    await sequelize.query(`SELECT pg_advisory_xact_lock(727003, hashtext(:email))`, { replacements: { email }, transaction });
    const rows = await sequelize.query<{ n: string; oldest: Date | null }>(
      `SELECT count(*) AS n, min(created_at) AS oldest FROM sign_in_failures
        WHERE email = :email AND created_at > now() - make_interval(mins => :window)`,
      { replacements: { email, window: WINDOW_MINUTES }, type: QueryTypes.SELECT, transaction },
    );
    const n = Number(rows[0]?.n ?? 0);
    if (n >= MAX_FAILURES && rows[0]?.oldest) {
      const until = new Date(rows[0].oldest).getTime() + WINDOW_MINUTES * 60_000;
      return { retryAfter: Math.max(1, Math.ceil((until - Date.now()) / 1000)) };
    }
    await sequelize.query(`INSERT INTO sign_in_failures (email, ip) VALUES (:email, :ip)`, {
      replacements: { email, ip: ip ?? null },
      transaction,
    });
    return { retryAfter: null };
  });
}

export async function clearFailures(email: string): Promise<void> {
  await getSequelize().query(`DELETE FROM sign_in_failures WHERE email = :email`, { replacements: { email } });
}

export async function pruneFailures(): Promise<void> {
  await getSequelize().query(`DELETE FROM sign_in_failures WHERE created_at < now() - interval '1 day'`);
}
