// Sessions live in PostgreSQL (connect-pg-simple; its table comes from a migration). The same
// middleware serves Express and the socket.io handshake.
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import pg from 'pg';
import type { Config } from '../config/env';

export const SESSION_COOKIE = 'sporewell.sid';

export interface SessionKit {
  middleware: RequestHandler;
  pool: pg.Pool;
  close(): Promise<void>;
}

export function createSessionKit(config: Config): SessionKit {
  const PgStore = connectPgSimple(session);
  const pool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 10, application_name: 'sporewell-sessions' });
  // A dropped idle connection (database restart) must not crash the process.
  pool.on('error', () => undefined);
  const idleMs = config.SESSION_IDLE_MINUTES * 60_000;
  const store = new PgStore({
    pool,
    tableName: 'session',
    createTableIfMissing: false,
    ttl: Math.ceil(idleMs / 1000),
    pruneSessionInterval: config.NODE_ENV === 'test' ? false : 15 * 60,
    errorLog: () => undefined,
  });
  const middleware = session({
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.TRUST_PROXY,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.secureCookies,
      maxAge: idleMs,
      path: '/',
    },
  });
  return {
    middleware,
    pool,
    async close() {
      store.close();
      await pool.end().catch(() => undefined);
    },
  };
}

/** Ends every stored session of one user (sign-out everywhere, disabled account, new password). */
export async function destroyUserSessions(pool: pg.Pool, userId: number, exceptSid?: string): Promise<string[]> {
  const result = await pool.query<{ sid: string }>(
    `DELETE FROM session WHERE (sess -> 'passport' ->> 'user') = $1 AND ($2::text IS NULL OR sid <> $2) RETURNING sid`,
    [String(userId), exceptSid ?? null],
  );
  return result.rows.map((r) => r.sid);
}
