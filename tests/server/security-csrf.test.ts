// ASVS 3.5.x (4.0.3: 4.2.2): what errors-and-roles.test.ts does not already prove. A signed-in
// person's browser tricked by another site into posting a form (urlencoded, multipart or
// text/plain) changes nothing, even when the cookie goes along (another port or a sibling
// subdomain is "same-site", so SameSite=Lax alone would let it through); a cross-site request without an
// Origin is refused on Sec-Fetch-Site; and no GET route changes anything, whoever asks.
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { agent, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { listRoutes } from '../setup/list-routes';
import { createBatch, createCase } from '../factories/cases';
import { photoRows } from '../factories/photos';
import { signedIn } from '../factories/sign-in';
import { insertMessage } from '../factories/steward-data';
import { messageRows, newClientId } from '../factories/threads';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t?.close();
});

/** Another port on our host (same-site, since a site ignores the port, so a Lax cookie goes along) and an unrelated site. */
const ATTACKERS = ['http://127.0.0.1:4000', 'https://elsewhere.example.test'];

describe('ASVS 3.5.1 / 3.5.2: cross-site forms change nothing', () => {
  test('ASVS 3.5.1 / 3.5.2: when another origin posts a urlencoded, text/plain or multipart form to the thread with the session cookie, then 403 and no message is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const before = await messageRows(caseId);
    for (const origin of ATTACKERS) {
      const urlencoded = await browser.post(`/api/cases/${caseId}/messages`).set({ Origin: origin, 'Content-Type': 'application/x-www-form-urlencoded' }).send(`clientId=${newClientId()}&body=Forged`);
      const text = await browser.post(`/api/cases/${caseId}/messages`).set({ Origin: origin, 'Content-Type': 'text/plain' }).send(JSON.stringify({ clientId: newClientId(), body: 'Forged' }));
      const multipart = await browser.post(`/api/cases/${caseId}/messages`).set({ Origin: origin }).field('clientId', newClientId()).field('body', 'Forged');
      // The same JSON a script would send (a CORS "simple" request cannot, but the guard does not rely on that).
      const json = await browser.post(`/api/cases/${caseId}/messages`).set({ Origin: origin, 'Content-Type': 'application/json' }).send({ clientId: newClientId(), body: 'Forged' });
      for (const res of [urlencoded, text, multipart, json]) {
        expect(res.status, origin).toBe(403);
        expect(res.body.error.code).toBe('cross_site');
      }
    }
    expect(await messageRows(caseId)).toEqual(before);
  });

  test('ASVS 3.5.1 / 3.5.2: when another origin posts a multipart photo upload with the session cookie, then 403 and nothing is stored', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#8a6' } }).jpeg().toBuffer();
    for (const origin of ATTACKERS) {
      const res = await browser.post(`/api/cases/${caseId}/photos`).set({ Origin: origin }).attach('photos', jpeg, 'jar.jpg');
      expect(res.status).toBe(403);
    }
    expect(await photoRows(caseId)).toBe(0);
  });

  test('ASVS 3.5.1 / 3.5.3: when a cross-site request carries no Origin but the browser says Sec-Fetch-Site: cross-site, then 403 and nothing changes', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    const before = await messageRows(caseId);
    const res = await browser.post(`/api/cases/${caseId}/messages`).set({ 'Sec-Fetch-Site': 'cross-site', 'Content-Type': 'application/json' }).send({ clientId: newClientId(), body: 'Forged' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('cross_site');
    const logout = await browser.post('/api/auth/logout').set({ 'Sec-Fetch-Site': 'cross-site' });
    expect(logout.status).toBe(403);
    expect(await messageRows(caseId)).toEqual(before);
    // The session survived the forged sign-out.
    expect((await browser.get('/api/auth/me')).status).toBe(200);
  });

  test('ASVS 3.5.1: when our own page posts JSON (Origin ours, or Sec-Fetch-Site same-origin), then it goes through (the control)', async () => {
    const { browser, user } = await signedIn(t.app);
    const caseId = await createCase(user.id);
    expect((await browser.post(`/api/cases/${caseId}/messages`).set({ Origin: TEST_ORIGIN, 'Content-Type': 'application/json' }).send({ clientId: newClientId(), body: 'Ours' })).status).toBe(201);
    expect((await browser.post(`/api/cases/${caseId}/messages`).set({ 'Sec-Fetch-Site': 'same-origin', 'Content-Type': 'application/json' }).send({ clientId: newClientId(), body: 'Ours too' })).status).toBe(201);
  });
});

