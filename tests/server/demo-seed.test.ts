// The demo seed on a database of its own (it would crowd the shared API database with the demo
// community): run twice at the same moment, it seeds once; its threads carry the system lines
// of each status change and read marks, so the demo accounts do not start with a pile of
// "new" messages they took part in.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { OPEN_STATUSES } from '../../server/shared/case-status';
import { migrate } from '../../server/src/db/migrator';
import { closeSequelize, getSequelize, initSequelize } from '../../server/src/db/sequelize';
import { seedDemo } from '../../server/src/db/seeders/demo';
import { DEMO_CASES, DEMO_PASSWORD, DEMO_USERS } from '../../server/src/db/seeders/demo-data';
import { makeTestApp, agent, type TestApp } from '../setup/test-app';
import { createFreshDatabase, type FreshDatabase } from '../setup/fresh-database';
import { JSON_HEADERS } from '../factories/sign-in';

let freshDb: FreshDatabase | null = null;
let t: TestApp;

beforeAll(async () => {
  freshDb = await createFreshDatabase('seed');
  // This file's process talks to the fresh database only.
  await closeSequelize().catch(() => undefined);
  await migrate(initSequelize(freshDb.url));
  // Two seeders at once, as two processes starting together would run them.
  await Promise.all([seedDemo(), seedDemo()]);
  t = makeTestApp({ DATABASE_URL: freshDb.url });
}, 120_000);

afterAll(async () => {
  await t?.close();
  await closeSequelize().catch(() => undefined);
  await freshDb?.drop();
}, 60_000);

const select = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  getSequelize().query<T>(sql, { replacements, type: QueryTypes.SELECT });

async function signIn(email: string) {
  const browser = agent(t.app);
  const res = await browser.post('/api/auth/login').set(JSON_HEADERS).send({ email, password: DEMO_PASSWORD });
  expect(res.status).toBe(200);
  return browser;
}

const emailOf = (key: string) => DEMO_USERS.find((u) => u.key === key)!.email;
const nameOf = (key: string) => DEMO_USERS.find((u) => u.key === key)!.displayName;

async function threadOf(title: string) {
  return select<{ seq: number; kind: string; body: string; authorEmail: string | null; at: Date }>(
    `SELECT m.seq, m.kind, m.body, u.email AS "authorEmail", m.created_at AS at
       FROM messages m JOIN cases c ON c.id = m.case_id LEFT JOIN users u ON u.id = m.author_id
      WHERE c.title = :title ORDER BY m.seq`,
    { title },
  );
}

