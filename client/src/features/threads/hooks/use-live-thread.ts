// Keeps one case's thread live: joins the case's room (again after every reconnect, asking for
// what came after the last message we hold), and folds broadcasts into the query cache.
import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { PresenceEntry, ThreadMessage } from '@shared/socket-events';
import { useLiveSocket } from '../../../lib/socket';
import type { UnreadCounts } from '../api/get-unread';
import { addToThread } from '../api/send-message';
import { threadKeys } from '../api/thread-keys';
import { lastSeqOf, markHidden } from '../lib/merge-messages';

const JOIN_TIMEOUT_MS = 10_000;
/** A "typing" that is never followed by "stopped" (a closed laptop) fades after this long. */
const TYPING_FADES_MS = 8_000;

export interface TypingPerson {
  userId: number;
  displayName: string;
}

export type JoinState = { kind: 'joining' } | { kind: 'joined' } | { kind: 'refused'; message: string };

export interface LiveThread {
  join: JoinState;
  present: PresenceEntry[];
  typing: TypingPerson[];
}

export function useLiveThread(caseId: number, options: { onCaseUpdated?: () => void; myUserId: number | null }): LiveThread {
  const socket = useLiveSocket();
  const queryClient = useQueryClient();
  const [join, setJoin] = useState<JoinState>({ kind: 'joining' });
  const [present, setPresent] = useState<PresenceEntry[]>([]);
  const [typing, setTyping] = useState<Map<number, TypingPerson & { until: number }>>(new Map());
  const onCaseUpdated = useRef(options.onCaseUpdated);
  onCaseUpdated.current = options.onCaseUpdated;
  const myUserId = options.myUserId;

  useEffect(() => {
    if (!socket) return;
    let active = true;
    const key = threadKeys.detail(caseId);

    /** Asks for everything after `afterSeq`, page after page (the server answers in chunks). */
    const catchUp = async (afterSeq: number) => {
      let from = afterSeq;
      for (;;) {
        const answer = await socket.timeout(JOIN_TIMEOUT_MS).emitWithAck('message:since', { caseId, afterSeq: from });
        if (!active || !answer.ok) return;
        addToThread(queryClient, caseId, answer.messages);
        if (!answer.hasMore || answer.messages.length === 0) return;
        from = lastSeqOf(answer.messages);
      }
    };

    const joinRoom = async () => {
      setJoin({ kind: 'joining' });
      const held = queryClient.getQueryData<ThreadMessage[]>(key);
      // With nothing held yet the server sends the latest page; otherwise what came after ours.
      const afterSeq = held?.length ? lastSeqOf(held) : undefined;
      try {
        const answer = await socket.timeout(JOIN_TIMEOUT_MS).emitWithAck('case:join', { caseId, afterSeq });
        if (!active) return;
        if (!answer.ok) {
          setJoin({ kind: 'refused', message: answer.error.message });
          return;
        }
        addToThread(queryClient, caseId, answer.messages ?? []);
        setPresent(answer.presence ?? []);
        setJoin({ kind: 'joined' });
        if (answer.hasMore && afterSeq !== undefined) await catchUp(lastSeqOf(answer.messages));
        // Joining counts as reading: the counts in the header change, when they had any for this
        // case (or are not known yet). A case with nothing unread costs no second ask.
        const counts = queryClient.getQueryData<UnreadCounts>(threadKeys.unread());
        if (!counts || (counts.byCase[caseId] ?? 0) > 0) void queryClient.invalidateQueries({ queryKey: threadKeys.unread() });
      } catch {
        // No answer: the next reconnect joins again; meanwhile the page load's copy stands.
        if (active) setJoin({ kind: 'joining' });
      }
    };

    const onMessage = (message: ThreadMessage) => {
      if (message.caseId !== caseId) return;
      // The server counts it read for whoever has the case open, so the header count stays.
      addToThread(queryClient, caseId, [message]);
      if (message.author) dropTyping(message.author.id);
    };
    const onHidden = ({ caseId: id, messageId }: { caseId: number; messageId: number }) => {
      if (id !== caseId) return;
      queryClient.setQueryData<ThreadMessage[]>(key, (current) => (current ? markHidden(current, messageId) : current));
    };
    const onPresence = ({ caseId: id, present: list }: { caseId: number; present: PresenceEntry[] }) => {
      if (id === caseId) setPresent(list);
    };
    const dropTyping = (userId: number) =>
      setTyping((current) => {
        if (!current.has(userId)) return current;
        const next = new Map(current);
        next.delete(userId);
        return next;
      });
    const onTyping = (event: { caseId: number; userId: number; displayName: string; typing: boolean }) => {
      if (event.caseId !== caseId || event.userId === myUserId) return;
      if (!event.typing) return dropTyping(event.userId);
      setTyping((current) =>
        new Map(current).set(event.userId, { userId: event.userId, displayName: event.displayName, until: Date.now() + TYPING_FADES_MS }),
      );
    };
    const onCase = ({ caseId: id }: { caseId: number }) => {
      if (id === caseId) onCaseUpdated.current?.();
    };
    const onDisconnect = () => {
      // Presence and typing are only true while we are connected to see them.
      setPresent([]);
      setTyping(new Map());
    };

    socket.on('connect', joinRoom);
    socket.on('disconnect', onDisconnect);
    socket.on('message:new', onMessage);
    socket.on('message:hidden', onHidden);
    socket.on('presence', onPresence);
    socket.on('typing', onTyping);
    socket.on('case:updated', onCase);
    if (socket.connected) void joinRoom();

    return () => {
      active = false;
      socket.off('connect', joinRoom);
      socket.off('disconnect', onDisconnect);
      socket.off('message:new', onMessage);
      socket.off('message:hidden', onHidden);
      socket.off('presence', onPresence);
      socket.off('typing', onTyping);
      socket.off('case:updated', onCase);
      if (socket.connected) socket.emit('case:leave', { caseId });
    };
  }, [socket, caseId, queryClient, myUserId]);

  // Let stale "is typing" lines fade.
  useEffect(() => {
    if (typing.size === 0) return;
    const soonest = Math.min(...[...typing.values()].map((t) => t.until));
    const timer = setTimeout(() => {
      const now = Date.now();
      setTyping((current) => new Map([...current].filter(([, t]) => t.until > now)));
    }, Math.max(0, soonest - Date.now()) + 50);
    return () => clearTimeout(timer);
  }, [typing]);

  return { join, present, typing: [...typing.values()].map(({ userId, displayName }) => ({ userId, displayName })) };
}

