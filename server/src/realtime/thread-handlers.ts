// The events one socket may send. Every payload is validated with the shared schemas; every
// failure becomes a `{ ok: false, error: { code, message } }` ack (never a thrown error or an
// unhandled rejection). socket.io delivers at most once, so the durable path is: store, ack,
// and the client's catch-up by seq (`message:since`); the broadcast is only the fast path.
import type { Server, Socket } from 'socket.io';
import { z } from 'zod';
import {
  joinCaseSchema,
  leaveCaseSchema,
  sendMessageSchema,
  sinceSchema,
  typingSchema,
  type ClientToServerEvents,
  type PresenceEntry,
  type ServerToClientEvents,
} from '../../shared/socket-events';
import type { AppContext } from '../context';
import { databaseAnswer } from '../db/sequelize';
import { AppError } from '../lib/errors';
import { fieldsOf } from '../lib/http';
import { log } from '../lib/logger';
import { canReadCase, findCaseForAccess } from '../modules/cases/case-access';
import { FIRST_LOOK_COUNT, listMessages, postMessage, seesAsidesOn } from '../modules/threads/messages.service';
import { publishChange } from '../modules/threads/thread-events';
import { caseIdOfRoom, caseRoom, caseStaffRoom } from './rooms';
import { loadSessionUser, type SocketData } from './socket-auth';

export type ThreadServer = Server<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>;
export type ThreadSocket = Socket<ClientToServerEvents, ServerToClientEvents, Record<string, never>, SocketData>;

type AckBody = { ok: true; [key: string]: unknown } | { ok: false; error: { code: string; message: string; fields?: Record<string, string> } };

const NOT_FOUND = { ok: false as const, error: { code: 'not_found', message: 'That case was not found.' } };

/** Photos take the full transaction in messages.service.ts, which reads no session: the person is read first. */
const withoutPhotos = (input: { photoIds?: number[] }) => !input.photoIds?.length;

export function errorAck(error: unknown): AckBody {
  if (error instanceof AppError) return { ok: false, error: { code: error.code, message: error.message, ...(error.fields ? { fields: error.fields } : {}) } };
  const database = databaseAnswer(error);
  if (database) return { ok: false, error: { code: database.code, message: database.message } };
  log.error('socket.unhandled', { error: (error as Error)?.stack ?? String(error) });
  return { ok: false, error: { code: 'server_error', message: 'Something went wrong on our side. Try again in a moment.' } };
}

export async function presenceOf(io: ThreadServer, caseId: number): Promise<PresenceEntry[]> {
  const sockets = await io.in(caseRoom(caseId)).fetchSockets();
  const byUser = new Map<number, PresenceEntry>();
  for (const s of sockets) byUser.set(s.data.userId, { userId: s.data.userId, displayName: s.data.displayName, role: s.data.role });
  return [...byUser.values()].sort((a, b) => a.displayName.localeCompare(b.displayName) || a.userId - b.userId);
}

async function announcePresence(io: ThreadServer, caseId: number): Promise<PresenceEntry[]> {
  const present = await presenceOf(io, caseId);
  io.to(caseRoom(caseId)).emit('presence', { caseId, present });
  return present;
}

/** Presence announced after a disconnect, still asking the other processes who is there. */
const leavingAnnouncements = new Set<Promise<unknown>>();

/** Waits (at most `ms`) for those announcements, so a stopping process still says who left. */
export async function presenceSettled(ms: number): Promise<void> {
  if (!leavingAnnouncements.size) return;
  let timer: NodeJS.Timeout | undefined;
  await Promise.race([Promise.allSettled([...leavingAnnouncements]), new Promise((resolve) => (timer = setTimeout(resolve, ms)))]);
  clearTimeout(timer);
}

