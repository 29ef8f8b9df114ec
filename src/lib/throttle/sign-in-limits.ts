import crypto from 'node:crypto';
import type { RateLimiterMySQL } from 'rate-limiter-flexible';
import { consumePoint, makeLimiter, retryAfterSeconds } from './store';

// Sign-in throttling after OWASP ASVS V2.2 (anti-automation without a lockout anyone can aim at staff):
// - per account, from an unknown device: 10 failures within 15 minutes, then the account pauses for
//   unknown devices; each further pause within a day lasts twice as long (15 min, 30 min, 1 h … 24 h);
// - per known device (a signed cookie from an earlier successful sign-in to that account): its own
//   10 failures per 15 minutes, so guesses from elsewhere never lock the owner out of their own machine;
// - per address: 100 failures per 15 minutes — a shop is one public address, so colleagues' typos
//   must not lock out each other.
// Every attempt reserves its point before the password is checked (one atomic upsert in MariaDB), so
// concurrent guesses cannot all slip under a limit; a success gives its points back.
export const SIGN_IN_LIMITS = {
  accountFailures: 10,
  accountWindowSeconds: 15 * 60,
  firstPauseSeconds: 15 * 60,
  longestPauseSeconds: 24 * 60 * 60,
  pauseMemorySeconds: 24 * 60 * 60,
  deviceFailures: 10,
  deviceWindowSeconds: 15 * 60,
  addressFailures: 100,
  addressWindowSeconds: 15 * 60,
} as const;

type Limiters = {
  account: RateLimiterMySQL;
  pauses: RateLimiterMySQL;
  device: RateLimiterMySQL;
  address: RateLimiterMySQL;
};
let limiters: Limiters | undefined;

function signInLimiters(): Limiters {
  limiters ??= {
    account: makeLimiter({
      keyPrefix: 'signin-account',
      points: SIGN_IN_LIMITS.accountFailures,
      durationSeconds: SIGN_IN_LIMITS.accountWindowSeconds,
    }),
    pauses: makeLimiter({
      keyPrefix: 'signin-pauses',
      points: 1_000_000,
      durationSeconds: SIGN_IN_LIMITS.pauseMemorySeconds,
    }),
    device: makeLimiter({
      keyPrefix: 'signin-device',
      points: SIGN_IN_LIMITS.deviceFailures,
      durationSeconds: SIGN_IN_LIMITS.deviceWindowSeconds,
    }),
    address: makeLimiter({
      keyPrefix: 'signin-address',
      points: SIGN_IN_LIMITS.addressFailures,
      durationSeconds: SIGN_IN_LIMITS.addressWindowSeconds,
    }),
  };
  return limiters;
}

/** Keys never hold an e-mail in clear: the table is read by people who debug, not by the owner. */
export function accountKey(email: string): string {
  return crypto.createHash('sha256').update(email.trim().toLowerCase()).digest('hex');
}

/** The n-th pause of the day lasts 15 min × 2^(n−1), at most a day. */
export function pauseSeconds(pauseNumber: number): number {
  const doubled = SIGN_IN_LIMITS.firstPauseSeconds * 2 ** Math.max(0, pauseNumber - 1);
  return Math.min(doubled, SIGN_IN_LIMITS.longestPauseSeconds);
}

export type SignInReservation =
  | { ok: true; settle: (succeeded: boolean) => Promise<void> }
  | { ok: false; retryAfterSeconds: number; pauseStarted: boolean };

/** From a device that signed in to this account before: only that device's own count applies. */
async function reserveKnownDevice(deviceId: string): Promise<SignInReservation> {
  const { device } = signInLimiters();
  const taken = await consumePoint(device, deviceId);
  if (!taken.allowed) return { ok: false, retryAfterSeconds: retryAfterSeconds(taken.res), pauseStarted: false };
  return {
    ok: true,
    settle: async (succeeded) => {
      if (succeeded) await device.delete(deviceId);
    },
  };
}

async function reserveUnknownDevice(email: string, ip: string): Promise<SignInReservation> {
  const { account, pauses, address } = signInLimiters();
  const key = accountKey(email);
  const byAddress = await consumePoint(address, ip);
  if (!byAddress.allowed)
    return { ok: false, retryAfterSeconds: retryAfterSeconds(byAddress.res), pauseStarted: false };
  const byAccount = await consumePoint(account, key);
  if (!byAccount.allowed) {
    // A refused attempt checked no password, so it is not a failure from this address.
    await address.reward(ip, 1);
    // Exactly one caller sees the first point past the limit (the upsert is atomic): it starts the pause.
    if (byAccount.res.consumedPoints === SIGN_IN_LIMITS.accountFailures + 1) {
      const pauseNumber = (await pauses.consume(key)).consumedPoints;
      const seconds = pauseSeconds(pauseNumber);
      await account.block(key, seconds);
      return { ok: false, retryAfterSeconds: seconds, pauseStarted: true };
    }
    return { ok: false, retryAfterSeconds: retryAfterSeconds(byAccount.res), pauseStarted: false };
  }
  return {
    ok: true,
    settle: async (succeeded) => {
      if (!succeeded) return;
      await Promise.all([account.delete(key), pauses.delete(key), address.reward(ip, 1)]);
    },
  };
}

export function reserveSignInAttempt(input: {
  email: string;
  ip: string;
  knownDeviceId: string | null;
}): Promise<SignInReservation> {
  return input.knownDeviceId ? reserveKnownDevice(input.knownDeviceId) : reserveUnknownDevice(input.email, input.ip);
}

/**
 * A password set from an e-mailed link proves the owner: the account's failures and pauses are
 * forgotten, so "reset your password" (the 429's advice) really lets them in from any browser.
 */
export async function forgetAccountFailures(email: string): Promise<void> {
  const { account, pauses } = signInLimiters();
  const key = accountKey(email);
  await Promise.all([account.delete(key), pauses.delete(key)]);
}
