// `npm start`: everything a newcomer needs, on embedded defaults.
import { DEMO_PASSWORD, DEMO_USERS } from '../server/src/db/seeders/demo-data';
import { startServer } from '../server/src/index';
import { buildClientIfStale, checkNode, localDatabase, sessionSecret } from './local-env';

const say = (line: string) => console.log(`[sporewell] ${line}`);

async function main(): Promise<void> {
  checkNode();
  const db = await localDatabase(say);
  let stopping = false;
  try {
    buildClientIfStale(say);
    const env: Record<string, string | undefined> = {
      ...process.env,
      DATABASE_URL: db.url,
      SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(),
      UPLOAD_DIR: process.env.UPLOAD_DIR ?? '.data/uploads',
    };
    const production = env.NODE_ENV === 'production';
    const running = await startServer({ env, seedDemo: !production && env.SEED_DEMO !== '0' });
    say(`Sporewell is ready at ${running.url}`);
    if (running.mailCatcherPort) say(`Mail is caught locally (SMTP on 127.0.0.1:${running.mailCatcherPort}); stewards read it on the Steward desk.`);
    if (!production) {
      say(`Demo accounts (demo only; password "${DEMO_PASSWORD}"):`);
      for (const role of ['grower', 'mentor', 'steward'] as const) {
        const user = DEMO_USERS.find((u) => u.email === `${role}@example.test`);
        if (user) say(`  ${role.padEnd(8)} ${user.email}  (${user.displayName})`);
      }
    }
    const stop = async (signal: string) => {
      if (stopping) return;
      stopping = true;
      say(`${signal}: stopping…`);
      await running.close().catch(() => undefined);
      db.release();
      process.exit(0);
    };
    process.on('SIGINT', () => void stop('SIGINT'));
    process.on('SIGTERM', () => void stop('SIGTERM'));
  } catch (error) {
    console.error(`[sporewell] ${(error as Error).message}`);
    db.release();
    process.exit(1);
  }
}

void main();
