// `npm run dev`: the API on API_PORT (default 3000) with the local cluster, and Vite with HMR
// on 5173 proxying /api, /uploads and /socket.io (ws) to it.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { startServer } from '../server/src/index';
import { checkNode, localDatabase, ROOT, sessionSecret } from './local-env';

const say = (line: string) => console.log(`[dev] ${line}`);

async function main(): Promise<void> {
  checkNode();
  const db = await localDatabase(say);
  const apiPort = process.env.API_PORT ?? '3000';
  const vitePort = process.env.VITE_PORT ?? '5173';
  const running = await startServer({
    env: {
      ...process.env,
      PORT: apiPort,
      DATABASE_URL: db.url,
      SESSION_SECRET: process.env.SESSION_SECRET ?? sessionSecret(),
      PUBLIC_URL: process.env.PUBLIC_URL ?? `http://127.0.0.1:${vitePort}`,
    },
    seedDemo: true,
  });
  say(`API on ${running.url}`);
  const vite = spawn(process.execPath, [path.join(ROOT, 'node_modules/vite/bin/vite.js'), '--port', vitePort, '--strictPort'], {
    cwd: ROOT,
    stdio: 'inherit',
    env: { ...process.env, API_PORT: String(running.port) },
  });
  say(`Open http://127.0.0.1:${vitePort}`);
  const stop = async () => {
    vite.kill('SIGTERM');
    await running.close().catch(() => undefined);
    db.release();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
  vite.on('exit', () => void stop());
}

void main();
