// Sending a message: over the socket when it is up (acknowledged only after the server has
// stored it), over HTTP when it is not, and held for the reconnect when neither gets through.
// Every attempt carries the same client id, so however many times it is tried it is stored once.
import { useCallback } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { ThreadMessage } from '@shared/socket-events';
import { api, isApiError } from '../../../lib/api-client';
import { getSocket } from '../../../lib/socket';
import { newClientId } from '../lib/client-id';
import { mergeMessages } from '../lib/merge-messages';
import { outbox, type PendingMessage } from '../lib/outbox';
import { threadKeys } from './thread-keys';

const ACK_TIMEOUT_MS = 12_000;

export function addToThread(queryClient: QueryClient, caseId: number, messages: ThreadMessage[]): void {
  if (messages.length === 0) return;
  queryClient.setQueryData<ThreadMessage[]>(threadKeys.detail(caseId), (current) => mergeMessages(current ?? [], messages));
  outbox.remove(caseId, messages.flatMap((m) => (m.clientId ? [m.clientId] : [])));
}

type HttpAnswer = ThreadMessage | { message: ThreadMessage };

async function sendOverHttp(message: PendingMessage): Promise<ThreadMessage> {
  const answer = await api.post<HttpAnswer>(`/api/cases/${message.caseId}/messages`, {
    clientId: message.clientId,
    body: message.body,
    kind: message.kind,
    photoIds: message.photoIds,
  });
  return 'message' in answer ? answer.message : answer;
}

/** One attempt for one pending message; the outbox records how it went. */
export async function deliver(queryClient: QueryClient, message: PendingMessage): Promise<void> {
  const { caseId, clientId } = message;
  outbox.update(caseId, clientId, { state: 'sending', error: undefined });
  const socket = getSocket();

  if (socket?.connected) {
    try {
      const answer = await socket
        .timeout(ACK_TIMEOUT_MS)
        .emitWithAck('message:send', { caseId, clientId, body: message.body, kind: message.kind, photoIds: message.photoIds });
      if (answer.ok) addToThread(queryClient, caseId, [answer.message]);
      else outbox.update(caseId, clientId, { state: 'failed', error: answer.error.message });
    } catch {
      // No answer in time. It may well be stored; a retry with the same id is safe either way.
      outbox.update(caseId, clientId, socket.connected
        ? { state: 'failed', error: 'Sporewell did not answer in time.' }
        : { state: 'waiting' });
    }
    return;
  }

  try {
    addToThread(queryClient, caseId, [await sendOverHttp(message)]);
  } catch (error) {
    if (isApiError(error, 0)) outbox.update(caseId, clientId, { state: 'waiting' });
    else outbox.update(caseId, clientId, { state: 'failed', error: isApiError(error) ? error.message : 'It could not be sent.' });
  }
}

/** Sends whatever waited for the connection, oldest first, one case's messages in order. */
export async function deliverWaiting(queryClient: QueryClient): Promise<void> {
  for (const message of outbox.waiting()) await deliver(queryClient, message);
}

export function useSendMessage(caseId: number) {
  const queryClient = useQueryClient();
  const send = useCallback(
    (body: string, kind: PendingMessage['kind'], photoIds?: number[]) => {
      const message: PendingMessage = {
        clientId: newClientId(),
        caseId,
        body,
        kind,
        photoIds: photoIds?.length ? photoIds : undefined,
        createdAt: new Date().toISOString(),
        state: 'sending',
      };
      outbox.add(message);
      void deliver(queryClient, message);
    },
    [caseId, queryClient],
  );
  const retry = useCallback((message: PendingMessage) => void deliver(queryClient, message), [queryClient]);
  return { send, retry };
}
