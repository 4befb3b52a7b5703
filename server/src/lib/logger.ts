// Structured one-line JSON logs. Security events (sign-in, refused access, role changes) go
// through `security` so they can be found and asserted (ASVS 16.3).
type Level = 'error' | 'info' | 'debug';
const order: Record<string, number> = { silent: 0, error: 1, info: 2, debug: 3 };
let threshold = order[process.env.LOG_LEVEL ?? (process.env.NODE_ENV === 'test' ? 'error' : 'info')] ?? 2;

export type LogSink = (line: string) => void;
let sink: LogSink = (line) => process.stdout.write(line + '\n');

export function setLogSink(next: LogSink, level?: keyof typeof order): void {
  sink = next;
  if (level) threshold = order[level];
}
export function setLogLevel(level: keyof typeof order): void {
  threshold = order[level];
}

function write(level: Level, event: string, data: Record<string, unknown> = {}): void {
  if (order[level] > threshold) return;
  sink(JSON.stringify({ t: new Date().toISOString(), level, event, ...data }));
}

export const log = {
  error: (event: string, data?: Record<string, unknown>) => write('error', event, data),
  info: (event: string, data?: Record<string, unknown>) => write('info', event, data),
  debug: (event: string, data?: Record<string, unknown>) => write('debug', event, data),
  /** Always written at info level or above, whatever the level, unless silent. */
  security: (event: string, data?: Record<string, unknown>) => {
    if (threshold === 0) return;
    sink(JSON.stringify({ t: new Date().toISOString(), level: 'security', event, ...data }));
  },
};
