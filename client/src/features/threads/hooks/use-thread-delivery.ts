import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useLiveSocket, type LiveSocket } from '../../../lib/socket';
import { deliverWaiting } from '../api/send-message';

// One listener per socket, however many components ask for it, so a held message goes out once.
const wired = new WeakSet<LiveSocket>();

/** Sends the messages that waited for the connection as soon as it is back, wherever the
 * person is in the app by then. */
export function useThreadDelivery(): void {
  const socket = useLiveSocket();
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!socket || wired.has(socket)) return;
    wired.add(socket);
    const flush = () => void deliverWaiting(queryClient);
    socket.on('connect', flush);
    if (socket.connected) flush();
  }, [socket, queryClient]);
}
