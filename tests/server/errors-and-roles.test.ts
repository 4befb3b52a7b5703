import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { createUser, FACTORY_PASSWORD } from '../factories/users';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.close();
});
const json = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };

async function signedIn(role: 'grower' | 'mentor' | 'steward') {
  const user = await createUser({ role });
  const browser = agent(t.app);
  await browser.post('/api/auth/login').set(json).send({ email: user.email, password: FACTORY_PASSWORD }).expect(200);
  return browser;
}

describe('the role guard on GET /api/steward/users', () => {
  test('when signed out, then 401', async () => {
    await agent(t.app).get('/api/steward/users').expect(401);
  });
  test('when a grower or a mentor asks, then 403', async () => {
    expect((await (await signedIn('grower')).get('/api/steward/users')).status).toBe(403);
    expect((await (await signedIn('mentor')).get('/api/steward/users')).status).toBe(403);
  });
  test('when a steward asks, then a page of users without password hashes', async () => {
    const res = await (await signedIn('steward')).get('/api/steward/users?role=steward');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, total: expect.any(Number) });
    expect(res.body.items.length).toBeGreaterThan(0);
    expect(res.body.items.every((u: { role: string }) => u.role === 'steward')).toBe(true);
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|passwordHash|password_hash/);
  });
  test('when a steward filters by an unknown role, then 400 with fields', async () => {
    const res = await (await signedIn('steward')).get('/api/steward/users?role=wizard');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.role).toBeTruthy();
  });
});

describe('error shapes', () => {
  test('when an unknown /api route is asked, then 404 JSON', async () => {
    const res = await agent(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(res.body.error.code).toBe('not_found');
  });
  test('when the JSON body is malformed, then 400, never 500', async () => {
    const res = await agent(t.app).post('/api/auth/login').set(json).send('{"email": "a@b.c", ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
  });
  test('when the JSON body is over the limit, then 413', async () => {
    const res = await agent(t.app).post('/api/auth/register').set(json).send(JSON.stringify({ email: 'a@example.test', password: 'x'.repeat(200_000), displayName: 'Big' }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });
  test('when a form or text/plain body is posted, then 415 and nothing happens (ASVS 3.5)', async () => {
    const form = await agent(t.app).post('/api/auth/register').set('Content-Type', 'application/x-www-form-urlencoded').send('email=a%40example.test&password=longenough1&displayName=F');
    expect(form.status).toBe(415);
    const text = await agent(t.app).post('/api/auth/register').set('Content-Type', 'text/plain').send('{"email":"b@example.test","password":"longenough1","displayName":"T"}');
    expect(text.status).toBe(415);
  });
  test('when a state change comes from another origin, then 403 (ASVS 3.5)', async () => {
    const res = await agent(t.app).post('/api/auth/login').set({ 'Content-Type': 'application/json', Origin: 'https://elsewhere.example' }).send({ email: 'a@example.test', password: 'whatever-pass' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_site');
  });
  test('when the health route is asked, then ok and db are true', async () => {
    const res = await agent(t.app).get('/api/health');
    expect(res.body).toEqual({ ok: true, db: true });
  });
  test('when a page is served, then the security headers are set (ASVS 3.4)', async () => {
    const res = await agent(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("base-uri 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('same-origin');
  });
  test('when the vocabulary is asked, then it lists stages, symptoms, causes and remedies with ids', async () => {
    const res = await agent(t.app).get('/api/vocabulary');
    expect(res.status).toBe(200);
    expect(res.body.stages.map((s: { id: string }) => s.id)).toContain('IMO2');
    expect(res.body.symptoms.find((s: { id: string }) => s.id === 'bubbling')).toMatchObject({ group: 'activity' });
    expect(res.body.causes.length).toBeGreaterThan(3);
    expect(res.body.remedies.length).toBeGreaterThan(3);
  });
});
