// Reads sessions, each with its user, for the session store, together with the database's
// change count (migration 0600).
//
// Batching. Requests that ask in the same turn of the event loop are read by one statement,
// sent in the check phase of that turn (`sid = ANY($1)`); while MAX_IN_FLIGHT statements are on
// their way, those who ask wait together for the next. No request ever joins a statement that
// was sent before it asked, so each one sees the session table and its user as they are after it arrived: a
// sign-out, an expiry, a disabled account or a role change, on any process, counts from the
// very next request. Under load many requests share one statement (the same sid is read once).
//
// The change count. Every transaction that changes what the rounds list shows adds one to
// `change_counters` (triggers of migration 0600), inside the transaction, so the sum moves
// exactly when such a change becomes visible. The same statement that reads the sessions reads
// the sum, in the same snapshot, taken after the request arrived: a cache entry made from data
// read after a request with count c saw everything such a request sees while the count is
// still c (rounds-page.ts). No NOTIFY: writers pay one small UPDATE, never a wake-up of every
// listener or the commit lock NOTIFY takes.
import type pg from 'pg';
import type { Role } from '../../shared/case-status';
import type { UserRecord } from '../modules/users/users.repository';

export interface SessionRead {
  /** the stored session, as express-session wrote it */
  sess: string;
  /** when the row expires, in ms since the epoch (this machine's clock) */
  expiresAt: number;
  /** the session's user, when it has one that exists */
  user: UserRecord | null;
  /** the change count in the snapshot the session was read in */
  changes: number;
}

interface ReadRow {
  changes: number;
  sid: string | null;
  sess: string;
  remainingMs: number;
  id: number | null;
  email: string | null;
  displayName: string | null;
  role: Role | null;
  emailVerified: boolean | null;
  disabled: boolean | null;
  about: string | null;
  notifyUrgent: boolean | null;
  createdAt: Date | null;
}

// The same conditions as connect-pg-simple's get (not expired) and the same user columns as
// usersRepository.findById. The passport id is checked to be a number before the cast. The
// count comes first so that it is there even when no session matched.
const READ_SQL = `
  SELECT n.changes, s.sid, s.sess::text AS sess, (extract(epoch FROM (s.expire::timestamptz - now())) * 1000)::float8 AS "remainingMs",
         u.id, u.email::text AS email, u.display_name AS "displayName", u.role, u.email_verified AS "emailVerified",
         u.disabled, u.about, u.notify_urgent AS "notifyUrgent", u.created_at AS "createdAt"
    FROM (SELECT coalesce(sum(n), 0)::float8 AS changes FROM change_counters) n
    LEFT JOIN session s ON s.sid = ANY($1::varchar[]) AND s.expire >= now()
    LEFT JOIN users u ON u.id = CASE WHEN (s.sess -> 'passport' ->> 'user') ~ '^[0-9]{1,9}$' THEN (s.sess -> 'passport' ->> 'user')::int END`;

/**
 * One: whoever asks while a statement is on its way waits for the next, so under load each
 * statement serves many requests (up to all 100 connections of the bench). Two, four or eight
 * on their way did no better in the rounds bench here.
 */
const MAX_IN_FLIGHT = 1;

/** Called once, with the read or the error (a callback rather than a promise: one per request, on every request). */
export type ReadCallback = (error: unknown, read: SessionRead | null) => void;

export interface SessionReaderStats {
  statements: number;
  reads: number;
}

export class SessionReader {
  readonly #pool: pg.Pool;
  #pending = new Map<string, ReadCallback[]>();
  #scheduled = false;
  #inFlight = 0;
  readonly stats: SessionReaderStats = { statements: 0, reads: 0 };

  constructor(pool: pg.Pool) {
    this.#pool = pool;
  }

  read(sid: string, callback: ReadCallback): void {
    const waiting = this.#pending.get(sid);
    if (waiting) waiting.push(callback);
    else this.#pending.set(sid, [callback]);
    this.stats.reads += 1;
    this.#schedule();
  }

  /** The same, as a promise. */
  readAsync(sid: string): Promise<SessionRead | null> {
    return new Promise((resolve, reject) => this.read(sid, (error, read) => (error ? reject(error) : resolve(read))));
  }

  #schedule(): void {
    if (this.#scheduled || this.#inFlight >= MAX_IN_FLIGHT) return;
    this.#scheduled = true;
    setImmediate(() => {
      this.#scheduled = false;
      void this.#flush();
    });
  }

  async #flush(): Promise<void> {
    if (this.#inFlight >= MAX_IN_FLIGHT || this.#pending.size === 0) return;
    const batch = this.#pending;
    this.#pending = new Map();
    this.#inFlight += 1;
    let rows: ReadRow[] | null = null;
    let failure: unknown = null;
    try {
      this.stats.statements += 1;
      ({ rows } = await this.#pool.query<ReadRow>({ name: 'sporewell_session_read', text: READ_SQL, values: [[...batch.keys()]] }));
    } catch (error) {
      failure = error ?? new Error('The session read failed.');
    }
    this.#inFlight -= 1;
    // Those still waiting asked after every statement on its way was sent: the next one.
    if (this.#pending.size) void this.#flush();
    const now = Date.now();
    const found = new Map<string, ReadRow>();
    for (const row of rows ?? []) if (row.sid !== null) found.set(row.sid, row);
    for (const [sid, waiters] of batch) {
      const row = found.get(sid);
      for (const callback of waiters) answer(callback, failure, failure ? null : row ? toRead(row, now) : null);
    }
  }
}

/** One callback's failure is its own: it is thrown on its own (as a callback's would be), and the others still get their answers. */
function answer(callback: ReadCallback, error: unknown, read: SessionRead | null): void {
  try {
    callback(error, read);
  } catch (thrown) {
    process.nextTick(() => {
      throw thrown;
    });
  }
}

function toRead(row: ReadRow, now: number): SessionRead {
  const user: UserRecord | null =
    row.id === null
      ? null
      : {
          id: row.id,
          email: row.email!,
          displayName: row.displayName!,
          role: row.role!,
          emailVerified: row.emailVerified!,
          disabled: row.disabled!,
          about: row.about,
          notifyUrgent: row.notifyUrgent!,
          createdAt: row.createdAt!,
        };
  return { sess: row.sess, expiresAt: now + row.remainingMs, user, changes: row.changes };
}
