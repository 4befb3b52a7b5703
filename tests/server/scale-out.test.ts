// Two real Sporewell processes (node --import tsx server/src/index.ts) on two ports, started at
// the same moment on a fresh database, sharing it for data, sessions, sign-in throttling, the
// outbox and socket fan-out, and an S3 fake for photos. The processes are ended by pid in
// afterAll, whatever happened.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import sharp from 'sharp';
import { SMTPServer } from 'smtp-server';
import { io as connectClient, type Socket } from 'socket.io-client';
import type { Ack, ClientToServerEvents, PresenceEntry, ServerToClientEvents, ThreadMessage } from '../../server/shared/socket-events';
import { DEMO_USERS } from '../../server/src/db/seeders/demo-data';
import { initModels } from '../../server/src/db/models';
import { closeSequelize, getSequelize, initSequelize } from '../../server/src/db/sequelize';
import { freePort } from '../../server/src/lib/local-postgres';
import { MAX_FAILURES } from '../../server/src/modules/auth/sign-in-throttle';
import { readGuides } from '../../server/src/modules/library/knowledge-loader';
import { enqueueMail } from '../../server/src/modules/mail/outbox';
import { spawnServers, stopProcess, type SpawnedServers } from '../../scripts/spawn-servers';
import { admin, createFreshDatabase, type FreshDatabase } from '../setup/fresh-database';
import { startS3Fake, type S3Fake } from '../setup/s3-fake';
import { createUser, FACTORY_PASSWORD, uniqueEmail } from '../factories/users';
import { createThreadCase, newClientId } from '../factories/threads';

type Client = Socket<ServerToClientEvents, ClientToServerEvents>;

/** What a load balancer in front of both would be reached at: both processes share it. */
const ORIGIN = 'http://127.0.0.1:3999';
const MIGRATIONS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../server/src/db/migrations');

let cluster: SpawnedServers | null = null;
let s3: S3Fake | null = null;
let smtp: SMTPServer | null = null;
let freshDb: FreshDatabase | null = null;
let uploadDir = '';
let A = '';
let B = '';
const caught: { to: string; subject: string; heloName: string }[] = [];
const open: Client[] = [];


/** A catcher in the test: an SMTP server on loopback that writes down each mail and which process sent it (its EHLO name). */
async function startCatcher(): Promise<{ server: SMTPServer; port: number }> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      let head = '';
      stream.on('data', (c: Buffer) => (head += c.toString('utf8')));
      stream.on('end', () => {
        const subject = /^Subject: (.*)$/im.exec(head)?.[1]?.trim() ?? '';
        for (const r of session.envelope.rcptTo) caught.push({ to: r.address, subject, heloName: session.hostNameAppearsAs });
        // A slow mail provider (50 ms a mail) keeps both workers busy on the same queue at once.
        setTimeout(() => callback(), 50);
      });
    },
  });
  const port = await freePort();
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  return { server, port };
}

beforeAll(async () => {
  freshDb = await createFreshDatabase('scale');

  s3 = await startS3Fake();
  const catcher = await startCatcher();
  smtp = catcher.server;
  uploadDir = path.join(fs.mkdtempSync(path.join(process.env.TEST_TMP ?? os.tmpdir(), 'scale-')), 'uploads');

  cluster = await spawnServers(2, {
    env: {
      ...process.env,
      DATABASE_URL: freshDb.url,
      PUBLIC_URL: ORIGIN,
      SEED_DEMO: '1',
      UPLOAD_DIR: uploadDir,
      LOG_LEVEL: 'error',
      ...s3.env,
    },
    // Each process names itself in its EHLO, so the catcher knows which one sent a mail.
    envFor: (i) => ({ SMTP_URL: `smtp://127.0.0.1:${catcher.port}/?name=process-${i}.example.test` }),
    start: 'together',
  });
  [A, B] = cluster.urls;

  initModels(initSequelize(freshDb.url));
}, 120_000);

