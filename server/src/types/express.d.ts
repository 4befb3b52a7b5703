import type { UserRecord } from '../modules/users/users.repository';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserRecord {}
  }
}

declare module 'express-session' {
  interface SessionData {
    startedAt?: number;
  }
}

export {};
