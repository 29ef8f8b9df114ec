import { safeNextPath, signInUrl } from '@/lib/auth/guard-paths';

// Known open-redirect bypasses (tab, CR/LF, backslash, "//", encoded and double-encoded forms, dot
// segments, other schemes). Each must fall back to the staff home, never name another origin.
const BYPASSES: string[] = [
  'https://evil.example/x',
  '//evil.example/x',
  '///evil.example/x',
  '/\\evil.example/x',
  '\\\\evil.example/x',
  '/\t/evil.example/x',
  '/\n/evil.example/x',
  '/\r\n/evil.example/x',
  '/%09/evil.example/x',
  '/%2F%09%2Fevil.example%2Fx',
  '%2F%2Fevil.example',
  '/%2F/evil.example',
  '/%2f%2fevil.example',
  '/%5Cevil.example',
  '/%5cevil.example',
  '/%252F%252Fevil.example',
  '/%25252F%25252Fevil.example',
  '/%0D%0ASet-Cookie:%20x=1',
  '/%0aevil',
  '/%00evil',
  '/\u0000evil',
  '/\u007fevil',
  '/\u0085evil',
  '/.//evil.example/x',
  '/./\\evil.example',
  '/x/..//evil.example',
  '/%E0%A4%A',
  '/%ED%A0%80',
  'javascript:alert(1)',
  ' /dashboard',
  'dashboard',
  '',
  `/${'a'.repeat(3000)}`,
  '/sign-in',
  '/sign-in?next=/dashboard',
  '/api/auth/me',
  '/api',
];

describe('safeNextPath', () => {
  it.each(BYPASSES)('refuses %j', (next) => {
    const result = safeNextPath(next);
    expect(result).toBe('/dashboard');
  });

  it('never returns anything that resolves off-site, for every bypass with any fallback', () => {
    for (const next of BYPASSES) {
      const result = safeNextPath(next, '/');
      expect(new URL(result, 'http://app.invalid').origin).toBe('http://app.invalid');
      expect(result).not.toMatch(/[\u0000-\u001f\\]/);
    }
  });

  it.each([
    ['/dashboard', '/dashboard'],
    ['/quotes/12?tab=lines#totals', '/quotes/12?tab=lines#totals'],
    ['/catalogue/cams?q=a%20b&sort=lsa', '/catalogue/cams?q=a%20b&sort=lsa'],
    ['/leads/../quotes', '/quotes'],
    ['/sign-in-help', '/sign-in-help'],
  ])('keeps the same-site path %j', (next, expected) => {
    expect(safeNextPath(next)).toBe(expected);
  });

  it('uses the given fallback for null, undefined and refusals', () => {
    expect(safeNextPath(null, '/')).toBe('/');
    expect(safeNextPath(undefined, '/x')).toBe('/x');
    expect(safeNextPath('//evil.example', '')).toBe('');
  });
});

describe('signInUrl', () => {
  it('carries a same-site path and drops a hostile one', () => {
    expect(signInUrl('/quotes/3')).toBe('/sign-in?next=%2Fquotes%2F3');
    expect(signInUrl('/%09/evil.example')).toBe('/sign-in');
  });
});
