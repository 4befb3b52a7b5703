// ASVS 16.3.1 / 16.3.2 (4.0.3: 7.1–7.2): sign-in, sign-out and password resets, and refused
// access — over HTTP (401/403 and the 404 another person's case or batch gets) and on the
// socket — each leave one security log line that says who, what and from where, and no line
// holds a password or a token. Role changes, disabled accounts and hidden messages have their
// log lines asserted in steward-users, mentor-applications and moderation tests.
import { afterEach, beforeEach, describe, expect, test } from 'vitest';
import { getSequelize } from '../../server/src/db/sequelize';
import { TEST_ORIGIN } from '../setup/test-app';
import { join, useLiveServer } from '../setup/live-server';
import { createBatch, createCase } from '../factories/cases';
import { captureLog, insertMessage } from '../factories/steward-data';
import { outboxFor } from '../factories/threads';
import { createUser, FACTORY_PASSWORD, uniqueEmail } from '../factories/users';

const live = useLiveServer();
const { signIn, person, connect } = live;

let log: ReturnType<typeof captureLog>;
beforeEach(() => {
  log = captureLog();
});
afterEach(() => {
  log.restore();
});

function post(path: string, body: unknown, headers: Record<string, string> = {}) {
  return fetch(`${live.server.url}${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: live.server.url, ...headers },
    body: JSON.stringify(body),
  });
}
function get(path: string, cookie?: string) {
  return fetch(`${live.server.url}${path}`, { headers: cookie ? { cookie } : {} });
}

const security = (event: string) => log.lines().filter((l) => l.level === 'security' && l.event === event);
/** Log lines are written after the answer in some paths: give them a moment. */
const settle = () => new Promise((r) => setTimeout(r, 50));

describe('ASVS 16.3.1: authentication events are logged', () => {
  test('ASVS 16.3.1: when someone registers, signs in, fails with a wrong password or an unknown e-mail, and signs out, then each leaves its line and none holds a password', async () => {
    const email = uniqueEmail('logged');
    const password = 'a-logged-but-never-written-password';
    expect((await post('/api/auth/register', { email, password, displayName: 'Logged' })).status).toBe(201);
    const user = await createUser();
    const cookie = await signIn(user.email);
    expect((await post('/api/auth/login', { email: user.email, password: 'wrong-password-for-the-log' })).status).toBe(401);
    const nobody = uniqueEmail('nobody');
    expect((await post('/api/auth/login', { email: nobody, password: 'wrong-password-for-the-log' })).status).toBe(401);
    expect((await post('/api/auth/logout', {}, { cookie })).status).toBe(204);
    await settle();

    expect(security('auth.registered')).toEqual([expect.objectContaining({ userId: expect.any(Number), ip: expect.any(String) })]);
    expect(security('auth.sign_in')).toContainEqual(expect.objectContaining({ userId: user.id, ip: expect.any(String), t: expect.stringMatching(/^\d{4}-\d\d-\d\dT/) }));
    expect(security('auth.sign_in_failed')).toEqual([
      expect.objectContaining({ email: user.email, known: true, ip: expect.any(String) }),
      expect.objectContaining({ email: nobody, known: false }),
    ]);
    expect(security('auth.sign_out')).toEqual([expect.objectContaining({ userId: user.id })]);
    const all = JSON.stringify(log.lines());
    for (const secret of [password, FACTORY_PASSWORD, 'wrong-password-for-the-log']) expect(all).not.toContain(secret);
  });

  test('ASVS 16.3.1: when a disabled account signs in, or an account is throttled, then that is logged', async () => {
    const disabled = await createUser({ disabled: true });
    expect((await post('/api/auth/login', { email: disabled.email, password: disabled.password })).status).toBe(403);
    const target = await createUser();
    // Ten failures already on the account (sign-in-throttle.ts: the 11th within 15 minutes is refused).
    await getSequelize().query(`INSERT INTO sign_in_failures (email, ip) SELECT :email, '192.0.2.1' FROM generate_series(1, 10)`, { replacements: { email: target.email } });
    expect((await post('/api/auth/login', { email: target.email, password: target.password })).status).toBe(429);
    await settle();
    expect(security('auth.sign_in_disabled')).toEqual([expect.objectContaining({ userId: disabled.id })]);
    expect(security('auth.sign_in_throttled')).toEqual([expect.objectContaining({ email: target.email, ip: expect.any(String) })]);
  });

  test('ASVS 16.3.1: when a password reset is asked for and used, then both are logged and the token is not', async () => {
    const user = await createUser();
    expect((await post('/api/auth/password-reset/request', { email: user.email })).status).toBe(202);
    const [mail] = await outboxFor(user.email, 'reset_password');
    const token = /reset-password\?token=([A-Za-z0-9_-]+)/.exec(mail.body_text)![1];
    expect((await post('/api/auth/password-reset', { token, password: 'a-brand-new-logged-password' })).status).toBe(200);
    await settle();
    expect(security('auth.reset_requested')).toEqual([expect.objectContaining({ userId: user.id })]);
    expect(security('auth.password_reset')).toEqual([expect.objectContaining({ userId: user.id })]);
    const all = JSON.stringify(log.lines());
    expect(all).not.toContain(token);
    expect(all).not.toContain('a-brand-new-logged-password');
  });
});

describe('ASVS 16.3.2: refused access is logged', () => {
  test('ASVS 16.3.2: when a visitor, a grower on a steward route, and a cross-site post are refused, then each is logged with status, path and who', async () => {
    const grower = await person('grower');
    expect((await get('/api/cases')).status).toBe(401);
    expect((await get('/api/steward/users', grower.cookie)).status).toBe(403);
    expect((await post('/api/cases', { stage: 'IMO2', symptoms: [] }, { cookie: grower.cookie, Origin: 'https://elsewhere.example.test' })).status).toBe(403);
    await settle();
    const refused = security('access.refused');
    expect(refused).toContainEqual(expect.objectContaining({ status: 401, method: 'GET', path: '/api/cases' }));
    expect(refused).toContainEqual(expect.objectContaining({ status: 403, code: 'forbidden', path: '/api/steward/users', userId: grower.user.id }));
    expect(refused).toContainEqual(expect.objectContaining({ status: 403, code: 'cross_site', method: 'POST', path: '/api/cases' }));
  });

  test("ASVS 16.3.2: when grower B asks for grower A's case, its thread, a photo or A's batch, then B gets 404 and each refusal is logged; a case that does not exist is not", async () => {
    const a = await createUser();
    const b = await person('grower');
    const caseId = await createCase(a.id);
    const batch = await createBatch(a.id);
    for (const path of [`/api/cases/${caseId}`, `/api/cases/${caseId}/messages`, `/api/cases/${caseId}/photos/1`, `/api/batches/${batch.id}`]) {
      expect((await get(path, b.cookie)).status, path).toBe(404);
    }
    expect((await get('/api/cases/999999999', b.cookie)).status).toBe(404);
    expect((await get(`/api/batches/999999999`, b.cookie)).status).toBe(404);
    await settle();
    expect(security('case.access_refused')).toEqual(Array.from({ length: 3 }, () => expect.objectContaining({ userId: b.user.id, caseId })));
    expect(security('batch.access_refused')).toEqual([expect.objectContaining({ userId: b.user.id, batchId: batch.id })]);
  });

  test("ASVS 16.3.2: when grower B reports a message in A's case, or grower A reports an aside in their own, then 404 and each refusal is logged; a message that does not exist is not", async () => {
    const a = await person('grower');
    const b = await person('grower');
    const caseId = await createCase(a.user.id);
    const text = await insertMessage(caseId, a.user.id, 'The jar smells of nail varnish.');
    const aside = await insertMessage(caseId, null, 'Mentors only: check the sugar ratio first.', 'aside');
    const report = (id: number, who: { cookie: string }) => post(`/api/messages/${id}/reports`, { reason: 'Probing.' }, { cookie: who.cookie });
    expect((await report(text, b)).status).toBe(404);
    expect((await report(aside, a)).status).toBe(404);
    expect((await report(999999999, b)).status).toBe(404);
    await settle();
    expect(security('message.access_refused')).toEqual([
      expect.objectContaining({ userId: b.user.id, messageId: text, caseId }),
      expect.objectContaining({ userId: a.user.id, messageId: aside, caseId }),
    ]);
  });

  test("ASVS 16.3.2: when a socket handshake comes from a foreign Origin or without a session, or grower B's socket asks to join A's case, then each is logged", async () => {
    const b = await person('grower');
    const caseId = await createCase((await createUser()).id);
    await expect(connect(b.cookie, 'https://elsewhere.example.test')).rejects.toBeTruthy();
    await expect(connect(null, TEST_ORIGIN)).rejects.toBeTruthy();
    const socket = await connect(b.cookie, TEST_ORIGIN);
    expect(await join(socket, caseId)).toMatchObject({ ok: false, error: { code: 'not_found' } });
    await settle();
    expect(security('socket.refused')).toEqual([
      expect.objectContaining({ reason: 'origin', origin: 'https://elsewhere.example.test', ip: expect.any(String) }),
      expect.objectContaining({ reason: 'signed_out' }),
    ]);
    expect(security('socket.join_refused')).toEqual([expect.objectContaining({ userId: b.user.id, caseId })]);
  });
});
