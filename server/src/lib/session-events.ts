// Sessions that end (sign-out, disabled account, new password) are announced here so the
// realtime layer can disconnect their sockets at once.
import { EventEmitter } from 'node:events';

interface SessionEventMap {
  'session:ended': [sid: string];
  'user:sessions-ended': [userId: number];
  'user:changed': [userId: number];
}

export const sessionEvents = new EventEmitter<SessionEventMap>();
sessionEvents.setMaxListeners(50);
