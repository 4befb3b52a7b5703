// The browser project's server: the real client build and the real server on a free loopback
// port, against its own database with the demo seeded, as `npm start` would serve it.
import fs from 'node:fs';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { startServer, type RunningServer } from '../../server/src/index';
import { createSequelize } from '../../server/src/db/sequelize';
import { buildClientIfStale } from '../../scripts/local-env';

let running: RunningServer | null = null;

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error('E2E_DATABASE_URL is not set: run the tests with `npm test`.');
  buildClientIfStale((line) => console.log(`[e2e] ${line}`));
  const reset = createSequelize(url);
  await reset.query('DROP SCHEMA public CASCADE; CREATE SCHEMA public;');
  await reset.close();
  const uploads = path.join(process.env.TEST_TMP ?? '/tmp', 'e2e-uploads');
  fs.mkdirSync(uploads, { recursive: true });
  running = await startServer({
    env: { ...process.env, NODE_ENV: 'test', DATABASE_URL: url, PORT: '0', UPLOAD_DIR: uploads, PUBLIC_URL: undefined, SMTP_URL: undefined },
    seedDemo: true,
    mailIntervalMs: 300,
  });
  project.provide('baseUrl', running.url);
  return async () => {
    await running?.close();
    running = null;
  };
}
