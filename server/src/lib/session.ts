// Sessions live in PostgreSQL (connect-pg-simple; its table comes from a migration). The same
// middleware serves Express and the socket.io handshake.
//
// What a signed-in request costs the database:
// - reading: the session row and its user in one statement (session-reader.ts), shared by every
//   request that asked in the same turn of the event loop, and never older than the request: sign-out, expiry, a disabled account, a role change or a
//   new password count from the next request, on every process. passport's deserializeUser takes
//   the user from that read (auth/passport.ts) rather than reading it again.
// - touching: express-session would UPDATE the row's expiry on every request (rolling idle
//   timeout). The store writes it only when the stored expiry has fallen more than
//   `touchEveryMs` behind the one the request asks for, so an active session costs one write a
//   minute. The idle timeout still holds: the stored expiry is never earlier than
//   (last request + idle limit − touchEveryMs), i.e. an idle session ends at most that much
//   before the limit and never after it. The cookie still rolls on every answer.
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { Request, RequestHandler } from 'express';
import pg from 'pg';
import type { Config } from '../config/env';
import type { UserRecord } from '../modules/users/users.repository';
import { SessionReader, type SessionRead } from './session-reader';

export const SESSION_COOKIE = 'sporewell.sid';

/**
 * Behind https the cookie carries the `__Host-` prefix (RFC 6265bis §4.1.3.2, ASVS 3.3.1): a
 * browser then takes it only when Secure, host-only and on path /, so neither a sibling
 * subdomain nor a plain-http page can plant or shadow it. Plain http (local use) keeps the
 * bare name, which a browser would refuse with the prefix.
 */
export function sessionCookieName(secure: boolean): string {
  return secure ? `__Host-${SESSION_COOKIE}` : SESSION_COOKIE;
}

/** The most the stored expiry may lag behind an active session's rolling one. */
export const TOUCH_EVERY_MS = 60_000;

export interface ChangeWatch {
  /**
   * The change count (session-reader.ts) in the snapshot this request's session was read in,
   * after the request arrived; undefined when its session was not read that way.
   */
  seenBy(req: Request): number | undefined;
}

export interface SessionKit {
  middleware: RequestHandler;
  pool: pg.Pool;
  /** for caches that must never answer with data older than the request (the rounds pages) */
  changes: ChangeWatch;
  reader: SessionReader;
  close(): Promise<void>;
}

const PgStore = connectPgSimple(session);
const LOADED = Symbol('sporewell.sessionRead');

type StoredSession = session.SessionData & { [LOADED]?: SessionRead };

/** What the store read for a request: its user (for deserializeUser) and when the row expires. */
const READ = Symbol('sporewell.sessionReadOfRequest');
type WithRead = { [READ]?: SessionRead };

/** Set on a request once its session has been written to the store. */
const SAVED = Symbol('sporewell.sessionSavedByRequest');
type WithSaved = { [SAVED]?: boolean };

/** Whether a session that began at `startedAt` (ms since the epoch, the session's own field) is past the absolute limit (ASVS 7.3.2). */
export function pastAbsoluteLimit(startedAt: unknown, hours: number): boolean {
  return typeof startedAt === 'number' && startedAt > 0 && Date.now() - startedAt > hours * 3_600_000;
}

/** The user read with this request's session, or undefined when it was not read that way. */
export function sessionUserOf(req: Request): UserRecord | null | undefined {
  return (req as WithRead)[READ]?.user;
}

class SporewellStore extends PgStore {
  readonly #reader: SessionReader;
  readonly #touchEveryMs: number;

  constructor(options: ConstructorParameters<typeof PgStore>[0], reader: SessionReader, touchEveryMs: number) {
    super(options);
    this.#reader = reader;
    this.#touchEveryMs = touchEveryMs;
  }

  override get(sid: string, callback: (error: unknown, session?: session.SessionData | null) => void): void {
    this.#reader.read(sid, (error, read) => {
      if (error) return callback(error);
      if (!read) return callback(null, null);
      let stored: StoredSession;
      try {
        stored = JSON.parse(read.sess) as StoredSession;
      } catch (parseError) {
        return callback(parseError);
      }
      // Symbol keys stay out of express-session's copy and out of its change hash.
      stored[LOADED] = read;
      callback(null, stored);
    });
  }

  override createSession(req: Request, stored: StoredSession): session.Session & Partial<session.SessionData> {
    const read = stored[LOADED];
    if (read) (req as WithRead)[READ] = read;
    return super.createSession(req, stored);
  }

  override set(sid: string, sess: session.SessionData, callback?: (error?: unknown) => void): void {
    const req = (sess as unknown as { req?: WithSaved }).req;
    if (req) req[SAVED] = true;
    super.set(sid, sess, callback);
  }

  /**
   * Sign-in regenerates the session (ASVS 7.2.4): the old row is deleted and a new id issued.
   * When this request's session was never stored (no row was read for its cookie and it has not
   * been saved), there is no row to delete, and the DELETE round trip is skipped; the new id is
   * issued all the same.
   */
  override regenerate(req: Request, callback: (error?: unknown) => void): void {
    if ((req as WithRead)[READ] || (req as WithSaved)[SAVED]) return super.regenerate(req, callback);
    (this as unknown as { generate(req: Request): void }).generate(req);
    callback();
  }

  override touch(sid: string, sess: session.SessionData, callback?: (error?: unknown) => void): void {
    // express-session hands over its Session object, which knows its request.
    const read = (sess as unknown as { req?: WithRead }).req?.[READ];
    const expires = sess.cookie?.expires;
    const wanted = expires instanceof Date ? expires.getTime() : expires ? new Date(expires).getTime() : NaN;
    if (read && Number.isFinite(wanted) && read.expiresAt >= wanted - this.#touchEveryMs) {
      // Called back at once: express-session then writes the answer in one piece.
      callback?.();
      return;
    }
    super.touch(sid, sess, (error?: unknown) => {
      if (!error && read && Number.isFinite(wanted)) read.expiresAt = wanted;
      callback?.(error);
    });
  }
}

export function createSessionKit(config: Config): SessionKit {
  const pool = new pg.Pool({ connectionString: config.DATABASE_URL, max: 10, application_name: 'sporewell-sessions' });
  // A dropped idle connection (database restart) must not crash the process.
  pool.on('error', () => undefined);
  const reader = new SessionReader(pool);
  const idleMs = config.SESSION_IDLE_MINUTES * 60_000;
  const store = new SporewellStore(
    {
      pool,
      tableName: 'session',
      createTableIfMissing: false,
      ttl: Math.ceil(idleMs / 1000),
      pruneSessionInterval: config.NODE_ENV === 'test' ? false : 15 * 60,
      errorLog: () => undefined,
    },
    reader,
    Math.min(TOUCH_EVERY_MS, Math.floor(idleMs / 10)),
  );
  const middleware = session({
    name: sessionCookieName(config.secureCookies),
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
  const changes: ChangeWatch = { seenBy: (req) => (req as WithRead)[READ]?.changes };
  return {
    middleware,
    pool,
    changes,
    reader,
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