export function registerThreadHandlers(io: ThreadServer, socket: ThreadSocket, ctx: AppContext): void {
  /** The person as last read; a post re-checks them as it is stored, so it needs no read of its own. */
  let known: Express.User | null = null;
  /** The person again, fresh from the session and users tables; null when the session or account is gone. */
  const freshUser = async (): Promise<Express.User | null> => {
    const user = await loadSessionUser(ctx.sessions.reader, socket.data.sid, ctx.config.SESSION_ABSOLUTE_HOURS);
    // A changed role means different rooms: the socket is dropped and the client reconnects into the right ones.
    if (!user || user.role !== socket.data.role) return (known = null);
    socket.data.displayName = user.displayName;
    return (known = user);
  };
  const refuse = (ack: (body: AckBody) => void) => {
    // The ack goes out before the disconnect, so the client learns why.
    ack({ ok: false, error: { code: 'unauthorized', message: 'Sign in again.' } });
    socket.disconnect(true);
  };

  /** One acknowledged event: validated payload, fresh user, any failure as an error ack. */
  const onAck = <S extends z.ZodType>(
    event: keyof ClientToServerEvents,
    schema: S,
    /** `afterAck`: work to run as soon as the ack is sent (in the same turn, not a later one) */
    handle: (user: Express.User, payload: z.infer<S>, afterAck: (work: () => void) => void) => Promise<AckBody>,
    /** the statement storing this payload re-checks the session and account itself */
    checkedInStatement: (payload: z.infer<S>) => boolean = () => false,
  ) => {
    socket.on(event, async (...args: unknown[]) => {
      const last = args.at(-1);
      const ack = typeof last === 'function' ? (last as (body: AckBody) => void) : () => undefined;
      const payload = typeof args[0] === 'function' ? undefined : args[0];
      try {
        const parsed = schema.safeParse(payload);
        if (!parsed.success) return ack({ ok: false, error: { code: 'invalid_input', message: 'Some of what you sent needs fixing.', fields: fieldsOf(parsed.error) } });
        // A post checks the session and account in the statement that stores it (message-writer.ts).
        const user = known && checkedInStatement(parsed.data) ? known : await freshUser();
        if (!user) return refuse(ack);
        const afterAck: (() => void)[] = [];
        const body = await handle(user, parsed.data, (work) => afterAck.push(work));
        ack(body);
        for (const work of afterAck) work();
      } catch (error) {
        if (error instanceof AppError && error.code === 'unauthorized') return refuse(ack);
        ack(errorAck(error));
      }
    });
  };

  onAck('case:join', joinCaseSchema, async (user, { caseId, afterSeq }) => {
    const access = await findCaseForAccess(caseId);
    if (!access || !canReadCase(user, access)) {
      log.security('socket.join_refused', { userId: user.id, caseId });
      return NOT_FOUND;
    }
    // Join before reading, so a message stored meanwhile arrives live or in the answer (or both:
    // the client keeps one per seq) and never falls between the two.
    const rooms = seesAsidesOn(user, access) ? [caseRoom(caseId), caseStaffRoom(caseId)] : [caseRoom(caseId)];
    await socket.join(rooms);
    try {
      const page = await listMessages(user, caseId, afterSeq === undefined ? { latest: FIRST_LOOK_COUNT } : { afterSeq });
      const presence = await announcePresence(io, caseId);
      return { ok: true, messages: page.items, presence, hasMore: page.hasMore };
    } catch (error) {
      for (const room of rooms) await socket.leave(room);
      throw error;
    }
  });

  onAck(
    'message:send',
    sendMessageSchema,
    async (user, input, afterAck) => {
      const result = await postMessage(ctx, user, input.caseId, input, withoutPhotos(input) ? { sid: socket.data.sid } : {});
      if (result.message.author?.id === user.id) socket.data.displayName = user.displayName = result.message.author.displayName;
      // Acknowledge first (the message is stored), then at once fan out to everyone but this
      // socket. Not on a later turn of the event loop: that turn comes only after every other
      // event ready meanwhile (a whole batch of acks, the posts arriving), which under load was
      // most of the time from ack to receipt.
      const change = result.change;
      if (change) afterAck(() => void publishChange(change, { skip: { socketId: socket.id, messageId: result.message.id } }));
      return { ok: true, message: result.message, duplicate: result.duplicate };
    },
    withoutPhotos,
  );

  onAck('message:since', sinceSchema, async (user, { caseId, afterSeq }) => {
    const page = await listMessages(user, caseId, { afterSeq });
    return { ok: true, messages: page.items, hasMore: page.hasMore };
  });

  socket.on('case:leave', async (payload: unknown) => {
    const parsed = leaveCaseSchema.safeParse(payload);
    if (!parsed.success || !socket.rooms.has(caseRoom(parsed.data.caseId))) return;
    try {
      await socket.leave(caseRoom(parsed.data.caseId));
      await socket.leave(caseStaffRoom(parsed.data.caseId));
      await announcePresence(io, parsed.data.caseId);
    } catch (error) {
      errorAck(error);
    }
  });

  // Typing is a hint, relayed without a database read; only to a room the socket has joined.
  socket.on('typing', (payload: unknown) => {
    const parsed = typingSchema.safeParse(payload);
    if (!parsed.success) return;
    const { caseId, typing, aside } = parsed.data;
    if (aside && !socket.rooms.has(caseStaffRoom(caseId))) return;
    if (!socket.rooms.has(caseRoom(caseId))) return;
    socket.to(aside ? caseStaffRoom(caseId) : caseRoom(caseId)).emit('typing', { caseId, userId: socket.data.userId, displayName: socket.data.displayName, typing });
  });

  let leaving: number[] = [];
  socket.on('disconnecting', () => {
    leaving = [...socket.rooms].map(caseIdOfRoom).filter((id): id is number => id !== null);
  });
  socket.on('disconnect', () => {
    if (!leaving.length) return;
    // A tick later, so that when a stopping process drops all its sockets at once, every
    // announcement is made after all of them are gone and none lists a socket that just left.
    const announced = new Promise((resolve) => setImmediate(resolve)).then(() =>
      Promise.all(leaving.map((caseId) => announcePresence(io, caseId).catch(errorAck))),
    );
    leavingAnnouncements.add(announced);
    void announced.finally(() => leavingAnnouncements.delete(announced));
  });
}
