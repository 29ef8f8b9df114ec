import { unsealData } from 'iron-session';
import { NextResponse, type NextRequest } from 'next/server';
import { SESSION_COOKIE, SESSION_TTL_SECONDS, sessionSecret } from '@/lib/auth/config';
import { PATH_HEADER, signInUrl } from '@/lib/auth/guard-paths';
import { STAFF_PREFIXES } from '@/lib/auth/staff-nav';
import { pageContentSecurityPolicy } from '@/lib/http/page-policy';

// Runs before every page, and before any path with a percent-escape. Jobs: refuse a path that is
// not valid percent-encoded UTF-8 (Next's router would otherwise fail to decode it and answer a bare
// 500), put the page's CSP on (built at request time: it names the payments host), tell the page its
// own path (so a guard deep in a server component can send people back after signing in), and send
// visitors without a readable session cookie away from staff pages early. The real check (session
// row, active user, permission) is requireAccessForPage / the route kit; this is the fast first gate only.
// The staff prefixes come from the staff navigation (lib/auth/staff-nav.ts, no server-only imports).

function isStaffPath(pathname: string): boolean {
  return STAFF_PREFIXES.some((prefix) => pathname === prefix || pathname.startsWith(`${prefix}/`));
}

function isApiPath(pathname: string): boolean {
  return pathname === '/api' || pathname.startsWith('/api/');
}

/** False for "/q/%ED%A0%80" (an encoded lone surrogate), "/x/%E0%A4%A" and other undecodable paths. */
function isDecodablePath(pathname: string): boolean {
  try {
    decodeURIComponent(pathname);
    return true;
  } catch {
    return false;
  }
}

async function hasReadableSession(request: NextRequest): Promise<boolean> {
  const seal = request.cookies.get(SESSION_COOKIE)?.value;
  if (!seal) return false;
  try {
    const data = await unsealData<{ token?: string }>(seal, { password: sessionSecret(), ttl: SESSION_TTL_SECONDS });
    return typeof data.token === 'string';
  } catch {
    return false;
  }
}

function withPagePolicy(response: NextResponse): NextResponse {
  response.headers.set('Content-Security-Policy', pageContentSecurityPolicy());
  return response;
}

// The same as next.config.mjs gives API answers; said here too because attachment paths are left out there.
const API_HEADERS = {
  'Cache-Control': 'no-store',
  'Content-Security-Policy': "default-src 'none'; frame-ancestors 'none'",
};

function notFound(request: NextRequest, api: boolean): NextResponse {
  if (api)
    return NextResponse.json({ message: 'There is nothing at this address.' }, { status: 404, headers: API_HEADERS });
  // The app's own not-found page, with its 404 status, for a path nothing can match.
  return withPagePolicy(NextResponse.rewrite(new URL('/_lobewise/not-found', request.url)));
}

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const api = isApiPath(pathname);
  if (!isDecodablePath(pathname)) return notFound(request, api);
  if (api) return NextResponse.next();
  const here = `${pathname}${search}`;
  if (isStaffPath(pathname) && !(await hasReadableSession(request))) {
    return withPagePolicy(NextResponse.redirect(new URL(signInUrl(here), request.url)));
  }
  const headers = new Headers(request.headers);
  headers.set(PATH_HEADER, here);
  return withPagePolicy(NextResponse.next({ request: { headers } }));
}

export const config = {
  matcher: [
    // Pages (API routes, build output and static files, public/ included, need no page policy)...
    '/((?!api/|_next/|favicon\\.ico|.*\\.(?:png|jpg|svg|ico|woff2|txt|webmanifest)$).*)',
    // ...and any path holding a percent-escape, so a malformed one answers 404 wherever it points.
    '/:path(.*%.*)',
  ],
};
