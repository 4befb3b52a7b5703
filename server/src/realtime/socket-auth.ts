// Who is on the other end of a socket. The handshake carries the Express session cookie
// (express-session runs on the engine's handshake request); the person is then read from the
// session row and the users table together, at the handshake and again on every event that
// reads or writes, so a sign-out, an expired session, a disabled account or a role change
// applies at once rather than at the next reconnect.
import type { IncomingMessage } from 'node:http';
import type { Request } from 'express';
import { QueryTypes } from 'sequelize';
import type { Role } from '../../shared/case-status';
import { getSequelize } from '../db/sequelize';
import { allowedOrigins } from '../lib/security';
import { log } from '../lib/logger';
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
  session?: { passport?: { user?: unknown } };
};

/** The signed-in person behind a live session, or null when the session ended or the account is off. */
export async function loadSessionUser(sid: string, absoluteHours: number): Promise<UserRecord | null> {
  const [row] = await getSequelize().query<UserRecord & { startedAt: string | null }>(
    `SELECT u.id, u.email, u.display_name AS "displayName", u.role, u.email_verified AS "emailVerified", u.disabled,
            u.about, u.notify_urgent AS "notifyUrgent", u.created_at AS "createdAt", s.sess ->> 'startedAt' AS "startedAt"
       FROM session s
       JOIN users u ON u.id = CASE WHEN (s.sess -> 'passport' ->> 'user') ~ '^[0-9]{1,9}$' THEN (s.sess -> 'passport' ->> 'user')::int END
      WHERE s.sid = :sid AND s.expire > now() AND NOT u.disabled`,
    { replacements: { sid }, type: QueryTypes.SELECT },
  );
  if (!row) return null;
  // The same absolute limit the HTTP side enforces (app.ts absoluteSessionTimeout).
  if (row.startedAt && Date.now() - Number(row.startedAt) > absoluteHours * 3_600_000) return null;
  const { startedAt: _startedAt, ...user } = row;
  return user;
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
