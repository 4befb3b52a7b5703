import { useEffect, useId, useRef, useState } from 'react';
import { Link, Outlet, useLocation, useNavigation } from 'react-router';
import type { PublicUser } from '@shared/auth-schemas';
import { useUser } from '../../features/auth/api/get-me';
import { useAccountChanges } from '../../features/auth/hooks/use-account-changes';
import { UnreadBadge } from '../../features/threads/components/unread-badge';
import { Alert } from '../ui/alert';
import { cx } from '../ui/cx';
import { PAGE_WIDTH } from './content-layout';
import { SiteNav } from './site-nav';
import { SporewellMark } from './sporewell-mark';
import { UserMenu } from './user-menu';

export function AppLayout() {
  const me = useUser();
  const user = me.data ?? null;
  useAccountChanges();
  const location = useLocation();
  const navigation = useNavigation();
  const mainRef = useRef<HTMLElement>(null);
  const shownPath = useRef(location.pathname);

  // After a client-side navigation, start screen readers and keyboards at the new content
  // instead of leaving focus on a link that may no longer exist. (Compared by path, not by
  // "first render", because StrictMode runs effects twice on mount.)
  useEffect(() => {
    if (shownPath.current === location.pathname) return;
    shownPath.current = location.pathname;
    mainRef.current?.focus();
  }, [location.pathname]);

  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded-soft focus:bg-loam focus:px-4 focus:py-3 focus:font-bold focus:text-rice"
      >
        Skip to main content
      </a>
      {navigation.state === 'loading' && (
        <div aria-hidden="true" className="fixed inset-x-0 top-0 z-40 h-1 bg-moss motion-safe:animate-pulse" />
      )}
      <SiteHeader user={user} />
      {me.isError && !user && (
        <div className={cx(PAGE_WIDTH, 'pt-4')}>
          <Alert tone="warning" title="You are seeing Sporewell as a visitor">
            {me.error.message}
          </Alert>
        </div>
      )}
      <main id="main" ref={mainRef} tabIndex={-1} className="flex-1 focus:outline-none">
        <Outlet />
      </main>
      <footer className="border-t border-line bg-rice-deep">
        <p className={cx(PAGE_WIDTH, 'py-5 text-base text-loam-soft')}>
          Advice in Sporewell comes from community members, not licensed professionals.
        </p>
      </footer>
    </div>
  );
}

function SiteHeader({ user }: { user: PublicUser | null }) {
  const [menuOpen, setMenuOpen] = useState(false);
  const menuButtonRef = useRef<HTMLButtonElement>(null);
  const panelRef = useRef<HTMLDivElement>(null);
  const panelId = useId();
  const location = useLocation();

  // Following a link from the phone menu closes it.
  useEffect(() => setMenuOpen(false), [location.pathname]);

  useEffect(() => {
    if (!menuOpen) return;
    panelRef.current?.querySelector<HTMLElement>('a, button')?.focus();
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key !== 'Escape') return;
      setMenuOpen(false);
      menuButtonRef.current?.focus();
    };
    document.addEventListener('keydown', onKeyDown);
    return () => document.removeEventListener('keydown', onKeyDown);
  }, [menuOpen]);

  return (
    <header className="border-b-4 border-moss bg-rice-deep">
      <div className={cx(PAGE_WIDTH, 'flex items-center gap-3 py-2 xl:gap-4')}>
        <Link to="/" className="flex min-h-11 shrink-0 items-center gap-2 rounded-soft text-xl font-extrabold text-loam no-underline sm:text-2xl">
          <SporewellMark className="size-8 sm:size-9" />
          Sporewell
        </Link>
        <nav aria-label="Main" className="hidden xl:block">
          <SiteNav user={user} layout="bar" />
        </nav>
        <div className="ml-auto hidden items-center gap-4 xl:flex">
          <UnreadBadge user={user} />
          <UserMenu user={user} layout="bar" />
        </div>
        <div className="ml-auto flex min-w-0 items-center gap-3 xl:hidden">
          <UnreadBadge user={user} className="shrink-0" />
          {user && <span className="min-w-0 truncate font-bold">{user.displayName}</span>}
          <button
            ref={menuButtonRef}
            type="button"
            aria-expanded={menuOpen}
            aria-controls={panelId}
            onClick={() => setMenuOpen((open) => !open)}
            className="inline-flex min-h-11 min-w-11 shrink-0 items-center gap-2 rounded-soft border-2 border-loam-soft px-3 font-bold"
          >
            <MenuIcon open={menuOpen} />
            Menu
          </button>
        </div>
      </div>
      <div id={panelId} ref={panelRef} hidden={!menuOpen} className={cx(PAGE_WIDTH, 'border-t border-line pb-5 pt-3 xl:hidden')}>
        <nav aria-label="Main">
          <SiteNav user={user} layout="stack" />
        </nav>
        <div className="mt-4 border-t border-line pt-4">
          <UserMenu user={user} layout="stack" />
        </div>
      </div>
    </header>
  );
}

function MenuIcon({ open }: { open: boolean }) {
  return (
    <svg aria-hidden="true" viewBox="0 0 24 24" className="size-5" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round">
      {open ? <path d="M6 6l12 12M18 6L6 18" /> : <path d="M4 7h16M4 12h16M4 17h16" />}
    </svg>
  );
}
