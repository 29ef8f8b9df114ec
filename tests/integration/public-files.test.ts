import fs from 'node:fs';
import path from 'node:path';
import { readRuntime } from '../support/runtime';

// public/ over HTTP from the production build: each file byte for byte, with the content type browsers and
// crawlers expect (nosniff is on everywhere, so a wrong type is a broken icon or an ignored manifest), the
// static files' strict policy rather than a page's, and no session work on the way. The files' contents are
// checked in tests/unit/public/public-files.test.ts.
const { appUrl } = readRuntime();
const PUBLIC_DIR = path.resolve(__dirname, '../../public');

const FILES: [string, RegExp][] = [
  ['/favicon.ico', /^image\/(x-icon|vnd\.microsoft\.icon)$/],
  ['/apple-touch-icon.png', /^image\/png$/],
  ['/icon-192.png', /^image\/png$/],
  ['/icon-512.png', /^image\/png$/],
  ['/site.webmanifest', /^application\/manifest\+json(; charset=utf-8)?$/i],
  ['/robots.txt', /^text\/plain(; charset=utf-8)?$/i],
];

describe('public/ files', () => {
  it.each(FILES)('%s is served as it is in public/, typed %s', async (file, type) => {
    const res = await fetch(`${appUrl}${file}`, { redirect: 'manual' });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(type);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    // next.config.mjs's fallback for static files, not the page policy the proxy builds (which allows inline scripts).
    expect(res.headers.get('content-security-policy')).toContain("default-src 'self'");
    expect(res.headers.get('content-security-policy')).not.toContain('unsafe-inline');
    expect(res.headers.get('set-cookie')).toBeNull();
    expect(Buffer.from(await res.arrayBuffer()).equals(fs.readFileSync(path.join(PUBLIC_DIR, file)))).toBe(true);
  });

  it('every page names the manifest and the home-screen icon in its head', async () => {
    for (const page of ['/', '/ask', '/sign-in']) {
      const html = await (await fetch(`${appUrl}${page}`)).text();
      expect([page, /<link rel="manifest" href="\/site\.webmanifest"/.test(html)]).toEqual([page, true]);
      expect([page, /<link rel="apple-touch-icon" href="\/apple-touch-icon\.png"/.test(html)]).toEqual([page, true]);
      // The tab icons: the app's own SVG (src/app/icon.svg), and favicon.ico beside it.
      expect([page, /<link rel="icon" href="\/icon\.svg" type="image\/svg\+xml"/.test(html)]).toEqual([page, true]);
      expect([page, /<link rel="icon" href="\/favicon\.ico" sizes="32x32"/.test(html)]).toEqual([page, true]);
    }
  });

  it('a path that is not in public/ still answers the app’s 404, not a file', async () => {
    const res = await fetch(`${appUrl}/apple-touch-icon-precomposed.png`);
    expect(res.status).toBe(404);
  });
});
