// Pure helpers shared by the guard and the proxy (no server-only imports here).

/** The request header the proxy sets to the page's path and query, so pages can send people back. */
export const PATH_HEADER = 'x-lobewise-path';

// A base no real request can have: a `next` that resolves to any other origin leaves the site.
const PROBE_ORIGIN = 'http://lobewise.invalid';
const NEXT_MAX_LENGTH = 2048;
// Browsers drop tab/CR/LF inside URLs ("/\t/evil" becomes "//evil") and treat "\" as "/", so any of
// them, and any other control character, makes a path ambiguous; it is refused rather than cleaned.
const AMBIGUOUS = /[\u0000-\u001f\u007f-\u009f\\]/;
const LEAVES_SITE = /^\/[/\\]/;
const NEVER_RETURN_TO = /^\/(?:sign-in(?:[/?#]|$)|api(?:[/?#]|$))/;

/** Decodes percent-escapes until nothing changes, so "%252F" is judged as "/"; null when malformed. */
function fullyDecoded(value: string): string | null {
  let current = value;
  for (let round = 0; round < 4; round++) {
    let next: string;
    try {
      next = decodeURIComponent(current);
    } catch {
      return null;
    }
    if (next === current) return current;
    current = next;
  }
  return null;
}

/**
 * Only a path on this site may be a place to return to after signing in. The URL API decides what a
 * browser would make of it; anything that is ambiguous in raw or decoded form falls back instead.
 */
export function safeNextPath(next: string | null | undefined, fallback = '/dashboard'): string {
  if (typeof next !== 'string' || next.length === 0 || next.length > NEXT_MAX_LENGTH) return fallback;
  if (!next.startsWith('/') || LEAVES_SITE.test(next) || AMBIGUOUS.test(next)) return fallback;
  const decoded = fullyDecoded(next);
  if (decoded === null || LEAVES_SITE.test(decoded) || AMBIGUOUS.test(decoded)) return fallback;
  let url: URL;
  try {
    url = new URL(next, PROBE_ORIGIN);
  } catch {
    return fallback;
  }
  if (url.origin !== PROBE_ORIGIN) return fallback;
  // Dot segments can fold into "//host" ("/.//evil"): judge the path the browser would really request.
  const path = `${url.pathname}${url.search}${url.hash}`;
  if (LEAVES_SITE.test(path) || NEVER_RETURN_TO.test(path)) return fallback;
  return path;
}

export function signInUrl(next: string | null | undefined): string {
  const path = safeNextPath(next, '');
  return path ? `/sign-in?next=${encodeURIComponent(path)}` : '/sign-in';
}
