// The thread's mail that no request sets off: once a minute, the urgent cases nobody took
// (urgent-watcher.ts) and the grower posts a mentor left unread (grower-wrote-watcher.ts).
// One pass at a time; a database that is away makes a pass fail quietly, and the next one
// catches up (both checks work from what is stored, not from what happened in between).
import type { AppContext } from '../../context';
import { isConnectionError } from '../../db/sequelize';
import { log } from '../../lib/logger';
import { runGrowerWroteCheck } from './grower-wrote-watcher';
import { runUrgentCaseCheck } from './urgent-watcher';

export interface ThreadMailWatcher {
  stop(): Promise<void>;
}

export function startThreadMailWatcher(ctx: AppContext, intervalMs = 60_000): ThreadMailWatcher {
  let stopped = false;
  let running: Promise<void> | null = null;
  const check = async (name: string, run: (ctx: AppContext) => Promise<number>) => {
    try {
      await run(ctx);
    } catch (error) {
      if (!isConnectionError(error)) log.error(`${name}.error`, { error: (error as Error).message });
    }
  };
  const timer = setInterval(() => {
    if (stopped || running) return;
    running = (async () => {
      await check('urgent_watcher', runUrgentCaseCheck);
      await check('grower_wrote_watcher', runGrowerWroteCheck);
    })().finally(() => {
      running = null;
    });
  }, intervalMs);
  timer.unref();
  return {
    async stop() {
      stopped = true;
      clearInterval(timer);
      await running;
    },
  };
}
