// A real listening server (startServer) for socket tests, and the socket.io-client helpers they
// share: sign in over HTTP for a session cookie, open a websocket with it, ask with an ack.
// `useLiveServer()` registers the vitest hooks (start before the file, drop sockets after each
// test, stop after the file) and hands back helpers bound to that server.
import { afterAll, afterEach, beforeAll, expect } from 'vitest';
import { io as connectClient, type ManagerOptions, type Socket, type SocketOptions } from 'socket.io-client';
import type { Role } from '../../server/shared/case-status';
import type { Ack, ClientToServerEvents, PresenceEntry, ServerToClientEvents, ThreadMessage } from '../../server/shared/socket-events';
import { startServer, type RunningServer } from '../../server/src/index';
import { TEST_ORIGIN } from './test-app';
import { createUser, FACTORY_PASSWORD } from '../factories/users';
import { createThreadCase, newClientId } from '../factories/threads';

export type Client = Socket<ServerToClientEvents, ClientToServerEvents>;
export type JoinAck = Ack<{ messages: ThreadMessage[]; presence: PresenceEntry[]; hasMore: boolean }>;
export type SinceAck = Ack<{ messages: ThreadMessage[]; hasMore: boolean }>;
export type SendAck = Ack<{ message: ThreadMessage; duplicate: boolean }>;

export interface ConnectOptions {
  transports?: ManagerOptions['transports'];
  /** more handshake headers (e.g. Sec-Fetch-Site) */
  headers?: Record<string, string>;
}

export function useLiveServer() {
  let server: RunningServer;
  const open: Client[] = [];

  beforeAll(async () => {
    server = await startServer({ env: { ...process.env, PORT: '0', PUBLIC_URL: TEST_ORIGIN }, migrate: false, seedDemo: false, mailIntervalMs: 60_000 });
  });
  afterEach(() => {
    while (open.length) open.pop()!.disconnect();
  });
  afterAll(async () => {
    await server?.close();
  });

  async function signIn(email: string, password = FACTORY_PASSWORD): Promise<string> {
    const res = await fetch(`${server.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: server.url },
      body: JSON.stringify({ email, password }),
    });
    expect(res.status).toBe(200);
    const cookie = res.headers.getSetCookie().find((c) => c.startsWith('sporewell.sid='));
    return cookie!.split(';')[0];
  }

  async function person(role: Role, displayName?: string) {
    const user = await createUser({ role, displayName });
    return { user, cookie: await signIn(user.email) };
  }

  function connect(cookie: string | null, origin?: string, options: ConnectOptions = {}): Promise<Client> {
    const headers: Record<string, string> = { ...options.headers };
    if (cookie) headers.cookie = cookie;
    if (origin) headers.origin = origin;
    const socketOptions: Partial<ManagerOptions & SocketOptions> = { transports: options.transports ?? ['websocket'], reconnection: false, forceNew: true, extraHeaders: headers };
    const socket: Client = connectClient(server.url, socketOptions);
    open.push(socket);
    return new Promise((resolve, reject) => {
      socket.once('connect', () => resolve(socket));
      socket.once('connect_error', (error) => reject(error));
    });
  }

  function api(cookie: string | null, method: string, path: string, body?: unknown) {
    return fetch(`${server.url}${path}`, {
      method,
      headers: { 'Content-Type': 'application/json', Origin: server.url, ...(cookie ? { cookie } : {}) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  }

  async function aCase(options: { mentorId?: number; status?: 'awaiting_mentor' | 'in_conversation' } = {}) {
    const grower = await person('grower', 'Ada Fernhill');
    const kase = await createThreadCase({ growerId: grower.user.id, ...options });
    return { grower, caseId: kase.id };
  }

  return {
    get server(): RunningServer {
      return server;
    },
    signIn,
    person,
    connect,
    api,
    aCase,
  };
}

/** Collects every `message:new` a socket receives. */
export function inbox(socket: Client): ThreadMessage[] {
  const got: ThreadMessage[] = [];
  socket.on('message:new', (m) => got.push(m));
  return got;
}

export function waitFor<T>(check: () => T | undefined | false, ms = 3000): Promise<T> {
  return new Promise((resolve, reject) => {
    const started = Date.now();
    const tick = () => {
      const value = check();
      if (value) return resolve(value);
      if (Date.now() - started > ms) return reject(new Error('timed out waiting'));
      setTimeout(tick, 15);
    };
    tick();
  });
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Emits with an ack and a timeout, payload unchecked (bad payloads are part of the tests). */
export function ask<T>(socket: Client, event: string, payload: unknown): Promise<T> {
  return (socket.timeout(5000) as unknown as { emitWithAck(e: string, p: unknown): Promise<T> }).emitWithAck(event, payload);
}
export const join = (socket: Client, caseId: number, afterSeq?: number) => ask<JoinAck>(socket, 'case:join', afterSeq === undefined ? { caseId } : { caseId, afterSeq });
export const since = (socket: Client, caseId: number, afterSeq: number) => ask<SinceAck>(socket, 'message:since', { caseId, afterSeq });
export const send = (socket: Client, caseId: number, body: string, extra: Record<string, unknown> = {}) =>
  ask<SendAck>(socket, 'message:send', { caseId, clientId: newClientId(), body, ...extra });