/** Tells the others in the room that we are writing: at most every few seconds while keys are
 * pressed, and "stopped" after a pause or once the message is sent. While an aside is being
 * written only mentors and stewards hear of it. */
export function useTypingSignal(caseId: number): { keyPressed: (aside: boolean) => void; stopped: () => void } {
  const socket = useLiveSocket();
  const state = useRef<{ lastSent: number; aside: boolean; timer: ReturnType<typeof setTimeout> | null }>({ lastSent: 0, aside: false, timer: null });

  const stopped = useCallback(() => {
    const current = state.current;
    if (current.timer) clearTimeout(current.timer);
    current.timer = null;
    if (current.lastSent && socket?.connected) socket.emit('typing', { caseId, typing: false, aside: current.aside });
    current.lastSent = 0;
  }, [socket, caseId]);

  useEffect(() => stopped, [stopped]);

  const keyPressed = useCallback(
    (aside: boolean) => {
      if (!socket?.connected) return;
      const current = state.current;
      if (current.lastSent && current.aside !== aside) stopped();
      const now = Date.now();
      if (now - current.lastSent > 3_000) {
        socket.emit('typing', { caseId, typing: true, aside });
        current.lastSent = now;
        current.aside = aside;
      }
      if (current.timer) clearTimeout(current.timer);
      current.timer = setTimeout(stopped, 4_000);
    },
    [socket, caseId, stopped],
  );

  return { keyPressed, stopped };
}
