// The live thread of a case, shown by the case page below the case header (PRODUCT.md screen 4).
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useLocation } from 'react-router';
import type { PublicUser } from '@shared/auth-schemas';
import type { CaseDetail } from '@shared/case-schemas';
import type { ThreadMessage } from '@shared/socket-events';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { useUser } from '../../auth/api/get-me';
import { casesKeys } from '../../cases/api/cases-keys';
import { useCase } from '../../cases/api/get-case';
import { useThread } from '../api/get-thread';
import { useSendMessage } from '../api/send-message';
import { useLiveThread } from '../hooks/use-live-thread';
import { useThreadDelivery } from '../hooks/use-thread-delivery';
import { CONVERSATION_ANCHOR } from '@shared/case-links';
import { usePendingMessages, type PendingMessage } from '../lib/outbox';
import { Composer } from './composer';
import { ConnectionBanner } from './connection-banner';
import { MessageItem, PendingItem } from './message-item';
import { PresenceLine, TypingLine } from './presence-line';
import { WorkflowBar } from './workflow-bar';
import { isStaffRole } from '@shared/case-status';

export interface CaseThreadProps {
  caseId: number;
  /** Slot for the closing action (PRODUCT.md screen 6), passed on to the workflow bar. */
  closeCaseAction?: ReactNode;
}

/** A thread whose case ended takes no more text (the server refuses it); asides still go. */
const ENDED = new Set(['recovered', 'lost', 'withdrawn']);

export function CaseThread({ caseId, closeCaseAction }: CaseThreadProps) {
  const user = useUser().data ?? null;
  const detail = useCase(caseId);
  if (!user) return null;
  if (detail.isPending) return <Spinner label="Opening the conversation…" />;
  if (detail.isError) {
    return (
      <Alert tone="danger" title="The conversation could not be opened">
        {detail.error.message}
      </Alert>
    );
  }
  return <LiveThread caseId={caseId} detail={detail.data} user={user} closeCaseAction={closeCaseAction} />;
}

function LiveThread({ caseId, detail, user, closeCaseAction }: { caseId: number; detail: CaseDetail; user: PublicUser; closeCaseAction?: ReactNode }) {
  const queryClient = useQueryClient();
  const thread = useThread(caseId);
  const pending = usePendingMessages(caseId);
  const { retry } = useSendMessage(caseId);
  useThreadDelivery();
  const refreshCase = useCallback(() => void queryClient.invalidateQueries({ queryKey: casesKeys.detail(caseId) }), [queryClient, caseId]);
  const live = useLiveThread(caseId, { myUserId: user.id, onCaseUpdated: refreshCase });

  const isGrower = detail.grower.id === user.id;
  const staff = !isGrower && isStaffRole(user.role);
  const ended = ENDED.has(detail.status);
  const messages = useMemo(() => thread.data ?? [], [thread.data]);
  // A message the server already holds stands in for its pending copy.
  const stored = useMemo(() => new Set(messages.flatMap((m) => (m.clientId ? [m.clientId] : []))), [messages]);
  const unsent = pending.filter((p) => !stored.has(p.clientId));

  const audience = isGrower ? (detail.mentor?.displayName.split(' ')[0] ?? 'the mentors') : (detail.grower.displayName.split(' ')[0] ?? 'the grower');

  // Opened at the conversation (#conversation, from the header's jump, the new-message list or
  // a reply e-mail): once the messages are in, show the newest of them and the composer, and
  // start the keyboard there. Again on every such link followed while the page is open.
  const location = useLocation();
  const sectionRef = useRef<HTMLElement>(null);
  const loaded = !thread.isPending;
  useEffect(() => {
    const section = sectionRef.current;
    if (!loaded || !section || location.hash !== `#${CONVERSATION_ANCHOR}`) return;
    const smooth = !window.matchMedia('(prefers-reduced-motion: reduce)').matches;
    section.scrollIntoView({ block: 'end', behavior: smooth ? 'smooth' : 'auto' });
    section.focus({ preventScroll: true });
  }, [loaded, location.key, location.hash]);

  return (
    <section
      ref={sectionRef}
      id={CONVERSATION_ANCHOR}
      tabIndex={-1}
      aria-labelledby={`thread-${caseId}-heading`}
      className="flex scroll-mb-4 flex-col gap-4 focus:outline-none"
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2 id={`thread-${caseId}-heading`} className="text-xl font-extrabold">
          Conversation
        </h2>
        <PresenceLine present={live.present} myUserId={user.id} />
      </div>

      <WorkflowBar detail={detail} user={user} closeCaseAction={closeCaseAction} />
      <ConnectionBanner className="sticky top-2 z-10 empty:hidden" />

      {live.join.kind === 'refused' && (
        <Alert tone="warning" title="Live updates are off for this case">
          {live.join.message} New messages show when you reload the page.
        </Alert>
      )}

      {thread.isPending ? (
        <Spinner label="Loading the messages…" />
      ) : thread.isError && messages.length === 0 ? (
        <Alert tone="danger" title="The messages could not be loaded">
          {thread.error.message}{' '}
          <Button variant="quiet" onClick={() => void thread.refetch()}>
            Try again
          </Button>
        </Alert>
      ) : (
        <MessageList messages={messages} pending={unsent} myUserId={user.id} onRetry={retry} isGrower={isGrower} />
      )}

      <TypingLine typing={live.typing} />

      {ended && !staff ? (
        <Alert tone="info" title="This case has ended">
          Its thread takes no new messages. If the batch needs help again, open a new case.
        </Alert>
      ) : (
        <Composer caseId={caseId} canAside={staff} onlyAsides={ended} audience={audience} />
      )}
    </section>
  );
}

