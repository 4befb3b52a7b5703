// Messages written but not yet acknowledged by the server, per case. Kept outside React so a
// message still on its way survives leaving the case page, and is sent when the connection
// comes back (the offline banner promises that).
import { useSyncExternalStore } from 'react';
import type { MessageKind } from '@shared/socket-events';
import { onSocketUserChange } from '../../../lib/socket';

export type PendingState =
  /** handed to the server, waiting for its answer */
  | 'sending'
  /** no connection: goes out by itself when the connection is back */
  | 'waiting'
  /** the server refused or did not answer: the person decides to retry */
  | 'failed';

export interface PendingMessage {
  clientId: string;
  caseId: number;
  body: string;
  kind: Exclude<MessageKind, 'system'>;
  /** photos already uploaded to the case, shown with this message */
  photoIds?: number[];
  createdAt: string;
  state: PendingState;
  error?: string;
}

const EMPTY: readonly PendingMessage[] = [];
let byCase = new Map<number, readonly PendingMessage[]>();
const listeners = new Set<() => void>();

function emit(): void {
  for (const listener of listeners) listener();
}

function setCase(caseId: number, list: readonly PendingMessage[]): void {
  byCase = new Map(byCase);
  if (list.length) byCase.set(caseId, list);
  else byCase.delete(caseId);
  emit();
}

export const outbox = {
  add(message: PendingMessage): void {
    setCase(message.caseId, [...(byCase.get(message.caseId) ?? EMPTY), message]);
  },
  update(caseId: number, clientId: string, change: Partial<Pick<PendingMessage, 'state' | 'error'>>): void {
    const list = byCase.get(caseId);
    if (!list?.some((m) => m.clientId === clientId)) return;
    setCase(caseId, list.map((m) => (m.clientId === clientId ? { ...m, ...change } : m)));
  },
  /** The server has it: from here on the stored message stands in its place. */
  remove(caseId: number, clientIds: Iterable<string>): void {
    const list = byCase.get(caseId);
    if (!list) return;
    const gone = new Set(clientIds);
    const next = list.filter((m) => !gone.has(m.clientId));
    if (next.length !== list.length) setCase(caseId, next);
  },
  get(caseId: number): readonly PendingMessage[] {
    return byCase.get(caseId) ?? EMPTY;
  },
  /** Everything that can go out now that the connection is back. */
  waiting(): PendingMessage[] {
    return [...byCase.values()].flat().filter((m) => m.state === 'waiting');
  },
  clear(): void {
    byCase = new Map();
    emit();
  },
  subscribe(listener: () => void): () => void {
    listeners.add(listener);
    return () => listeners.delete(listener);
  },
};

// Unsent words of one person must never go out under the next person's session.
onSocketUserChange(() => outbox.clear());

export function usePendingMessages(caseId: number): readonly PendingMessage[] {
  return useSyncExternalStore(outbox.subscribe, () => outbox.get(caseId), () => EMPTY);
}
