// Keeps the signed-in person's role current while a tab stays open: when the server says
// `account:changed` (a steward approved them as a mentor, changed their role or disabled the
// account), the user is asked for again at once, so the header and the role-gated pages follow
// without a reload. The server drops the socket right after (its rooms were for the old role);
// once the new answer is in, the same person's socket connects again into the right rooms.
import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { PublicUser } from '@shared/auth-schemas';
import { useLiveSocket } from '../../../lib/socket';
import { authKeys } from '../api/auth-keys';

export function useAccountChanges(): void {
  const socket = useLiveSocket();
  const queryClient = useQueryClient();

  useEffect(() => {
    if (!socket) return;
    const onChanged = () => {
      const before = queryClient.getQueryData<PublicUser | null>(authKeys.me())?.id;
      const asked = queryClient.invalidateQueries({ queryKey: authKeys.me() });
      socket.once('disconnect', (reason) => {
        if (reason !== 'io server disconnect') return;
        void asked.then(() => {
          const now = queryClient.getQueryData<PublicUser | null>(authKeys.me());
          if (now && now.id === before && !socket.active) socket.connect();
        });
      });
    };
    socket.on('account:changed', onChanged);
    return () => {
      socket.off('account:changed', onChanged);
    };
  }, [socket, queryClient]);
}
