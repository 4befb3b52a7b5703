// Route guards and role checks. The server enforces access on every route; these only decide
// what a page shows and where a visitor is sent.
import type { QueryClient } from '@tanstack/react-query';
import { data, redirect } from 'react-router';
import type { PublicUser } from '@shared/auth-schemas';
import type { Role } from '@shared/case-status';
import { meQueryOptions } from '../features/auth/api/get-me';

/** Who may open a page: anyone (visitors too), any signed-in user, or only these roles. */
export type Access = 'anyone' | 'signed-in' | readonly Role[];

export const ROLE_LABELS: Record<Role, string> = { grower: 'Grower', mentor: 'Mentor', steward: 'Steward' };

export function canAccess(user: PublicUser | null | undefined, access: Access): boolean {
  if (access === 'anyone') return true;
  if (!user) return false;
  return access === 'signed-in' || access.includes(user.role);
}

/** What a 403 thrown by requireUser carries to the route's error boundary. */
export interface RoleRefusal {
  kind: 'role';
  allowed: readonly Role[];
  role: Role;
}

export function isRoleRefusal(value: unknown): value is RoleRefusal {
  return typeof value === 'object' && value !== null && (value as { kind?: unknown }).kind === 'role';
}

/** The user from cache or the server; an unreachable server counts as signed out. */
export async function loadUser(queryClient: QueryClient): Promise<PublicUser | null> {
  try {
    return await queryClient.ensureQueryData(meQueryOptions());
  } catch {
    return null;
  }
}

/** Where each role starts after signing in: a grower at their batches, a mentor at the rounds,
 * a steward at the desk. */
export const HOME_BY_ROLE: Record<Role, string> = { grower: '/batches', mentor: '/rounds', steward: '/steward' };

/** Only same-site paths, so a crafted `next` cannot send someone to another site after sign-in. */
export function safeNext(next: string | null | undefined, fallback = '/batches'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next.startsWith('/sign-in') || next.startsWith('/join')) return fallback;
  return next;
}

export function signInPath(next?: string): string {
  return next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in';
}

/**
 * For route loaders. Resolves to the signed-in user; otherwise throws a redirect to
 * `/sign-in?next=<this page>`, or a 403 (shown as "not for your role") when the role does not fit.
 */
export async function requireUser(
  queryClient: QueryClient,
  request: Request,
  roles?: readonly Role[],
): Promise<PublicUser> {
  const user = await loadUser(queryClient);
  if (!user) throw signInFrom(request);
  if (roles && !roles.includes(user.role)) {
    // The remembered answer may predate a role change (a steward approved this person while
    // the tab was open): ask once more before refusing. Only refusals cost the extra request.
    const fresh = await refetchUser(queryClient, user);
    if (!fresh) throw signInFrom(request);
    if (roles.includes(fresh.role)) return fresh;
    throw data({ kind: 'role', allowed: roles, role: fresh.role } satisfies RoleRefusal, {
      status: 403,
      statusText: 'Not for your role',
    });
  }
  return user;
}

function signInFrom(request: Request) {
  const url = new URL(request.url);
  return redirect(signInPath(url.pathname + url.search));
}

/** Who the server says is signed in now; `fallback` when it cannot be asked. */
export async function refetchUser(queryClient: QueryClient, fallback: PublicUser | null): Promise<PublicUser | null> {
  try {
    return await queryClient.fetchQuery({ ...meQueryOptions(), staleTime: 0 });
  } catch {
    return fallback;
  }
}

/** Loader for sign-in and join: someone already signed in goes straight on to `next`. */
export const redirectIfSignedIn =
  (queryClient: QueryClient) =>
  async ({ request }: { request: Request }) => {
    const user = await loadUser(queryClient);
    if (user) throw redirect(safeNext(new URL(request.url).searchParams.get('next'), HOME_BY_ROLE[user.role]));
    return null;
  };