/** Scrolls just far enough that the end of the thread is on screen — never up, so the composer
 * someone is typing in stays where it is. */
function revealEnd(end: HTMLElement | null): boolean {
  if (!end) return false;
  const below = end.getBoundingClientRect().bottom - window.innerHeight;
  if (below <= 0) return false;
  const smooth = !window.matchMedia('(prefers-reduced-motion: reduce)').matches;
  window.scrollBy({ top: below + 16, behavior: smooth ? 'smooth' : 'auto' });
  return true;
}

function MessageList({
  messages,
  pending,
  myUserId,
  onRetry,
  isGrower,
}: {
  messages: ThreadMessage[];
  pending: readonly PendingMessage[];
  myUserId: number;
  onRetry: (message: PendingMessage) => void;
  isGrower: boolean;
}) {
  const endRef = useRef<HTMLDivElement>(null);
  const atEnd = useRef(true);
  // True from an automatic scroll until the end is on screen again: a message that lands while
  // a smooth scroll is still under way must be followed too, not counted as "below".
  const following = useRef(false);
  const [unseen, setUnseen] = useState(0);
  const count = messages.length + pending.length;
  const previousCount = useRef(count);
  const lastIsMine = pending.length > 0 || messages.at(-1)?.author?.id === myUserId;

  // Whether the end of the thread is on screen (or nearly), so new messages can follow without
  // yanking someone who scrolled up to reread.
  useEffect(() => {
    const end = endRef.current;
    if (!end || typeof IntersectionObserver === 'undefined') return;
    const observer = new IntersectionObserver(
      ([entry]) => {
        atEnd.current = entry.isIntersecting;
        if (entry.isIntersecting) {
          following.current = false;
          setUnseen(0);
        }
      },
      { rootMargin: '0px 0px 240px 0px' },
    );
    observer.observe(end);
    return () => observer.disconnect();
  }, []);

  useLayoutEffect(() => {
    const added = count - previousCount.current;
    previousCount.current = count;
    if (added <= 0) return;
    if (atEnd.current || following.current || lastIsMine) {
      following.current = revealEnd(endRef.current);
    } else {
      setUnseen((n) => n + added);
    }
  }, [count, lastIsMine]);

  if (count === 0) {
    return (
      <p className="rounded-soft border border-dashed border-line px-4 py-6 text-center text-loam-soft">
        {isGrower
          ? 'No messages yet. A mentor will reply here; you can add anything you notice meanwhile.'
          : 'No messages yet. Say hello and ask what you need to know.'}
      </p>
    );
  }

  return (
    <div>
      {/* role="log": screen readers read out what is added at the end, in order. */}
      <div role="log" aria-label="Messages">
        <ol className="flex flex-col gap-3">
          {messages.map((message) => (
            <MessageItem key={message.id} message={message} mine={message.author?.id === myUserId} />
          ))}
          {pending.map((message) => (
            <PendingItem key={message.clientId} message={message} onRetry={() => onRetry(message)} />
          ))}
        </ol>
      </div>
      <div ref={endRef} className="h-px" />
      {unseen > 0 && (
        <div className="sticky bottom-3 mt-2 flex justify-center">
          <Button
            variant="primary"
            className="shadow-md"
            onClick={() => {
              revealEnd(endRef.current);
              setUnseen(0);
            }}
          >
            {unseen === 1 ? '1 new message below' : `${unseen} new messages below`}
          </Button>
        </div>
      )}
    </div>
  );
}
