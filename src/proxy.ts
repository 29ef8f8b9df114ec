import { unsealData } from 'iron-session';
import { NextResponse, type NextRequest } from 'next/server';
import { SESSION_COOKIE, SESSION_TTL_SECONDS, sessionSecret } from '@/lib/auth/config';
import { PATH_HEADER, signInUrl } from '@/lib/auth/guard-paths';

// Runs before every page. Two jobs: tell the page its own path (so a guard deep in a server
// component can send people back after signing in), and send visitors without a readable session
// cookie away from staff pages early. The real check (session row, active user, role) is
// requireRoleForPage / requireRole; this is the fast first gate only.
const STAFF_PREFIXES = ['/dashboard', '/account', '/staff', '/advisor', '/catalogue', '/interviews', '/quotes', '/leads', '/jobs', '/dyno', '/reports', '/settings'];

function isStaffPath(pathname: string): boolean {
  return STAFF_PREFIXES.some((prefix) => pathname === prefix || pathname.startsWith(`${prefix}/`));
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

export async function proxy(request: NextRequest) {
  const { pathname, search } = request.nextUrl;
  const here = `${pathname}${search}`;
  if (isStaffPath(pathname) && !(await hasReadableSession(request))) {
    return NextResponse.redirect(new URL(signInUrl(here), request.url));
  }
  const headers = new Headers(request.headers);
  headers.set(PATH_HEADER, here);
  return NextResponse.next({ request: { headers } });
}

export const config = {
  matcher: ['/((?!api/|_next/|favicon\\.ico|.*\\.(?:png|jpg|svg|ico|woff2|txt)$).*)'],
};
