import crypto from 'node:crypto';
import { sealData, unsealData } from 'iron-session';
import { cookies } from 'next/headers';
import { sessionSecret } from './config';
import { accountKey } from '@/lib/throttle/sign-in-limits';

// The "device cookie" of OWASP's brute-force guidance: after a successful sign-in the browser gets a
// sealed cookie naming that account and a random device id. A later sign-in to the same account from
// that browser counts its failures against the device alone, so guessing from elsewhere never locks
// the owner out of the machine they use. One cookie per account, so a shared counter PC works for each.
const DEVICE_TTL_SECONDS = 90 * 24 * 60 * 60;
type DeviceData = { account: string; deviceId: string };

function cookieName(email: string): string {
  return `lobewise_device_${accountKey(email).slice(0, 16)}`;
}

/** The device id when this browser holds a valid cookie for this account, else null. */
export async function knownDeviceId(email: string): Promise<string | null> {
  const value = (await cookies()).get(cookieName(email))?.value;
  if (!value) return null;
  try {
    const data = await unsealData<Partial<DeviceData>>(value, { password: sessionSecret(), ttl: DEVICE_TTL_SECONDS });
    return data.account === accountKey(email) && typeof data.deviceId === 'string' ? data.deviceId : null;
  } catch {
    return null;
  }
}

/** Keeps the browser's device id for this account (or makes one) and refreshes the cookie's life. */
export async function rememberDevice(email: string, secure: boolean): Promise<void> {
  const deviceId = (await knownDeviceId(email)) ?? crypto.randomBytes(16).toString('base64url');
  const sealed = await sealData({ account: accountKey(email), deviceId } satisfies DeviceData, {
    password: sessionSecret(),
    ttl: DEVICE_TTL_SECONDS,
  });
  (await cookies()).set(cookieName(email), sealed, {
    httpOnly: true,
    sameSite: 'lax',
    secure,
    path: '/',
    maxAge: DEVICE_TTL_SECONDS,
  });
}
