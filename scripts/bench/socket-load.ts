// Live-thread load: many socket.io clients in this process, two per case room, each room's two
// sockets taking turns to send; the latency is from `message:send` to the `message:new` the
// other socket of the room receives. The same load runs against Sporewell and the bare relay.
//
// Message k goes to room k mod R, from its first socket on even passes and its second on odd
// ones, so every socket sends at rate / (2R). After the untimed `warmupSeconds`, sending stops
// at `maxMessages` or `seconds` more, whichever comes first; then the run waits for every ack (15 s timeout each) and at most
// `drainMs` more for what is still on its way.
// Every message carries a unique clientId, which is how receipts are counted: once is right,
// twice is a duplicate, never (for a message whose ack said stored) is a loss.
import os from 'node:os';
import { monitorEventLoopDelay, performance } from 'node:perf_hooks';
import { io as connectClient, type Socket } from 'socket.io-client';
import type { CpuProbe } from './cpu-usage';
import { percentiles } from './stats';

export interface RoomSockets {
  caseId: number;
  /** Cookie header of each of the room's two sockets (ignored by the bare relay) */
  cookies: [string, string];
}

export interface ThreadLoadOptions {
  /**
   * Where the sockets connect (each sends its server's own URL as Origin): the first socket of
   * each room to the first server, the second to the last, so with two processes every
   * message crosses from one to the other.
   */
  servers: string[];
  rooms: RoomSockets[];
  ratePerSecond: number;
  seconds: number;
  maxMessages: number;
  /**
   * Seconds of sending at the same rate before the timed part (default 0): those messages are
   * counted for loss and duplicates like the others but left out of the latencies, so the
   * figures are of a warmed-up server (compiled code, pools and caches filled), for both runs.
   */
  warmupSeconds?: number;
  drainMs: number;
  /** how many handshakes / joins are in flight at once while setting up */
  wave?: number;
  /** pause between the last join and the first message (default 3 s) */
  settleMs?: number;
  /** CPU probes, read over the sending and draining only (not the connecting) */
  cpu?: Record<string, () => CpuProbe>;
}

export interface ThreadLoadResult {
  sockets: number;
  connectSeconds: number;
  connectFailures: number;
  joinFailures: number;
  sent: number;
  /** how many of `sent` were the untimed warm-up */
  warmup: number;
  sendSeconds: number;
  acked: number;
  /** error code (or "timeout") → count, for acks that did not say stored */
  ackFailures: Record<string, number>;
  received: number;
  lost: number;
  duplicated: number;
  /** a message that reached a socket other than the other one of its room */
  misdelivered: number;
  disconnects: number;
  latency: ReturnType<typeof percentiles>;
  /** the same for the messages sent in the first and in the second half of the sending */
  latencyByHalf: [ReturnType<typeof percentiles>, ReturnType<typeof percentiles>];
  ackLatency: ReturnType<typeof percentiles>;
  /** from the sender's ack to the other socket's receipt (negative when the receipt came first) */
  afterAck: ReturnType<typeof percentiles>;
  /** CPU ms over the sending and draining, by probe name (null where it could not be read) */
  cpuMs: Record<string, number | null>;
  /** every clientId of this run starts with it (to count what the server stored) */
  clientIdPrefix: string;
  /** how late this process's event loop ran its callbacks over the sending and draining, in ms */
  clientLoopDelay: { p50: number; p99: number; max: number };
  /** the 1-minute load average when the sending started and when the draining ended */
  loadAverage: [number, number];
}

type Client = Socket;

async function inWaves<T>(items: T[], wave: number, work: (item: T, index: number) => Promise<void>): Promise<void> {
  for (let from = 0; from < items.length; from += wave) {
    await Promise.all(items.slice(from, from + wave).map((item, i) => work(item, from + i)));
  }
}

