// autocannon and cookie-signature ship without type declarations; these are the parts the
// bench uses.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  export interface Histogram {
    average: number;
    mean: number;
    min: number;
    max: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
  }
  export interface Result {
    requests: Histogram & { total: number; sent: number };
    latency: Histogram;
    throughput: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    statusCodeStats: Record<string, { count: number }>;
  }
  export interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (request: Request, context: Record<string, unknown>) => Request;
  }
  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    amount?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: Request[];
    overallRate?: number;
    maxOverallRequests?: number;
  }
  export interface Instance extends EventEmitter, PromiseLike<Result> {
    stop(): void;
  }
  function autocannon(options: Options): Instance;
  export default autocannon;
}

declare module 'cookie-signature' {
  export function sign(value: string, secret: string): string;
  export function unsign(value: string, secret: string): string | false;
}
