import { Op } from 'sequelize';
import { SignInAttempt, authDb } from '../models/auth';

// Throttling counts failures in MariaDB, so every app instance sees the same numbers.
export const THROTTLE_WINDOW_MS = 15 * 60 * 1000;
export const THROTTLE_MAX_FAILURES = 10;

export async function recordSignInAttempt(email: string, ip: string, succeeded: boolean): Promise<void> {
  authDb();
  await SignInAttempt.create({ email: email.slice(0, 254), ip, succeeded });
}

/** Seconds until the oldest failure that keeps the count at the limit leaves the window. */
function secondsUntilBelowLimit(failuresNewestFirst: SignInAttempt[], now: number): number {
  const pivot = failuresNewestFirst[THROTTLE_MAX_FAILURES - 1];
  return Math.max(1, Math.ceil((pivot.createdAt.getTime() + THROTTLE_WINDOW_MS - now) / 1000));
}

/**
 * Null when a sign-in may be tried, otherwise how many seconds to wait. An account counts the
 * failures since its last success within the window; an address counts every failure in it
 * (a success on one's own account must not reset the count for guessing at others).
 */
export async function signInRetryAfter(email: string, ip: string): Promise<number | null> {
  authDb();
  const now = Date.now();
  const since = new Date(now - THROTTLE_WINDOW_MS);
  const lastSuccess = await SignInAttempt.findOne({
    where: { email, succeeded: true, createdAt: { [Op.gte]: since } },
    order: [['createdAt', 'DESC']],
  });
  const accountSince = lastSuccess && lastSuccess.createdAt > since ? lastSuccess.createdAt : since;
  const [byAccount, byAddress] = await Promise.all([
    SignInAttempt.findAll({ where: { email, succeeded: false, createdAt: { [Op.gt]: accountSince } }, order: [['createdAt', 'DESC']], limit: THROTTLE_MAX_FAILURES }),
    SignInAttempt.findAll({ where: { ip, succeeded: false, createdAt: { [Op.gte]: since } }, order: [['createdAt', 'DESC']], limit: THROTTLE_MAX_FAILURES }),
  ]);
  const waits: number[] = [];
  if (byAccount.length >= THROTTLE_MAX_FAILURES) waits.push(secondsUntilBelowLimit(byAccount, now));
  if (byAddress.length >= THROTTLE_MAX_FAILURES) waits.push(secondsUntilBelowLimit(byAddress, now));
  return waits.length ? Math.max(...waits) : null;
}
