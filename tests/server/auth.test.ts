import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, cookieOf, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { createUser, FACTORY_PASSWORD, uniqueEmail } from '../factories/users';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const json = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };

describe('POST /api/auth/register', () => {
  test('when the details are good, then it answers 201 signed in as a grower and stores an argon2id hash', async () => {
    const browser = agent(t.app);
    const email = uniqueEmail('join');
    const res = await browser.post('/api/auth/register').set(json).send({ email, password: 'mossy-jar-on-the-shelf', displayName: 'Ada' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, displayName: 'Ada', role: 'grower', emailVerified: false });
    expect(res.body.passwordHash).toBeUndefined();
    const me = await browser.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.email).toBe(email);
    const [row] = await getSequelize().query<{ password_hash: string }>('SELECT password_hash FROM users WHERE email = :email', {
      replacements: { email },
      type: QueryTypes.SELECT,
    });
    // ASVS 11.4.2: argon2id with m ≥ 19 MiB, t ≥ 2, p ≥ 1 (OWASP Password Storage Cheat Sheet minimum).
    expect(row.password_hash.startsWith('$argon2id$')).toBe(true);
    const params = Object.fromEntries(row.password_hash.split('$')[3].split(',').map((kv) => kv.split('=')));
    expect(Number(params.m)).toBeGreaterThanOrEqual(19456);
    expect(Number(params.t)).toBeGreaterThanOrEqual(2);
    expect(Number(params.p)).toBeGreaterThanOrEqual(1);
  });

  test('when a new account is made, then a verification e-mail is queued in the outbox', async () => {
    const email = uniqueEmail('verify');
    await agent(t.app).post('/api/auth/register').set(json).send({ email, password: 'mossy-jar-on-the-shelf', displayName: 'Bo' }).expect(201);
    const mails = await getSequelize().query<{ subject: string; body_text: string }>('SELECT subject, body_text FROM outbox_mail WHERE to_address = :email', {
      replacements: { email },
      type: QueryTypes.SELECT,
    });
    expect(mails).toHaveLength(1);
    expect(mails[0].body_text).toContain('/verify-email?token=');
  });

  test('when the e-mail is malformed and the password short, then 400 names both fields', async () => {
    const res = await agent(t.app).post('/api/auth/register').set(json).send({ email: 'not-an-email', password: 'short', displayName: 'X' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  test('when the password is 64 characters, then it works (ASVS 6.2.9)', async () => {
    const password = 'fermented-rice-'.repeat(5).slice(0, 64);
    expect(password).toHaveLength(64);
    const email = uniqueEmail('long');
    await agent(t.app).post('/api/auth/register').set(json).send({ email, password, displayName: 'Long' }).expect(201);
    await agent(t.app).post('/api/auth/login').set(json).send({ email, password }).expect(200);
  });

  test('when the password is on the common-password list, then it is refused (ASVS 6.2.4)', async () => {
    const res = await agent(t.app).post('/api/auth/register').set(json).send({ email: uniqueEmail(), password: 'password123', displayName: 'X' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/most-used/);
  });

  test('when the e-mail is already taken (in any letter case), then 409', async () => {
    const user = await createUser();
    const res = await agent(t.app).post('/api/auth/register').set(json).send({ email: user.email.toUpperCase(), password: 'mossy-jar-on-the-shelf', displayName: 'Dup' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('email_taken');
  });

  test('when the grower tries to choose a role, then the role is ignored', async () => {
    const res = await agent(t.app).post('/api/auth/register').set(json).send({ email: uniqueEmail(), password: 'mossy-jar-on-the-shelf', displayName: 'Sly', role: 'steward' });
    expect(res.status).toBe(201);
    expect(res.body.role).toBe('grower');
  });
});

describe('POST /api/auth/login', () => {
  test('when the password is wrong or the e-mail unknown, then both answer the same 401', async () => {
    const user = await createUser();
    const wrong = await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: 'not-the-password' });
    const unknown = await agent(t.app).post('/api/auth/login').set(json).send({ email: uniqueEmail('nobody'), password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  test('when signing in, then the session id changes and the old one is refused (ASVS 7.2.4)', async () => {
    const user = await createUser();
    const browser = agent(t.app);
    // An anonymous session first (a failed attempt does not make one, so use the register validation path).
    const before = await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD });
    const first = cookieOf(before);
    expect(first).toBeTruthy();
    await browser.post('/api/auth/logout').set(json).expect(204);
    const again = await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD });
    const second = cookieOf(again);
    expect(second).toBeTruthy();
    expect(second).not.toEqual(first);
    const replay = await agent(t.app).get('/api/auth/me').set('Cookie', first!);
    expect(replay.status).toBe(401);
  });

  test('when someone signs in again over a stored session (no sign-out between), then that session row is deleted and its cookie refused (ASVS 7.2.4)', async () => {
    const first = await createUser();
    const second = await createUser();
    const browser = agent(t.app);
    const signedIn = await browser.post('/api/auth/login').set(json).send({ email: first.email, password: FACTORY_PASSWORD }).expect(200);
    const old = cookieOf(signedIn)!;
    const oldSid = decodeURIComponent(old.split('=')[1]!).replace(/^s:/, '').split('.')[0];
    const count = async (sid: string) =>
      (await getSequelize().query<{ n: number }>('SELECT count(*)::int AS n FROM session WHERE sid = :sid', { replacements: { sid }, type: QueryTypes.SELECT }))[0]!.n;
    expect(await count(oldSid!)).toBe(1);
    const again = await browser.post('/api/auth/login').set(json).send({ email: second.email, password: FACTORY_PASSWORD }).expect(200);
    expect(cookieOf(again)).not.toEqual(old);
    expect(await count(oldSid!)).toBe(0);
    await agent(t.app).get('/api/auth/me').set('Cookie', old).expect(401);
    const me = await browser.get('/api/auth/me').expect(200);
    expect(me.body.email).toBe(second.email);
  });

  test('when signed out, then replaying the old cookie gives 401 (ASVS 7.4.1)', async () => {
    const user = await createUser();
    const browser = agent(t.app);
    const login = await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
    const cookie = cookieOf(login)!;
    await agent(t.app).get('/api/auth/me').set('Cookie', cookie).expect(200);
    await browser.post('/api/auth/logout').set(json).expect(204);
    await agent(t.app).get('/api/auth/me').set('Cookie', cookie).expect(401);
  });

  test('when the session cookie is set, then it is HttpOnly, SameSite=Lax and not Secure over plain http', async () => {
    const user = await createUser();
    const res = await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD });
    const raw = ([] as string[]).concat(res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('sporewell.sid='))!;
    expect(raw).toMatch(/HttpOnly/i);
    expect(raw).toMatch(/SameSite=Lax/i);
    expect(raw).not.toMatch(/Secure/i);
  });

  test('when the account is disabled, then sign-in is refused even with the right password', async () => {
    const user = await createUser({ disabled: true });
    const res = await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('account_disabled');
  });

  test('when one account fails ten times in 15 minutes, then the 11th try is refused from any IP and says when to retry (ASVS 6.3.1)', async () => {
    const user = await createUser();
    const proxied = makeTestApp({ TRUST_PROXY: '1' });
    try {
      for (let i = 0; i < 10; i += 1) {
        await agent(proxied.app).post('/api/auth/login').set(json).set('X-Forwarded-For', `10.0.0.${i}`).send({ email: user.email, password: 'wrong-password-here' }).expect(401);
      }
      const refused = await agent(proxied.app).post('/api/auth/login').set(json).set('X-Forwarded-For', '192.0.2.77').send({ email: user.email, password: FACTORY_PASSWORD });
      expect(refused.status).toBe(429);
      expect(refused.body.error.code).toBe('too_many_attempts');
      expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
      // Another account is not affected.
      const other = await createUser();
      await agent(proxied.app).post('/api/auth/login').set(json).send({ email: other.email, password: FACTORY_PASSWORD }).expect(200);
    } finally {
      await proxied.close();
    }
  });
});

describe('throttling holds under concurrency', () => {
  test('when 15 wrong attempts arrive at once through two app instances, then exactly 10 are checked and 5 refused', async () => {
    const user = await createUser();
    const second = makeTestApp();
    try {
      const results = await Promise.all(
        Array.from({ length: 15 }, (_, i) =>
          agent(i % 2 ? second.app : t.app).post('/api/auth/login').set(json).send({ email: user.email, password: `wrong-password-${i}` }),
        ),
      );
      const statuses = results.map((r) => r.status).sort();
      expect(statuses.filter((s) => s === 401)).toHaveLength(10);
      expect(statuses.filter((s) => s === 429)).toHaveLength(5);
    } finally {
      await second.close();
    }
  });
});

describe('GET /api/auth/me', () => {
  test('when signed out, then 401 with the error shape', async () => {
    const res = await agent(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'unauthorized', message: expect.any(String) } });
  });
});

