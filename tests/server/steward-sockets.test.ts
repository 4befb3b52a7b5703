// The steward's changes reach live sockets at once: a disabled account's sockets drop (ASVS
// 7.4.2, "HTTP and socket both refused at once"), and a hidden message is withdrawn from every
// open thread. Runs the real realtime layer on a loopback port.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { io as connect, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '../../server/shared/socket-events';
import { attachRealtime, type Realtime } from '../../server/src/realtime/realtime';
import { agent, cookieOf, makeTestApp, TEST_ORIGIN, type TestApp } from '../setup/test-app';
import { createUser } from '../factories/users';
import { insertCase, insertMessage, JSON_HEADERS, personSignedIn } from '../factories/steward-data';

type ClientSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

let t: TestApp;
let server: http.Server;
let realtime: Realtime;
let url: string;
const sockets: ClientSocket[] = [];

beforeAll(async () => {
  t = makeTestApp();
  server = http.createServer(t.app);
  realtime = attachRealtime(server, t.ctx);
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  for (const s of sockets) s.disconnect();
  await realtime.close();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await t.close();
});

async function cookieFor(user: { email: string; password: string }): Promise<string> {
  const res = await agent(t.app).post('/api/auth/login').set(JSON_HEADERS).send({ email: user.email, password: user.password }).expect(200);
  return cookieOf(res)!;
}

function openSocket(cookie: string): Promise<ClientSocket> {
  const socket: ClientSocket = connect(url, { transports: ['websocket'], extraHeaders: { Cookie: cookie, Origin: TEST_ORIGIN }, reconnection: false, forceNew: true });
  sockets.push(socket);
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', reject);
  });
}

describe('a disabled account over sockets', () => {
  test('when a steward disables an account, then its open socket is disconnected by the server and a new one is refused', async () => {
    const grower = await createUser();
    const cookie = await cookieFor(grower);
    const socket = await openSocket(cookie);
    const dropped = new Promise<string>((resolve) => socket.once('disconnect', (reason) => resolve(reason)));
    const { browser } = await personSignedIn(t.app, 'steward');
    await browser.patch(`/api/steward/users/${grower.id}`).set(JSON_HEADERS).send({ disabled: true }).expect(200);
    expect(await dropped).toBe('io server disconnect');
    await expect(openSocket(cookie)).rejects.toBeTruthy();
  });
});

describe('a hidden message over sockets', () => {
  test('when a steward hides a message, then a grower with the thread open is sent message:hidden, and a rejoin carries no text', async () => {
    const grower = await createUser();
    const mentor = await createUser({ role: 'mentor' });
    const caseId = await insertCase({ growerId: grower.id, mentorId: mentor.id, status: 'in_conversation' });
    const messageId = await insertMessage(caseId, mentor.id, 'A remark nobody should have to read.');
    const socket = await openSocket(await cookieFor(grower));
    const joined = await socket.emitWithAck('case:join', { caseId });
    expect(joined.ok).toBe(true);
    const hidden = new Promise<{ caseId: number; messageId: number }>((resolve) => socket.once('message:hidden', resolve));
    const { browser } = await personSignedIn(t.app, 'steward');
    await browser.post(`/api/steward/messages/${messageId}/hide`).set(JSON_HEADERS).send({}).expect(200);
    expect(await hidden).toEqual({ caseId, messageId });
    const again = await socket.emitWithAck('case:join', { caseId });
    expect(again.ok).toBe(true);
    expect(JSON.stringify(again)).not.toContain('nobody should have to read');
  });
});
