// The bench's people, cases and sessions, written straight into the throw-away database.
//
// - Open cases for the rounds list and the live thread: one per grower, each held by one of a
//   few mentors, in conversation, with three messages already (the opening line and one each).
// - Sessions for the sockets: one session row per socket, inserted directly with the same
//   JSON express-session writes and a cookie signed with the server's SESSION_SECRET (what
//   express-session does: `s:` + HMAC, URL-encoded). A thousand argon2 sign-ins would cost
//   ~25 s of CPU and measure sign-in, not the thread; one session per socket keeps every socket
//   a separate signed-in device, as in use.
// - A few accounts with real argon2id hashes for the sign-in burst and the rounds list.
import crypto from 'node:crypto';
import { sign } from 'cookie-signature';
import pg from 'pg';
import { URGENCY_WEIGHTS } from '../../server/shared/urgency';
import { STAGE_IDS, SYMPTOM_IDS } from '../../server/shared/vocabulary';
import { SESSION_COOKIE } from '../../server/src/lib/session';
import { hashPassword } from '../../server/src/modules/auth/passwords';

export const BENCH_PASSWORD = 'bench-larchmere-compost-7731';

export interface SignedIn {
  userId: number;
  /** the Cookie header value */
  cookie: string;
}

export interface Room {
  caseId: number;
  grower: SignedIn;
  mentor: SignedIn;
}

export interface BenchData {
  rooms: Room[];
  /** a mentor with a real password, for the rounds list */
  roundsMentor: { email: string; password: string };
  /** accounts with real passwords, for the sign-in burst */
  signInAccounts: { email: string; password: string }[];
}

const level = (score: number) => (score >= URGENCY_WEIGHTS.levels.high ? 'high' : score >= URGENCY_WEIGHTS.levels.medium ? 'medium' : 'low');

