import { getIronSession, type IronSession, type SessionOptions } from 'iron-session';
import { cookies, headers } from 'next/headers';
import { cache } from 'react';
import {
  createStaffSession,
  findActiveSession,
  revokeSession,
  type ActiveSession,
} from '@/lib/db/queries/staff-sessions';
import { SESSION_COOKIE, SESSION_TTL_SECONDS, sessionSecret } from './config';
import { clientIp, isHttps, userAgent } from './request-info';
import { hashToken, randomToken } from './tokens';

// The cookie holds only an encrypted random session token; the staff_sessions row (looked up by
// the token's hash) is what makes it valid, so signing out or deactivating ends it at once.
type CookieData = { token?: string };

async function sessionOptions(): Promise<SessionOptions> {
  const requestHeaders = await headers();
  return {
    cookieName: SESSION_COOKIE,
    password: sessionSecret(),
    ttl: SESSION_TTL_SECONDS,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure: isHttps(requestHeaders), path: '/' },
  };
}

async function ironSession(): Promise<IronSession<CookieData>> {
  const store = await cookies();
  const options = await sessionOptions();
  try {
    return await getIronSession<CookieData>(store, options);
  } catch {
    // A cookie so mangled that it cannot even be parsed: treat it as absent (and overwrite it).
    const withoutIt = {
      get: (name: string) => (name === SESSION_COOKIE ? undefined : store.get(name)),
      set: store.set.bind(store),
    };
    return getIronSession<CookieData>(withoutIt, options);
  }
}

/** The live session of this request, or null. Cached per request. */
export const currentSession = cache(async (): Promise<ActiveSession | null> => {
  // A cookie that fails to decrypt (tampered, or sealed with another secret) reads as empty.
  const session = await ironSession();
  if (!session.token) return null;
  return findActiveSession(hashToken(session.token));
});

/** Starts a session for a user and sets the cookie on the response being built. */
export async function startSession(userId: number): Promise<number> {
  const requestHeaders = await headers();
  const token = randomToken();
  const sessionId = await createStaffSession({
    tokenHash: hashToken(token),
    userId,
    ip: clientIp(requestHeaders),
    userAgent: userAgent(requestHeaders),
    expiresAt: new Date(Date.now() + SESSION_TTL_SECONDS * 1000),
  });
  const session = await ironSession();
  session.token = token;
  await session.save();
  return sessionId;
}

/** Revokes this request's session (if any) and clears the cookie. */
export async function endSession(): Promise<void> {
  const session = await ironSession();
  if (session.token) await revokeSession(hashToken(session.token));
  session.destroy();
}
