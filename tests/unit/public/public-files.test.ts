import fs from 'node:fs';
import path from 'node:path';
import { palette } from '@/lib/palette';

// The files in public/ that browsers and crawlers ask for by name. Served by Next as they are; the
// integration test public-files.test.ts fetches them over HTTP.
const ROOT = path.resolve(__dirname, '../../..');
const publicFile = (name: string) => fs.readFileSync(path.join(ROOT, 'public', name));

type Rule = { allow: boolean; pattern: string };

function robotsRules(text: string): Rule[] {
  return text
    .split('\n')
    .map((line) => line.replace(/#.*/, '').trim())
    .map((line) => /^(allow|disallow):\s*(\S*)$/i.exec(line))
    .filter((m): m is RegExpExecArray => m !== null)
    .map((m) => ({ allow: m[1].toLowerCase() === 'allow', pattern: m[2] }));
}

// RFC 9309, 2.2.2: the longest matching pattern decides, Allow winning a tie; '*' is any run of
// characters and a final '$' anchors the end. (Implemented here so the test reads the file as a crawler does.)
function allowed(rules: Rule[], urlPath: string): boolean {
  const matches = rules.filter(({ pattern }) => {
    const anchored = pattern.endsWith('$');
    const body = (anchored ? pattern.slice(0, -1) : pattern).split('*').map((s) => s.replace(/[.+?^${}()|[\]\\]/g, '\\$&')).join('.*');
    return new RegExp(`^${body}${anchored ? '$' : ''}`).test(urlPath);
  });
  if (matches.length === 0) return true;
  const longest = Math.max(...matches.map((r) => r.pattern.length));
  return matches.some((r) => r.pattern.length === longest && r.allow);
}

// The first path segment of every page, read from src/app (route groups are folded in, as in URLs): a new
// area, or one moved between groups, is checked without anyone editing this test.
function pageSegments(dir = path.join(ROOT, 'src/app')): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    if (!entry.isDirectory() || entry.name.startsWith('_') || ['api', 'fonts'].includes(entry.name)) return [];
    return /^\(.*\)$/.test(entry.name) ? pageSegments(path.join(dir, entry.name)) : [`/${entry.name}`];
  });
}

describe('robots.txt', () => {
  const rules = robotsRules(publicFile('robots.txt').toString('utf8'));

  it('applies to every crawler', () => {
    expect(publicFile('robots.txt').toString('utf8')).toMatch(/^User-agent: \*$/m);
  });

  it('lets crawlers read the public start page, the questionnaire and what they need to draw them', () => {
    for (const open of ['/', '/ask', '/ask?from=flyer', '/_next/static/chunks/main.js', '/favicon.ico', '/icon.svg', '/site.webmanifest']) {
      expect([open, allowed(rules, open)]).toEqual([open, true]);
    }
  });

  it('keeps out the API, private quote links, questionnaire results and sign-in', () => {
    for (const closed of ['/api/health', '/api/quotes/1', '/q/demo-quote-whitlock-link-2026', '/ask/result/some-private-token', '/sign-in', '/reset-password?token=x']) {
      expect([closed, allowed(rules, closed)]).toEqual([closed, false]);
    }
  });

  it('keeps out every page but the questionnaire, as the route folders name them (staff, manager, sign-in, private links)', () => {
    const pages = pageSegments().filter((p) => p !== '/ask');
    expect(pages).toEqual(expect.arrayContaining(['/dashboard', '/quotes', '/jobs', '/catalogue', '/reports', '/q', '/sign-in']));
    for (const page of pages.flatMap((p) => [p, `${p}/1`])) {
      expect([page, allowed(rules, page)]).toEqual([page, false]);
    }
  });
});

describe('site.webmanifest', () => {
  const manifest = JSON.parse(publicFile('site.webmanifest').toString('utf8'));

  it('names the product and takes its colours from the palette (tailwind.config.ts tokens)', () => {
    expect(manifest).toMatchObject({ name: 'Lobewise', short_name: 'Lobewise', start_url: '/' });
    // The header bar is ink on every page; the page behind it paper.
    expect(manifest.theme_color).toBe(palette.ink.DEFAULT);
    expect(manifest.background_color).toBe(palette.paper.DEFAULT);
  });

  it('lists icons that exist in public/ at the size they claim', () => {
    expect(manifest.icons.length).toBeGreaterThanOrEqual(2);
    for (const icon of manifest.icons as { src: string; sizes: string; type: string }[]) {
      expect(icon.type).toBe('image/png');
      const [width, height] = pngSize(publicFile(icon.src.replace(/^\//, '')));
      expect(`${width}x${height}`).toBe(icon.sizes);
    }
  });
});

// A PNG's width and height sit in its IHDR chunk, right after the 8-byte signature and the chunk header.
function pngSize(bytes: Buffer): [number, number] {
  expect(bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  return [bytes.readUInt32BE(16), bytes.readUInt32BE(20)];
}

describe('icons', () => {
  it('favicon.ico holds 16, 32 and 48 px images, each a valid PNG of its stated size', () => {
    const ico = publicFile('favicon.ico');
    expect([ico.readUInt16LE(0), ico.readUInt16LE(2)]).toEqual([0, 1]); // reserved, type 1 = icon
    const count = ico.readUInt16LE(4);
    const sizes = Array.from({ length: count }, (_, i) => {
      const entry = 6 + i * 16;
      const size = ico.readUInt8(entry) || 256;
      const [length, offset] = [ico.readUInt32LE(entry + 8), ico.readUInt32LE(entry + 12)];
      expect(pngSize(ico.subarray(offset, offset + length))).toEqual([size, size]);
      return size;
    });
    expect(sizes).toEqual([16, 32, 48]);
  });

  it('apple-touch-icon.png is the 180 px home-screen icon', () => {
    expect(pngSize(publicFile('apple-touch-icon.png'))).toEqual([180, 180]);
  });
});
