// The thread's write path under load: group commit. Posts that arrive while a write is under
// way queue up; then the next write stores them all in ONE statement (one round trip, one
// commit, so one WAL flush for the lot), and each post learns its own outcome. A post alone
// is written at once: under light load nothing waits for a batch to fill.
//
// The statement checks everything the old transaction checked, per post and as of now:
// the writer's account is on and has the role the socket was opened with, a socket's session
// is live and within its absolute limit; the case exists and the writer may read it; only
// mentors and stewards (never on their own case) write asides; a clientId already used in the
// case answers the stored message (or refuses, when someone else used it); an ended case takes
// no text. The cases are locked in id order, their next_seq hands out the seq numbers, and the
// case fields, the waiting clock and the read marks (the writer's own and those of whoever is
// watching the case) move with the insert. An acknowledgement is sent only after this
// statement committed.
//
// A write does not wait for a case another transaction holds (another process's write, a
// claim): it stores the rest, and the posts for that case go in the next write, which waits
// its turn for them (LockMode). In this process, a case already being written is left for the
// next write. So one busy case never holds up a whole batch, and posts of a case keep their order.
//
// Left to the full transaction in messages.service.ts (the statement answers "slow"): a reply
// from the grower while the case is over to them (a status change and a system line) and a
// mentor's reply while the grower is away (the reply mail and its 10-minute window). Posts
// with photos never come here.
import pg from 'pg';
import { isConnectionError } from '../../db/sequelize';
import type { Role } from '../../../shared/case-status';
import type { ThreadMessage } from '../../../shared/socket-events';
import { AppError, databaseUnavailable } from '../../lib/errors';
import { log } from '../../lib/logger';
import { toMessage, type MessageRow } from './messages.repository';
import { viewersOfCases } from './thread-events';

export interface QueuedPost {
  /** the database the post goes to (the process's DATABASE_URL) */
  databaseUrl: string;
  caseId: number;
  author: { id: number; role: Role };
  /** a socket's session, re-checked by the statement; null over HTTP, whose request has just read it */
  sid: string | null;
  /** sessions that started before this (ms since the epoch) are past the absolute limit */
  startedAfterMs: number | null;
  kind: 'text' | 'aside';
  body: string;
  clientId: string;
  preview: string;
}

export type WriteOutcome =
  | { outcome: 'stored' | 'duplicate'; message: ThreadMessage; growerId: number; mentorId: number | null; viewing: number[] }
  | { outcome: Refusal };

/** Why a post was not stored here: refused (to be answered as such), or "slow" for the full transaction. */
export type Refusal = 'unauthorized' | 'not_found' | 'refused' | 'forbidden' | 'taken' | 'closed' | 'slow';

/** Most posts one statement takes; more wait for the next. A statement costs about 1.5 ms of database CPU plus 0.1 ms a post. */
const MAX_BATCH = 500;
/** Writes under way at once. Two keep the disk busy (one flushes while the next is built) without thinning the batches. */
const MAX_IN_FLIGHT = 2;
/** A deadlock with some other transaction on the cases rows aborts the whole statement, which then runs again. */
const RETRIES = 3;
const RETRYABLE = new Set(['40P01', '40001']);
/**
 * How a write takes its cases' locks. "skip": only the cases nobody else holds right now (a
 * write of another process, a claim); posts for the others answer "busy" and go again. "wait":
 * every case, waiting its turn, for posts that were skipped once, so none waits for ever. A
 * skipping write never waits, and waiting writes lock in id order, so no two writes deadlock.
 */
type LockMode = 'skip' | 'wait';

