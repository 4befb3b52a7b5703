// Messages reach a thread by several roads — the first page load, the join answer, live
// broadcasts, our own acks, catch-up after a reconnect — and in any order. Every road goes
// through here, so each message is shown exactly once, in the server's order (seq).
import type { ThreadMessage } from '@shared/socket-events';

/** Merges `incoming` into `current` (both may be unsorted); for the same id the incoming copy
 * wins, because it is newer (a steward may have hidden it meanwhile). */
export function mergeMessages(current: readonly ThreadMessage[], incoming: readonly ThreadMessage[]): ThreadMessage[] {
  if (incoming.length === 0) return current as ThreadMessage[];
  const byId = new Map<number, ThreadMessage>();
  for (const message of current) byId.set(message.id, message);
  for (const message of incoming) byId.set(message.id, message);
  // A client id names one message per case; should two ids ever carry it, keep the stored one
  // with the lower seq, which is the one the server answered the first send with.
  const byClientId = new Map<string, ThreadMessage>();
  const merged: ThreadMessage[] = [];
  for (const message of [...byId.values()].sort((a, b) => a.seq - b.seq || a.id - b.id)) {
    if (message.clientId) {
      if (byClientId.has(message.clientId)) continue;
      byClientId.set(message.clientId, message);
    }
    merged.push(message);
  }
  return merged;
}

export function lastSeqOf(messages: readonly ThreadMessage[] | undefined): number {
  let last = 0;
  for (const message of messages ?? []) if (message.seq > last) last = message.seq;
  return last;
}

/** The thread as a steward's hide leaves it: the message stays in its place, its words go. */
export function markHidden(messages: readonly ThreadMessage[], messageId: number): ThreadMessage[] {
  return messages.map((m) => (m.id === messageId ? { ...m, hidden: true, body: '', photos: [] } : m));
}
