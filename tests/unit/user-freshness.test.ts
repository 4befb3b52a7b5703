// The signed-in user on the client is remembered for minutes; these are the ways it is asked
// for again so a changed role shows without a reload: a 403 from any call, coming back to the
// tab, and a role-gated page refusing on a remembered role (the socket's account:changed is in
// tests/server/account-changes.test.ts).
import { afterEach, describe, expect, test, vi } from 'vitest';
import type { Query } from '@tanstack/react-query';
import type { PublicUser } from '../../server/shared/auth-schemas';
import { ApiError } from '../../client/src/lib/api-client';
import { createQueryClient, ROLE_RECHECK_MS } from '../../client/src/lib/query-client';
import { requireUser } from '../../client/src/lib/auth';
import { authKeys } from '../../client/src/features/auth/api/auth-keys';
import { ME_FOCUS_RECHECK_MS, meQueryOptions } from '../../client/src/features/auth/api/get-me';

const person = (role: PublicUser['role']): PublicUser => ({ id: 41, email: 'wren@example.test', displayName: 'Wren Applicant', role, emailVerified: true });

/** The server's answer to GET /api/auth/me, counting how often it is asked. */
function serverSays(role: PublicUser['role']) {
  const calls: string[] = [];
  vi.stubGlobal('fetch', async (path: string) => {
    calls.push(path);
    return new Response(JSON.stringify(person(role)), { status: 200, headers: { 'Content-Type': 'application/json' } });
  });
  return calls;
}

afterEach(() => {
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

async function refused(client: ReturnType<typeof createQueryClient>, status: number) {
  await client.fetchQuery({ queryKey: ['some-page', Math.random()], queryFn: () => Promise.reject(new ApiError(status, 'forbidden', 'Not for you.')) }).catch(() => undefined);
}

describe('asking for the signed-in user again', () => {
  test('when any call answers 403, then the user is asked for again, at most once every few seconds', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const client = createQueryClient();
    const invalidated = () => client.getQueryState(authKeys.me())?.isInvalidated;
    client.setQueryData(authKeys.me(), person('grower'));
    await refused(client, 403);
    expect(invalidated()).toBe(true);

    client.setQueryData(authKeys.me(), person('grower'));
    await refused(client, 403);
    expect(invalidated()).toBe(false);

    vi.setSystemTime(Date.now() + ROLE_RECHECK_MS);
    await refused(client, 403);
    expect(invalidated()).toBe(true);

    // Other refusals leave it alone.
    client.setQueryData(authKeys.me(), person('grower'));
    vi.setSystemTime(Date.now() + ROLE_RECHECK_MS);
    await refused(client, 404);
    expect(invalidated()).toBe(false);
  });

  test('when the tab gets focus again, then the user is asked for once the answer is half a minute old, not before', () => {
    const decide = meQueryOptions().refetchOnWindowFocus as unknown as (query: Query) => boolean | 'always';
    const answeredAgo = (ms: number) => ({ state: { dataUpdatedAt: Date.now() - ms } }) as unknown as Query;
    expect(decide(answeredAgo(ME_FOCUS_RECHECK_MS + 1_000))).toBe('always');
    expect(decide(answeredAgo(5_000))).toBe(false);
  });

  test('when a page for mentors refuses a remembered grower, then the server is asked once and a freshly approved mentor gets in', async () => {
    const client = createQueryClient();
    client.setQueryData(authKeys.me(), person('grower'));
    const calls = serverSays('mentor');
    const user = await requireUser(client, new Request('http://127.0.0.1/rounds'), ['mentor', 'steward']);
    expect(user.role).toBe('mentor');
    expect(calls).toEqual(['/api/auth/me']);
    expect(client.getQueryData<PublicUser>(authKeys.me())?.role).toBe('mentor');
  });

  test('when the server still says grower, then the page is refused for the role; when the role fits, the server is not asked', async () => {
    const client = createQueryClient();
    client.setQueryData(authKeys.me(), person('grower'));
    const calls = serverSays('grower');
    const refusal = await requireUser(client, new Request('http://127.0.0.1/rounds'), ['mentor', 'steward']).then(
      () => null,
      (thrown: unknown) => thrown,
    );
    expect(refusal).toMatchObject({ data: { kind: 'role', role: 'grower' }, init: { status: 403 } });
    expect(calls).toHaveLength(1);

    await requireUser(client, new Request('http://127.0.0.1/batches'), ['grower']);
    expect(calls).toHaveLength(1);
  });
});
