// What the routers need from the running process, passed in rather than imported, so tests
// can build an app around their own database and mail setup.
import type { Config } from './config/env';
import type { SessionKit } from './lib/session';

export interface AppContext {
  config: Config;
  sessions: SessionKit;
  /** Wakes the outbox worker after mail was queued (a no-op when none runs). */
  pokeMail(): void;
}
