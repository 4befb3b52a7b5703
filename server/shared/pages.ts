// The client's pages by address. The client's router is built from this list
// (client/src/app/router.tsx), and the server uses it to name a page's code in the HTML it sends
// for that address (server/src/lib/client-shell.ts), so the browser fetches the page's code
// together with the app's instead of only after the app has started.
import type { Role } from './case-status';

/** Who may open a page: anyone (visitors too), any signed-in user, or only these roles. */
export type Access = 'anyone' | 'signed-in' | readonly Role[];

export function canAccess(user: { role: Role } | null | undefined, access: Access): boolean {
  if (access === 'anyone') return true;
  if (!user) return false;
  return access === 'signed-in' || access.includes(user.role);
}

export interface PageRoute {
  /** React Router path below the root ('' is the landing page, '*' everything else). */
  path: string;
  /** The page's file under client/src/app/routes/, without `.tsx`. */
  module: string;
  access: Access;
}

export const PAGES: readonly PageRoute[] = [
  { path: '', module: 'landing', access: 'anyone' },
  { path: 'sign-in', module: 'auth/sign-in', access: 'anyone' },
  { path: 'join', module: 'auth/join', access: 'anyone' },
  { path: 'forgot-password', module: 'auth/forgot-password', access: 'anyone' },
  { path: 'reset-password', module: 'auth/reset-password', access: 'anyone' },
  { path: 'verify-email', module: 'auth/verify-email', access: 'anyone' },
  { path: 'batches', module: 'batches/batch-shelf', access: 'signed-in' },
  { path: 'batches/new', module: 'batches/new-batch', access: 'signed-in' },
  { path: 'batches/:id', module: 'batches/batch-page', access: 'signed-in' },
  { path: 'batches/:id/edit', module: 'batches/edit-batch', access: 'signed-in' },
  { path: 'batches/:id/label', module: 'batches/batch-label', access: 'signed-in' },
  { path: 'cases/new', module: 'cases/open-case', access: 'signed-in' },
  { path: 'cases/:id', module: 'cases/case-page', access: 'signed-in' },
  { path: 'cases/:id/recovery-report', module: 'cases/recovery-report', access: 'signed-in' },
  { path: 'rounds', module: 'rounds/rounds', access: ['mentor', 'steward'] },
  { path: 'library', module: 'library/field-library', access: 'anyone' },
  { path: 'library/:slug', module: 'library/field-note', access: 'anyone' },
  { path: 'steward', module: 'steward/steward-desk', access: ['steward'] },
  { path: 'mentors/:id', module: 'mentors/mentor-profile', access: 'signed-in' },
  { path: 'apply-to-mentor', module: 'mentors/apply', access: 'signed-in' },
  { path: '*', module: 'not-found', access: 'anyone' },
];

/**
 * The page React Router would show at `pathname`, ranked the way it ranks (a fixed segment
 * beats a `:param`, which beats `*`; case-insensitive; a trailing slash ignored).
 */
export function pageAt(pathname: string, pages: readonly PageRoute[] = PAGES): PageRoute | undefined {
  const segments = pathname.toLowerCase().split('/').filter(Boolean);
  let best: { page: PageRoute; score: number } | undefined;
  for (const page of pages) {
    const score = matchScore(page.path, segments);
    if (score !== null && (!best || score > best.score)) best = { page, score };
  }
  return best?.page;
}

function matchScore(path: string, segments: string[]): number | null {
  const parts = path.split('/').filter(Boolean);
  let score = 0;
  for (let i = 0; i < parts.length; i += 1) {
    const part = parts[i];
    if (part === '*') return score + 1;
    const segment = segments[i];
    if (segment === undefined) return null;
    if (part.startsWith(':')) score += 3;
    else if (part.toLowerCase() === segment) score += 10;
    else return null;
  }
  return parts.length === segments.length ? score + 2 : null;
}
