// How a signed-in request reads its session (server/src/lib/session.ts, session-reader.ts): one
// statement for the session and its user, shared by requests that ask together but never older
// than the request; the stored expiry written at most once a minute while the idle limit holds.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { TOUCH_EVERY_MS } from '../../server/src/lib/session';
import { cookieOf, makeTestApp, type TestApp } from '../setup/test-app';
import { signedIn } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

async function sessionOf(userId: number): Promise<{ sid: string; expire: number }> {
  const [row] = await getSequelize().query<{ sid: string; expire: number }>(
    `SELECT sid, (extract(epoch FROM expire::timestamptz) * 1000)::float8 AS expire FROM session WHERE (sess -> 'passport' ->> 'user') = :id`,
    { replacements: { id: String(userId) }, type: QueryTypes.SELECT },
  );
  return row;
}

describe('reading sessions', () => {
  test('when several reads of sessions are asked together, then one statement answers them all', async () => {
    const one = await signedIn(t.app);
    const two = await signedIn(t.app);
    const [a, b] = [await sessionOf(one.user.id), await sessionOf(two.user.id)];
    const before = { ...t.sessions.reader.stats };
    const reads = await Promise.all([a.sid, b.sid, a.sid, 'no-such-session'].map((sid) => t.sessions.reader.readAsync(sid)));
    expect(t.sessions.reader.stats.statements - before.statements).toBe(1);
    expect(reads.map((r) => r?.user?.id ?? null)).toEqual([one.user.id, two.user.id, one.user.id, null]);
  });

  test('when a session ends while a read of it is on its way, then a read asked afterwards does not see it', async () => {
    const { user } = await signedIn(t.app);
    const { sid } = await sessionOf(user.id);
    const earlier = t.sessions.reader.readAsync(sid);
    await new Promise((resolve) => setImmediate(resolve));
    await getSequelize().query(`DELETE FROM session WHERE sid = :sid`, { replacements: { sid } });
    const later = await t.sessions.reader.readAsync(sid);
    await earlier;
    expect(later).toBeNull();
  });

  test('when the role or the disabled flag changes on another connection, then the very next request has it', async () => {
    const { user, browser } = await signedIn(t.app);
    await browser.get('/api/steward/users').expect(403);
    await getSequelize().query(`UPDATE users SET role = 'steward' WHERE id = :id`, { replacements: { id: user.id } });
    await browser.get('/api/steward/users').expect(200);
    await getSequelize().query(`UPDATE users SET disabled = true WHERE id = :id`, { replacements: { id: user.id } });
    await browser.get('/api/auth/me').expect(401);
  });
});

describe('touching sessions', () => {
  test('when a session is used again within the minute, then its stored expiry is not written, but the cookie still rolls', async () => {
    const { user, browser } = await signedIn(t.app);
    const first = await sessionOf(user.id);
    const res = await browser.get('/api/auth/me').expect(200);
    expect(cookieOf(res)).not.toBeNull();
    await browser.get('/api/auth/me').expect(200);
    expect((await sessionOf(user.id)).expire).toBe(first.expire);
  });

  test('when the stored expiry has fallen more than a minute behind, then the next request moves it to a full idle limit again (ASVS 7.3.1)', async () => {
    const { user, browser } = await signedIn(t.app);
    await getSequelize().query(`UPDATE session SET expire = expire - make_interval(secs => :secs) WHERE (sess -> 'passport' ->> 'user') = :id`, {
      replacements: { id: String(user.id), secs: (TOUCH_EVERY_MS / 1000) * 2 },
    });
    const lagging = await sessionOf(user.id);
    const asked = Date.now();
    await browser.get('/api/auth/me').expect(200);
    const touched = await sessionOf(user.id);
    expect(touched.expire).toBeGreaterThan(lagging.expire);
    // connect-pg-simple stores whole seconds; the limit counts from this request.
    expect(touched.expire).toBeGreaterThanOrEqual(asked + t.config.SESSION_IDLE_MINUTES * 60_000 - TOUCH_EVERY_MS);
  });
});
