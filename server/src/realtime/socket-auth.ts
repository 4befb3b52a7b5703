// Who is on the other end of a socket. The handshake carries the Express session cookie
// (express-session runs on the engine's handshake request, and the session store reads the row
// and its user together, session-reader.ts); the person is taken from that read at the
// handshake, and read again the same way on every event that reads or writes, so a sign-out,
// an expired session, a disabled account or a role change applies at once rather than at the
// next reconnect. Those reads go through the same batching reader as HTTP requests: sockets
// asking in the same turn of the event loop (a reconnect storm) share one statement.
import type { IncomingMessage } from 'node:http';
import type { Request } from 'express';
import type { Role } from '../../shared/case-status';
import { allowedOrigins } from '../lib/security';
import { log } from '../lib/logger';
import { pastAbsoluteLimit, sessionUserOf } from '../lib/session';
import type { SessionRead, SessionReader } from '../lib/session-reader';
import type { UserRecord } from '../modules/users/users.repository';

export interface SocketData {
  userId: number;
  sid: string;
  displayName: string;
  role: Role;
}

export type SessionRequest = IncomingMessage & {
  _query?: Record<string, string>;
  sessionID?: string;
  session?: { passport?: { user?: unknown }; startedAt?: unknown };
};

/**
 * The person a session names, or null: no live session, no user, a disabled account, or a
 * session past its absolute limit (the same rule as the HTTP side's, `pastAbsoluteLimit`).
 */
export function signedInUser(read: Pick<SessionRead, 'user'> | null, startedAt: unknown, absoluteHours: number): UserRecord | null {
  const user = read?.user;
  if (!user || user.disabled || pastAbsoluteLimit(startedAt, absoluteHours)) return null;
  return user;
}

/**
 * The person behind a handshake. The session store has just read this session and its user for
 * this very request (express-session runs on the handshake): that read is as fresh as another
 * would be, so it is read again only when it was not made that way.
 */
export function handshakeUser(req: SessionRequest, reader: SessionReader, absoluteHours: number): Promise<UserRecord | null> {
  const read = sessionUserOf(req as unknown as Request);
  if (read === undefined) return req.sessionID ? loadSessionUser(reader, req.sessionID, absoluteHours) : Promise.resolve(null);
  return Promise.resolve(signedInUser({ user: read }, req.session?.startedAt, absoluteHours));
}

/** The signed-in person behind a live session, read now, or null when the session ended or the account is off. */
export async function loadSessionUser(reader: SessionReader, sid: string, absoluteHours: number): Promise<UserRecord | null> {
  const read = await reader.readAsync(sid);
  if (!read) return null;
  let startedAt: unknown;
  try {
    startedAt = (JSON.parse(read.sess) as { startedAt?: unknown }).startedAt;
  } catch {
    return null;
  }
  return signedInUser(read, startedAt, absoluteHours);
}

/**
 * socket.io's `cors` option only sets response headers; a WebSocket handshake is not bound by
 * CORS at all, so the Origin is checked here (ASVS 4.4.2). Browsers always send Origin on a
 * WebSocket handshake and on cross-site requests; a same-origin polling GET may come without one.
 */
export function originGuard(publicUrl: string) {
  return (req: IncomingMessage, callback: (err: string | null | undefined, success: boolean) => void): void => {
    const origin = req.headers.origin;
    const foreign = origin ? !allowedOrigins(publicUrl, req as unknown as Request).has(origin) : req.headers['sec-fetch-site'] === 'cross-site';
    if (foreign) {
      log.security('socket.refused', { reason: 'origin', origin: origin ?? null, ip: req.socket.remoteAddress });
      callback('This origin may not connect.', false);
      return;
    }
    callback(null, true);
  };
}

/** The error a refused handshake reaches the client with (`connect_error`: message and data.code). */
export function refusal(code: string, message: string): Error & { data: { code: string } } {
  return Object.assign(new Error(message), { data: { code } });
}