function connect(url: string, cookie: string, origin: string): Promise<Client> {
  const socket = connectClient(url, {
    transports: ['websocket'],
    reconnection: false,
    forceNew: true,
    timeout: 20_000,
    extraHeaders: { cookie, origin },
  });
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket));
    socket.once('connect_error', (error) => {
      socket.close();
      reject(error);
    });
  });
}

export async function runThreadLoad(options: ThreadLoadOptions): Promise<ThreadLoadResult> {
  const wave = options.wave ?? 50;
  const tag = Math.random().toString(36).slice(2, 8);
  const prefix = `bench-${tag}-`;
  const R = options.rooms.length;
  const sockets: (Client | null)[] = new Array(R * 2).fill(null);
  let connectFailures = 0;
  let joinFailures = 0;
  let disconnects = 0;
  let running = true;

  const warmupSeconds = options.warmupSeconds ?? 0;
  const warmup = Math.floor(warmupSeconds * options.ratePerSecond);
  const total = warmup + options.maxMessages;
  const sentAt = new Float64Array(total);
  const receivedAt = new Float64Array(total);
  const receipts = new Uint16Array(total);
  const ackOk = new Uint8Array(total);
  const ackedAt = new Float64Array(total);
  const ackMs: number[] = [];
  const ackFailures: Record<string, number> = {};
  let misdelivered = 0;
  let acked = 0;
  let settled = 0;

  const sender = (k: number) => (k % R) * 2 + (Math.floor(k / R) % 2);
  const receiver = (k: number) => (k % R) * 2 + 1 - (Math.floor(k / R) % 2);

  const connectStarted = performance.now();
  try {
    await inWaves(options.rooms.flatMap((room) => room.cookies.map((cookie) => ({ cookie, caseId: room.caseId }))), wave, async ({ cookie }, index) => {
      try {
        const server = index % 2 === 0 ? options.servers[0] : options.servers[options.servers.length - 1];
        const socket = await connect(server, cookie, server);
        socket.on('disconnect', () => {
          if (running) disconnects += 1;
        });
        socket.on('message:new', (message: { clientId?: string | null }) => {
          const id = message.clientId;
          if (!id || !id.startsWith(prefix)) return;
          const k = Number(id.slice(prefix.length));
          if (!(k >= 0 && k < total)) return;
          if (receiver(k) !== index) {
            misdelivered += 1;
            return;
          }
          receipts[k] += 1;
          if (receipts[k] === 1) receivedAt[k] = performance.now();
        });
        sockets[index] = socket;
      } catch {
        connectFailures += 1;
      }
    });
    await inWaves(sockets.map((s, i) => ({ s, caseId: options.rooms[Math.floor(i / 2)].caseId })), wave, async ({ s, caseId }) => {
      if (!s) return;
      try {
        const answer = (await s.timeout(20_000).emitWithAck('case:join', { caseId })) as { ok: boolean };
        if (!answer.ok) joinFailures += 1;
      } catch {
        joinFailures += 1;
      }
    });
    const connectSeconds = (performance.now() - connectStarted) / 1000;
    // The joins set off presence broadcasts; let them go out before the timed sending starts.
    await new Promise((r) => setTimeout(r, options.settleMs ?? 3000));

    // Sending: a 1 ms tick tops the count up to where the rate says it should be by now.
    let sent = 0;
    const probes = Object.entries(options.cpu ?? {}).map(([name, make]) => [name, make()] as const);
    const sendStarted = performance.now();
    const loadAtStart = os.loadavg()[0];
    // The clients' own event loop: a receipt waits for it, so a busy bench process adds to the
    // latency of both runs alike (the same sockets, the same load, in this process).
    const loopDelay = monitorEventLoopDelay({ resolution: 1 });
    loopDelay.enable();
    const sendOne = (k: number) => {
      const socket = sockets[sender(k)];
      const fail = (code: string) => {
        ackFailures[code] = (ackFailures[code] ?? 0) + 1;
        settled += 1;
      };
      sentAt[k] = performance.now();
      if (!socket?.connected) return fail('not_connected');
      const caseId = options.rooms[k % R].caseId;
      socket.timeout(15_000).emit(
        'message:send',
        { caseId, clientId: `${prefix}${k}`, body: `Bench message ${k}: the top layer smells sweet again, no fuzz yet.` },
        (error: Error | null, answer?: { ok: boolean; error?: { code: string } }) => {
          if (error) return fail('timeout');
          if (!answer?.ok) return fail(answer?.error?.code ?? 'no_answer');
          ackOk[k] = 1;
          ackedAt[k] = performance.now();
          acked += 1;
          settled += 1;
          if (k >= warmup) ackMs.push(performance.now() - sentAt[k]);
        },
      );
    };
    await new Promise<void>((resolve) => {
      const timer = setInterval(() => {
        const elapsed = (performance.now() - sendStarted) / 1000;
        const due = Math.min(total, Math.floor(elapsed * options.ratePerSecond));
        while (sent < due) sendOne(sent++);
        if (sent >= total || elapsed >= options.seconds + warmupSeconds) {
          clearInterval(timer);
          resolve();
        }
      }, 1);
    });
    const sendSeconds = (performance.now() - sendStarted) / 1000;

    // Draining: first every ack answered (each has its own 15 s timeout), then every stored
    // message received, or `drainMs` after the last ack.
    const pause = () => new Promise((r) => setTimeout(r, 50));
    const acksBy = performance.now() + 20_000;
    while (settled < sent && performance.now() < acksBy) await pause();
    const drainUntil = performance.now() + options.drainMs;
    const allIn = () => {
      for (let k = 0; k < sent; k++) if (ackOk[k] && receipts[k] === 0) return false;
      return true;
    };
    while (!allIn() && performance.now() < drainUntil) await pause();
    // A short grace for duplicates that would arrive just after the last first receipt.
    await new Promise((r) => setTimeout(r, 300));
    running = false;
    loopDelay.disable();
    const loadAtEnd = os.loadavg()[0];
    const cpuMs = Object.fromEntries(
      probes.map(([name, probe]) => {
        const used = probe.read();
        return [name, used === null || !Number.isFinite(used) ? null : used];
      }),
    );

    const latencies: number[] = [];
    const afterAck: number[] = [];
    const halves: [number[], number[]] = [[], []];
    const middle = warmup + (sent - warmup) / 2;
    let received = 0;
    let lost = 0;
    let duplicated = 0;
    for (let k = 0; k < sent; k++) {
      if (receipts[k] > 0) {
        received += 1;
        if (k >= warmup) {
          latencies.push(receivedAt[k] - sentAt[k]);
          halves[k < middle ? 0 : 1].push(receivedAt[k] - sentAt[k]);
          if (ackOk[k]) afterAck.push(receivedAt[k] - ackedAt[k]);
        }
      } else if (ackOk[k]) lost += 1;
      if (receipts[k] > 1) duplicated += receipts[k] - 1;
    }
    return {
      sockets: sockets.filter(Boolean).length,
      connectSeconds,
      connectFailures,
      joinFailures,
      sent,
      warmup,
      sendSeconds,
      acked,
      ackFailures,
      received,
      lost,
      duplicated,
      misdelivered,
      disconnects,
      latency: percentiles(latencies),
      latencyByHalf: [percentiles(halves[0]), percentiles(halves[1])],
      ackLatency: percentiles(ackMs),
      afterAck: percentiles(afterAck),
      cpuMs,
      clientIdPrefix: prefix,
      clientLoopDelay: { p50: loopDelay.percentile(50) / 1e6, p99: loopDelay.percentile(99) / 1e6, max: loopDelay.max / 1e6 },
      loadAverage: [loadAtStart, loadAtEnd],
    };
  } finally {
    running = false;
    for (const s of sockets) s?.disconnect();
  }
}
