// socket.io on the HTTP server: Origin check, the Express session on the handshake, the person
// re-read from the database, rooms per case / user / session, and the publisher the thread
// services hand their stored changes to. Sign-out and disabled accounts drop sockets at once.
// With fan-out (startServer), every room emit, fetchSockets and disconnectSockets below reaches
// the sockets of every process on the database, so none of them needs to know where a socket is.
import type http from 'node:http';
import type { NextFunction, Request, Response } from 'express';
import { QueryTypes } from 'sequelize';
import { Server } from 'socket.io';
import type { AppContext } from '../context';
import { getSequelize } from '../db/sequelize';
import { log } from '../lib/logger';
import { sessionEvents } from '../lib/session-events';
import { warmMessageWriter } from '../modules/threads/message-writer';
import { messagesRepository } from '../modules/threads/messages.repository';
import { addThreadPublisher, type PublishOptions, type ThreadChange, type ThreadPublisher } from '../modules/threads/thread-events';
import { usersRepository } from '../modules/users/users.repository';
import { attachFanout, type Fanout } from './fanout';
import { caseRoom, caseStaffRoom, sessionRoom, STAFF_ROOM, userRoom } from './rooms';
import { handshakeUser, originGuard, refusal, type SessionRequest } from './socket-auth';
import { errorAck, presenceSettled, registerThreadHandlers, type ThreadServer } from './thread-handlers';
import { trackViewers, type ViewerRegistry } from './viewers';
import { isStaffRole } from '../../shared/case-status';

export interface Realtime {
  io: ThreadServer;
  /** Resolves when the socket layer can serve: at once alone, after LISTEN with fan-out. */
  ready: Promise<void>;
  close(): Promise<void>;
}

export interface RealtimeOptions {
  /** Fan out through this database to the other processes on it (the PostgreSQL adapter). */
  fanoutDatabaseUrl?: string;
}

/** A message is at most 5,000 characters; 64 KiB leaves room for the envelope and nothing more. */
const MAX_PAYLOAD_BYTES = 64 * 1024;

export function attachRealtime(httpServer: http.Server, ctx: AppContext, options: RealtimeOptions = {}): Realtime {
  const io: ThreadServer = new Server(httpServer, {
    serveClient: false,
    maxHttpBufferSize: MAX_PAYLOAD_BYTES,
    allowRequest: originGuard(ctx.config.publicUrl),
  });
  const fanout: Fanout | null = options.fanoutDatabaseUrl ? attachFanout(io, options.fanoutDatabaseUrl) : null;
  const viewers = trackViewers(io);
  // Once this process hears the others, it asks who is on which case there; the first posts find the thread's writer ready.
  const ready = Promise.all([(fanout?.ready ?? Promise.resolve()).then(() => viewers.hello()), warmMessageWriter(ctx.config.DATABASE_URL)]).then(() => undefined);

  // The session is read on the handshake request only (later polling requests carry the
  // engine's sid); the person behind it is then loaded by the middleware below.
  io.engine.use((req: SessionRequest, res: Response, next: NextFunction) => {
    if (req._query?.sid !== undefined) return next();
    ctx.sessions.middleware(req as unknown as Request, res, next);
  });

  io.use((socket, next) => {
    const req = socket.request as SessionRequest;
    const sid = req.sessionID;
    if (!sid || req.session?.passport?.user === undefined) {
      log.security('socket.refused', { reason: 'signed_out', ip: req.socket.remoteAddress });
      return next(refusal('unauthorized', 'Sign in first.'));
    }
    handshakeUser(req, ctx.sessions.reader, ctx.config.SESSION_ABSOLUTE_HOURS).then(
      (user) => {
        if (!user) {
          log.security('socket.refused', { reason: 'session_ended', ip: req.socket.remoteAddress });
          return next(refusal('unauthorized', 'Sign in first.'));
        }
        socket.data = { userId: user.id, sid, displayName: user.displayName, role: user.role };
        next();
      },
      (error) => {
        errorAck(error);
        next(refusal('server_error', 'Sporewell could not check your sign-in. Try again in a moment.'));
      },
    );
  });

  io.on('connection', (socket) => {
    const rooms = [userRoom(socket.data.userId), sessionRoom(socket.data.sid)];
    if (isStaffRole(socket.data.role)) rooms.push(STAFF_ROOM);
    void socket.join(rooms);
    registerThreadHandlers(io, socket, ctx);
  });

  const onSessionEnded = (sid: string) => {
    io.in(sessionRoom(sid)).disconnectSockets(true);
  };
  // Some of the user's sessions ended (new password, disabled account): drop the sockets whose session is gone.
  const onUserSessionsEnded = (userId: number) => {
    dropEndedSessions(io, userId).catch(errorAck);
  };
  const onUserChanged = (userId: number) => {
    dropChangedUser(io, userId).catch(errorAck);
  };
  sessionEvents.on('session:ended', onSessionEnded);
  sessionEvents.on('user:sessions-ended', onUserSessionsEnded);
  sessionEvents.on('user:changed', onUserChanged);
  const removePublisher = addThreadPublisher(threadPublisher(io, viewers));

  return {
    io,
    ready,
    async close() {
      sessionEvents.off('session:ended', onSessionEnded);
      sessionEvents.off('user:sessions-ended', onUserSessionsEnded);
      sessionEvents.off('user:changed', onUserChanged);
      removePublisher();
      // Only this process's sockets: io.disconnectSockets() would drop every process's.
      io.local.disconnectSockets(true);
      // The people on those sockets leave the presence lists of the other processes' viewers.
      await presenceSettled(2_000);
      viewers.close();
      await fanout?.close();
      // Not io.close(): that also closes the HTTP server, which startServer closes itself.
      io.engine.close();
    },
  };
}

