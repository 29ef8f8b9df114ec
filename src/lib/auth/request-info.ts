import { CLIENT_ADDRESS_HEADER } from '@/lib/http/client-address';

// Facts about an incoming request that the auth code needs. Server-only.

/**
 * The client address, as the server hook decided it from the socket and TRUSTED_PROXY_HOPS
 * (src/lib/http/peer-hook.ts). X-Forwarded-For is never read here: without a trusted proxy it is
 * whatever the caller wrote. 'unknown' only for a request that reached no hook.
 */
export function clientIp(headers: Headers): string {
  return headers.get(CLIENT_ADDRESS_HEADER)?.slice(0, 64) || 'unknown';
}

export function userAgent(headers: Headers): string | null {
  return headers.get('user-agent')?.slice(0, 255) ?? null;
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export function isStateChanging(method: string): boolean {
  return !SAFE_METHODS.has(method.toUpperCase());
}

/**
 * Cross-site request check for state-changing requests. A browser always sends Origin on a
 * cross-origin POST/PUT/PATCH/DELETE, so: an Origin that is not this host (or APP_BASE_URL) fails,
 * as does Sec-Fetch-Site: cross-site. Requests with neither header come from non-browser
 * clients, which cannot ride on someone else's cookie, and pass.
 */
export function isCrossSite(request: Request): boolean {
  if (!isStateChanging(request.method)) return false;
  const headers = request.headers;
  const origin = headers.get('origin');
  if (origin) {
    if (origin === 'null') return true;
    let originHost: string;
    try {
      originHost = new URL(origin).host.toLowerCase();
    } catch {
      return true;
    }
    const allowed = new Set<string>();
    for (const name of ['host', 'x-forwarded-host']) {
      const value = headers.get(name);
      if (value) allowed.add(value.split(',')[0].trim().toLowerCase());
    }
    if (process.env.APP_BASE_URL) {
      try {
        allowed.add(new URL(process.env.APP_BASE_URL).host.toLowerCase());
      } catch {
        // a malformed APP_BASE_URL simply adds nothing
      }
    }
    return !allowed.has(originHost);
  }
  return headers.get('sec-fetch-site') === 'cross-site';
}

/** True when the request arrived over https, or the app's public address is https. */
export function isHttps(headers: Headers): boolean {
  const proto = headers.get('x-forwarded-proto')?.split(',')[0].trim();
  return proto === 'https' || (process.env.APP_BASE_URL ?? '').startsWith('https:');
}
