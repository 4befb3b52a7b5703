// Socket fan-out between processes through PostgreSQL: the socket.io PostgreSQL adapter sends
// every broadcast, fetchSockets and disconnectSockets to the other processes as a NOTIFY (big
// payloads through the socket_io_attachments table, migration 0500) and LISTENs for theirs.
// It gets a pool of its own: one connection stays checked out for LISTEN for the life of the
// process, which must never starve the Sequelize pool that serves requests.
//
// Two costs the adapter would pay per broadcast are cut here. Alone on the database (no other
// process heard from), a broadcast goes straight to this process's sockets: a NOTIFY nobody
// else listens to would only cost a round trip and a statement. With others, the NOTIFYs made
// while one is being sent go together in one statement, in the order they were made.
import crypto from 'node:crypto';
import pg from 'pg';
import { createAdapter } from '@socket.io/postgres-adapter';
import { isConnectionError } from '../db/sequelize';
import { log } from '../lib/logger';
import type { ThreadServer } from './thread-handlers';

export const ATTACHMENTS_TABLE = 'socket_io_attachments';

export interface Fanout {
  /** Resolves once this process LISTENs and has asked the others to make themselves known. */
  ready: Promise<void>;
  close(): Promise<void>;
}

const READY_WITHIN_MS = 10_000;