describe('the demo seed', () => {
  test('when two seeders run at the same moment, then each part is seeded once', async () => {
    const runs = await select<{ name: string; n: number }>(`SELECT name, count(*)::int AS n FROM seed_runs GROUP BY name ORDER BY name`);
    expect(runs).toEqual([
      { name: 'demo:cases', n: 1 },
      { name: 'demo:users', n: 1 },
    ]);
    const [cases] = await select<{ n: number }>(`SELECT count(*)::int AS n FROM cases`);
    expect(cases.n).toBe(DEMO_CASES.length);
    const [before] = await select<{ n: number }>(`SELECT count(*)::int AS n FROM messages`);
    await seedDemo();
    const [again] = await select<{ n: number }>(`SELECT count(*)::int AS n FROM messages`);
    expect(again.n).toBe(before.n);
  });

  test('when the demo mentor signs in, then one fresh grower line waits for them, on the open case they hold', async () => {
    const mentor = await signIn(emailOf('marta'));
    const unread = await mentor.get('/api/cases/unread');
    expect(unread.status).toBe(200);
    expect(unread.body.total).toBe(1);
    const [caseId] = Object.keys(unread.body.byCase).map(Number);
    const detail = await mentor.get(`/api/cases/${caseId}`);
    expect(OPEN_STATUSES).toContain(detail.body.status);
    expect(detail.body.grower.displayName).toBe(nameOf('rowan'));
    // The unread line is the grower's newest one.
    const messages = await mentor.get(`/api/cases/${caseId}/messages`);
    const last = messages.body.items.filter((m: { kind: string }) => m.kind === 'text').at(-1);
    expect(last.author.displayName).toBe(nameOf('rowan'));
  });

  test('when the demo grower signs in, then nothing they took part in reads as new', async () => {
    const grower = await signIn(emailOf('rowan'));
    const unread = await grower.get('/api/cases/unread');
    expect(unread.body).toEqual({ total: 0, byCase: {} });
  });

  test('when anyone on a seeded case counts unread lines, then a case that is over has none and nobody has more than two', async () => {
    const rows = await select<{ userId: number; status: string; n: number }>(
      `SELECT p.user_id AS "userId", c.status, count(m.id)::int AS n
         FROM cases c
         CROSS JOIN LATERAL (VALUES (c.grower_id), (c.mentor_id)) AS p(user_id)
         LEFT JOIN case_reads r ON r.case_id = c.id AND r.user_id = p.user_id
         JOIN messages m ON m.case_id = c.id AND m.seq > COALESCE(r.last_seq, 0)
        WHERE p.user_id IS NOT NULL AND m.author_id IS DISTINCT FROM p.user_id AND m.kind <> 'system'
          AND (m.kind = 'text' OR p.user_id <> c.grower_id)
        GROUP BY p.user_id, c.id, c.status`,
    );
    expect(rows.filter((r) => !(OPEN_STATUSES as readonly string[]).includes(r.status))).toEqual([]);
    const perPerson = new Map<number, number>();
    for (const r of rows) perPerson.set(r.userId, (perPerson.get(r.userId) ?? 0) + r.n);
    expect(Math.max(0, ...perPerson.values())).toBeLessThanOrEqual(2);
    expect(rows.length).toBeGreaterThan(0); // some open case does wait on someone
  });

  test('when a resolved case is read, then its thread says who took it, who closed it and what the recovery report said, in time order', async () => {
    const demo = DEMO_CASES.find((c) => c.key === 'c-lab-layers')!;
    const thread = await threadOf(demo.title);
    const system = thread.filter((m) => m.kind === 'system');
    expect(system.map((m) => m.body)).toEqual([
      'Case opened',
      `${nameOf('marta')} took this case.`,
      expect.stringMatching(new RegExp(`^${nameOf('marta')} closed the case\\. Likely cause: .+\\. Remedy: .+\\. The case is now “Watching”`)),
      expect.stringMatching(new RegExp(`^${nameOf('rowan')} filed the recovery report: ${demo.outcome === 'partly' ? 'Partly recovered' : demo.outcome === 'lost' ? 'Lost' : 'Recovered'}, ${demo.stars} of 5 stars`)),
    ]);
    expect(system[1].authorEmail).toBe(emailOf('marta'));
    expect(system[3].authorEmail).toBe(emailOf('rowan'));
    // Taken before the mentor's first word, closed after the last, reported last.
    const firstMentorLine = thread.findIndex((m) => m.kind !== 'system' && m.authorEmail === emailOf('marta'));
    expect(thread.indexOf(system[1])).toBeLessThan(firstMentorLine);
    expect(thread.at(-1)).toBe(system[3]);
    expect(thread.at(-2)).toBe(system[2]);
  });

  test('when any seeded thread is read in seq order, then its lines are in time order too, and every status change left its line', async () => {
    const rows = await select<{ title: string; status: string; times: string[]; bodies: string[] }>(
      `SELECT c.title, c.status, array_agg(m.created_at::text ORDER BY m.seq) AS times, array_agg(m.body ORDER BY m.seq) FILTER (WHERE m.kind = 'system') AS bodies
         FROM cases c JOIN messages m ON m.case_id = c.id GROUP BY c.id`,
    );
    expect(rows).toHaveLength(DEMO_CASES.length);
    for (const row of rows) {
      const ms = row.times.map((s) => new Date(s).getTime());
      expect(ms, row.title).toEqual([...ms].sort((a, b) => a - b));
      const demo = DEMO_CASES.find((c) => c.title === row.title)!;
      const has = (pattern: RegExp) => row.bodies.some((b) => pattern.test(b));
      expect(has(/ took this case\.$/), row.title).toBe(demo.mentorKey !== undefined);
      expect(has(/ closed the case\. /), row.title).toBe(['watching', 'recovered', 'lost'].includes(demo.status));
      expect(has(/ filed the recovery report: /), row.title).toBe(['recovered', 'lost'].includes(demo.status));
      expect(has(/ to “Over to the grower”\.$/), row.title).toBe(demo.status === 'over_to_grower');
    }
  });

  test('when the seeded case still watching is read, then its check-ins already due count as sent and no mail was queued for them', async () => {
    const checkIns = await select<{ day: number; due: boolean; sent: boolean }>(
      `SELECT k.day, k.due_at <= now() AS due, k.sent_at IS NOT NULL AS sent
         FROM check_ins k JOIN cases c ON c.id = k.case_id WHERE c.status = 'watching' ORDER BY k.day`,
    );
    expect(checkIns.map((k) => k.day)).toEqual([1, 3, 7]);
    for (const k of checkIns) expect(k.sent).toBe(k.due);
    expect(checkIns.some((k) => !k.due)).toBe(true);
    const [outbox] = await select<{ n: number }>(`SELECT count(*)::int AS n FROM outbox_mail`);
    expect(outbox.n).toBe(0);
  });
});
