import { NavLink } from 'react-router';
import type { PublicUser } from '@shared/auth-schemas';
import { canAccess, type Access } from '../../lib/auth';
import { cx } from '../ui/cx';

const NAV_ITEMS: ReadonlyArray<{ to: string; label: string; access: Access }> = [
  { to: '/batches', label: 'Batch shelf', access: 'signed-in' },
  { to: '/cases/new', label: 'Open a case', access: 'signed-in' },
  { to: '/rounds', label: 'Rounds', access: ['mentor', 'steward'] },
  { to: '/library', label: 'Field Library', access: 'anyone' },
  { to: '/steward', label: 'Steward desk', access: ['steward'] },
];

export function SiteNav({ user, layout }: { user: PublicUser | null; layout: 'bar' | 'stack' }) {
  const items = NAV_ITEMS.filter((item) => canAccess(user, item.access));
  return (
    <ul className={layout === 'bar' ? 'flex items-center gap-1' : 'flex flex-col gap-1'}>
      {items.map((item) => (
        <li key={item.to}>
          <NavLink
            to={item.to}
            // "Open a case" must not light up on /cases/:id.
            end
            className={({ isActive }) =>
              cx(
                'flex min-h-11 items-center rounded-soft px-3 font-bold text-loam no-underline hover:bg-moss-mist',
                layout === 'stack' && 'px-4 text-lg',
                isActive && 'bg-moss-mist text-moss-deep underline decoration-2 underline-offset-8',
              )
            }
          >
            {item.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}
