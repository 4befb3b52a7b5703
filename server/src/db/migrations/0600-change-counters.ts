// A change count for caches that must never answer with data older than the request: every
// transaction that changes what the rounds list shows (cases, their messages, the names of
// growers and mentors), whoever runs it (any process, a migration, someone in psql), adds one
// to `change_counters` inside that transaction, so the sum moves exactly when the change
// becomes visible. Readers take the sum in the same statement as the session
// (lib/session-reader.ts).
//
// Why counters and not NOTIFY: a NOTIFY takes a database-wide lock at commit and wakes every
// listening connection, which measured +20 % on a message write; this is one small UPDATE.
// Why 128 rows: each transaction takes a row that no other one holds (SKIP LOCKED), so writers
// never wait for one another here and no new lock cycle (deadlock) can form; a transaction adds
// once however many statements it runs (a transaction-local flag).
import type { Migration } from '../migrator';

const COUNTER_ROWS = 128;

const TRIGGERS: [table: string, events: string][] = [
  ['cases', 'INSERT OR UPDATE OR DELETE OR TRUNCATE'],
  ['messages', 'INSERT OR UPDATE OR DELETE OR TRUNCATE'],
  ['users', 'UPDATE OF display_name OR DELETE OR TRUNCATE'],
];

export async function up({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  // Room on each page for the updated versions, so updates stay on their page (HOT).
  await q(`CREATE TABLE change_counters (slot int PRIMARY KEY, n bigint NOT NULL DEFAULT 0) WITH (fillfactor = 25)`);
  await q(`INSERT INTO change_counters (slot) SELECT generate_series(0, ${COUNTER_ROWS - 1})`);
  await q(`
    CREATE FUNCTION sporewell_count_change() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      start int;
    BEGIN
      IF current_setting('sporewell.change_counted', true) = 'on' THEN
        RETURN NULL;
      END IF;
      PERFORM set_config('sporewell.change_counted', 'on', true);
      start := (txid_current() % ${COUNTER_ROWS})::int;
      UPDATE change_counters SET n = n + 1
       WHERE slot = (SELECT slot FROM change_counters WHERE slot >= start ORDER BY slot LIMIT 1 FOR UPDATE SKIP LOCKED);
      IF NOT FOUND THEN
        UPDATE change_counters SET n = n + 1
         WHERE slot = (SELECT slot FROM change_counters ORDER BY slot LIMIT 1 FOR UPDATE SKIP LOCKED);
      END IF;
      IF NOT FOUND THEN
        -- Every row held by another transaction (${COUNTER_ROWS} at once): wait for one.
        UPDATE change_counters SET n = n + 1 WHERE slot = start;
      END IF;
      RETURN NULL;
    END $$`);
  for (const [table, events] of TRIGGERS) {
    await q(`CREATE TRIGGER ${table}_change_count AFTER ${events} ON ${table} FOR EACH STATEMENT EXECUTE FUNCTION sporewell_count_change()`);
  }
}

export async function down({ context }: Migration): Promise<void> {
  const q = (sql: string) => context.sequelize.query(sql);
  for (const [table] of TRIGGERS) await q(`DROP TRIGGER IF EXISTS ${table}_change_count ON ${table}`);
  await q(`DROP FUNCTION IF EXISTS sporewell_count_change()`);
  await q(`DROP TABLE IF EXISTS change_counters`);
}
