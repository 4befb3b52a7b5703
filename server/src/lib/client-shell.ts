// The HTML shell of the client, made for the address asked for:
// - who is signed in, as a JSON data block (never executed, so the CSP's script-src does not
//   apply). Without it the client must ask `/api/auth/me` before a signed-in page can fetch its
//   own data: one more round trip before the first useful paint, which on a weak rural
//   connection is the slowest part of opening a page.
// - the page's own code as `modulepreload` links (from Vite's manifest), so the browser fetches
//   it together with the app's instead of only once the app has started and asked for it.
import fs from 'node:fs';
import { canAccess, pageAt } from '../../shared/pages';
import { SHELL_DATA_ID, type ShellData } from '../../shared/page-shell';

export type { ShellData };

// `<`, `>` and `&` escaped so no value can close the script element or open a comment;
// U+2028/2029 for old parsers that treat them as line ends.
const UNSAFE = /[<>&\u2028\u2029]/g;
const escapeJsonForHtml = (json: string) => json.replace(UNSAFE, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);

/** What Vite's build manifest says of one chunk (only what is read here). */
export interface ManifestChunk {
  file: string;
  isEntry?: boolean;
  imports?: string[];
}
export type Manifest = Record<string, ManifestChunk>;

/** The files of the page shown at `pathname` and every chunk they import, except the entry (the
 * shell loads that already). None for a page this person would be sent away from. */
export function pageChunks(manifest: Manifest | null, pathname: string, data: ShellData | undefined): string[] {
  const page = pageAt(pathname);
  if (!manifest || !page || !data || !canAccess(data.user, page.access)) return [];
  const files: string[] = [];
  const seen = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk || chunk.isEntry || seen.has(key)) return;
    seen.add(key);
    files.push(`/${chunk.file}`);
    for (const imported of chunk.imports ?? []) visit(imported);
  };
  visit(`src/app/routes/${page.module}.tsx`);
  return files;
}

/** `data` undefined (the session could not be read): no block, and the client asks the server itself. */
export function renderShell(template: string, data: ShellData | undefined, preloads: readonly string[] = []): string {
  const tags = preloads.map((href) => `<link rel="modulepreload" crossorigin href="${href}" />`);
  if (data) tags.push(`<script type="application/json" id="${SHELL_DATA_ID}">${escapeJsonForHtml(JSON.stringify(data))}</script>`);
  if (tags.length === 0) return template;
  const at = template.indexOf('</head>');
  const block = `${tags.join('\n  ')}\n  `;
  return at === -1 ? `${block}${template}` : `${template.slice(0, at)}${block}${template.slice(at)}`;
}

/** A file of the build, re-read only when the build replaced it (the tests rebuild while a
 * server runs); null while it does not exist. */
export function builtFile<T>(file: string, parse: (text: string) => T): () => T | null {
  let cached: { mtimeMs: number; value: T } | null = null;
  return () => {
    let mtimeMs: number;
    try {
      mtimeMs = fs.statSync(file).mtimeMs;
    } catch {
      return null;
    }
    if (!cached || cached.mtimeMs !== mtimeMs) {
      try {
        cached = { mtimeMs, value: parse(fs.readFileSync(file, 'utf8')) };
      } catch {
        return null;
      }
    }
    return cached.value;
  };
}
