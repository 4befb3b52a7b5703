// ASVS 3.3.1–3.3.4 (4.0.3: 3.4.x): the session cookie behind TLS, which auth.test.ts (plain
// http) cannot show. With an https PUBLIC_URL behind a trusted proxy the cookie is Secure,
// HttpOnly, SameSite=Lax, host-only on path / with the __Host- prefix (RFC 6265bis), and lives
// for the idle timeout; it is never sent over a connection that is not https; signing out clears
// it with the same attributes. HSTS is sent only when the public address is https.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { agent, makeTestApp, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';

const PUBLIC = 'https://sporewell.example.test';
let tls: TestApp;
let user: Awaited<ReturnType<typeof createUser>>;
beforeAll(async () => {
  tls = makeTestApp({ PUBLIC_URL: PUBLIC, TRUST_PROXY: '1' });
  user = await createUser();
});
afterAll(async () => {
  await tls?.close();
});

/** The raw Set-Cookie line for the session cookie, split into its attributes (lower-case names). */
function sessionCookie(res: { headers: Record<string, unknown> }): Map<string, string> | null {
  const raw = ([] as string[]).concat((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('__Host-sporewell.sid='));
  if (!raw) return null;
  const parts = raw.split(';').map((p) => p.trim());
  return new Map(parts.slice(1).map((p) => [p.split('=')[0].toLowerCase(), p.split('=').slice(1).join('=')]));
}

const viaTls = { 'Content-Type': 'application/json', Origin: PUBLIC, 'X-Forwarded-Proto': 'https' };

describe('ASVS 3.3.x: the session cookie behind TLS', () => {
  test('ASVS 3.3.1 / 3.3.2 / 3.3.4: when signing in over https behind the proxy, then the cookie is __Host-sporewell.sid, Secure, HttpOnly, SameSite=Lax, host-only, path / and lives for the idle timeout', async () => {
    const res = await agent(tls.app).post('/api/auth/login').set(viaTls).send({ email: user.email, password: user.password });
    expect(res.status).toBe(200);
    const cookie = sessionCookie(res);
    expect(cookie).not.toBeNull();
    expect(cookie!.has('secure')).toBe(true);
    expect(cookie!.has('httponly')).toBe(true);
    expect(cookie!.get('samesite')).toBe('Lax');
    expect(cookie!.get('path')).toBe('/');
    // No Domain attribute: the cookie goes back to this host only, never to sibling subdomains.
    expect(cookie!.has('domain')).toBe(false);
    const lifetime = Date.parse(cookie!.get('expires')!) - Date.now();
    const idle = tls.config.SESSION_IDLE_MINUTES * 60_000;
    expect(Math.abs(lifetime - idle)).toBeLessThan(60_000);
  });

  test('ASVS 3.3.1: when the same sign-in arrives over plain http (no https from the proxy), then no session cookie is sent at all', async () => {
    const res = await agent(tls.app).post('/api/auth/login').set({ 'Content-Type': 'application/json', Origin: PUBLIC }).send({ email: user.email, password: user.password });
    expect(res.status).toBe(200);
    expect(sessionCookie(res)).toBeNull();
  });

  test('ASVS 3.3.1: when an untrusted client claims https itself (no trusted proxy), then no session cookie is sent', async () => {
    const direct = makeTestApp({ PUBLIC_URL: PUBLIC });
    try {
      const res = await agent(direct.app).post('/api/auth/login').set(viaTls).send({ email: user.email, password: user.password });
      expect(res.status).toBe(200);
      expect(sessionCookie(res)).toBeNull();
    } finally {
      await direct.close();
    }
  });

  test('ASVS 3.3.1: when signing out over https, then the cookie is cleared with the same Secure, HttpOnly and SameSite attributes', async () => {
    const browser = agent(tls.app);
    await browser.post('/api/auth/login').set(viaTls).send({ email: user.email, password: user.password }).expect(200);
    const res = await browser.post('/api/auth/logout').set(viaTls);
    expect(res.status).toBe(204);
    const cleared = sessionCookie(res);
    expect(cleared).not.toBeNull();
    expect(Date.parse(cleared!.get('expires')!)).toBeLessThanOrEqual(Date.now());
    expect(cleared!.has('secure')).toBe(true);
    expect(cleared!.has('httponly')).toBe(true);
    expect(cleared!.get('samesite')).toBe('Lax');
  });

  test('ASVS 3.3.1: when the __Host- cookie comes back over https, then it is the session: /me knows who signed in', async () => {
    const login = await agent(tls.app).post('/api/auth/login').set(viaTls).send({ email: user.email, password: user.password }).expect(200);
    // supertest's jar keeps a Secure cookie off a plain-http test connection: send it as a browser on https would.
    const raw = ([] as string[]).concat(login.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('__Host-sporewell.sid='))!;
    const me = await agent(tls.app).get('/api/auth/me').set({ ...viaTls, Cookie: raw.split(';')[0] });
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ email: user.email });
  });
});

describe('ASVS 3.4.1 (4.0.3: 14.4.5): Strict-Transport-Security', () => {
  test('when the public address is https, then every answer says max-age=15552000 (180 days) for this host only', async () => {
    const res = await agent(tls.app).get('/api/vocabulary').set({ 'X-Forwarded-Proto': 'https' });
    expect(res.headers['strict-transport-security']).toBe('max-age=15552000');
  });

  test('when the public address is plain http (local use), then no HSTS header is sent', async () => {
    const plain = makeTestApp();
    try {
      const res = await agent(plain.app).get('/api/vocabulary');
      expect(res.headers['strict-transport-security']).toBeUndefined();
    } finally {
      await plain.close();
    }
  });
});