export async function seedBench(
  databaseUrl: string,
  options: { secret: string; idleMinutes: number; cases: number; mentors: number; signInAccounts: number },
): Promise<BenchData> {
  // Spread by index (co-prime steps), so every run has the same cases without a random source.
  const nth = <T>(list: readonly T[], i: number, step: number) => list[(i * step) % list.length];
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  try {
    const realHash = await hashPassword(BENCH_PASSWORD);
    const insertUsers = async (prefix: string, role: string, n: number, hash: string) => {
      const { rows } = await pool.query<{ id: number; email: string }>(
        `INSERT INTO users (email, display_name, password_hash, role, email_verified)
         SELECT $1 || '-' || i || '@example.test', initcap($1) || ' ' || i, $3, $2, true FROM generate_series(1, $4) AS i
         RETURNING id, email`,
        [prefix, role, hash, n],
      );
      return rows;
    };
    const [roundsMentor] = await insertUsers('bench-rounds-mentor', 'mentor', 1, realHash);
    const signIn = await insertUsers('bench-sign-in', 'grower', options.signInAccounts, realHash);
    // The socket users sign in through sessions written below, never with a password.
    const growers = await insertUsers('bench-grower', 'grower', options.cases, '!no-password');
    const mentors = await insertUsers('bench-mentor', 'mentor', options.mentors, '!no-password');

    const cases = growers.map((g, i) => {
      const stage = nth(STAGE_IDS, i, 7);
      const symptoms = [...new Set([nth(SYMPTOM_IDS, i, 5), nth(SYMPTOM_IDS, i + 3, 11)])];
      const urgency = 5 + ((i * 37) % 60);
      return {
        growerId: g.id,
        mentorId: mentors[i % mentors.length].id,
        stage,
        symptoms: `{${symptoms.join(',')}}`,
        title: `${stage}: ${symptoms.join(' and ').replace(/-/g, ' ')} (bench case ${i + 1})`,
        description: 'Opened by the bench. The jar sits on the shed shelf at Larchmere Commons; the top layer changed overnight.',
        urgency,
        level: level(urgency),
        hoursAgo: 1 + ((i * 13) % 72),
      };
    });
    const { rows: caseRows } = await pool.query<{ id: number; grower_id: number; mentor_id: number }>(
      `INSERT INTO cases (grower_id, mentor_id, stage, symptoms, title, description, status, urgency, urgency_level,
                          opened_at, claimed_at, waiting_since, last_message_at, last_message_preview, next_seq)
       SELECT r.grower, r.mentor, r.stage, r.symptoms::text[], r.title, r.description, 'in_conversation', r.urgency, r.level,
              now() - make_interval(hours => r.hours), now() - make_interval(hours => r.hours) + interval '20 minutes',
              now() - make_interval(hours => r.hours), now() - interval '5 minutes', 'Thanks, I will look at it this evening.', 3
         FROM unnest($1::int[], $2::int[], $3::text[], $4::text[], $5::text[], $6::text[], $7::int[], $8::text[], $9::int[])
           AS r(grower, mentor, stage, symptoms, title, description, urgency, level, hours)
       RETURNING id, grower_id, mentor_id`,
      [
        cases.map((c) => c.growerId),
        cases.map((c) => c.mentorId),
        cases.map((c) => c.stage),
        cases.map((c) => c.symptoms),
        cases.map((c) => c.title),
        cases.map((c) => c.description),
        cases.map((c) => c.urgency),
        cases.map((c) => c.level),
        cases.map((c) => c.hoursAgo),
      ],
    );
    await pool.query(
      `INSERT INTO messages (case_id, seq, author_id, kind, body, created_at)
       SELECT c.id, m.seq, CASE WHEN m.seq = 3 THEN c.mentor_id ELSE c.grower_id END, m.kind, m.body, c.opened_at + make_interval(mins => m.seq)
         FROM cases c
         CROSS JOIN (VALUES (1, 'system', 'Case opened'), (2, 'text', 'The top went pink overnight; photos attached.'),
                            (3, 'text', 'Thanks, I will look at it this evening.')) AS m(seq, kind, body)
        WHERE c.id = ANY($1::int[])`,
      [caseRows.map((c) => c.id)],
    );

    // Sessions, as express-session + connect-pg-simple store them.
    const idleMs = options.idleMinutes * 60_000;
    const sessionFor = (userId: number) => {
      const sid = crypto.randomBytes(24).toString('base64url');
      const expires = new Date(Date.now() + idleMs);
      const sess = {
        cookie: { originalMaxAge: idleMs, expires: expires.toISOString(), secure: false, httpOnly: true, path: '/', sameSite: 'lax' },
        passport: { user: userId },
        startedAt: Date.now(),
      };
      return { sid, sess: JSON.stringify(sess), expire: expires, cookie: `${SESSION_COOKIE}=${encodeURIComponent(`s:${sign(sid, options.secret)}`)}` };
    };
    const rooms: Room[] = [];
    const sessions: { sid: string; sess: string; expire: Date }[] = [];
    for (const c of caseRows) {
      const g = sessionFor(c.grower_id);
      const m = sessionFor(c.mentor_id);
      sessions.push(g, m);
      rooms.push({ caseId: c.id, grower: { userId: c.grower_id, cookie: g.cookie }, mentor: { userId: c.mentor_id, cookie: m.cookie } });
    }
    await pool.query(
      `INSERT INTO session (sid, sess, expire) SELECT * FROM unnest($1::varchar[], $2::json[], $3::timestamp[])`,
      [sessions.map((s) => s.sid), sessions.map((s) => s.sess), sessions.map((s) => s.expire.toISOString().replace('T', ' ').replace('Z', ''))],
    );
    await pool.query('ANALYZE');
    return {
      rooms,
      roundsMentor: { email: roundsMentor.email, password: BENCH_PASSWORD },
      signInAccounts: signIn.map((u) => ({ email: u.email, password: BENCH_PASSWORD })),
    };
  } finally {
    await pool.end();
  }
}
