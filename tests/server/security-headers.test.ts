// ASVS 3.4.x (4.0.3: 14.4): errors-and-roles.test.ts asserts the headers on /api/health; this
// file asserts them where they matter too: on the HTML document the browser runs, on error
// answers, on a served photo, and that other sites get no CORS permission to read answers.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { createCase } from '../factories/cases';
import { signedIn } from '../factories/sign-in';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t?.close();
});

/** The directives of a Content-Security-Policy header, by name. */
function directives(csp: string | undefined): Map<string, string[]> {
  return new Map(
    (csp ?? '')
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((d) => d[0])
      .map(([name, ...values]) => [name, values]),
  );
}

function expectFullHeaders(res: { headers: Record<string, string> }, where: string) {
  const csp = directives(res.headers['content-security-policy']);
  expect(csp.get('default-src'), where).toEqual(["'self'"]);
  // Scripts from our origin only: no inline script, no eval, so an injected <script> cannot run.
  expect(csp.get('script-src'), where).toEqual(["'self'"]);
  expect(csp.get('object-src'), where).toEqual(["'none'"]);
  expect(csp.get('base-uri'), where).toEqual(["'none'"]);
  expect(csp.get('frame-ancestors'), where).toEqual(["'none'"]);
  expect(csp.get('form-action'), where).toEqual(["'self'"]);
  expect(res.headers['x-content-type-options'], where).toBe('nosniff');
  expect(res.headers['referrer-policy'], where).toBe('same-origin');
  expect(res.headers['x-powered-by'], where).toBeUndefined();
}

describe('ASVS 3.4.x: security headers on every kind of answer', () => {
  test('ASVS 3.4.3 / 3.4.4 / 3.4.5 / 3.4.6: when the HTML document is asked for (a deep link) or a missing file, then CSP, nosniff, Referrer-Policy and frame-ancestors are set', async () => {
    // Without a client build the document route answers 503 text/plain; the headers are the same.
    const page = await agent(t.app).get('/cases/42');
    expect([200, 503]).toContain(page.status);
    expectFullHeaders(page, 'document');
    expectFullHeaders(await agent(t.app).get('/no-such-file.js'), 'missing static file');
  });

  test('ASVS 3.4.x: when the API answers with an error (401, 400, 404, 413, 415), then the same headers are set and the answer is not cached', async () => {
    const json = { 'Content-Type': 'application/json', Origin: TEST_ORIGIN };
    const answers = {
      401: await agent(t.app).get('/api/auth/me'),
      400: await agent(t.app).post('/api/auth/login').set(json).send('{"email": '),
      404: await agent(t.app).get('/api/no-such-route'),
      413: await agent(t.app).post('/api/auth/login').set(json).send(JSON.stringify({ email: 'a@example.test', password: 'x'.repeat(200_000) })),
      415: await agent(t.app).post('/api/auth/login').set({ 'Content-Type': 'text/plain', Origin: TEST_ORIGIN }).send('hello'),
    };
    for (const [status, res] of Object.entries(answers)) {
      expect(res.status).toBe(Number(status));
      expectFullHeaders(res, `error ${status}`);
      expect(res.headers['content-type'], `error ${status}`).toMatch(/^application\/json/);
      expect(res.headers['cache-control'], `error ${status}`).toBe('no-store');
    }
  });

  test('ASVS 3.4.x: when a signed-in API answer carries private data, then it is marked no-store', async () => {
    const { browser } = await signedIn(t.app);
    const me = await browser.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.headers['cache-control']).toBe('no-store');
    expectFullHeaders(me, 'me');
  });

  test('ASVS 3.4.x: when a private photo is served, then it has nosniff, an image type, same-origin resource policy and private caching', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#8a6' } }).jpeg().toBuffer();
    const up = await browser.post(`/api/cases/${caseId}/photos`).set('Origin', TEST_ORIGIN).attach('photos', jpeg, 'jar.jpg').expect(201);
    const res = await browser.get(up.body.photos[0].url);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/jpeg');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['cross-origin-resource-policy']).toBe('same-origin');
    expect(res.headers['cache-control']).toMatch(/^private/);
    expect(directives(res.headers['content-security-policy']).get('default-src')).toEqual(["'self'"]);
  });

  test('ASVS 3.4.2: when another site asks (a simple GET with the cookie, or a preflight), then no CORS header lets it read the answer', async () => {
    const { browser } = await signedIn(t.app);
    const foreign = 'https://elsewhere.example.test';
    const read = await browser.get('/api/auth/me').set('Origin', foreign);
    expect(read.headers['access-control-allow-origin']).toBeUndefined();
    expect(read.headers['access-control-allow-credentials']).toBeUndefined();
    const preflight = await agent(t.app)
      .options('/api/cases')
      .set({ Origin: foreign, 'Access-Control-Request-Method': 'POST', 'Access-Control-Request-Headers': 'content-type' });
    expect(preflight.headers['access-control-allow-origin']).toBeUndefined();
    expect(preflight.headers['access-control-allow-methods']).toBeUndefined();
    expect(preflight.headers['access-control-allow-credentials']).toBeUndefined();
  });
});
