// The count of unread replies in the header, for the cases a person grows or holds. It is also
// what keeps the live connection up while someone is signed in, whatever page they are on.
import { useEffect, useId, useRef, useState } from 'react';
import { Link } from 'react-router';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import type { PublicUser } from '@shared/auth-schemas';
import { cx } from '../../../components/ui/cx';
import { useLiveSocket, type LiveSocket } from '../../../lib/socket';
import { myCasesQueryOptions } from '../../cases/api/get-my-cases';
import { useUnread } from '../api/get-unread';
import { threadKeys } from '../api/thread-keys';
import { useThreadDelivery } from '../hooks/use-thread-delivery';
import { conversationPath } from '@shared/case-links';

// One pair of listeners per socket however many badges there are (the header has one for wide
// screens and one for phones), so a hint or a reconnect asks for the counts once, not twice.
const wired = new WeakSet<LiveSocket>();

function useUnreadHints(): void {
  const socket = useLiveSocket();
  const queryClient = useQueryClient();
  useEffect(() => {
    if (!socket || wired.has(socket)) return;
    wired.add(socket);
    const refresh = () => void queryClient.invalidateQueries({ queryKey: threadKeys.unread() });
    socket.on('unread', refresh);
    // Anything may have arrived while there was no connection to be told on: ask again on every
    // connect, the first one too. The page asks for the counts as it loads, but the socket only
    // connects after the first paint, and a reply stored in between sends its hint to nobody.
    socket.on('connect', refresh);
  }, [socket, queryClient]);
}

export function UnreadBadge({ user, className }: { user: PublicUser | null; className?: string }) {
  useUnreadHints();
  useThreadDelivery();
  const unread = useUnread(user !== null);
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const wrapperRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  // Titles only when the list is opened: the count alone needs no more than the unread route.
  const titles = useQuery({ ...myCasesQueryOptions(), enabled: open });

  useEffect(() => {
    if (!open) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setOpen(false);
      buttonRef.current?.focus();
    };
    const onPointer = (event: PointerEvent) => {
      if (!wrapperRef.current?.contains(event.target as Node)) setOpen(false);
    };
    document.addEventListener('keydown', onKey);
    document.addEventListener('pointerdown', onPointer);
    return () => {
      document.removeEventListener('keydown', onKey);
      document.removeEventListener('pointerdown', onPointer);
    };
  }, [open]);

  const total = unread.data?.total ?? 0;
  if (!user || total === 0) return null;

  const byCase = Object.entries(unread.data?.byCase ?? {}).filter(([, n]) => n > 0);
  const known = new Map((titles.data?.items ?? []).map((c) => [String(c.id), c.title]));
  const where = user.role === 'grower' ? 'your cases' : 'the cases you hold';

  return (
    <div ref={wrapperRef} className={cx('relative', className)}>
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="inline-flex min-h-11 items-center gap-2 rounded-soft border-2 border-moss bg-moss-mist px-3 font-bold text-moss-deep hover:bg-rice"
      >
        <span className="inline-flex min-w-6 items-center justify-center rounded-full bg-moss px-1.5 text-sm font-extrabold text-rice">
          {total > 99 ? '99+' : total}
        </span>
        <span>
          new<span className="sr-only"> {total === 1 ? 'message' : 'messages'} in {where}</span>
        </span>
      </button>
      <div
        id={panelId}
        hidden={!open}
        className="absolute right-0 z-30 mt-2 w-80 max-w-[calc(100vw-2rem)] rounded-soft border border-line bg-rice p-3 shadow-lg"
      >
        <p className="font-extrabold">New messages in {where}</p>
        <ul className="mt-2 flex flex-col gap-1">
          {byCase.map(([caseId, n]) => (
            <li key={caseId}>
              <Link
                to={conversationPath(caseId)}
                onClick={() => setOpen(false)}
                className="flex min-h-11 items-center justify-between gap-3 rounded-soft px-2 py-1 no-underline hover:bg-moss-mist"
              >
                <span className="line-clamp-2 min-w-0 underline underline-offset-4">{known.get(caseId) ?? `Case ${caseId}`}</span>
                <span className="shrink-0 text-sm font-bold text-loam-soft">{n} new</span>
              </Link>
            </li>
          ))}
        </ul>
        {user.role !== 'grower' && (
          <Link to="/rounds" onClick={() => setOpen(false)} className="mt-2 inline-flex min-h-11 items-center px-2 font-bold">
            Go to the rounds
          </Link>
        )}
      </div>
    </div>
  );
}
