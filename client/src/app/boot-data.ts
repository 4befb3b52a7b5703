// What the server wrote into the page (server/src/lib/client-shell.ts): who is signed in, so the
// first page's loaders need not wait for `/api/auth/me` before fetching their own data.
import type { QueryClient } from '@tanstack/react-query';
import type { PublicUser } from '@shared/auth-schemas';
import { SHELL_DATA_ID, type ShellData } from '@shared/page-shell';
import { authKeys } from '../features/auth/api/auth-keys';

/** Puts the person from the page into the cache; without the block (Vite's dev server, or the
 * session could not be read), nothing is seeded and the client asks as before. Read once: a
 * later navigation within the tab trusts the cache and the API, not the first page. */
export function seedFromPage(queryClient: QueryClient, doc: Document = document): void {
  const block = doc.getElementById(SHELL_DATA_ID);
  if (!block?.textContent) return;
  block.remove();
  let user: PublicUser | null;
  try {
    user = (JSON.parse(block.textContent) as ShellData).user;
  } catch {
    return;
  }
  // The block is the server's own answer; checked by hand rather than with the zod schema, which
  // would put the whole of zod on the path to the first paint.
  if (user !== null && (typeof user !== 'object' || typeof user.id !== 'number' || typeof user.role !== 'string')) return;
  if (queryClient.getQueryData(authKeys.me()) === undefined) queryClient.setQueryData(authKeys.me(), user);
}
