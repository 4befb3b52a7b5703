// Fault (QUALITY.md): the server is killed with SIGKILL right after acknowledging messages.
// After a restart every acknowledged message is there exactly once, in order, and a client that
// resends what it never saw acknowledged does not create doubles.
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { io as connectClient, type Socket } from 'socket.io-client';
import type { Ack, ClientToServerEvents, ServerToClientEvents, ThreadMessage } from '../../server/shared/socket-events';
import { getSequelize } from '../../server/src/db/sequelize';
import { freePort } from '../../server/src/lib/local-postgres';
import { spawnServer, stopProcess, type SpawnedServer } from '../../scripts/spawn-servers';
import { makeTestApp, type TestApp } from '../setup/test-app';
import { createUser, FACTORY_PASSWORD } from '../factories/users';
import { createThreadCase, newClientId } from '../factories/threads';

type Client = Socket<ServerToClientEvents, ClientToServerEvents>;
let t: TestApp;
let server: SpawnedServer | null = null;
let port = 0;

function env(url: string) {
  return {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    NODE_ENV: 'test',
    DATABASE_URL: process.env.DATABASE_URL,
    SESSION_SECRET: process.env.SESSION_SECRET,
    UPLOAD_DIR: process.env.UPLOAD_DIR,
    PUBLIC_URL: url,
    LOG_LEVEL: 'silent',
    SEED_DEMO: '0',
  };
}

async function start(): Promise<SpawnedServer> {
  const url = `http://127.0.0.1:${port}`;
  return spawnServer(0, port, { env: env(url), output: 'capture', readyTimeoutMs: 60_000 });
}

beforeAll(async () => {
  t = makeTestApp(); // for the factories' database connection
  port = await freePort();
  server = await start();
}, 90_000);
afterAll(async () => {
  if (server) await stopProcess(server);
  await t?.close();
});

describe('the server killed right after acknowledging', () => {
  test('when SIGKILL follows the acks, then after a restart every acknowledged message is there once, and resends do not double', async () => {
    const grower = await createUser({ role: 'grower' });
    const kase = await createThreadCase({ growerId: grower.id, title: 'IMO2 fizzing after the storm' });
    const url = server!.url;
    const login = await fetch(`${url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: url },
      body: JSON.stringify({ email: grower.email, password: FACTORY_PASSWORD }),
    });
    expect(login.status).toBe(200);
    const cookie = login.headers.get('set-cookie')!.split(';')[0];
    const socket: Client = connectClient(url, { transports: ['websocket'], reconnection: false, forceNew: true, extraHeaders: { cookie, origin: url } });
    await new Promise<void>((resolve, reject) => {
      socket.once('connect', () => resolve());
      socket.once('connect_error', reject);
    });
    const joined = await socket.timeout(10_000).emitWithAck('case:join', { caseId: kase.id });
    expect(joined.ok).toBe(true);

    // Twenty messages sent as fast as the client can; the process dies the moment the 10th ack lands.
    const clientIds = Array.from({ length: 20 }, () => newClientId());
    const acked: ThreadMessage[] = [];
    let killed = false;
    await Promise.all(
      clientIds.map((clientId, i) =>
        socket
          .timeout(5_000)
          .emitWithAck('message:send', { caseId: kase.id, clientId, body: `Update ${i + 1}: still fizzing.` })
          .then((ack: Ack<{ message: ThreadMessage; duplicate: boolean }>) => {
            if (ack.ok && !killed) {
              acked.push(ack.message);
              if (acked.length === 10) {
                killed = true;
                process.kill(server!.pid, 'SIGKILL');
              }
            }
          })
          .catch(() => undefined),
      ),
    );
    socket.close();
    await server!.exited;
    expect(acked.length).toBeGreaterThanOrEqual(10);

    server = await start();
    const stored = async () =>
      getSequelize().query<{ client_id: string; seq: number }>(`SELECT client_id, seq FROM messages WHERE case_id = :id AND kind = 'text' ORDER BY seq`, {
        replacements: { id: kase.id },
        type: QueryTypes.SELECT,
      });
    const before = await stored();
    for (const message of acked) expect(before.filter((r) => r.client_id === message.clientId)).toHaveLength(1);

    // The client resends everything it sent (it cannot know what the dead process stored): nothing doubles.
    const again = await fetch(`${server.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: server.url },
      body: JSON.stringify({ email: grower.email, password: FACTORY_PASSWORD }),
    });
    const cookie2 = again.headers.get('set-cookie')!.split(';')[0];
    for (const [i, clientId] of clientIds.entries()) {
      const res = await fetch(`${server.url}/api/cases/${kase.id}/messages`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Origin: server.url, cookie: cookie2 },
        body: JSON.stringify({ clientId, body: `Update ${i + 1}: still fizzing.` }),
      });
      expect([200, 201]).toContain(res.status);
    }
    const after = await stored();
    expect(after).toHaveLength(20);
    expect(new Set(after.map((r) => r.client_id)).size).toBe(20);
    // Sequence numbers stay strictly increasing with no repeats.
    expect(after.map((r) => r.seq)).toEqual([...after.map((r) => r.seq)].sort((a, b) => a - b));
  }, 120_000);
});