afterAll(async () => {
  while (open.length) open.pop()!.disconnect();
  await cluster?.stop();
  await closeSequelize().catch(() => undefined);
  await new Promise<void>((resolve) => (smtp ? smtp.close(() => resolve()) : resolve()));
  await s3?.close();
  await freshDb?.drop();
}, 60_000);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function signIn(url: string, email: string, password = FACTORY_PASSWORD): Promise<Response> {
  return fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: ORIGIN },
    body: JSON.stringify({ email, password }),
  });
}

async function cookieFor(url: string, email: string): Promise<string> {
  const res = await signIn(url, email);
  expect(res.status).toBe(200);
  return res.headers.getSetCookie().find((c) => c.startsWith('sporewell.sid='))!.split(';')[0];
}

function api(url: string, cookie: string, method: string, route: string, body?: unknown): Promise<Response> {
  return fetch(`${url}${route}`, {
    method,
    headers: { 'Content-Type': 'application/json', Origin: ORIGIN, cookie },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

/** Websocket only, as the web client tries first: no sticky sessions needed. */
function connect(url: string, cookie: string): Promise<Client> {
  const socket: Client = connectClient(url, { transports: ['websocket'], reconnection: false, forceNew: true, extraHeaders: { cookie, origin: ORIGIN } });
  open.push(socket);
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', reject);
  });
}

function join(socket: Client, caseId: number) {
  return new Promise<Ack<{ messages: ThreadMessage[]; presence: PresenceEntry[]; hasMore: boolean }>>((resolve) => socket.emit('case:join', { caseId }, resolve));
}

async function until<T>(check: () => T | undefined | false | Promise<T | undefined | false>, ms = 5_000, what = 'the condition'): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await sleep(25);
  }
}

async function people() {
  const grower = await createUser({ role: 'grower', displayName: 'Ossian Vale' });
  const mentor = await createUser({ role: 'mentor', displayName: 'Brisa Thorne' });
  const thread = await createThreadCase({ growerId: grower.id, mentorId: mentor.id, status: 'in_conversation' });
  return { grower, mentor, caseId: thread.id };
}

describe('two processes started at once on an empty database', () => {
  test('when both start at the same moment, then every migration ran once, the demo seed and the guides are there once, and both serve', async () => {
    const sequelize = getSequelize();
    const files = fs.readdirSync(MIGRATIONS_DIR).filter((f) => /^\d{4}-.*\.(ts|js)$/.test(f) && !f.endsWith('.d.ts'));
    const ran = await sequelize.query<{ name: string }>(`SELECT name FROM schema_migrations ORDER BY name`, { type: QueryTypes.SELECT });
    expect(ran.map((r) => r.name)).toEqual(files.map((f) => f.replace(/\.(ts|js)$/, '')).sort());

    const seeds = await sequelize.query<{ name: string; n: number }>(`SELECT name, count(*)::int AS n FROM seed_runs GROUP BY name ORDER BY name`, { type: QueryTypes.SELECT });
    expect(seeds.map((s) => s.name)).toEqual(['demo:cases', 'demo:users']);
    expect(seeds.every((s) => s.n === 1)).toBe(true);
    const [{ users }] = await sequelize.query<{ users: number }>(`SELECT count(*)::int AS users FROM users WHERE email IN (:emails)`, {
      replacements: { emails: DEMO_USERS.map((u) => u.email) },
      type: QueryTypes.SELECT,
    });
    expect(users).toBe(DEMO_USERS.length);

    const { guides } = readGuides();
    const loaded = await sequelize.query<{ slug: string }>(`SELECT slug FROM library_entries WHERE kind = 'guide' ORDER BY slug`, { type: QueryTypes.SELECT });
    expect(loaded.map((g) => g.slug)).toEqual(guides.map((g) => g.slug).sort());

    for (const url of [A, B]) expect(await (await fetch(`${url}/api/health`)).json()).toEqual({ ok: true, db: true });
  });
});

