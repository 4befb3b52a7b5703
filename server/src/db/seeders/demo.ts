// Seeds the invented demo community once (PRODUCT.md "Demo scenario"). Never in production.
// Each part records itself in seed_runs inside its own transaction, so a crash mid-way leaves
// nothing half-seeded and a restart does not seed twice.
import { QueryTypes, type Transaction } from 'sequelize';
import { getSequelize } from '../sequelize';
import { hashPassword } from '../../modules/auth/passwords';
import { log } from '../../lib/logger';
import { DEMO_BATCHES, DEMO_CASES, DEMO_PASSWORD, DEMO_USERS } from './demo-data';
import { seedDemoCases } from './demo-cases';

const DEMO_LOCK = 727_002;

async function once(name: string, work: (t: Transaction) => Promise<void>): Promise<boolean> {
  const sequelize = getSequelize();
  return sequelize.transaction(async (transaction) => {
    await sequelize.query('SELECT pg_advisory_xact_lock(:key)', { replacements: { key: DEMO_LOCK }, transaction });
    const done = await sequelize.query(`SELECT 1 FROM seed_runs WHERE name = :name`, {
      replacements: { name },
      type: QueryTypes.SELECT,
      transaction,
    });
    if (done.length) return false;
    await work(transaction);
    await sequelize.query(`INSERT INTO seed_runs (name) VALUES (:name)`, { replacements: { name }, transaction });
    return true;
  });
}

export async function seedDemo(): Promise<void> {
  if (process.env.NODE_ENV === 'production') return;
  const sequelize = getSequelize();
  const seeded = await once('demo:users', async (transaction) => {
    // One hash serves every demo account: they share the published demo password anyway.
    const hash = await hashPassword(DEMO_PASSWORD);
    for (const user of DEMO_USERS) {
      await sequelize.query(
        `INSERT INTO users (email, display_name, password_hash, role, email_verified, about, created_at)
         VALUES (:email, :name, :hash, :role, true, :about, now() - make_interval(days => :since))
         ON CONFLICT (email) DO NOTHING`,
        {
          replacements: { email: user.email, name: user.displayName, hash, role: user.role, about: user.about ?? null, since: user.mentorSince ?? 380 },
          transaction,
        },
      );
    }
  });
  if (seeded) log.info('demo.seeded', { part: 'users', count: DEMO_USERS.length });

  const casesSeeded = await once('demo:cases', async (transaction) => seedDemoCases(await demoUserIds(transaction), transaction));
  if (casesSeeded) log.info('demo.seeded', { part: 'cases', batches: DEMO_BATCHES.length, cases: DEMO_CASES.length });
}

/** Maps demo user keys to their database ids (for later seed parts). */
export async function demoUserIds(transaction?: Transaction): Promise<Map<string, number>> {
  const rows = await getSequelize().query<{ id: number; email: string }>(`SELECT id, email FROM users WHERE email LIKE '%@example.test'`, {
    type: QueryTypes.SELECT,
    transaction,
  });
  const byEmail = new Map(rows.map((r) => [r.email, r.id]));
  return new Map(DEMO_USERS.filter((u) => byEmail.has(u.email)).map((u) => [u.key, byEmail.get(u.email)!]));
}
