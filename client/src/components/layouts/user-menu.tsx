import { Link, useLocation } from 'react-router';
import type { PublicUser } from '@shared/auth-schemas';
import { useLogout } from '../../features/auth/api/logout';
import { ROLE_LABELS, signInPath } from '../../lib/auth';
import { Button, buttonClasses } from '../ui/button';
import { cx } from '../ui/cx';
import { ACCOUNT_PATH } from '@shared/case-links';
import { isStaffRole } from '@shared/case-status';

/** Who is signed in and the way out; for a visitor, the ways in. */
export function UserMenu({ user, layout }: { user: PublicUser | null; layout: 'bar' | 'stack' }) {
  const logout = useLogout();
  const location = useLocation();
  const stacked = layout === 'stack';

  if (!user) {
    const here = location.pathname === '/' || location.pathname.startsWith('/sign-in') || location.pathname.startsWith('/join')
      ? undefined
      : location.pathname + location.search;
    return (
      <div className={cx('flex gap-2', stacked && 'flex-col sm:flex-row')}>
        <Link to={signInPath(here)} className={buttonClasses('secondary')}>
          Sign in
        </Link>
        <Link to="/join" className={buttonClasses('primary')}>
          Join
        </Link>
      </div>
    );
  }

  return (
    <div className={cx('flex gap-3', stacked ? 'flex-col sm:items-start' : 'items-center')}>
      <p className="leading-tight">
        <span className="sr-only">Signed in as </span>
        <Link to={ACCOUNT_PATH} aria-label={`${user.displayName}, your account`} className="block max-w-48 truncate font-extrabold text-loam">
          {user.displayName}
        </Link>
        <span className="block text-base text-loam-soft">
          {ROLE_LABELS[user.role]}
          {/* In the bar at a desk there is no room beside a full menu; the rounds page links it there. */}
          {stacked && isStaffRole(user.role) && (
            <>
              {' · '}
              <Link to={`/mentors/${user.id}`}>your track record</Link>
            </>
          )}
        </span>
      </p>
      <Button variant="secondary" onClick={() => logout.mutate()} disabled={logout.isPending}>
        {logout.isPending ? 'Signing out…' : 'Sign out'}
      </Button>
      {logout.error && (
        <p role="alert" className="font-semibold text-ember">
          Could not sign out: {logout.error.message}
        </p>
      )}
    </div>
  );
}