const statementText = (mode: LockMode) => `
WITH input AS (
  SELECT * FROM unnest($1::int[], $2::int[], $3::int[], $4::text[], $5::text[], $6::float8[], $7::text[], $8::text[], $9::text[], $10::text[])
    AS i(ord, case_id, author_id, role, sid, started_after, kind, body, client_id, preview)
),
viewer AS (
  SELECT DISTINCT case_id, user_id FROM unnest($11::int[], $12::int[]) AS v(case_id, user_id)
),
-- Every lookup below goes by index (through the arrays, or one probe per post), whatever the
-- planner guesses of the arrays' lengths: users, sessions and messages are far larger than a write.
-- Locked in id order; FOR UPDATE hands back each row as it is once locked (after any write
-- that held it), so status, holder and next_seq are current and stay so until the commit.
locked AS MATERIALIZED (
  SELECT c.id, c.grower_id, c.mentor_id, c.status, c.next_seq
    FROM cases c WHERE c.id = ANY($2::int[])
   ORDER BY c.id FOR UPDATE${mode === 'skip' ? ' SKIP LOCKED' : ''}
),
known AS (
  SELECT c.id FROM cases c WHERE c.id = ANY($2::int[])
),
existing AS (
  SELECT e.id, i.case_id, i.client_id, e.author_id
    FROM input i
    JOIN LATERAL (SELECT m.id, m.author_id FROM messages m WHERE m.case_id = i.case_id AND m.client_id = i.client_id LIMIT 1) e ON true
),
judged AS MATERIALIZED (
  SELECT i.*, l.grower_id, l.mentor_id, l.next_seq, e.id AS existing_id, a.display_name AS author_name,
         (a.role IN ('mentor', 'steward') AND l.grower_id <> i.author_id AND i.kind = 'text') AS reply,
         CASE
           WHEN a.role IS NULL THEN 'unauthorized'
           WHEN l.id IS NULL AND k.id IS NOT NULL THEN 'busy'
           WHEN l.id IS NULL THEN 'not_found'
           WHEN NOT (a.role IN ('mentor', 'steward') OR l.grower_id = i.author_id) THEN 'refused'
           WHEN i.kind = 'aside' AND NOT (a.role IN ('mentor', 'steward') AND l.grower_id <> i.author_id) THEN 'forbidden'
           WHEN e.id IS NOT NULL AND e.author_id IS DISTINCT FROM i.author_id THEN 'taken'
           WHEN e.id IS NOT NULL THEN 'duplicate'
           WHEN i.kind = 'text' AND l.status IN ('recovered', 'lost', 'withdrawn') THEN 'closed'
           WHEN i.kind = 'text' AND l.status = 'over_to_grower' AND l.grower_id = i.author_id THEN 'slow'
           WHEN a.role IN ('mentor', 'steward') AND l.grower_id <> i.author_id AND i.kind = 'text'
                AND NOT EXISTS (SELECT 1 FROM viewer v WHERE v.case_id = i.case_id AND v.user_id = l.grower_id) THEN 'slow'
           ELSE 'store'
         END AS outcome
    FROM input i
    -- The writer and their session, one probe each per post, joined to the post itself: a join
    -- of two row sets of the batch on ord is planned as a nested loop (the planner guesses one
    -- row for the filtered side), which cost the square of the batch (about 10 ms at 200 posts).
    -- The session's JSON is parsed once a post, not once a field. OFFSET 0 keeps each subquery
    -- a probe of its own (not pulled up into a join the planner might make a scan of users).
    LEFT JOIN LATERAL (
      SELECT u.display_name, u.role FROM users u
       WHERE u.id = i.author_id AND u.role = i.role AND NOT u.disabled
         AND (i.sid IS NULL OR EXISTS (
           SELECT 1 FROM (SELECT s.expire, s.sess::jsonb AS sess FROM session s WHERE s.sid = i.sid OFFSET 0) s
            WHERE s.expire > now() AND s.sess -> 'passport' ->> 'user' = u.id::text
              AND ((s.sess ->> 'startedAt') IS NULL OR (s.sess ->> 'startedAt') !~ '^[0-9]+(\\.[0-9]+)?$'
                   OR (s.sess ->> 'startedAt')::float8 >= i.started_after)))
      OFFSET 0
    ) a ON true
    LEFT JOIN locked l ON l.id = i.case_id
    LEFT JOIN known k ON k.id = i.case_id
    LEFT JOIN existing e ON e.case_id = i.case_id AND e.client_id = i.client_id
),
fresh AS MATERIALIZED (
  SELECT j.*, j.next_seq + row_number() OVER (PARTITION BY j.case_id ORDER BY j.ord) AS seq FROM judged j WHERE j.outcome = 'store'
),
per_case AS (
  SELECT case_id, count(*)::int AS n, bool_or(kind = 'text') AS has_text, bool_or(reply) AS any_reply,
         (array_agg(preview ORDER BY ord DESC) FILTER (WHERE kind = 'text'))[1] AS preview,
         (array_agg(reply ORDER BY ord DESC) FILTER (WHERE kind = 'text'))[1] AS last_text_is_reply
    FROM fresh GROUP BY case_id
),
bumped AS (
  UPDATE cases c
     SET next_seq = c.next_seq + p.n,
         last_message_at = CASE WHEN p.has_text THEN now() ELSE c.last_message_at END,
         last_message_preview = CASE WHEN p.has_text THEN p.preview ELSE c.last_message_preview END,
         updated_at = CASE WHEN p.has_text THEN now() ELSE c.updated_at END,
         first_reply_at = CASE WHEN p.any_reply AND c.first_reply_at IS NULL THEN now() ELSE c.first_reply_at END,
         -- urgency-recompute.ts: the grower writing starts the clock (kept if running), a reply stops it;
         -- several texts in one write end as the last one leaves it.
         waiting_since = CASE WHEN NOT p.has_text THEN c.waiting_since
                              WHEN p.last_text_is_reply THEN NULL
                              WHEN p.any_reply THEN now()
                              ELSE COALESCE(c.waiting_since, now()) END
    FROM per_case p WHERE c.id = p.case_id
  RETURNING 1
),
stored AS (
  INSERT INTO messages (case_id, seq, author_id, kind, body, client_id)
  SELECT case_id, seq, author_id, kind, body, client_id FROM fresh ORDER BY ord
  ON CONFLICT (case_id, client_id) DO NOTHING
  RETURNING id, case_id, seq, client_id, created_at, author_id, kind
),
read_marks AS (
  INSERT INTO case_reads (case_id, user_id, last_seq)
  SELECT r.case_id, r.user_id, max(r.seq)
    FROM (SELECT case_id, author_id AS user_id, seq FROM stored
          UNION ALL
          SELECT s.case_id, v.user_id, s.seq
            FROM stored s JOIN locked l ON l.id = s.case_id JOIN viewer v ON v.case_id = s.case_id
           WHERE v.user_id IN (l.grower_id, l.mentor_id) AND v.user_id <> s.author_id
             AND (s.kind = 'text' OR v.user_id <> l.grower_id)) r
   GROUP BY r.case_id, r.user_id
  ON CONFLICT (user_id, case_id) DO UPDATE SET last_seq = GREATEST(case_reads.last_seq, EXCLUDED.last_seq), updated_at = now()
  RETURNING 1
)
SELECT j.ord, j.outcome, j.grower_id AS "growerId", j.mentor_id AS "mentorId",
       COALESCE(s.id, d.id) AS id, j.case_id AS "caseId", COALESCE(s.seq, d.seq) AS seq, j.client_id AS "clientId",
       COALESCE(d.kind, j.kind) AS kind, COALESCE(d.body, j.body) AS body, COALESCE(d.hidden, false) AS hidden,
       COALESCE(s.created_at, d.created_at) AS "createdAt",
       COALESCE(d.author_id, j.author_id) AS "authorId",
       CASE WHEN d.id IS NULL THEN j.author_name ELSE d.author_name END AS "authorName",
       CASE WHEN d.id IS NULL THEN j.role ELSE d.author_role END AS "authorRole",
       d.photos
  FROM judged j
  LEFT JOIN stored s ON j.outcome = 'store' AND s.case_id = j.case_id AND s.client_id = j.client_id
  LEFT JOIN LATERAL (
    SELECT m.id, m.seq, m.kind, m.body, m.hidden, m.created_at, m.author_id, u.display_name AS author_name, u.role AS author_role,
           (SELECT json_agg(json_build_object('id', p.id, 'width', p.width, 'height', p.height) ORDER BY p.id)
              FROM case_photos p WHERE p.message_id = m.id) AS photos
      FROM messages m LEFT JOIN users u ON u.id = m.author_id
     WHERE j.outcome = 'duplicate' AND m.id = j.existing_id
     LIMIT 1
  ) d ON true
 ORDER BY j.ord`;
