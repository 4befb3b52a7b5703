// Child processes of the bench: each in its own process group, its output kept (and shown when it
// fails), waited on with a deadline, and stopped when the bench ends however it ends.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export interface Child {
  name: string;
  proc: ChildProcess;
  /** everything it printed so far, stdout and stderr interleaved */
  output(): string;
  /** resolves with the exit code (or null when killed by a signal) */
  exited: Promise<number | null>;
  /** the first IPC message that passes `test` */
  message<T>(test: (m: unknown) => m is T, timeoutMs: number): Promise<T>;
  /** the first output line matching `pattern` (already printed ones count) */
  line(pattern: RegExp, timeoutMs: number): Promise<RegExpMatchArray>;
  stop(): Promise<void>;
}

const live = new Set<Child>();

export interface SpawnOptions {
  env?: Record<string, string | undefined>;
  args?: string[];
  /** flags for Node itself, e.g. --cpu-prof when looking for where the time goes */
  nodeArgs?: string[];
  /** how the child is asked to stop: the other helpers' benches clean up their clusters on SIGINT only */
  stopSignal?: NodeJS.Signals;
  /** how long a stop waits before SIGKILL; long for the search benches, which answer a signal only between two rankings */
  killAfterMs?: number;
  /** print its lines as they come, prefixed with the name */
  echo?: boolean;
}

/** Runs a TypeScript file with tsx in a child Node process (with an IPC channel). */
export function spawnTs(name: string, script: string, options: SpawnOptions = {}): Child {
  const proc = spawn(process.execPath, [...(options.nodeArgs ?? []), '--import', 'tsx', path.resolve(ROOT, script), ...(options.args ?? [])], {
    cwd: ROOT,
    env: { ...process.env, ...options.env },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
    detached: true,
  });
  let text = '';
  let pending = '';
  const lineWaiters = new Set<{ pattern: RegExp; resolve: (m: RegExpMatchArray) => void }>();
  const onData = (chunk: Buffer) => {
    const s = chunk.toString('utf8');
    text += s;
    pending += s;
    const lines = pending.split('\n');
    pending = lines.pop() ?? '';
    for (const l of lines) {
      if (options.echo) console.log(`  [${name}] ${l}`);
      for (const w of lineWaiters) {
        const m = l.match(w.pattern);
        if (m) {
          lineWaiters.delete(w);
          w.resolve(m);
        }
      }
    }
  };
  proc.stdout!.on('data', onData);
  proc.stderr!.on('data', onData);
  const exited = new Promise<number | null>((resolve) => proc.once('exit', (code) => resolve(code)));
  let gone = false;
  void exited.then(() => {
    gone = true;
    live.delete(child);
  });
  const failIfGone = <T>(waiting: Promise<T>, what: string, timeoutMs: number): Promise<T> =>
    new Promise<T>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`${name}: no ${what} within ${timeoutMs / 1000} s.\n${tail(text)}`)), timeoutMs);
      waiting.then(
        (v) => {
          clearTimeout(timer);
          resolve(v);
        },
        reject,
      );
      void exited.then((code) => {
        clearTimeout(timer);
        reject(new Error(`${name} exited (code ${code}) before ${what}.\n${tail(text)}`));
      });
    });

  const child: Child = {
    name,
    proc,
    output: () => text,
    exited,
    message<T>(test: (m: unknown) => m is T, timeoutMs: number) {
      return failIfGone(
        new Promise<T>((resolve) => {
          const onMessage = (m: unknown) => {
            if (!test(m)) return;
            proc.off('message', onMessage);
            resolve(m);
          };
          proc.on('message', onMessage);
        }),
        'IPC message',
        timeoutMs,
      );
    },
    line(pattern: RegExp, timeoutMs: number) {
      const already = text.split('\n').map((l) => l.match(pattern)).find((m) => m);
      if (already) return Promise.resolve(already);
      return failIfGone(new Promise<RegExpMatchArray>((resolve) => lineWaiters.add({ pattern, resolve })), `line ${pattern}`, timeoutMs);
    },
    async stop() {
      if (gone) return;
      signalGroup(proc, options.stopSignal ?? 'SIGTERM');
      const timer = setTimeout(() => signalGroup(proc, 'SIGKILL'), options.killAfterMs ?? 20_000);
      await exited;
      clearTimeout(timer);
    },
  };
  live.add(child);
  return child;
}

function signalGroup(proc: ChildProcess, signal: NodeJS.Signals): void {
  if (proc.pid === undefined) return;
  try {
    process.kill(-proc.pid, signal);
  } catch {
    // Already gone.
  }
}

export function tail(text: string, lines = 25): string {
  return text.trimEnd().split('\n').slice(-lines).join('\n');
}

/** Stops every child still running (the bench's finally and signal handlers). */
export async function stopAllChildren(): Promise<void> {
  await Promise.all([...live].map((c) => c.stop()));
}

export interface Listening {
  type: 'listening';
  url: string;
  port: number;
}
export const isListening = (m: unknown): m is Listening => typeof m === 'object' && m !== null && (m as { type?: unknown }).type === 'listening';