export function attachFanout(io: ThreadServer, databaseUrl: string): Fanout {
  // A name of its own, so the LISTEN connection of this process can be found in pg_stat_activity.
  const applicationName = `sporewell-fanout-${process.pid}-${crypto.randomBytes(3).toString('hex')}`;
  const pool = new pg.Pool({
    connectionString: databaseUrl,
    // One connection LISTENs; the other sends every NOTIFY in turn. The adapter delivers even to
    // this process's own sockets only after its NOTIFY went out, so one sending connection keeps
    // this process's broadcasts (presence, typing on/off) in the order they were made.
    max: 2,
    application_name: applicationName,
    // TCP keep-alive notices a LISTEN connection whose database host vanished.
    keepAlive: true,
    connectionTimeoutMillis: 5_000,
  });
  let closed = false;
  const report = reporter(() => closed);
  // A lost connection is an 'error' event: on an idle client the pool forwards it; the LISTEN
  // client is checked out, and an unheard 'error' would end the process. The adapter sees the
  // connection end and LISTENs again (on a new connection) once the database is back.
  pool.on('error', report);
  // The adapter forgets a LISTEN connection that ended without handing it back, and the pool
  // would count it as in use for ever: after a database restart or two there would be no
  // connection left to send with. Hand such a connection back, so the pool drops it.
  const checkedOut = new Set<pg.PoolClient>();
  pool.on('acquire', (client) => checkedOut.add(client));
  pool.on('release', (_error, client) => checkedOut.delete(client));
  pool.on('connect', (client) => {
    client.on('error', report);
    client.on('end', () =>
      setImmediate(() => {
        if (!checkedOut.has(client)) return;
        try {
          client.release(new Error('connection ended'));
        } catch {
          // already handed back
        }
      }),
    );
  });
  const notifier = batchedNotify(pool);
  // The prefix batchedNotify adds must still fit under NOTIFY's 8000-byte limit.
  const makeAdapter = createAdapter(notifier.pool, { tableName: ATTACHMENTS_TABLE, errorHandler: report, payloadThreshold: 7_900 });
  io.adapter(function localWhenAlone(this: unknown, nsp: Parameters<typeof makeAdapter>[0]) {
    const made = makeAdapter(nsp) as unknown as { nodesMap: Map<string, number>; broadcast(packet: unknown, opts: BroadcastOptions): unknown };
    const broadcast = made.broadcast.bind(made);
    // The `local` flag is the adapter's own "this process only": it then delivers at once, without a NOTIFY.
    made.broadcast = (packet, opts) => broadcast(packet, made.nodesMap.size === 0 ? { ...opts, flags: { ...opts.flags, local: true } } : opts);
    return made;
  } as unknown as typeof makeAdapter);
  const adapter = io.of('/').adapter as unknown as { init(): void; close(): void | Promise<void> };

  const ready = (async () => {
    const started = Date.now();
    while (!closed && Date.now() - started < READY_WITHIN_MS) {
      try {
        const { rowCount } = await pool.query(
          `SELECT 1 FROM pg_stat_activity WHERE application_name = $1 AND state = 'idle' AND query LIKE 'LISTEN %'`,
          [applicationName],
        );
        if (rowCount) {
          // The greeting sent when the adapter was made may have gone out before this process
          // listened, so the answers were missed: greet again, now that they will be heard.
          adapter.init();
          log.info('realtime.fanout_listening', {});
          return;
        }
      } catch (error) {
        report(error as Error);
      }
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    if (!closed) log.error('realtime.fanout_not_listening', { waitedMs: READY_WITHIN_MS });
  })();

  return {
    ready,
    async close() {
      if (closed) return;
      closed = true;
      await ready;
      // Broadcasts already made (the presence of the people just dropped) go out first.
      await drained(pool, 1, notifier);
      // Tells the other processes this one is gone (else they wait for its heartbeat to time
      // out, and ask it in vain meanwhile) and hands the LISTEN connection back. That goodbye
      // is queued in the pool, which must not end before it is sent.
      await adapter.close();
      await drained(pool, 0, notifier);
      await pool.end();
    },
  };
}

/** Waits (at most 2 s) until no NOTIFY is queued, nothing waits for a connection and at most `busy` are in use. */
async function drained(pool: pg.Pool, busy: number, notifier: BatchedNotify): Promise<void> {
  const deadline = Date.now() + 2_000;
  do await new Promise((resolve) => setTimeout(resolve, 5));
  while (Date.now() < deadline && (notifier.queued() > 0 || pool.waitingCount > 0 || pool.totalCount - pool.idleCount > busy));
}

interface BroadcastOptions {
  flags?: Record<string, unknown>;
}

const NOTIFY = 'SELECT pg_notify($1, $2)';

interface BatchedNotify {
  /** what the adapter is given as its pool: NOTIFYs are batched, everything else passes through */
  pool: pg.Pool;
  queued(): number;
}

/**
 * The adapter sends each message as its own `SELECT pg_notify($1, $2)`. Here those made while
 * one statement is on its way wait and go together in the next, one after another, so the
 * order stays the order they were made in. PostgreSQL drops a notification identical to one
 * already sent in the same transaction; a counter at the front of each payload (the adapter
 * reads the payload as JSON and ignores a field it does not know) keeps two equal messages
 * (typing on, off, on) both.
 */
function batchedNotify(pool: pg.Pool): BatchedNotify {
  let waiting: { channel: string; payload: string; resolve(): void; reject(error: unknown): void }[] = [];
  let sending = false;
  let counter = 0;
  const send = async () => {
    sending = true;
    while (waiting.length) {
      const batch = waiting;
      waiting = [];
      try {
        await pool.query(`SELECT count(pg_notify(c, p)) FROM unnest($1::text[], $2::text[]) AS t(c, p)`, [batch.map((n) => n.channel), batch.map((n) => n.payload)]);
        for (const n of batch) n.resolve();
      } catch (error) {
        for (const n of batch) n.reject(error);
      }
    }
    sending = false;
  };
  const query = (text: unknown, values?: unknown[]) => {
    if (text !== NOTIFY || !values) return (pool.query as (text: unknown, values?: unknown[]) => Promise<unknown>)(text, values);
    const [channel, payload] = values as [string, string];
    const unique = payload.startsWith('{') && payload !== '{}' ? `{"~":${(counter = (counter + 1) % 1e9)},${payload.slice(1)}` : payload;
    return new Promise<void>((resolve, reject) => {
      waiting.push({ channel, payload: unique, resolve, reject });
      if (!sending) void send();
    });
  };
  // The adapter uses nothing of its pool but connect() (for LISTEN) and query().
  const facade = { connect: () => pool.connect(), query } as unknown as pg.Pool;
  return { pool: facade, queued: () => waiting.length + (sending ? 1 : 0) };
}

/** Logs fan-out trouble: a database outage once every 10 s rather than once per broadcast. */
function reporter(isClosed: () => boolean): (error: Error) => void {
  let quietUntil = 0;
  return (error) => {
    if (isClosed()) return;
    if (isConnectionError(error)) {
      if (Date.now() < quietUntil) return;
      quietUntil = Date.now() + 10_000;
      log.error('realtime.fanout_unreachable', { error: error.message });
      return;
    }
    log.error('realtime.fanout_error', { error: error?.message ?? String(error) });
  };
}