const STATEMENTS: Record<LockMode, { name: string; text: string }> = {
  skip: { name: 'sporewell_thread_write_skip_v3', text: statementText('skip') },
  wait: { name: 'sporewell_thread_write_wait_v3', text: statementText('wait') },
};

type ResultRow = MessageRow & { ord: number; outcome: string; growerId: number | null; mentorId: number | null };

interface Pending {
  post: QueuedPost;
  key: string;
  /** how often its case was held by another write when this post's turn came */
  skipped: number;
  resolve(outcome: WriteOutcome): void;
  reject(error: unknown): void;
}

/** What one statement answered for a post: its outcome, or to go again (its case was busy, or its clientId was just taken). */
type RowResult = WriteOutcome | 'busy' | 'again';

/**
 * One queue per database: every post of every socket and request goes through it. It has
 * connections of its own, as many as its writes under way: a post never waits behind HTTP
 * requests for a connection of the shared pool, and its statements stay prepared, on a generic
 * plan from the first write (the arrays' lengths are all a custom plan would learn).
 */
class MessageWriter {
  private readonly pool: pg.Pool;
  private queue: Pending[] = [];
  private inFlight = 0;
  /** cases of the writes under way: a later post for one waits for the next write, so posts keep their order and never queue on a lock of this process */
  private writing = new Map<number, number>();
  private scheduled = false;

