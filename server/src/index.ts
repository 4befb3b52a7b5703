// The running server: database, migrations, demo seed, mail, HTTP + socket.io, graceful stop.
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Transporter } from 'nodemailer';
import { buildApp } from './app';
import { parseConfig, type Config } from './config/env';
import type { AppContext } from './context';
import { migrate } from './db/migrator';
import { initModels } from './db/models';
import { closeSequelize, initSequelize } from './db/sequelize';
import { seedDemo } from './db/seeders/demo';
import { startMailCatcher, type MailCatcher } from './lib/mail-catcher';
import { log, setLogLevel } from './lib/logger';
import { closePhotoStores } from './lib/photo-store';
import { createSessionKit } from './lib/session';
import { attachRealtime } from './realtime/realtime';
import { startThreadMailWatcher } from './modules/threads/mail-watcher';
import { startLibraryWork } from './modules/library/library-startup';
import { createTransport } from './modules/mail/mailer';
import { startOutboxWorker, type OutboxWorker } from './modules/mail/outbox';
import { setArgonMemory } from './modules/auth/passwords';

export interface RunningServer {
  url: string;
  port: number;
  config: Config;
  mailCatcherPort: number | null;
  close(): Promise<void>;
}

export interface StartOptions {
  env?: Record<string, string | undefined>;
  migrate?: boolean;
  seedDemo?: boolean;
  mailIntervalMs?: number;
}

export async function startServer(options: StartOptions = {}): Promise<RunningServer> {
  const config = parseConfig(options.env ?? process.env);
  setLogLevel(config.LOG_LEVEL);
  setArgonMemory(config.ARGON2_MEMORY_KIB);
  // With a bucket configured, photos never touch this machine's disk.
  if (!config.s3) fs.mkdirSync(path.resolve(config.UPLOAD_DIR), { recursive: true });

  const sequelize = initSequelize(config.DATABASE_URL, { poolMax: 20 });
  initModels(sequelize);
  await sequelize.authenticate();
  if (options.migrate !== false) {
    const ran = await migrate(sequelize);
    if (ran.length) log.info('db.migrated', { ran });
  }
  const shouldSeed = options.seedDemo ?? config.SEED_DEMO ?? config.NODE_ENV === 'development';
  if (shouldSeed && config.NODE_ENV !== 'production') await seedDemo();

  let catcher: MailCatcher | null = null;
  let smtpUrl = config.SMTP_URL;
  if (config.useMailCatcher) {
    catcher = await startMailCatcher(0);
    smtpUrl = `smtp://127.0.0.1:${catcher.port}`;
  }
  const transport: Transporter = createTransport(smtpUrl!);
  const worker: OutboxWorker = startOutboxWorker(transport, config.MAIL_FROM, options.mailIntervalMs ?? 2000);

  const sessions = createSessionKit(config);
  const ctx: AppContext = { config, sessions, pokeMail: () => worker.poke() };
  const app = buildApp(ctx);
  const server = http.createServer(app);
  server.keepAliveTimeout = 65_000;
  // Fan-out through PostgreSQL always: another process may join this database at any time.
  const realtime = attachRealtime(server, ctx, { fanoutDatabaseUrl: config.DATABASE_URL });
  await realtime.ready;
  const mailWatcher = startThreadMailWatcher(ctx);
  const libraryWork = await startLibraryWork(config, ctx.pokeMail);

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.PORT, config.HOST, () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  const url = `http://${config.HOST === '0.0.0.0' ? '127.0.0.1' : config.HOST}:${port}`;
  log.info('server.listening', { url });

  let closing: Promise<void> | null = null;
  const close = () =>
    (closing ??= (async () => {
      await mailWatcher.stop();
      await libraryWork.stop();
      await realtime.close();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
      await worker.stop();
      transport.close();
      await catcher?.close();
      await closePhotoStores();
      await sessions.close();
      await closeSequelize();
    })());

  return { url, port, config, mailCatcherPort: catcher?.port ?? null, close };
}

/** Run directly (`tsx server/src/index.ts`): start, and stop cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  try {
    const running = await startServer();
    const stop = (signal: string) => {
      log.info('server.stopping', { signal });
      running.close().then(
        () => process.exit(0),
        () => process.exit(1),
      );
    };
    process.once('SIGINT', () => stop('SIGINT'));
    process.once('SIGTERM', () => stop('SIGTERM'));
    process.send?.({ type: 'listening', url: running.url, port: running.port, mailCatcherPort: running.mailCatcherPort });
  } catch (error) {
    console.error((error as Error).message);
    process.exit(1);
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  void main();
}
