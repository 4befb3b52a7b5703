// The HTML shell of the client with who is signed in written into it, as a JSON data block
// (never executed, so the CSP's script-src does not apply). Without it the client must ask
// `/api/auth/me` before a signed-in page can fetch its own data: one more round trip before the
// first useful paint, which on a weak rural connection is the slowest part of opening a page.
//
// Not here, on purpose: `modulepreload` links for the page's chunks. Tried and measured with
// Lighthouse: the chunks then share the bandwidth (and the main thread, which compiles them) with
// the app's entry, so the first paint came about a second later while the page's largest text
// came no sooner.
import fs from 'node:fs';
import { SHELL_DATA_ID, type ShellData } from '../../shared/page-shell';

export type { ShellData };

// `<`, `>` and `&` escaped so no value can close the script element or open a comment;
// U+2028/2029 for old parsers that treat them as line ends.
const UNSAFE = /[<>&\u2028\u2029]/g;
const escapeJsonForHtml = (json: string) => json.replace(UNSAFE, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);

/** `data` undefined (the session could not be read): no block, and the client asks the server itself. */
export function renderShell(template: string, data: ShellData | undefined): string {
  if (!data) return template;
  const block = `<script type="application/json" id="${SHELL_DATA_ID}">${escapeJsonForHtml(JSON.stringify(data))}</script>\n  `;
  const at = template.indexOf('</head>');
  return at === -1 ? `${block}${template}` : `${template.slice(0, at)}${block}${template.slice(at)}`;
}

/** index.html as built, re-read only when the build replaced it (the tests rebuild while a
 * server runs); null while there is none. */
export function shellTemplate(file: string): () => string | null {
  let cached: { mtimeMs: number; text: string } | null = null;
  return () => {
    try {
      const { mtimeMs } = fs.statSync(file);
      if (!cached || cached.mtimeMs !== mtimeMs) cached = { mtimeMs, text: fs.readFileSync(file, 'utf8') };
      return cached.text;
    } catch {
      return null;
    }
  };
}