  constructor(databaseUrl: string) {
    this.pool = new pg.Pool({
      connectionString: databaseUrl,
      max: MAX_IN_FLIGHT,
      idleTimeoutMillis: 60_000,
      connectionTimeoutMillis: 5_000,
      allowExitOnIdle: true,
      application_name: 'sporewell-thread-writer',
      options: '-c plan_cache_mode=force_generic_plan',
    });
    // An idle connection lost (a database restart) is an 'error' event, which unheard would end the process.
    this.pool.on('error', (error) => {
      if (!isConnectionError(error)) log.error('thread.writer_connection_error', { error: error.message });
    });
  }

  /**
   * Opens the connections and prepares both statements (plan included) in a transaction that is
   * rolled back, so the first posts after start do not pay for it. Never throws.
   */
  async warm(): Promise<void> {
    const empty = Array.from({ length: 12 }, () => []);
    await Promise.all(
      Array.from({ length: MAX_IN_FLIGHT }, async () => {
        let client: pg.PoolClient | null = null;
        try {
          client = await this.pool.connect();
          await client.query('BEGIN');
          for (const statement of Object.values(STATEMENTS)) await client.query({ ...statement, values: empty });
          await client.query('ROLLBACK');
          client.release();
        } catch (error) {
          client?.release(error as Error);
          if (!unavailable(error)) log.error('thread.writer_warm_failed', { error: (error as Error).message });
        }
      }),
    );
  }

  write(post: QueuedPost): Promise<WriteOutcome> {
    return new Promise((resolve, reject) => {
      this.queue.push({ post, key: `${post.caseId}:${post.clientId}`, skipped: 0, resolve, reject });
      this.schedule();
    });
  }

  /** Starts a write on the next turn of the event loop, so what arrived together goes together. */
  private schedule(): void {
    if (this.scheduled || this.inFlight >= MAX_IN_FLIGHT || !this.queue.length) return;
    this.scheduled = true;
    setImmediate(() => {
      this.scheduled = false;
      this.flush();
    });
  }

  private flush(): void {
    while (this.inFlight < MAX_IN_FLIGHT && this.queue.length) {
      // A case with a post that was skipped before waits for its lock, with all its posts, in order.
      const patient = new Set(this.queue.filter((p) => p.skipped > 0).map((p) => p.post.caseId));
      const mode: LockMode = this.queue.some((p) => patient.has(p.post.caseId) && !this.writing.has(p.post.caseId)) ? 'wait' : 'skip';
      const batch: Pending[] = [];
      const keys = new Set<string>();
      const rest: Pending[] = [];
      for (const pending of this.queue) {
        const caseId = pending.post.caseId;
        const fits = batch.length < MAX_BATCH && !this.writing.has(caseId) && patient.has(caseId) === (mode === 'wait') && !keys.has(pending.key);
        if (fits) {
          batch.push(pending);
          keys.add(pending.key);
        } else rest.push(pending);
      }
      this.queue = rest;
      if (!batch.length) return;
      const cases = [...new Set(batch.map((p) => p.post.caseId))];
      for (const caseId of cases) this.writing.set(caseId, (this.writing.get(caseId) ?? 0) + 1);
      this.inFlight += 1;
      void this.run(batch, mode).finally(() => {
        for (const caseId of cases) {
          const left = this.writing.get(caseId)! - 1;
          if (left) this.writing.set(caseId, left);
          else this.writing.delete(caseId);
        }
        this.inFlight -= 1;
        this.schedule();
      });
    }
  }

