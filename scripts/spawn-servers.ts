// Several Sporewell processes on one database, each a real `node --import tsx server/src/index.ts`
// on its own port: what `npm start` runs with WORKERS=N, what the scale-out tests and the bench
// run against. A process counts as up when /api/health answers { ok: true, db: true }.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { freePort } from '../server/src/lib/local-postgres';
import { ROOT } from './local-env';

export interface SpawnedServer {
  index: number;
  url: string;
  port: number;
  pid: number;
  /** The loopback mail catcher of this process, when it runs one (no SMTP_URL). */
  mailCatcherPort: number | null;
  /** The last lines the process wrote (with output 'capture'), for a failure message. */
  output(): string;
  /** Resolves with the exit code (or signal) once the process has ended. */
  exited: Promise<number | string>;
}

export interface SpawnOptions {
  /** The environment of every process (DATABASE_URL, SESSION_SECRET, …); PORT is set per process. */
  env: Record<string, string | undefined>;
  /** One port per process; free loopback ports when not given. */
  ports?: number[];
  /** Extra settings for process `index` (e.g. its own SMTP_URL or SEED_DEMO). */
  envFor?: (index: number) => Record<string, string | undefined>;
  /**
   * 'together' starts every process at the same moment (the advisory locks sort out migrations,
   * demo seed and the knowledge loader); 'first-alone' lets the first one do that work before
   * the others start, so they find it done.
   */
  start?: 'together' | 'first-alone';
  /** 'inherit' shows the logs, 'capture' keeps the last few KiB of each for errors. */
  output?: 'inherit' | 'capture';
  readyTimeoutMs?: number;
}

export interface SpawnedServers {
  servers: SpawnedServer[];
  urls: string[];
  /** SIGTERM to each process by its pid (SIGKILL after 10 s); resolves when all have ended. */
  stop(): Promise<void>;
}

const SERVER_ENTRY = path.join(ROOT, 'server/src/index.ts');
const KEEP_OUTPUT = 16 * 1024;

/** Starts one process and waits until it serves; throws (and ends it) if it does not. */
export async function spawnServer(index: number, port: number, options: SpawnOptions): Promise<SpawnedServer> {
  const env = { ...options.env, ...options.envFor?.(index), PORT: String(port) };
  const capture = (options.output ?? 'capture') === 'capture';
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', SERVER_ENTRY], {
    cwd: ROOT,
    env: Object.fromEntries(Object.entries(env).filter(([, v]) => v !== undefined)) as NodeJS.ProcessEnv,
    stdio: ['ignore', capture ? 'pipe' : 'inherit', capture ? 'pipe' : 'inherit', 'ipc'],
  });
  let tail = '';
  const keep = (chunk: Buffer) => {
    tail = (tail + chunk.toString('utf8')).slice(-KEEP_OUTPUT);
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  const exited = new Promise<number | string>((resolve) => child.once('exit', (code, signal) => resolve(code ?? signal ?? 'unknown')));
  let mailCatcherPort: number | null = null;
  child.on('message', (message: { type?: string; mailCatcherPort?: number | null }) => {
    if (message?.type === 'listening') mailCatcherPort = message.mailCatcherPort ?? null;
  });
  const url = `http://127.0.0.1:${port}`;
  const server: SpawnedServer = { index, url, port, pid: child.pid!, get mailCatcherPort() { return mailCatcherPort; }, output: () => tail, exited };
  try {
    await untilHealthy(url, exited, options.readyTimeoutMs ?? 60_000);
  } catch (error) {
    await stopProcess(server);
    throw new Error(`Sporewell process ${index} (port ${port}) did not start: ${(error as Error).message}\n${tail}`);
  }
  return server;
}

export async function spawnServers(n: number, options: SpawnOptions): Promise<SpawnedServers> {
  const ports = options.ports ?? (await distinctFreePorts(n));
  if (ports.length < n) throw new Error(`spawnServers: ${n} processes need ${n} ports.`);
  const started: SpawnedServer[] = [];
  const stop = async () => {
    await Promise.all(started.map(stopProcess));
  };
  try {
    if (options.start === 'first-alone') {
      started.push(await spawnServer(0, ports[0], options));
      for (const s of await Promise.all(ports.slice(1, n).map((port, i) => spawnServer(i + 1, port, options)))) started.push(s);
    } else {
      const results = await Promise.allSettled(ports.slice(0, n).map((port, i) => spawnServer(i, port, options)));
      for (const r of results) if (r.status === 'fulfilled') started.push(r.value);
      const failed = results.find((r): r is PromiseRejectedResult => r.status === 'rejected');
      if (failed) throw failed.reason;
    }
  } catch (error) {
    await stop();
    throw error;
  }
  started.sort((a, b) => a.index - b.index);
  return { servers: started, urls: started.map((s) => s.url), stop };
}

/** Ends one process by its pid: SIGTERM (a graceful stop), SIGKILL if it is still there after 10 s. */
export async function stopProcess(server: Pick<SpawnedServer, 'pid' | 'exited'>): Promise<void> {
  const signal = (name: NodeJS.Signals) => {
    try {
      process.kill(server.pid, name);
    } catch {
      // already gone
    }
  };
  signal('SIGTERM');
  let timer: NodeJS.Timeout | undefined;
  const ended = await Promise.race([server.exited.then(() => true), new Promise<false>((resolve) => (timer = setTimeout(() => resolve(false), 10_000)))]);
  clearTimeout(timer);
  if (!ended) {
    signal('SIGKILL');
    await server.exited;
  }
}

async function untilHealthy(url: string, exited: Promise<number | string>, timeoutMs: number): Promise<void> {
  let gone: number | string | null = null;
  void exited.then((code) => (gone = code));
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (gone !== null) throw new Error(`it exited (${gone})`);
    try {
      const res = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2_000) });
      const body = (await res.json().catch(() => null)) as { ok?: boolean; db?: boolean } | null;
      if (res.ok && body?.ok && body.db) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no healthy answer within ${Math.round(timeoutMs / 1000)} s`);
}

async function distinctFreePorts(n: number): Promise<number[]> {
  const ports = new Set<number>();
  while (ports.size < n) ports.add(await freePort());
  return [...ports];
}
