// Pure helpers shared by the guard and the proxy (no server-only imports here).

/** The request header the proxy sets to the page's path and query, so pages can send people back. */
export const PATH_HEADER = 'x-lobewise-path';

/** Only a path on this site may be a place to return to after signing in. */
export function safeNextPath(next: string | null | undefined, fallback = '/dashboard'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (/^\/(sign-in|api\/)/.test(next)) return fallback;
  return next;
}

export function signInUrl(next: string | null | undefined): string {
  const path = safeNextPath(next, '');
  return path ? `/sign-in?next=${encodeURIComponent(path)}` : '/sign-in';
}
