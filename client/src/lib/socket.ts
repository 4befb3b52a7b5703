// The one socket.io connection of the signed-in person. It lives as long as the session: made
// when someone signs in, dropped at sign-out, and remade when a different person signs in on
// the same tab (the handshake carries the session cookie, so a socket never outlives its user).
// socket.io-client itself is fetched only once someone is signed in, after the page has shown:
// visitors never need it, and nothing live is on screen before the first paint.
import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@shared/socket-events';
import { authKeys } from '../features/auth/api/auth-keys';
import { useUser } from '../features/auth/api/get-me';
import { appPainted } from './after-paint';

export type LiveSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

/** 'connecting' only until the first answer after sign-in; after that a drop is 'offline'
 * until the connection is back, so the banner does not flicker with every retry. */
export type ConnectionState = 'connecting' | 'online' | 'offline';

interface Snapshot {
  socket: LiveSocket | null;
  userId: number | null;
  state: ConnectionState;
}

let snapshot: Snapshot = { socket: null, userId: null, state: 'connecting' };
const listeners = new Set<() => void>();

function publish(next: Partial<Snapshot>): void {
  snapshot = { ...snapshot, ...next };
  for (const listener of listeners) listener();
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

const getSnapshot = () => snapshot;

// The browser knows about a lost network long before socket.io's ping timeout (up to 45 s) does.
function onBrowserOffline(): void {
  if (snapshot.socket) publish({ state: 'offline' });
}

function onBrowserOnline(): void {
  const socket = snapshot.socket;
  // socket.io-client may have failed to load while the network was away.
  if (!socket) {
    if (snapshot.userId !== null) bindSocketToUser(snapshot.userId);
    return;
  }
  if (socket.connected) publish({ state: 'online' });
  // Skip the rest of socket.io's back-off: the network is back now.
  else socket.connect();
}

if (typeof window !== 'undefined') {
  window.addEventListener('offline', onBrowserOffline);
  window.addEventListener('online', onBrowserOnline);
}

let socketIo: Promise<typeof import('socket.io-client')> | null = null;
// The first bind runs in an effect of the first render, which React may run before the browser
// paints: the page's first paint does not wait for socket.io-client's download and start-up.
const loadSocketIo = () => (socketIo ??= appPainted().then(() => import('socket.io-client')));

function createSocket(io: (typeof import('socket.io-client'))['io']): LiveSocket {
  const socket: LiveSocket = io({
    path: '/socket.io',
    // Websocket first: the fan-out adapter across processes needs it or sticky sessions.
    transports: ['websocket', 'polling'],
    withCredentials: true,
    autoConnect: false,
    reconnectionDelayMax: 10_000,
  });
  socket.on('connect', () => publish({ state: 'online' }));
  socket.on('disconnect', () => publish({ state: 'offline' }));
  socket.on('connect_error', () => publish({ state: 'offline' }));
  return socket;
}

/** The user whose socket is being made (socket.io-client still on its way). */
let makingFor: number | null = null;

/** Makes sure the socket belongs to `userId` (null: nobody signed in, no socket). The socket
 * appears in the snapshot once socket.io-client has loaded; until then this returns null. */
export function bindSocketToUser(userId: number | null): LiveSocket | null {
  if (snapshot.userId === userId && (snapshot.socket || userId === null || makingFor === userId)) return snapshot.socket;
  snapshot.socket?.removeAllListeners();
  snapshot.socket?.disconnect();
  makingFor = null;
  if (userId === null) {
    publish({ socket: null, userId: null, state: 'connecting' });
    return null;
  }
  publish({ socket: null, userId, state: 'connecting' });
  makingFor = userId;
  loadSocketIo().then(
    ({ io }) => {
      // Someone else signed in (or out) while it loaded: that call made its own.
      if (makingFor !== userId) return;
      makingFor = null;
      const socket = createSocket(io);
      publish({ socket });
      socket.connect();
    },
    () => {
      if (makingFor !== userId) return;
      makingFor = null;
      // The next bind (e.g. the session recheck, or going back online) tries again.
      socketIo = null;
      publish({ state: 'offline' });
    },
  );
  return null;
}

export function getSocket(): LiveSocket | null {
  return snapshot.socket;
}

/** Listeners that must hear when the person behind the socket changes (e.g. unsent messages
 * of the previous person are dropped, so nothing is sent under someone else's name). */
export function onSocketUserChange(listener: (userId: number | null) => void): () => void {
  let last = snapshot.userId;
  return subscribe(() => {
    if (snapshot.userId === last) return;
    last = snapshot.userId;
    listener(last);
  });
}

/** Sockets whose session is already watched (see useLiveSocket). */
const watched = new WeakSet<LiveSocket>();

/**
 * Keeps the socket in step with the session and returns it (null for a visitor). Safe to call
 * from several components: they all share the one connection.
 */
export function useLiveSocket(): LiveSocket | null {
  const queryClient = useQueryClient();
  const userId = useUser().data?.id ?? null;
  const current = useSyncExternalStore(subscribe, getSnapshot, getSnapshot);
  const socket = current.userId === userId ? current.socket : null;

  useEffect(() => {
    bindSocketToUser(userId);
  }, [userId]);

  useEffect(() => {
    if (!socket || watched.has(socket)) return;
    watched.add(socket);
    // The server drops a socket whose session ended (signed out in another tab, account
    // disabled), and refuses a handshake without a live session; socket.io retries neither.
    // Asking who is signed in settles it: the header shows the truth, and if the session is
    // still good the socket comes back (at most once a minute, so a fault cannot spin).
    let lastRecheck = 0;
    const recheckSession = () => {
      if (Date.now() - lastRecheck < 60_000) return;
      lastRecheck = Date.now();
      void queryClient.invalidateQueries({ queryKey: authKeys.me() }).then(() => {
        const stillSignedIn = queryClient.getQueryData<{ id: number } | null>(authKeys.me())?.id === userId;
        if (stillSignedIn && snapshot.socket === socket && !socket.active) socket.connect();
      });
    };
    const onDisconnect = (reason: string) => {
      if (reason === 'io server disconnect') recheckSession();
    };
    const onRefused = (error: Error & { data?: { code?: string } }) => {
      if (error.data?.code === 'unauthorized') recheckSession();
    };
    // Kept for the socket's whole life (however many components share it); a replaced socket
    // loses its listeners in bindSocketToUser.
    socket.on('disconnect', onDisconnect);
    socket.on('connect_error', onRefused);
  }, [socket, userId, queryClient]);

  return socket;
}

export function useConnectionState(): ConnectionState {
  return useSyncExternalStore(subscribe, () => snapshot.state, () => 'connecting' as const);
}
