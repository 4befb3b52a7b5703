// What closing and the Field Library need when the server starts: the guides in knowledge/
// loaded (or refreshed), field notes made for cases marked published that have none yet (the
// demo seed's), and the check-in worker. Each step is idempotent and safe with two processes.
import type { Config } from '../../config/env';
import { startCheckInWorker } from '../closing/check-ins.worker';
import { publishPendingNotes } from './field-notes';
import { loadKnowledge } from './knowledge-loader';

export interface LibraryWork {
  stop(): Promise<void>;
}

export async function startLibraryWork(config: Config, pokeMail: () => void, options: { checkInIntervalMs?: number } = {}): Promise<LibraryWork> {
  await loadKnowledge();
  await publishPendingNotes();
  const worker = startCheckInWorker({ publicUrl: config.publicUrl, pokeMail, intervalMs: options.checkInIntervalMs });
  return { stop: () => worker.stop() };
}
