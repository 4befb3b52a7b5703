import { describe, expect, test } from 'vitest';
import { renderShell } from '../../server/src/lib/client-shell';
import type { PublicUser } from '../../server/shared/auth-schemas';

const TEMPLATE = '<!doctype html>\n<html>\n  <head>\n    <title>Sporewell</title>\n  </head>\n  <body><div id="root"></div></body>\n</html>\n';
const grower: PublicUser = { id: 7, email: 'wren@example.test', displayName: 'Wren', role: 'grower', emailVerified: true };

/** The JSON inside the data block, as the browser would hand it to JSON.parse. */
function dataBlock(html: string): unknown {
  const match = /<script type="application\/json" id="sporewell-boot">([^<]*)<\/script>/.exec(html);
  return match ? JSON.parse(match[1]) : undefined;
}

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

  test('when a visitor asks, then the page says so (null), so the client does not ask again', () => {
    expect(dataBlock(renderShell(TEMPLATE, { user: null }))).toEqual({ user: null });
  });
});
