// What the server writes into the HTML shell for the client to read at start
// (server/src/lib/client-shell.ts writes it, client/src/app/boot-data.ts reads it).
import type { PublicUser } from './auth-schemas';

/** The id of the `<script type="application/json">` block in the page. */
export const SHELL_DATA_ID = 'sporewell-boot';

export interface ShellData {
  /** null: a visitor. */
  user: PublicUser | null;
}
