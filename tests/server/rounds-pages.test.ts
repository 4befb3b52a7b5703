// The shared rounds pages (server/src/modules/cases/rounds-page.ts): built once for everyone with
// the same filter and view, and never older than the request, whoever changed the data.
import { once } from 'node:events';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import zlib from 'node:zlib';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { getSequelize } from '../../server/src/db/sequelize';
import { roundsPageStats } from '../../server/src/modules/cases/rounds-page';
import { cookieOf, makeTestApp, type TestApp } from '../setup/test-app';
import { JSON_HEADERS, signedIn } from '../factories/sign-in';
import { createCase } from '../factories/cases';
import { insertMessage } from '../factories/steward-data';

// Two apps, each with its own session reader (its own LISTEN connection) and its own pages:
// to PostgreSQL they are two processes.
let a: TestApp;
let b: TestApp;
beforeAll(() => {
  a = makeTestApp();
  b = makeTestApp();
});
afterAll(async () => {
  await a.close();
  await b.close();
});

type Page = { items: { id: number; title: string; status: string; mentor: { id: number } | null; lastMessagePreview: string | null }[]; total: number };
const itemOf = (page: Page, id: number) => page.items.find((c) => c.id === id);

describe('shared rounds pages', () => {
  test('when two mentors ask for the same page at once, then it is built once and both get it', async () => {
    const grower = await signedIn(a.app);
    await createCase(grower.user.id, { title: 'shared page' });
    const first = await signedIn(a.app, 'mentor');
    const second = await signedIn(a.app, 'mentor');
    const url = '/api/cases?status=awaiting_mentor&sort=newest&pageSize=7';
    const before = { ...roundsPageStats };
    const [x, y] = await Promise.all([first.browser.get(url), second.browser.get(url)]);
    expect(x.status).toBe(200);
    expect(y.body).toEqual(x.body);
    expect(roundsPageStats.built - before.built).toBe(1);
    expect(roundsPageStats.shared - before.shared).toBe(1);
  });

  test('when a case is changed on another connection right before a read, then every read shows the change', async () => {
    const grower = await signedIn(a.app);
    const mentor = await signedIn(a.app, 'mentor');
    const id = await createCase(grower.user.id, { status: 'in_conversation', mentorId: mentor.user.id, title: 'v0' });
    const url = '/api/cases?mine=1';
    for (let i = 1; i <= 15; i++) {
      await mentor.browser.get(url).expect(200);
      // Not through this app: the page it just built must not be reused.
      await getSequelize().query(`UPDATE cases SET title = $2 WHERE id = $1`, { bind: [id, `v${i}`] });
      const page = (await mentor.browser.get(url).expect(200)).body as Page;
      expect(itemOf(page, id)?.title).toBe(`v${i}`);
    }
  });

  test('when another process claims a case, then this one shows it claimed on the next read', async () => {
    const grower = await signedIn(a.app);
    const reader = await signedIn(a.app, 'mentor');
    const claimer = await signedIn(b.app, 'mentor');
    const url = '/api/cases?status=awaiting_mentor,in_conversation&sort=newest&pageSize=20';
    for (let i = 0; i < 3; i++) {
      const id = await createCase(grower.user.id, { title: `to claim ${i}` });
      expect(itemOf((await reader.browser.get(url).expect(200)).body, id)?.status).toBe('awaiting_mentor');
      await claimer.browser.post(`/api/cases/${id}/claim`).set(JSON_HEADERS).expect(200);
      const after = itemOf((await reader.browser.get(url).expect(200)).body, id);
      expect(after).toMatchObject({ status: 'in_conversation', mentor: { id: claimer.user.id } });
    }
  });

  test('when the latest line is hidden, then mentors and stewards asking for the same page get their own views', async () => {
    const grower = await signedIn(a.app);
    const mentor = await signedIn(a.app, 'mentor');
    const steward = await signedIn(a.app, 'steward');
    const id = await createCase(grower.user.id, { title: 'hidden latest line' });
    await insertMessage(id, grower.user.id, 'A line everyone sees.');
    const hiddenId = await insertMessage(id, grower.user.id, 'A line a steward hid.');
    await getSequelize().query(`UPDATE messages SET hidden = true, hidden_at = now() WHERE id = $1`, { bind: [hiddenId] });
    const url = '/api/cases?status=awaiting_mentor&sort=newest&pageSize=50';
    const [seenByMentor, seenBySteward] = await Promise.all([mentor.browser.get(url), steward.browser.get(url)]);
    expect(itemOf(seenByMentor.body, id)?.lastMessagePreview).toBe('A line everyone sees.');
    expect(itemOf(seenBySteward.body, id)?.lastMessagePreview).toBe('A line a steward hid.');
    // And a grower's list is their own, never a mentor's page.
    const own = (await grower.browser.get(url).expect(200)).body as Page;
    expect(own.items.map((c) => c.id)).toEqual([id]);
  });

  test('when the client has the page or accepts gzip, then it gets 304 or the same JSON gzipped', async () => {
    const grower = await signedIn(a.app);
    for (let i = 0; i < 4; i++) await createCase(grower.user.id, { title: `enough to compress ${i}` });
    const mentor = await signedIn(a.app, 'mentor');
    const url = '/api/cases?sort=oldest&pageSize=100';
    const plain = await mentor.browser.get(url).expect(200);
    const etag = plain.headers.etag as string;
    expect(etag).toMatch(/^W\/"/);
    expect(plain.headers['cache-control']).toBe('no-store');
    const again = await mentor.browser.get(url).set('If-None-Match', etag);
    expect(again.status).toBe(304);
    expect(again.text ?? '').toBe('');
    // Raw bytes, as they go over the wire (supertest would unzip them).
    const server = http.createServer(a.app).listen(0, '127.0.0.1');
    await once(server, 'listening');
    try {
      const { port } = server.address() as AddressInfo;
      // The cookie rolls with every answer, so the last one carries it.
      const cookie = cookieOf(plain)!;
      const raw = await new Promise<{ headers: http.IncomingHttpHeaders; body: Buffer }>((resolve, reject) => {
        http
          .get({ host: '127.0.0.1', port, path: url, headers: { cookie, 'accept-encoding': 'gzip' } }, (res) => {
            const chunks: Buffer[] = [];
            res.on('data', (c: Buffer) => chunks.push(c));
            res.on('end', () => resolve({ headers: res.headers, body: Buffer.concat(chunks) }));
          })
          .on('error', reject);
      });
      expect(raw.headers['content-encoding']).toBe('gzip');
      expect(raw.headers.vary).toMatch(/Accept-Encoding/i);
      expect(JSON.parse(zlib.gunzipSync(raw.body).toString('utf8'))).toEqual(plain.body);
    } finally {
      server.close();
    }
  });
});

describe('the change count (migration 0600)', () => {
  const count = async () => {
    const [row] = await getSequelize().query<{ n: number }>(`SELECT sum(n)::float8 AS n FROM change_counters`, { type: QueryTypes.SELECT });
    return row.n;
  };

  test('when a case, a message or a name changes, then the count moves once per transaction; other writes leave it', async () => {
    const grower = await signedIn(a.app);
    const id = await createCase(grower.user.id, { title: 'counted' });
    const sequelize = getSequelize();
    const moves = async (work: () => Promise<unknown>) => {
      const before = await count();
      await work();
      return (await count()) - before;
    };
    expect(await moves(() => insertMessage(id, grower.user.id, 'counted once, three statements'))).toBe(1);
    expect(await moves(() => sequelize.query(`UPDATE messages SET hidden = true WHERE case_id = $1`, { bind: [id] }))).toBe(1);
    expect(await moves(() => sequelize.query(`UPDATE cases SET status = 'in_conversation' WHERE id = $1`, { bind: [id] }))).toBe(1);
    expect(await moves(() => sequelize.query(`UPDATE users SET display_name = 'Renamed grower' WHERE id = $1`, { bind: [grower.user.id] }))).toBe(1);
    expect(await moves(() => sequelize.query(`UPDATE users SET notify_urgent = true WHERE id = $1`, { bind: [grower.user.id] }))).toBe(0);
  });

  test('when two transactions write at once, then neither waits for the other at the count', async () => {
    const grower = await signedIn(a.app);
    const [x, y] = [await createCase(grower.user.id), await createCase(grower.user.id)];
    const sequelize = getSequelize();
    await sequelize.transaction(async (first) => {
      await sequelize.query(`UPDATE cases SET title = 'first, still open' WHERE id = $1`, { bind: [x], transaction: first });
      // The first transaction holds its counter row. Each transaction after it starts at the
      // next row (by transaction id), so one of these 130 starts at the held row: it must take
      // another rather than wait for a transaction that waits for it.
      const before = await count();
      for (let i = 0; i < 130; i++) await sequelize.query(`UPDATE cases SET title = $2 WHERE id = $1`, { bind: [y, `second, ${i}`] });
      expect((await count()) - before).toBe(130);
    });
  });
});
