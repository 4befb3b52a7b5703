// HTTP load with autocannon from the bench process, against servers running in child processes.
// Latencies are taken from autocannon's `response` events (every response, in ms) so any
// percentile can be read, not only the ones autocannon's summary carries.
import autocannon, { type Request } from 'autocannon';
import { quantile } from './stats';

export interface HttpRun {
  requests: number;
  seconds: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  /** status code → count */
  statuses: Record<string, number>;
  errors: number;
  timeouts: number;
}

export async function runLoad(options: {
  url: string;
  connections: number;
  /** how long to load; ignored when `amount` is given */
  seconds: number;
  /** a fixed number of requests instead, every one of them answered (or timed out) before the run ends */
  amount?: number;
  headers?: Record<string, string>;
  method?: string;
  requests?: Request[];
  overallRate?: number;
}): Promise<HttpRun> {
  const times: number[] = [];
  const statuses: Record<string, number> = {};
  // autocannon refuses keys that are present but undefined (e.g. `method`).
  const given = Object.fromEntries(
    Object.entries({
      method: options.method,
      headers: options.headers,
      requests: options.requests,
      overallRate: options.overallRate,
      ...(options.amount ? { amount: options.amount } : { duration: options.seconds }),
    }).filter(([, v]) => v !== undefined),
  );
  const instance = autocannon({ url: options.url, connections: options.connections, timeout: 10, ...given });
  instance.on('response', (_client: unknown, statusCode: number, _bytes: number, responseTime: number) => {
    times.push(responseTime);
    statuses[statusCode] = (statuses[statusCode] ?? 0) + 1;
  });
  const result = await instance;
  times.sort((a, b) => a - b);
  return {
    requests: times.length,
    seconds: result.duration,
    perSecond: times.length / result.duration,
    p50: quantile(times, 0.5),
    p95: quantile(times, 0.95),
    p99: quantile(times, 0.99),
    max: times.at(-1) ?? NaN,
    statuses,
    errors: result.errors,
    timeouts: result.timeouts,
  };
}

export const only2xx = (run: HttpRun) => Object.entries(run.statuses).every(([code]) => code.startsWith('2')) && run.errors === 0;
export const statusSummary = (run: HttpRun) =>
  Object.entries(run.statuses)
    .map(([code, n]) => `${n}×${code}`)
    .join(', ') + (run.errors ? `, ${run.errors} errors` : '');
