import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { sessionEvents } from '../../server/src/lib/session-events';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { captureLog, JSON_HEADERS, personSignedIn, signedInAgent } from '../factories/steward-data';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const STEWARD_ROUTES: Array<[method: 'get' | 'patch' | 'post', path: string, body?: object]> = [
  ['get', '/api/steward/users'],
  ['patch', '/api/steward/users/1', { role: 'mentor' }],
  ['get', '/api/steward/audit'],
  ['get', '/api/steward/mentor-applications?status=pending'],
  ['patch', '/api/steward/mentor-applications/1', { decision: 'approved', note: '' }],
  ['get', '/api/steward/reports'],
  ['post', '/api/steward/messages/1/hide', {}],
  ['post', '/api/steward/reports/1/dismiss', {}],
  ['get', '/api/steward/metrics'],
  ['get', '/api/steward/mail'],
];

async function sessionRows(userId: number): Promise<number> {
  const [{ n }] = await getSequelize().query<{ n: string }>(`SELECT count(*) AS n FROM session WHERE (sess -> 'passport' ->> 'user') = :id`, {
    replacements: { id: String(userId) },
    type: QueryTypes.SELECT,
  });
  return Number(n);
}

async function roleOf(userId: number): Promise<{ role: string; disabled: boolean }> {
  const [row] = await getSequelize().query<{ role: string; disabled: boolean }>(`SELECT role, disabled FROM users WHERE id = :userId`, {
    replacements: { userId },
    type: QueryTypes.SELECT,
  });
  return row;
}

/** Leaves `keep` as the only active steward for the length of `work`, then puts the others back. */
async function asOnlySteward(keep: number, work: () => Promise<void>): Promise<void> {
  const sequelize = getSequelize();
  const others = await sequelize.query<{ id: number }>(
    `UPDATE users SET disabled = true WHERE role = 'steward' AND NOT disabled AND id <> :keep RETURNING id`,
    { replacements: { keep }, type: QueryTypes.SELECT },
  );
  try {
    await work();
  } finally {
    if (others.length) await sequelize.query(`UPDATE users SET disabled = false WHERE id IN (:ids)`, { replacements: { ids: others.map((o) => o.id) } });
  }
}

describe('the role guard on every steward route', () => {
  test('when signed out, then every steward route answers 401', async () => {
    for (const [method, path, body] of STEWARD_ROUTES) {
      const req = agent(t.app)[method](path).set(JSON_HEADERS);
      const res = await (body ? req.send(body) : req);
      expect(res.status, `${method.toUpperCase()} ${path}`).toBe(401);
    }
  });

  test('when a grower or a mentor calls any steward route, then 403 and nothing changes', async () => {
    for (const role of ['grower', 'mentor'] as const) {
      const { browser } = await personSignedIn(t.app, role);
      for (const [method, path, body] of STEWARD_ROUTES) {
        const req = browser[method](path).set(JSON_HEADERS);
        const res = await (body ? req.send(body) : req);
        expect(res.status, `${role} ${method.toUpperCase()} ${path}`).toBe(403);
      }
    }
  });
});

describe('GET /api/steward/users', () => {
  test('when a steward searches by name with a role filter and small pages, then only matching people come back, paged', async () => {
    const tag = `Quillon${Date.now()}`;
    for (let i = 0; i < 3; i++) await createUser({ role: 'mentor', displayName: `${tag} mentor ${i}` });
    await createUser({ role: 'grower', displayName: `${tag} grower` });
    const { browser } = await personSignedIn(t.app, 'steward');
    const first = await browser.get(`/api/steward/users?q=${tag}&role=mentor&pageSize=2&page=1`).expect(200);
    expect(first.body).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(first.body.items).toHaveLength(2);
    const second = await browser.get(`/api/steward/users?q=${tag}&role=mentor&pageSize=2&page=2`).expect(200);
    expect(second.body.items).toHaveLength(1);
    const all = [...first.body.items, ...second.body.items];
    expect(all.every((u: { role: string; displayName: string }) => u.role === 'mentor' && u.displayName.startsWith(tag))).toBe(true);
    expect(all[0]).toEqual(expect.objectContaining({ disabled: false, createdAt: expect.any(String), email: expect.stringContaining('@example.test') }));
  });
});

