import { describe, expect, test } from 'vitest';
import { pageChunks, renderShell, type Manifest } from '../../server/src/lib/client-shell';
import { pageAt } from '../../server/shared/pages';
import type { PublicUser } from '../../server/shared/auth-schemas';

const TEMPLATE = '<!doctype html>\n<html>\n  <head>\n    <title>Sporewell</title>\n  </head>\n  <body><div id="root"></div></body>\n</html>\n';
const grower: PublicUser = { id: 7, email: 'wren@example.test', displayName: 'Wren', role: 'grower', emailVerified: true };

/** The JSON inside the data block, as the browser would hand it to JSON.parse. */
function dataBlock(html: string): unknown {
  const match = /<script type="application\/json" id="sporewell-boot">([^<]*)<\/script>/.exec(html);
  return match ? JSON.parse(match[1]) : undefined;
}

describe('which page an address shows (the order React Router ranks paths in)', () => {
  test('when a fixed segment and a :param both fit, then the fixed one wins', () => {
    expect(pageAt('/cases/new')?.module).toBe('cases/open-case');
    expect(pageAt('/cases/42')?.module).toBe('cases/case-page');
    expect(pageAt('/cases/42/recovery-report')?.module).toBe('cases/recovery-report');
  });
  test('when the address is the root, has a trailing slash or other letter case, then it still matches', () => {
    expect(pageAt('/')?.module).toBe('landing');
    expect(pageAt('/library/')?.module).toBe('library/field-library');
    expect(pageAt('/Library/some-note')?.module).toBe('library/field-note');
  });
  test('when no page has the address, then it is the not-found page', () => {
    expect(pageAt('/cases/42/nothing/here')?.module).toBe('not-found');
    expect(pageAt('/compost')?.module).toBe('not-found');
  });
});

describe('the HTML shell', () => {
  test('when a grower is signed in, then the page carries them as JSON the client can read back', () => {
    const html = renderShell(TEMPLATE, { user: grower });
    expect(dataBlock(html)).toEqual({ user: grower });
    expect(html.indexOf('sporewell-boot')).toBeLessThan(html.indexOf('</head>'));
  });

  test('when a name holds markup, then it cannot end the script element, and reads back unchanged', () => {
    const sly = { ...grower, displayName: '</script><script>alert(1)</script><!-- & \u2028' };
    const html = renderShell(TEMPLATE, { user: sly });
    expect(html).not.toContain('</script><script>');
    expect(html).not.toContain('<!--');
    expect(html.match(/<\/script>/g)).toHaveLength(1);
    expect(dataBlock(html)).toEqual({ user: sly });
  });

  test('when the session could not be read, then the shell is sent as built, so the client asks itself', () => {
    expect(renderShell(TEMPLATE, undefined)).toBe(TEMPLATE);
  });

  test('when preloads are given, then each is a modulepreload link in the head', () => {
    const html = renderShell(TEMPLATE, { user: null }, ['/assets/a.js', '/assets/b.js']);
    const head = html.slice(0, html.indexOf('</head>'));
    expect(head).toContain('<link rel="modulepreload" crossorigin href="/assets/a.js" />');
    expect(head).toContain('<link rel="modulepreload" crossorigin href="/assets/b.js" />');
    expect(dataBlock(html)).toEqual({ user: null });
  });
});

describe("a page's chunks from the build manifest", () => {
  const manifest: Manifest = {
    'index.html': { file: 'assets/index-1.js', isEntry: true },
    'src/app/routes/cases/case-page.tsx': { file: 'assets/case-page-2.js', imports: ['index.html', '_schemas-3.js', '_thread-4.js'] },
    '_schemas-3.js': { file: 'assets/schemas-3.js', imports: ['index.html'] },
    '_thread-4.js': { file: 'assets/thread-4.js', imports: ['_schemas-3.js'] },
    'src/app/routes/landing.tsx': { file: 'assets/landing-5.js', imports: ['index.html'] },
  };

  test('when a signed-in grower opens a case, then its chunk and every chunk it imports are named once, the entry not', () => {
    expect(pageChunks(manifest, '/cases/3', { user: grower })).toEqual(['/assets/case-page-2.js', '/assets/schemas-3.js', '/assets/thread-4.js']);
  });

  test('when a visitor opens a signed-in page, then nothing is preloaded (they are sent to sign in)', () => {
    expect(pageChunks(manifest, '/cases/3', { user: null })).toEqual([]);
    expect(pageChunks(manifest, '/', { user: null })).toEqual(['/assets/landing-5.js']);
  });

  test('when a grower opens a page for mentors, or there is no manifest, then nothing is preloaded', () => {
    expect(pageChunks({ ...manifest, 'src/app/routes/rounds/rounds.tsx': { file: 'assets/rounds-6.js' } }, '/rounds', { user: grower })).toEqual([]);
    expect(pageChunks(null, '/cases/3', { user: grower })).toEqual([]);
  });
});
