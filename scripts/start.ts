// `npm start`: everything a newcomer needs, on embedded defaults. With WORKERS=N (N > 1) it runs
// N server processes on consecutive ports from PORT, all on the one database (DEVELOPERS.md
// "Several processes"): the first starts alone and does the migrations, demo seed and guide
// loading; the others start once it serves and find that work done.
import { z } from 'zod';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/src/db/seeders/demo-data';
import { startServer } from '../server/src/index';
import { buildClientIfStale, checkNode, localDatabase, sessionSecret, type LocalDatabase } from './local-env';
import { spawnServer, spawnServers, stopProcess, type SpawnedServer, type SpawnOptions } from './spawn-servers';

const say = (line: string) => console.log(`[sporewell] ${line}`);

const workersSchema = z.coerce
  .number({ error: 'WORKERS must be a whole number of processes, such as 2.' })
  .int('WORKERS must be a whole number of processes, such as 2.')
  .min(1, 'WORKERS must be at least 1.')
  .max(32, 'WORKERS must be at most 32 (one machine has only so many cores).');

/** A process that falls over is started again, but not more than this often. */
const MAX_RESTARTS_PER_MINUTE = 3;

async function main(): Promise<void> {
  checkNode();
  const workers = workersSchema.safeParse(process.env.WORKERS || '1');
  if (!workers.success) {
    console.error(`[sporewell] ${workers.error.issues[0].message}`);
    process.exit(1);
  }
  const db = await localDatabase(say);
  try {
    buildClientIfStale(say);
    const env: Record<string, string | undefined> = {
      ...process.env,
      DATABASE_URL: db.url,
      SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(),
      UPLOAD_DIR: process.env.UPLOAD_DIR ?? '.data/uploads',
    };
    const production = env.NODE_ENV === 'production';
    const seed = !production && env.SEED_DEMO !== '0';
    if (workers.data === 1) await runOne(env, seed, db);
    else await runSeveral(workers.data, env, seed, db);
    if (!production) {
      say(`Demo accounts (demo only; password "${DEMO_PASSWORD}"):`);
      for (const role of ['grower', 'mentor', 'steward'] as const) {
        const user = DEMO_USERS.find((u) => u.email === `${role}@example.test`);
        if (user) say(`  ${role.padEnd(8)} ${user.email}  (${user.displayName})`);
      }
    }
  } catch (error) {
    console.error(`[sporewell] ${(error as Error).message}`);
    db.release();
    process.exit(1);
  }
}

async function runOne(env: Record<string, string | undefined>, seed: boolean, db: LocalDatabase): Promise<void> {
  const running = await startServer({ env, seedDemo: seed });
  say(`Sporewell is ready at ${running.url}`);
  if (running.mailCatcherPort) say(`Mail is caught locally (SMTP on 127.0.0.1:${running.mailCatcherPort}); stewards read it on the Steward desk.`);
  onStopSignal(async () => {
    await running.close().catch(() => undefined);
  }, db);
}

async function runSeveral(n: number, env: Record<string, string | undefined>, seed: boolean, db: LocalDatabase): Promise<void> {
  const basePort = Number(env.PORT ?? 3000);
  if (!Number.isInteger(basePort) || basePort < 0 || basePort + n - 1 > 65535) throw new Error(`PORT ${env.PORT} leaves no room for ${n} consecutive ports.`);
  // PORT=0 asks for any free ports; otherwise PORT, PORT+1, … so a load balancer can list them.
  const ports = basePort === 0 ? undefined : Array.from({ length: n }, (_, i) => basePort + i);
  const options: SpawnOptions = {
    env: { ...env, PORT: undefined },
    // Only the first process seeds; the advisory lock would keep the others safe anyway.
    envFor: (i) => ({ SEED_DEMO: seed && i === 0 ? '1' : '0' }),
    output: 'inherit',
    readyTimeoutMs: 120_000,
  };
  say(`Starting ${n} processes${ports ? ` on ports ${ports[0]}–${ports.at(-1)}` : ''}…`);
  const cluster = await spawnServers(n, { ...options, ports, start: 'first-alone' });
  const current: SpawnedServer[] = [...cluster.servers];
  let stopping = false;

  const restartsOf = current.map(() => [] as number[]);
  const watch = (server: SpawnedServer) => {
    void server.exited.then(async (code) => {
      // A clean exit is a stop someone asked for (Ctrl-C reaches every process of the terminal).
      if (stopping || code === 0) return;
      const recent = (restartsOf[server.index] = restartsOf[server.index].filter((at) => at > Date.now() - 60_000));
      if (recent.length >= MAX_RESTARTS_PER_MINUTE) {
        say(`Process ${server.index} (port ${server.port}) keeps ending (${code}); stopping all of them.`);
        await stopAll();
        db.release();
        process.exit(1);
      }
      recent.push(Date.now());
      say(`Process ${server.index} (port ${server.port}) ended (${code}); starting it again…`);
      await new Promise((resolve) => setTimeout(resolve, 1_000));
      if (stopping) return;
      try {
        const again = await spawnServer(server.index, server.port, options);
        current[server.index] = again;
        watch(again);
        say(`Process ${server.index} is back at ${again.url}`);
      } catch (error) {
        say((error as Error).message);
        watch(server);
      }
    });
  };
  const stopAll = async () => {
    stopping = true;
    await Promise.all(current.map(stopProcess));
  };
  current.forEach(watch);

  say(`Sporewell is ready at ${current.map((s) => s.url).join(', ')} (one database; put a load balancer in front, see README "Running more than one process").`);
  const catcher = current.find((s) => s.mailCatcherPort)?.mailCatcherPort;
  if (catcher) say(`Mail is caught locally (each process runs a catcher, e.g. SMTP on 127.0.0.1:${catcher}); stewards read it on the Steward desk.`);
  onStopSignal(stopAll, db);
}

function onStopSignal(stop: () => Promise<void>, db: LocalDatabase): void {
  let stopping = false;
  const handle = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    say(`${signal}: stopping…`);
    await stop();
    db.release();
    process.exit(0);
  };
  process.on('SIGINT', () => void handle('SIGINT'));
  process.on('SIGTERM', () => void handle('SIGTERM'));
}

void main();
