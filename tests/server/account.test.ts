// The signed-in person's own account: their name (PATCH /api/auth/me) and their password
// (POST /api/auth/password), which checks the current one under the sign-in throttle, ends
// their other sessions, keeps this one, and mails them that it changed.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { MAX_FAILURES } from '../../server/src/modules/auth/sign-in-throttle';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { captureLog } from '../factories/steward-data';
import { createUser, FACTORY_PASSWORD } from '../factories/users';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const json = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };

async function signedInTwice() {
  const user = await createUser({ displayName: 'Oriel Thornbury' });
  const here = agent(t.app);
  const elsewhere = agent(t.app);
  for (const browser of [here, elsewhere]) await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
  return { user, here, elsewhere };
}

describe('PATCH /api/auth/me', () => {
  test('when a member changes their name, then it is stored trimmed and answered; an empty or too long name is 400 and changes nothing; a visitor gets 401', async () => {
    const { here } = await signedInTwice();
    const res = await here.patch('/api/auth/me').set(json).send({ displayName: '  Oriel T.  ', role: 'steward', email: 'other@example.test' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ displayName: 'Oriel T.', role: 'grower' });
    expect(res.body.email).not.toBe('other@example.test');
    expect((await here.get('/api/auth/me').expect(200)).body.displayName).toBe('Oriel T.');
    const empty = await here.patch('/api/auth/me').set(json).send({ displayName: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.displayName).toBe('Tell us what to call you.');
    expect((await here.patch('/api/auth/me').set(json).send({ displayName: 'x'.repeat(61) })).status).toBe(400);
    expect((await here.get('/api/auth/me').expect(200)).body.displayName).toBe('Oriel T.');
    expect((await agent(t.app).patch('/api/auth/me').set(json).send({ displayName: 'Nobody' })).status).toBe(401);
  });
});

describe('POST /api/auth/password', () => {
  test('when the current password is right, then the new one works, the old one does not, other sessions end, this one goes on, and a mail says so', async () => {
    const { user, here, elsewhere } = await signedInTwice();
    const log = captureLog();
    try {
      await here.post('/api/auth/password').set(json).send({ currentPassword: FACTORY_PASSWORD, password: 'a-fresh-orchard-password' }).expect(200);
      expect(log.lines()).toContainEqual(expect.objectContaining({ level: 'security', event: 'auth.password_changed', userId: user.id }));
      expect(JSON.stringify(log.lines())).not.toContain('a-fresh-orchard-password');
    } finally {
      log.restore();
    }
    await here.get('/api/auth/me').expect(200);
    await elsewhere.get('/api/auth/me').expect(401);
    await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(401);
    await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: 'a-fresh-orchard-password' }).expect(200);
    const mails = await getSequelize().query<{ subject: string; body_text: string }>(`SELECT subject, body_text FROM outbox_mail WHERE to_address = :to AND kind = 'password_changed'`, {
      replacements: { to: user.email },
      type: QueryTypes.SELECT,
    });
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Your Sporewell password was changed');
    expect(mails[0].body_text).toContain(`${t.config.publicUrl}/forgot-password`);
    expect(mails[0].body_text).not.toContain('a-fresh-orchard-password');
  });

  test('when the current password is wrong, the new one is common, too short or the same, then 400 names the field and the password stays', async () => {
    const { user, here, elsewhere } = await signedInTwice();
    const wrong = await here.post('/api/auth/password').set(json).send({ currentPassword: 'not-my-password', password: 'a-fresh-orchard-password' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toBe('That is not your current password.');
    const common = await here.post('/api/auth/password').set(json).send({ currentPassword: FACTORY_PASSWORD, password: 'password1' });
    expect(common.status).toBe(400);
    expect(common.body.error.fields.password).toBeTruthy();
    const short = await here.post('/api/auth/password').set(json).send({ currentPassword: FACTORY_PASSWORD, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBe('Use at least 8 characters.');
    const same = await here.post('/api/auth/password').set(json).send({ currentPassword: FACTORY_PASSWORD, password: FACTORY_PASSWORD });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.password).toBe('That is the password you have now. Choose a new one.');
    await elsewhere.get('/api/auth/me').expect(200);
    await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
    expect((await agent(t.app).post('/api/auth/password').set(json).send({ currentPassword: 'x', password: 'y-long-enough' })).status).toBe(401);
  });

  test(`ASVS 6.3.1: when the current password is guessed wrong ${MAX_FAILURES} times, then the next try is 429 with Retry-After, even with the right one, and signing in is throttled too`, async () => {
    const { user, here } = await signedInTwice();
    for (let i = 0; i < MAX_FAILURES; i += 1) {
      expect((await here.post('/api/auth/password').set(json).send({ currentPassword: `guess-number-${i}`, password: 'a-fresh-orchard-password' })).status).toBe(400);
    }
    const refused = await here.post('/api/auth/password').set(json).send({ currentPassword: FACTORY_PASSWORD, password: 'a-fresh-orchard-password' });
    expect(refused.status).toBe(429);
    expect(refused.body.error.code).toBe('too_many_attempts');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect((await agent(t.app).post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD })).status).toBe(429);
  });
});