describe('sessions across processes', () => {
  test('when a person signs in on A, then B knows them; signing out on B drops their socket on A', async () => {
    const user = await createUser({ displayName: 'Wren Adair' });
    const cookie = await cookieFor(A, user.email);
    const me = await api(B, cookie, 'GET', '/api/auth/me');
    expect(me.status).toBe(200);
    expect(((await me.json()) as { id: number }).id).toBe(user.id);

    const socket = await connect(A, cookie);
    const dropped = new Promise<string>((resolve) => socket.once('disconnect', resolve));
    expect((await api(B, cookie, 'POST', '/api/auth/logout')).status).toBeLessThan(300);
    expect(await Promise.race([dropped, sleep(5_000).then(() => 'still connected')])).toBe('io server disconnect');
    expect((await api(A, cookie, 'GET', '/api/auth/me')).status).toBe(401);
  });
});

describe('the live thread across processes', () => {
  test('when the grower is on A and the mentor on B, then presence, typing and messages cross both ways', async () => {
    const { grower, mentor, caseId } = await people();
    const growerSocket = await connect(A, await cookieFor(A, grower.email));
    const mentorCookie = await cookieFor(B, mentor.email);
    const mentorSocket = await connect(B, mentorCookie);

    const growerJoin = await join(growerSocket, caseId);
    expect(growerJoin.ok).toBe(true);
    const mentorJoin = await join(mentorSocket, caseId);
    expect(mentorJoin.ok).toBe(true);
    // B asks A who is in the room: the grower, whose socket is on A, is present.
    if (mentorJoin.ok) expect(mentorJoin.presence.map((p) => p.userId).sort()).toEqual([grower.id, mentor.id].sort());

    const typing = new Promise<{ userId: number; typing: boolean }>((resolve) => growerSocket.once('typing', resolve));
    mentorSocket.emit('typing', { caseId, typing: true });
    expect(await Promise.race([typing, sleep(5_000).then(() => null)])).toMatchObject({ userId: mentor.id, typing: true });

    const onB: ThreadMessage[] = [];
    mentorSocket.on('message:new', (m) => onB.push(m));
    const sent = await new Promise<Ack<{ message: ThreadMessage; duplicate: boolean }>>((resolve) =>
      growerSocket.emit('message:send', { caseId, clientId: newClientId(), body: 'The crock smells of vinegar since the rain.' }, resolve),
    );
    expect(sent.ok).toBe(true);
    const arrived = await until(() => onB.find((m) => m.body === 'The crock smells of vinegar since the rain.'), 5_000, 'the message on B');
    expect(arrived.author?.id).toBe(grower.id);

    const onA: ThreadMessage[] = [];
    growerSocket.on('message:new', (m) => onA.push(m));
    const reply = await api(B, mentorCookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Stir it and keep the lid loose tonight.', kind: 'text' });
    expect(reply.status).toBe(201);
    await until(() => onA.find((m) => m.body === 'Stir it and keep the lid loose tonight.'), 5_000, 'the reply on A');
    // A mentor aside stays with the staff, even across processes.
    const aside = await api(B, mentorCookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Likely a yeast bloom.', kind: 'aside' });
    expect(aside.status).toBe(201);
    await sleep(500);
    expect(onA.some((m) => m.body === 'Likely a yeast bloom.')).toBe(false);

    const left = new Promise<{ present: PresenceEntry[] }>((resolve) => mentorSocket.on('presence', (p) => p.present.length === 1 && resolve(p)));
    growerSocket.disconnect();
    expect((await Promise.race([left, sleep(5_000).then(() => null)]))?.present.map((p) => p.userId)).toEqual([mentor.id]);
  });

  test('when the grower watches the case on A, then a mentor reply on B sends no mail; once the grower has gone, it does', async () => {
    const { grower, mentor, caseId } = await people();
    const growerSocket = await connect(A, await cookieFor(A, grower.email));
    expect((await join(growerSocket, caseId)).ok).toBe(true);
    const mentorCookie = await cookieFor(B, mentor.email);
    const replyMails = async () =>
      (await getSequelize().query<{ n: number }>(`SELECT count(*)::int AS n FROM outbox_mail WHERE to_address = :to AND kind = 'mentor_reply'`, {
        replacements: { to: grower.email },
        type: QueryTypes.SELECT,
      }))[0].n;

    expect((await api(B, mentorCookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Is the cloth still dry?', kind: 'text' })).status).toBe(201);
    expect(await replyMails()).toBe(0);

    growerSocket.disconnect();
    await sleep(300);
    expect((await api(B, mentorCookie, 'POST', `/api/cases/${caseId}/messages`, { clientId: newClientId(), body: 'Send a photo when you can.', kind: 'text' })).status).toBe(201);
    expect(await replyMails()).toBe(1);
  });
});

describe('fan-out after a lost connection', () => {
  test('when the fan-out connections of process B are cut, then B listens again and messages cross both ways once more', async () => {
    const { grower, mentor, caseId } = await people();
    const growerSocket = await connect(A, await cookieFor(A, grower.email));
    const mentorSocket = await connect(B, await cookieFor(B, mentor.email));
    expect((await join(growerSocket, caseId)).ok).toBe(true);
    expect((await join(mentorSocket, caseId)).ok).toBe(true);

    const fanoutOfB = `sporewell-fanout-${cluster!.servers[1].pid}-%`;
    const listening = async () =>
      (await admin((c) => c.query(`SELECT pid FROM pg_stat_activity WHERE datname = $1 AND application_name LIKE $2 AND query LIKE 'LISTEN %'`, [freshDb!.name, fanoutOfB]))).rows;
    const [before] = await listening();
    expect(before).toBeDefined();
    const cut = await admin((c) => c.query(`SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE datname = $1 AND application_name LIKE $2`, [freshDb!.name, fanoutOfB]));
    expect(cut.rowCount).toBeGreaterThan(0);
    await until(async () => (await listening()).some((r) => r.pid !== before.pid), 15_000, 'B to LISTEN again');

    const onA: ThreadMessage[] = [];
    growerSocket.on('message:new', (m) => onA.push(m));
    const onB: ThreadMessage[] = [];
    mentorSocket.on('message:new', (m) => onB.push(m));
    // B sends: its pool still has a connection to NOTIFY with (the cut LISTEN one was handed back).
    mentorSocket.emit('message:send', { caseId, clientId: newClientId(), body: 'Back again: how does it smell now?' }, () => undefined);
    await until(() => onA.find((m) => m.body === 'Back again: how does it smell now?'), 5_000, 'B’s message on A');
    growerSocket.emit('message:send', { caseId, clientId: newClientId(), body: 'Sweeter, the vinegar is fading.' }, () => undefined);
    await until(() => onB.find((m) => m.body === 'Sweeter, the vinegar is fading.'), 5_000, 'A’s message on B');
  }, 40_000);
});

describe('limits and jobs shared through PostgreSQL', () => {
  test('when wrong passwords for one account arrive at both processes at once, then exactly the limit are checked and the rest refused', async () => {
    const user = await createUser();
    const attempts = MAX_FAILURES + 6;
    const answers = await Promise.all(Array.from({ length: attempts }, (_, i) => signIn(i % 2 ? B : A, user.email, 'not-the-password-at-all').then((r) => r.status)));
    expect(answers.filter((s) => s === 401)).toHaveLength(MAX_FAILURES);
    expect(answers.filter((s) => s === 429)).toHaveLength(attempts - MAX_FAILURES);
    // The right password is refused too while the account is throttled, on either process.
    expect((await signIn(A, user.email)).status).toBe(429);
    expect((await signIn(B, user.email)).status).toBe(429);
  });

  test('when both processes send the same outbox, then every mail goes out exactly once', async () => {
    const recipients = Array.from({ length: 60 }, () => uniqueEmail('outbox'));
    await getSequelize().transaction(async (transaction) => {
      for (const to of recipients) await enqueueMail({ to, subject: 'Your case has a reply', text: 'A mentor answered.' }, transaction);
    });
    const mine = () => caught.filter((m) => recipients.includes(m.to));
    await until(() => mine().length >= recipients.length, 30_000, 'every mail at the catcher');
    // Time for a second sending of any mail to show up, had one been claimed twice.
    await sleep(2_500);
    const got = mine();
    expect(got).toHaveLength(recipients.length);
    expect(new Set(got.map((m) => m.to)).size).toBe(recipients.length);
    // Both workers took part: the queue was shared, not left to one of them.
    expect(new Set(got.map((m) => m.heloName))).toEqual(new Set(['process-0.example.test', 'process-1.example.test']));
    const [{ pending }] = await getSequelize().query<{ pending: number }>(`SELECT count(*)::int AS pending FROM outbox_mail WHERE to_address IN (:to) AND status <> 'sent'`, {
      replacements: { to: recipients },
      type: QueryTypes.SELECT,
    });
    expect(pending).toBe(0);
  }, 60_000);
});

describe('photos in the shared bucket', () => {
  test('when a grower uploads a photo through A, then B serves the same bytes from the bucket and neither wrote to local disk', async () => {
    const { grower, caseId } = await people();
    const cookie = await cookieFor(A, grower.email);
    const jpeg = await sharp({ create: { width: 640, height: 480, channels: 3, background: { r: 140, g: 100, b: 60 } } }).jpeg().toBuffer();
    const form = new FormData();
    form.append('photos', new Blob([new Uint8Array(jpeg)], { type: 'image/jpeg' }), 'crock.jpg');
    const upload = await fetch(`${A}/api/cases/${caseId}/photos`, { method: 'POST', headers: { Origin: ORIGIN, cookie }, body: form });
    expect(upload.status).toBe(201);
    const [photo] = ((await upload.json()) as { photos: { id: number; url: string; thumbUrl: string }[] }).photos;

    const fromA = Buffer.from(await (await fetch(`${A}${photo.url}`, { headers: { cookie } })).arrayBuffer());
    const fromB = await fetch(`${B}${photo.url}`, { headers: { cookie } });
    expect(fromB.status).toBe(200);
    expect(Buffer.from(await fromB.arrayBuffer()).equals(fromA)).toBe(true);
    expect((await fetch(`${B}${photo.thumbUrl}`, { headers: { cookie } })).status).toBe(200);

    const [keys] = await getSequelize().query<{ storageKey: string; thumbKey: string }>(
      `SELECT storage_key AS "storageKey", thumb_key AS "thumbKey" FROM case_photos WHERE id = :id`,
      { replacements: { id: photo.id }, type: QueryTypes.SELECT },
    );
    expect(await s3!.has(keys.storageKey)).toBe(true);
    expect(await s3!.has(keys.thumbKey)).toBe(true);
    expect(fs.existsSync(uploadDir)).toBe(false);
  });
});

// Last, because it stops process B.
describe('one process stops', () => {
  test('when process B stops, then the sockets on A stay connected and hear that B’s people left', async () => {
    const { grower, mentor, caseId } = await people();
    const growerSocket = await connect(A, await cookieFor(A, grower.email));
    const mentorSocket = await connect(B, await cookieFor(B, mentor.email));
    expect((await join(growerSocket, caseId)).ok).toBe(true);
    expect((await join(mentorSocket, caseId)).ok).toBe(true);
    await until(() => growerSocket.connected, 1_000, 'the grower connected');
    const alone = new Promise<PresenceEntry[]>((resolve) => growerSocket.on('presence', (p) => p.present.length === 1 && resolve(p.present)));

    await stopProcess(cluster!.servers[1]);
    expect((await Promise.race([alone, sleep(5_000).then(() => null)]))?.map((p) => p.userId)).toEqual([grower.id]);
    await sleep(500);
    expect(growerSocket.connected).toBe(true);
    const again = await join(growerSocket, caseId);
    // A no longer waits for B's answer: B said goodbye as it stopped.
    if (again.ok) expect(again.presence.map((p) => p.userId)).toEqual([grower.id]);
    expect(again.ok).toBe(true);
  });
});