async function dropEndedSessions(io: ThreadServer, userId: number): Promise<void> {
  const sockets = await io.in(userRoom(userId)).fetchSockets();
  if (!sockets.length) return;
  const sids = [...new Set(sockets.map((s) => s.data.sid))];
  const alive = await getSequelize().query<{ sid: string }>(`SELECT sid FROM session WHERE sid IN (:sids) AND expire > now()`, {
    replacements: { sids },
    type: QueryTypes.SELECT,
  });
  const aliveSids = new Set(alive.map((r) => r.sid));
  for (const s of sockets) if (!aliveSids.has(s.data.sid)) s.disconnect(true);
}

async function dropChangedUser(io: ThreadServer, userId: number): Promise<void> {
  const user = await usersRepository.findById(userId);
  const sockets = await io.in(userRoom(userId)).fetchSockets();
  for (const s of sockets) {
    if (user && !user.disabled && user.role === s.data.role) continue;
    // Said first, so the client asks who it is now (its pages follow the new role) rather than
    // only learning of it from the dropped connection.
    s.emit('account:changed');
    s.disconnect(true);
  }
}

function threadPublisher(io: ThreadServer, registry: ViewerRegistry): ThreadPublisher {
  return {
    async publish(change: ThreadChange, options: PublishOptions) {
      const { caseId } = change;
      for (const message of change.messages) {
        const room = message.kind === 'aside' ? caseStaffRoom(caseId) : caseRoom(caseId);
        const target = options.skip?.messageId === message.id ? io.to(room).except(options.skip.socketId) : io.to(room);
        target.emit('message:new', message);
      }
      if (change.caseUpdate) io.to([caseRoom(caseId), STAFF_ROOM, userRoom(change.growerId)]).emit('case:updated', change.caseUpdate);
      await settleUnread(io, change, change.viewing ? null : (registry.viewersOf([caseId]).get(caseId) ?? new Set()));
    },
    viewersOf: (caseIds) => registry.viewersOf(caseIds),
    messageHidden(caseId, messageId) {
      io.to(caseRoom(caseId)).emit('message:hidden', { caseId, messageId });
    },
    // The thread merges it by id over the placeholder; an aside goes to the staff of the case only.
    // No unread hint: the message is not new.
    messageShown(caseId, message) {
      io.to(message.kind === 'aside' ? caseStaffRoom(caseId) : caseRoom(caseId)).emit('message:new', message);
    },
  };
}

/**
 * The grower and the holding mentor count unread messages. Whoever is viewing the case has
 * just been sent the message, so it counts as read; the others are told to refresh their count.
 * `viewing` null: the change says who was viewing, and their reads were marked as it was stored.
 */
async function settleUnread(io: ThreadServer, change: ThreadChange, viewing: Set<number> | null): Promise<void> {
  const counted = change.messages.filter((m) => m.kind !== 'system' && m.author);
  if (!counted.length) return;
  const watching = viewing ?? new Set(change.viewing);
  const people = [...new Set([change.growerId, change.mentorId].filter((id): id is number => id !== null))];
  for (const userId of people) {
    const theirs = counted.filter((m) => m.author!.id !== userId && (m.kind === 'text' || userId !== change.growerId));
    if (!theirs.length) continue;
    if (!watching.has(userId)) io.to(userRoom(userId)).emit('unread', { caseId: change.caseId });
    else if (viewing) await messagesRepository.markRead(change.caseId, userId, theirs.at(-1)!.seq);
  }
}