describe('PATCH /api/steward/users/:id', () => {
  test('when a steward makes a grower a mentor, then the answer, the audit log and the security log say so', async () => {
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    const grower = await createUser();
    const log = captureLog();
    try {
      const res = await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ role: 'mentor' }).expect(200);
      expect(res.body).toMatchObject({ id: grower.id, role: 'mentor', disabled: false });
      expect(log.lines()).toContainEqual(expect.objectContaining({ level: 'security', event: 'steward.role_changed', actorId: steward.id, userId: grower.id, from: 'grower', to: 'mentor' }));
    } finally {
      log.restore();
    }
    const audit = await browser.get(`/api/steward/audit?targetType=user&targetId=${grower.id}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({
      action: 'user.role_changed',
      actor: { id: steward.id, displayName: steward.displayName },
      targetType: 'user',
      targetId: String(grower.id),
      targetLabel: grower.displayName,
      detail: { from: 'grower', to: 'mentor' },
    });
    expect(Date.now() - Date.parse(audit.body.items[0].createdAt)).toBeLessThan(60_000);
  });

  test('when the role does not exist, then 400 names the field and the role is unchanged', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    const grower = await createUser();
    const res = await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ role: 'wizard' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.role).toBeTruthy();
    expect((await roleOf(grower.id)).role).toBe('grower');
  });

  test('when the body has neither role nor disabled, or an extra field, then 400', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    const grower = await createUser();
    expect((await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({})).status).toBe(400);
    expect((await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ email: 'x@example.test' })).status).toBe(400);
  });

  test('when the person does not exist, then 404', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    expect((await browser.patch('/api/steward/users/2000000000').set(JSON_HEADERS).send({ role: 'mentor' })).status).toBe(404);
  });

  test('when the last active steward tries to step down or disable their own account, then 409 and nothing changes', async () => {
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    await asOnlySteward(steward.id, async () => {
      const demote = await browser.patch(`/api/steward/users/${steward.id}`).set(JSON_HEADERS).send({ role: 'mentor' });
      expect(demote.status).toBe(409);
      expect(demote.body.error.code).toBe('last_steward');
      const disable = await browser.patch(`/api/steward/users/${steward.id}`).set(JSON_HEADERS).send({ disabled: true });
      expect(disable.status).toBe(409);
      expect(disable.body.error.code).toBe('last_steward');
      expect(await roleOf(steward.id)).toEqual({ role: 'steward', disabled: false });
      // Still signed in and still a steward.
      await browser.get('/api/steward/users').expect(200);
    });
  });

  test('when there is another active steward, then one steward may make the other a grower', async () => {
    const { browser } = await personSignedIn(t.app, 'steward');
    const other = await createUser({ role: 'steward' });
    const res = await browser.patch(`/api/steward/users/${other.id}`).set(JSON_HEADERS).send({ role: 'grower' });
    expect(res.status).toBe(200);
    expect((await roleOf(other.id)).role).toBe('grower');
  });

  test('when a grower is made a steward, then their already-open session is a steward on its very next request', async () => {
    const grower = await createUser();
    const growerBrowser = await signedInAgent(t.app, grower);
    await growerBrowser.get('/api/steward/users').expect(403);
    const { browser: stewardBrowser } = await personSignedIn(t.app, 'steward');
    await stewardBrowser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ role: 'steward' }).expect(200);
    // The same cookie, no new sign-in.
    await growerBrowser.get('/api/steward/users').expect(200);
    expect((await growerBrowser.get('/api/auth/me').expect(200)).body.role).toBe('steward');
  });

  test('when a steward disables an account, then all its sessions end at once, the old cookies are refused, and the realtime layer is told', async () => {
    const grower = await createUser();
    const phone = await signedInAgent(t.app, grower);
    const laptop = await signedInAgent(t.app, grower);
    expect(await sessionRows(grower.id)).toBe(2);
    const ended: number[] = [];
    const onEnded = (userId: number) => ended.push(userId);
    sessionEvents.on('user:sessions-ended', onEnded);
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    const log = captureLog();
    try {
      const res = await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ disabled: true }).expect(200);
      expect(res.body.disabled).toBe(true);
      expect(log.lines()).toContainEqual(expect.objectContaining({ level: 'security', event: 'steward.user_disabled', actorId: steward.id, userId: grower.id, sessionsEnded: 2 }));
    } finally {
      log.restore();
      sessionEvents.off('user:sessions-ended', onEnded);
    }
    expect(ended).toEqual([grower.id]);
    expect(await sessionRows(grower.id)).toBe(0);
    await phone.get('/api/auth/me').expect(401);
    await laptop.get('/api/auth/me').expect(401);
    // Signing in again is refused while disabled.
    const again = await agent(t.app).post('/api/auth/login').set(JSON_HEADERS).send({ email: grower.email, password: grower.password });
    expect(again.status).toBe(403);

    // Enabling the account again does not bring the ended sessions back; a fresh sign-in works.
    await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ disabled: false }).expect(200);
    await phone.get('/api/auth/me').expect(401);
    await signedInAgent(t.app, grower);
    const audit = await browser.get(`/api/steward/audit?targetType=user&targetId=${grower.id}`).expect(200);
    expect(audit.body.items.map((a: { action: string }) => a.action)).toEqual(['user.enabled', 'user.disabled']);
  });
});

describe('GET /api/steward/audit', () => {
  test('when a steward reads the log in pages, then it is newest first with who, what and when', async () => {
    const { user: steward, browser } = await personSignedIn(t.app, 'steward');
    const a = await createUser();
    const b = await createUser();
    await browser.patch(`/api/steward/users/${a.id}`).set(JSON_HEADERS).send({ role: 'mentor' }).expect(200);
    await browser.patch(`/api/steward/users/${b.id}`).set(JSON_HEADERS).send({ disabled: true }).expect(200);
    const page1 = await browser.get(`/api/steward/audit?actorId=${steward.id}&pageSize=1`).expect(200);
    expect(page1.body).toMatchObject({ total: 2, page: 1, pageSize: 1 });
    expect(page1.body.items[0]).toMatchObject({ action: 'user.disabled', targetLabel: b.displayName, actor: { id: steward.id } });
    const page2 = await browser.get(`/api/steward/audit?actorId=${steward.id}&pageSize=1&page=2`).expect(200);
    expect(page2.body.items[0]).toMatchObject({ action: 'user.role_changed', targetLabel: a.displayName });
  });
});
