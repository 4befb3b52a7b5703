// Builds the real app against the test database, the way index.ts does, minus the listen.
import type { Express } from 'express';
import supertest from 'supertest';
import { buildApp } from '../../server/src/app';
import { parseConfig, type Config } from '../../server/src/config/env';
import type { AppContext } from '../../server/src/context';
import { initModels } from '../../server/src/db/models';
import { initSequelize } from '../../server/src/db/sequelize';
import { createSessionKit, type SessionKit } from '../../server/src/lib/session';

export interface TestApp {
  app: Express;
  config: Config;
  ctx: AppContext;
  sessions: SessionKit;
  mailPokes: number;
  close(): Promise<void>;
}

export const TEST_ORIGIN = 'http://127.0.0.1:3999';

export function testConfig(overrides: Record<string, string> = {}): Config {
  return parseConfig({
    ...process.env,
    NODE_ENV: 'test',
    PUBLIC_URL: TEST_ORIGIN,
    ...overrides,
  });
}

export function makeTestApp(overrides: Record<string, string> = {}): TestApp {
  const config = testConfig(overrides);
  const sequelize = initSequelize(config.DATABASE_URL);
  initModels(sequelize);
  const sessions = createSessionKit(config);
  const result: TestApp = {
    app: undefined as unknown as Express,
    config,
    sessions,
    mailPokes: 0,
    ctx: undefined as unknown as AppContext,
    async close() {
      await sessions.close();
    },
  };
  result.ctx = { config, sessions, pokeMail: () => void (result.mailPokes += 1) };
  result.app = buildApp(result.ctx);
  return result;
}

/** A supertest agent keeps cookies between requests, like one browser. */
export function agent(app: Express) {
  return supertest.agent(app);
}

export function cookieOf(res: { headers: Record<string, unknown> }, name = 'sporewell.sid'): string | null {
  const raw = res.headers['set-cookie'];
  const list = Array.isArray(raw) ? raw : raw ? [String(raw)] : [];
  const found = list.find((c: string) => c.startsWith(`${name}=`));
  return found ? found.split(';')[0] : null;
}
