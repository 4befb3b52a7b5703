// Who has a socket joined to which case, known without asking: the thread needs it for every
// post (a watcher's read is marked with the post; an away grower gets the reply mail), and
// fetchSockets() would cost a round trip to every other process each time.
//
// This process's own sockets are read from the adapter's rooms, exactly and at once. Each other
// process tells the rest about its own whenever a case room changes (coalesced per turn of the
// event loop) and in full when asked, when a process joins, and every few seconds; a process
// that leaves (or is not heard from within the adapter's heartbeat timeout) is forgotten with
// its sockets. Between a change on one process and its NOTIFY reaching the others (a few
// milliseconds) the others still see the old state: the worst that does is one reply mail to a
// grower who had just opened the case, or one read left unmarked. Alone, nothing is sent.
import { caseIdOfRoom, caseRoom } from './rooms';
import type { ThreadServer } from './thread-handlers';

const CHANGED = 'sporewell:viewers';
const HELLO = 'sporewell:viewers-hello';
const FULL_EVERY_MS = 10_000;

interface ClusterAdapterInternals {
  uid?: string;
  nodesMap?: Map<string, number>;
  removeNode?: (uid: string) => void;
  rooms: Map<string, Set<string>>;
  on(event: 'join-room' | 'leave-room', listener: (room: string) => void): void;
  off(event: 'join-room' | 'leave-room', listener: (room: string) => void): void;
}

/** [caseId, userIds] pairs; an empty list means nobody is on that case there any more. */
type Entries = [number, number[]][];
interface ViewersMessage {
  from: string;
  full: boolean;
  cases: Entries;
}

export interface ViewerRegistry {
  viewersOf(caseIds: number[]): Map<number, Set<number>>;
  /** Asks the other processes for their viewers (after this one LISTENs). */
  hello(): void;
  close(): void;
}

export function trackViewers(io: ThreadServer): ViewerRegistry {
  const nsp = io.of('/');
  const adapter = nsp.adapter as unknown as ClusterAdapterInternals;
  const clustered = adapter.nodesMap instanceof Map && typeof adapter.uid === 'string';
  const remote = new Map<string, Map<number, number[]>>();

  const localViewers = (caseId: number): number[] => {
    const ids = adapter.rooms.get(caseRoom(caseId));
    if (!ids) return [];
    const users = new Set<number>();
    for (const id of ids) {
      const userId = nsp.sockets.get(id)?.data.userId;
      if (userId !== undefined) users.add(userId);
    }
    return [...users];
  };

  const viewersOf = (caseIds: number[]): Map<number, Set<number>> => {
    const out = new Map<number, Set<number>>();
    for (const caseId of caseIds) {
      const users = new Set(localViewers(caseId));
      for (const cases of remote.values()) for (const userId of cases.get(caseId) ?? []) users.add(userId);
      if (users.size) out.set(caseId, users);
    }
    return out;
  };

  if (!clustered) return { viewersOf, hello: () => undefined, close: () => undefined };

  const peers = () => adapter.nodesMap!.size > 0;
  const send = (message: Omit<ViewersMessage, 'from'>) => {
    if (!peers()) return;
    (io.serverSideEmit as unknown as (event: string, payload: ViewersMessage) => void)(CHANGED, { from: adapter.uid!, ...message });
  };
  const sendFull = () => {
    const cases: Entries = [];
    for (const room of adapter.rooms.keys()) {
      const caseId = caseIdOfRoom(room);
      if (caseId !== null) cases.push([caseId, localViewers(caseId)]);
    }
    send({ full: true, cases });
  };

  // Changes of this process's case rooms, told once per turn of the event loop.
  const dirty = new Set<number>();
  let flushing = false;
  const onRoomChange = (room: string) => {
    const caseId = caseIdOfRoom(room);
    if (caseId === null || !peers()) return;
    dirty.add(caseId);
    if (flushing) return;
    flushing = true;
    setImmediate(() => {
      flushing = false;
      const cases: Entries = [...dirty].map((id) => [id, localViewers(id)]);
      dirty.clear();
      if (cases.length) send({ full: false, cases });
    });
  };
  adapter.on('join-room', onRoomChange);
  adapter.on('leave-room', onRoomChange);

  const onChanged = (message: ViewersMessage) => {
    if (!message || typeof message.from !== 'string' || !Array.isArray(message.cases)) return;
    let theirs = remote.get(message.from);
    if (!theirs || message.full) remote.set(message.from, (theirs = new Map()));
    for (const [caseId, users] of message.cases) {
      if (users.length) theirs.set(caseId, users);
      else theirs.delete(caseId);
    }
  };
  const onHello = () => sendFull();
  (nsp.on as unknown as (event: string, listener: (payload: ViewersMessage) => void) => void)(CHANGED, onChanged);
  (nsp.on as unknown as (event: string, listener: () => void) => void)(HELLO, onHello);

  // A process gone (goodbye or heartbeat timeout) takes its sockets with it.
  const removeNode = adapter.removeNode!.bind(adapter);
  adapter.removeNode = (uid: string) => {
    remote.delete(uid);
    removeNode(uid);
  };
  // Full lists now and then mend what a lost NOTIFY (a database restart) left wrong.
  const timer = setInterval(sendFull, FULL_EVERY_MS);
  timer.unref();

  return {
    viewersOf,
    hello() {
      (io.serverSideEmit as unknown as (event: string) => void)(HELLO);
      sendFull();
    },
    close() {
      clearInterval(timer);
      adapter.off('join-room', onRoomChange);
      adapter.off('leave-room', onRoomChange);
      nsp.off(CHANGED, onChanged as never);
      nsp.off(HELLO, onHello as never);
      adapter.removeNode = removeNode;
      remote.clear();
    },
  };
}