/**
 * A fingerprint of everything a person could change: each table's rows, hashed. Left out: the
 * session table (a rolling idle timeout renews it on every request, by design) and case_reads
 * (reading a thread moves the reader's own "read up to" mark, which is what reading means).
 */
const TABLES = ['users', 'batches', 'cases', 'messages', 'case_photos', 'check_ins', 'library_entries', 'mentor_applications', 'message_reports', 'audit_log', 'outbox_mail', 'user_tokens', 'search_terms', 'sign_in_failures'];
async function fingerprint(): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const table of TABLES) {
    const [row] = await getSequelize().query<{ n: number; h: string | null }>(`SELECT count(*)::int AS n, md5(string_agg(x::text, '|' ORDER BY x::text)) AS h FROM ${table} x`, {
      type: QueryTypes.SELECT,
    });
    out[table] = `${row.n}:${row.h}`;
  }
  return out;
}

describe('ASVS 3.5.3: GET never changes state', () => {
  test('ASVS 3.5.3: when every GET route is called by a visitor, the owning grower, another grower, a mentor and a steward, then no table changes', async () => {
    const owner = await signedIn(t.app);
    const people = [agent(t.app), owner.browser, (await signedIn(t.app)).browser, (await signedIn(t.app, 'mentor')).browser, (await signedIn(t.app, 'steward')).browser];
    const batch = await createBatch(owner.user.id);
    const caseId = await createCase(owner.user.id, { batchId: batch.id });
    await insertMessage(caseId, owner.user.id, 'A message to read.');
    const jpeg = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#8a6' } }).jpeg().toBuffer();
    const photo = await owner.browser.post(`/api/cases/${caseId}/photos`).set('Origin', TEST_ORIGIN).attach('photos', jpeg, 'jar.jpg').expect(201);
    const [mentor] = await getSequelize().query<{ id: number }>(`SELECT id FROM users WHERE role = 'mentor' ORDER BY id DESC LIMIT 1`, { type: QueryTypes.SELECT });
    const [entry] = await getSequelize().query<{ slug: string }>(`SELECT slug FROM library_entries ORDER BY id LIMIT 1`, { type: QueryTypes.SELECT });
    const params: Record<string, string> = { id: String(caseId), photoId: String(photo.body.photos[0].id), slug: entry?.slug ?? 'no-such-guide' };
    const urlOf = (route: string) =>
      route
        .slice('GET '.length)
        .replace(/^\/api\/batches\/:id/, `/api/batches/${batch.id}`)
        .replace(/^\/api\/mentors\/:id/, `/api/mentors/${mentor.id}`)
        .replace(/:(\w+)/g, (_m, name: string) => params[name] ?? '1');
    const gets = listRoutes(t.app).filter((r) => r.startsWith('GET '));
    expect(gets.length).toBeGreaterThan(20);

    const before = await fingerprint();
    const answered: number[] = [];
    for (const route of gets) {
      for (const person of people) answered.push((await person.get(urlOf(route)).query(route === 'GET /api/library' ? { q: 'bubbling' } : {})).status);
    }
    expect(answered.filter((s) => s >= 500)).toEqual([]);
    // Most calls got through to do their reading (the control: a table of 401s would prove nothing).
    expect(answered.filter((s) => s === 200).length).toBeGreaterThan(gets.length * 2);
    expect(await fingerprint()).toEqual(before);
  });
});
