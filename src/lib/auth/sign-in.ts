import { recordAudit } from '@/lib/audit';
import { findUserByEmail, setPasswordHash } from '@/lib/db/queries/users';
import { HttpError } from '@/lib/http/errors';
import { reserveSignInAttempt } from '@/lib/throttle/sign-in-limits';
import type { SessionUser } from './guard';
import { burnVerifyTime, hashPassword, needsNewHash, verifyPassword } from './password';

/** The one answer to a failed sign-in: it never says which half was wrong. */
export const WRONG_PAIR_MESSAGE = 'The e-mail or the password is wrong.';

export type SignInOutcome =
  | { kind: 'signed-in'; user: SessionUser }
  | { kind: 'wrong-pair' }
  | { kind: 'throttled'; retryAfterSeconds: number; pauseStarted: boolean };

/**
 * Checks an e-mail and password pair. Unknown e-mail, deactivated account, account without a
 * password yet and wrong password all give the same answer, after the same work. The attempt is
 * counted before the password is checked (src/lib/throttle/sign-in-limits.ts).
 */
export async function checkSignIn(
  email: string,
  password: string,
  ip: string,
  knownDeviceId: string | null,
): Promise<SignInOutcome> {
  const reservation = await reserveSignInAttempt({ email, ip, knownDeviceId });
  if (!reservation.ok)
    return {
      kind: 'throttled',
      retryAfterSeconds: reservation.retryAfterSeconds,
      pauseStarted: reservation.pauseStarted,
    };

  const user = await findUserByEmail(email);
  let ok = false;
  if (user && user.active && user.passwordHash) {
    ok = await verifyPassword(user.passwordHash, password);
  } else {
    await burnVerifyTime(password);
  }

  await reservation.settle(ok && !!user);
  if (!ok || !user) {
    await recordAudit({
      actor: email,
      action: 'auth.sign-in-failed',
      entityType: user ? 'user' : null,
      entityId: user?.id ?? null,
      ip,
    });
    return { kind: 'wrong-pair' };
  }

  if (user.passwordHash && needsNewHash(user.passwordHash)) {
    await setPasswordHash(user.id, await hashPassword(password));
  }
  const sessionUser: SessionUser = { id: user.id, email: user.email, name: user.name, role: user.role };
  await recordAudit({ user: sessionUser, action: 'auth.signed-in', entityType: 'user', entityId: user.id, ip });
  return { kind: 'signed-in', user: sessionUser };
}

/** The 429 for a throttled sign-in, with Retry-After; it reads the same whether or not the account exists. */
export function signInThrottled(retryAfterSeconds: number): HttpError {
  const minutes = Math.ceil(retryAfterSeconds / 60);
  return new HttpError(
    429,
    `Too many sign-in attempts. Try again in about ${minutes} minute${minutes === 1 ? '' : 's'}, sign in from a browser you used before, or reset your password.`,
    { retryAfterSeconds },
    { 'Retry-After': String(retryAfterSeconds) },
  );
}
