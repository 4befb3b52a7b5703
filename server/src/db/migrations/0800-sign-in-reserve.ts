// Taking a sign-in attempt slot in one round trip (modules/auth/sign-in-throttle.ts). The
// function takes the account's advisory lock, counts its failures in the window and, below the
// limit, writes the slot, all within the calling statement's transaction. Inside a VOLATILE
// PL/pgSQL function every statement takes a fresh snapshot (READ COMMITTED), so the count runs
// after the lock is held and sees every slot a concurrent attempt committed before releasing
// it: the limit stays exact across processes, as with the explicit transaction it replaces.
// The lock key is the lower-cased e-mail, as the citext comparison of the count is.
import type { Migration } from '../migrator';

export async function up({ context }: Migration): Promise<void> {
  await context.sequelize.query(`
    CREATE OR REPLACE FUNCTION sign_in_reserve(p_email citext, p_ip text, p_max integer, p_window_minutes integer)
    RETURNS TABLE (failures bigint, oldest timestamptz, reserved boolean)
    LANGUAGE plpgsql VOLATILE AS $$
    BEGIN
      PERFORM pg_advisory_xact_lock(727003, hashtext(lower(p_email::text)));
      SELECT count(*), min(f.created_at) INTO failures, oldest
        FROM sign_in_failures f
       WHERE f.email = p_email AND f.created_at > now() - make_interval(mins => p_window_minutes);
      reserved := failures < p_max;
      IF reserved THEN
        INSERT INTO sign_in_failures (email, ip) VALUES (p_email, p_ip);
      END IF;
      RETURN NEXT;
    END
    $$`);
}

export async function down({ context }: Migration): Promise<void> {
  await context.sequelize.query(`DROP FUNCTION IF EXISTS sign_in_reserve(citext, text, integer, integer)`);
}
