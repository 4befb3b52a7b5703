// Faults (QUALITY.md "Faults"): PostgreSQL restarted under load, the mail server down.
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startServer, type RunningServer } from '../../server/src/index';
import { getSequelize } from '../../server/src/db/sequelize';
import { startCluster, stopCluster, freePort } from '../../server/src/lib/local-postgres';
import { startMailCatcher } from '../../server/src/lib/mail-catcher';
import { createTransport } from '../../server/src/modules/mail/mailer';
import { enqueueMail, startOutboxWorker } from '../../server/src/modules/mail/outbox';
import { createUser, uniqueEmail } from '../factories/users';

let server: RunningServer;
beforeAll(async () => {
  server = await startServer({
    env: { ...process.env, PORT: '0', PUBLIC_URL: undefined, SMTP_URL: undefined },
    migrate: false,
    seedDemo: false,
    mailIntervalMs: 60_000,
  });
});
afterAll(async () => {
  await server?.close();
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('PostgreSQL restarted under load', () => {
  test('when the database goes away for a few seconds, then requests in the gap get a JSON 503, the server stays up and serves again within 5 s', async () => {
    const dataDir = process.env.PG_DATA_DIR!;
    const metaFile = path.join(process.env.TEST_TMP!, 'pg.json');
    const user = await createUser();
    const login = await fetch(`${server.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', Origin: server.url },
      body: JSON.stringify({ email: user.email, password: user.password }),
    });
    expect(login.status).toBe(200);
    const cookie = login.headers.get('set-cookie')!.split(';')[0];

    const seen: { at: number; status: number; code?: string }[] = [];
    let running = true;
    const load = (async () => {
      // A bounded loop of requests on loopback: at most ~400, for at most 30 s.
      const deadline = Date.now() + 30_000;
      for (let i = 0; running && i < 400 && Date.now() < deadline; i += 1) {
        const batch = await Promise.all(
          [0, 1, 2].map(async () => {
            try {
              const res = await fetch(`${server.url}/api/auth/me`, { headers: { cookie } });
              const body = (await res.json().catch(() => ({}))) as { error?: { code: string } };
              return { at: Date.now(), status: res.status, code: body.error?.code };
            } catch {
              return { at: Date.now(), status: -1 };
            }
          }),
        );
        seen.push(...batch);
        await sleep(40);
      }
    })();

    await sleep(500);
    stopCluster(dataDir, 'fast');
    await sleep(3000);
    await startCluster({ dataDir, metaFile });
    const back = Date.now();
    await sleep(6000);
    running = false;
    await load;

    const during = seen.filter((s) => s.status !== 200);
    expect(during.length).toBeGreaterThan(0);
    // Nothing but a clean JSON 503: never a 500, never a dropped connection.
    for (const s of during) {
      expect(s.status).toBe(503);
      // Unreachable, or (should every pooled connection stay stuck for the pool's whole wait) busy.
      expect(['database_unavailable', 'busy']).toContain(s.code);
    }
    const firstOk = seen.find((s) => s.at >= back && s.status === 200);
    expect(firstOk, 'served again after the database returned').toBeTruthy();
    expect(firstOk!.at - back).toBeLessThanOrEqual(5000);
    const last = await fetch(`${server.url}/api/health`);
    expect(await last.json()).toEqual({ ok: true, db: true });
  }, 60_000);
});

describe('the mail server is down', () => {
  test('when the mail server is away and comes back, then the queued mail is sent once it is back, exactly once', async () => {
    const port = await freePort();
    const to = uniqueEmail('outage');
    const transport = createTransport(`smtp://127.0.0.1:${port}`);
    // Nothing listens on the port yet: the mail server is down.
    await enqueueMail({ to, subject: 'Your case has a reply', text: 'A mentor answered.' });
    const worker = startOutboxWorker(transport, 'Sporewell <no-reply@sporewell.example.test>', 200);
    try {
      await sleep(1500);
      const [pending] = await getSequelize().query<{ status: string; attempts: number }>(
        `SELECT status, attempts FROM outbox_mail WHERE to_address = :to`,
        { replacements: { to }, type: QueryTypes.SELECT },
      );
      expect(pending.status).toBe('pending');
      expect(pending.attempts).toBeGreaterThanOrEqual(1);

      const catcher = await startMailCatcher(port);
      try {
        // The first retry comes 5 s after the first failure (back-off 5 s, 10 s, 20 s … capped at 10 min).
        await expect
          .poll(
            async () =>
              (await getSequelize().query<{ n: string }>(`SELECT count(*) AS n FROM caught_mail WHERE envelope_to = :to`, { replacements: { to }, type: QueryTypes.SELECT }))[0].n,
            { timeout: 15_000, interval: 250 },
          )
          .toBe('1');
        await sleep(1000);
        const [sent] = await getSequelize().query<{ status: string }>(`SELECT status FROM outbox_mail WHERE to_address = :to`, { replacements: { to }, type: QueryTypes.SELECT });
        expect(sent.status).toBe('sent');
        const [{ n }] = await getSequelize().query<{ n: string }>(`SELECT count(*) AS n FROM caught_mail WHERE envelope_to = :to`, { replacements: { to }, type: QueryTypes.SELECT });
        expect(n).toBe('1');
      } finally {
        await catcher.close();
      }
    } finally {
      await worker.stop();
      transport.close();
    }
  }, 40_000);
});