  private async run(batch: Pending[], mode: LockMode): Promise<void> {
    let results: (RowResult | 'failed')[];
    try {
      results = await writeWithRetries(this.pool, batch.map((p) => p.post), mode);
    } catch (error) {
      if (unavailable(error)) {
        for (const p of batch) p.reject(databaseUnavailable());
        return;
      }
      if (batch.length === 1) {
        for (const p of batch) p.reject(error);
        return;
      }
      // One bad post must not sink the others: each goes again on its own.
      log.error('thread.write_batch_failed', { posts: batch.length, error: (error as Error).message });
      results = [];
      for (const p of batch) {
        try {
          results.push((await writeWithRetries(this.pool, [p.post], 'wait'))[0]);
        } catch (alone) {
          p.reject(unavailable(alone) ? databaseUnavailable() : alone);
          results.push('failed');
        }
      }
    }
    // What goes again goes first, in its order, ahead of what came meanwhile.
    const again: Pending[] = [];
    batch.forEach((p, i) => {
      const result = results[i];
      if (result === 'failed') return;
      if (result === 'busy') again.push({ ...p, skipped: p.skipped + 1 });
      // Stored by a concurrent write between this statement's snapshot and its insert: it reads as the duplicate it is next time.
      else if (result === 'again') again.push(p);
      else p.resolve(result);
    });
    this.queue.unshift(...again);
  }
}

/** The database is away (or cannot be reached within the connect timeout): the same would happen to each post alone. */
function unavailable(error: unknown): boolean {
  return isConnectionError(error) || /timeout exceeded when trying to connect/.test((error as Error)?.message ?? '');
}

async function writeWithRetries(pool: pg.Pool, posts: QueuedPost[], mode: LockMode): Promise<RowResult[]> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await writeOnce(pool, posts, mode);
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (attempt >= RETRIES || !code || !RETRYABLE.has(code)) throw error;
    }
  }
}

async function writeOnce(pool: pg.Pool, posts: QueuedPost[], mode: LockMode): Promise<RowResult[]> {
  const caseIds = [...new Set(posts.map((p) => p.caseId))];
  // Whoever has a socket on the case now is sent the post live: their read is marked with it.
  const viewers = viewersOfCases(caseIds);
  const viewerCases: number[] = [];
  const viewerUsers: number[] = [];
  for (const [caseId, users] of viewers) for (const userId of users) viewerCases.push(caseId), viewerUsers.push(userId);
  const values = [
    posts.map((_, i) => i),
    posts.map((p) => p.caseId),
    posts.map((p) => p.author.id),
    posts.map((p) => p.author.role),
    posts.map((p) => p.sid),
    posts.map((p) => p.startedAfterMs),
    posts.map((p) => p.kind),
    posts.map((p) => p.body),
    posts.map((p) => p.clientId),
    posts.map((p) => p.preview),
    viewerCases,
    viewerUsers,
  ];
  const { rows } = await pool.query<ResultRow>({ ...STATEMENTS[mode], values });
  return rows.map((row): RowResult => {
    const outcome = row.outcome;
    if (outcome === 'busy') return 'busy';
    if (outcome === 'store' || outcome === 'duplicate') {
      if (row.id === null) return 'again';
      const seen = viewers.get(row.caseId) ?? new Set<number>();
      return {
        outcome: outcome === 'store' ? 'stored' : 'duplicate',
        message: toMessage(row),
        growerId: row.growerId!,
        mentorId: row.mentorId,
        viewing: [row.growerId, row.mentorId].filter((id): id is number => id !== null && seen.has(id)),
      };
    }
    return { outcome: outcome as Refusal };
  });
}

const writers = new Map<string, MessageWriter>();

function writerFor(databaseUrl: string): MessageWriter {
  let writer = writers.get(databaseUrl);
  if (!writer) writers.set(databaseUrl, (writer = new MessageWriter(databaseUrl)));
  return writer;
}

/** Stores one post (with whatever else is waiting); resolves once it is committed, or says why not. */
export function writeMessage(post: QueuedPost): Promise<WriteOutcome> {
  return writerFor(post.databaseUrl).write(post);
}

/** Gets the writer for this database ready before the first post (connections open, statements planned). */
export function warmMessageWriter(databaseUrl: string): Promise<void> {
  return writerFor(databaseUrl).warm();
}