describe('sessions time out', () => {
  test('when a session is idle past the limit, then it gives 401 (ASVS 7.3.1)', async () => {
    const user = await createUser();
    const browser = agent(t.app);
    await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
    await getSequelize().query(`UPDATE session SET expire = now() - interval '1 minute' WHERE (sess -> 'passport' ->> 'user') = :id`, {
      replacements: { id: String(user.id) },
    });
    await browser.get('/api/auth/me').expect(401);
  });

  test('when a session is older than the absolute limit, then it gives 401 even while in use (ASVS 7.3.2)', async () => {
    const user = await createUser();
    const browser = agent(t.app);
    await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
    await browser.get('/api/auth/me').expect(200);
    const days = (t.config.SESSION_ABSOLUTE_HOURS + 1) / 24;
    await getSequelize().query(
      `UPDATE session SET sess = jsonb_set(sess::jsonb, '{startedAt}', to_jsonb((extract(epoch from now() - make_interval(days => :days)) * 1000)::bigint))::json
        WHERE (sess -> 'passport' ->> 'user') = :id`,
      { replacements: { id: String(user.id), days: Math.ceil(days) } },
    );
    await browser.get('/api/auth/me').expect(401);
  });
});

describe('password reset and e-mail verification', () => {
  async function tokenFromOutbox(email: string, path: string): Promise<string> {
    const rows = await getSequelize().query<{ body_text: string }>('SELECT body_text FROM outbox_mail WHERE to_address = :email ORDER BY id DESC LIMIT 1', {
      replacements: { email },
      type: QueryTypes.SELECT,
    });
    const match = rows[0]?.body_text.match(new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`));
    if (!match) throw new Error('no token mailed');
    return match[1];
  }

  test('when a reset is asked for an unknown e-mail, then the answer is the same 202', async () => {
    const res = await agent(t.app).post('/api/auth/password-reset/request').set(json).send({ email: uniqueEmail('ghost') });
    expect(res.status).toBe(202);
  });

  test('when the mailed reset link is used, then the new password works, the old one and old sessions do not, and the link is single-use', async () => {
    const user = await createUser();
    const old = agent(t.app);
    await old.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
    await agent(t.app).post('/api/auth/password-reset/request').set(json).send({ email: user.email }).expect(202);
    const token = await tokenFromOutbox(user.email, '/reset-password');
    await agent(t.app).post('/api/auth/password-reset').set(json).send({ token, password: 'a-brand-new-garden-password' }).expect(200);
    await old.get('/api/auth/me').expect(401);
    await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(401);
    await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: 'a-brand-new-garden-password' }).expect(200);
    await agent(t.app).post('/api/auth/password-reset').set(json).send({ token, password: 'yet-another-garden-password' }).expect(400);
  });

  test('when the verification link is used, then the account is verified', async () => {
    const email = uniqueEmail('ver');
    const browser = agent(t.app);
    await browser.post('/api/auth/register').set(json).send({ email, password: 'mossy-jar-on-the-shelf', displayName: 'Vera' }).expect(201);
    const token = await tokenFromOutbox(email, '/verify-email');
    const res = await agent(t.app).post('/api/auth/verify-email').set(json).send({ token });
    expect(res.status).toBe(200);
    expect(res.body.emailVerified).toBe(true);
  });

  const linkMails = (email: string, kind: string) =>
    getSequelize().query<{ id: number }>('SELECT id FROM outbox_mail WHERE to_address = :email AND kind = :kind', { replacements: { email, kind }, type: QueryTypes.SELECT });
  /** Moves the address's mails back in time, as if sent that many seconds ago. */
  const sentAgo = (email: string, seconds: number) =>
    getSequelize().query('UPDATE outbox_mail SET created_at = created_at - make_interval(secs => :seconds) WHERE to_address = :email', { replacements: { email, seconds } });

  test('when a new member asks for the confirmation link again at once, then 429 says when to ask, and nothing is sent; after two minutes a new link goes out and works', async () => {
    const email = uniqueEmail('again');
    const browser = agent(t.app);
    await browser.post('/api/auth/register').set(json).send({ email, password: 'mossy-jar-on-the-shelf', displayName: 'Ansel' }).expect(201);
    const soon = await browser.post('/api/auth/verify-email/resend').set(json).send({});
    expect(soon.status).toBe(429);
    expect(soon.body.error.code).toBe('link_sent_recently');
    expect(soon.body.error.message).toContain(`A link went to ${email} less than 2 minutes ago.`);
    expect(soon.body.error.message).toMatch(/you can ask for another in (about \d minutes|\d+ seconds)\.$/);
    expect(Number(soon.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(soon.headers['retry-after'])).toBeLessThanOrEqual(120);
    expect(await linkMails(email, 'verify_email')).toHaveLength(1);

    await sentAgo(email, 121);
    await browser.post('/api/auth/verify-email/resend').set(json).send({}).expect(202);
    expect(await linkMails(email, 'verify_email')).toHaveLength(2);
    const token = await tokenFromOutbox(email, '/verify-email');
    expect((await agent(t.app).post('/api/auth/verify-email').set(json).send({ token }).expect(200)).body.emailVerified).toBe(true);
    // Confirmed: asking again sends nothing.
    await sentAgo(email, 121);
    await browser.post('/api/auth/verify-email/resend').set(json).send({}).expect(202);
    expect(await linkMails(email, 'verify_email')).toHaveLength(2);
  });

  test('when a reset is asked for again and again, then each answer is the same 202 and one link goes out per two minutes', async () => {
    const user = await createUser();
    for (let i = 0; i < 5; i += 1) await agent(t.app).post('/api/auth/password-reset/request').set(json).send({ email: user.email }).expect(202);
    expect(await linkMails(user.email, 'reset_password')).toHaveLength(1);
    await sentAgo(user.email, 121);
    await agent(t.app).post('/api/auth/password-reset/request').set(json).send({ email: user.email }).expect(202);
    expect(await linkMails(user.email, 'reset_password')).toHaveLength(2);
  });
});
