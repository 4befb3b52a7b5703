// What `npm start` and `npm run dev` share: the local cluster under .data/, its database,
// the kept session secret, and "build the client when it is stale".
import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDatabase, startCluster, stopCluster, type LocalCluster } from '../server/src/lib/local-postgres';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
export const DATA_DIR = path.join(ROOT, '.data');
const LEASES = path.join(DATA_DIR, 'leases');

export function checkNode(): void {
  const [major, minor] = process.versions.node.split('.').map(Number);
  if (major < 20 || (major === 20 && minor < 19)) {
    console.error(`Sporewell needs Node.js 20.19 or newer; this is ${process.versions.node}.`);
    process.exit(1);
  }
}

export function sessionSecret(): string {
  const file = path.join(DATA_DIR, 'session-secret');
  fs.mkdirSync(DATA_DIR, { recursive: true });
  if (!fs.existsSync(file)) fs.writeFileSync(file, crypto.randomBytes(48).toString('base64url'), { mode: 0o600 });
  return fs.readFileSync(file, 'utf8').trim();
}

export interface LocalDatabase {
  url: string;
  cluster: LocalCluster | null;
  release(): void;
}

/** Starts (or reuses) the local cluster and takes a lease on it; the last lease out stops it. */
export async function localDatabase(say: (line: string) => void): Promise<LocalDatabase> {
  if (process.env.DATABASE_URL) {
    say('Using the database in DATABASE_URL (no local cluster started).');
    return { url: process.env.DATABASE_URL, cluster: null, release: () => undefined };
  }
  const cluster = await startCluster({ dataDir: path.join(DATA_DIR, 'pg'), metaFile: path.join(DATA_DIR, 'pg.json'), preferredPort: 54329, say });
  say(cluster.startedHere ? `Started PostgreSQL on 127.0.0.1:${cluster.port}.` : `PostgreSQL is already running on 127.0.0.1:${cluster.port}; sharing it.`);
  await ensureDatabase(cluster, 'sporewell');
  fs.mkdirSync(LEASES, { recursive: true });
  const lease = path.join(LEASES, String(process.pid));
  fs.writeFileSync(lease, String(Date.now()));
  let released = false;
  return {
    url: cluster.url('sporewell'),
    cluster,
    release() {
      if (released) return;
      released = true;
      fs.rmSync(lease, { force: true });
      if (liveLeases().length === 0) {
        say('Stopping PostgreSQL…');
        stopCluster(cluster.dataDir);
      } else {
        say('Another Sporewell is still using PostgreSQL; leaving it running.');
      }
    },
  };
}

function liveLeases(): string[] {
  if (!fs.existsSync(LEASES)) return [];
  return fs.readdirSync(LEASES).filter((pid) => {
    try {
      process.kill(Number(pid), 0);
      return true;
    } catch {
      fs.rmSync(path.join(LEASES, pid), { force: true });
      return false;
    }
  });
}

function newestMtime(dir: string): number {
  let newest = 0;
  if (!fs.existsSync(dir)) return newest;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules') continue;
    const full = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(full) : fs.statSync(full).mtimeMs);
  }
  return newest;
}

export function buildClientIfStale(say: (line: string) => void): void {
  const built = path.join(ROOT, 'dist/client/index.html');
  const sources = Math.max(
    newestMtime(path.join(ROOT, 'client')),
    newestMtime(path.join(ROOT, 'server/shared')),
    fs.statSync(path.join(ROOT, 'vite.config.ts')).mtimeMs,
    fs.statSync(path.join(ROOT, 'package-lock.json')).mtimeMs,
  );
  if (fs.existsSync(built) && fs.statSync(built).mtimeMs >= sources) return;
  say('Building the client…');
  const result = spawnSync(process.execPath, [path.join(ROOT, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], {
    cwd: ROOT,
    stdio: 'inherit',
    // Always React's production build, even when the tests (NODE_ENV=test) ask for the build.
    env: { ...process.env, NODE_ENV: 'production' },
  });
  if (result.status !== 0) throw new Error('The client build failed (see above).');
}
