import { connectTestDatabase } from './database';

// The throttle counters (rate_limits, kept by rate-limiter-flexible) that a test file's requests
// made. Every request in the tests comes from 127.0.0.1, so files clear what they counted.
export async function clearRateLimits(prefix: 'signin-' | 'lead-'): Promise<void> {
  await connectTestDatabase().query('DELETE FROM rate_limits WHERE `key` LIKE ?', { replacements: [`${prefix}%`] });
}

/** Makes a counter's window end now, as if its time had passed (the store compares `expire` with the clock). */
export async function expireRateLimits(keyPrefix: string): Promise<void> {
  await connectTestDatabase().query('UPDATE rate_limits SET expire = ? WHERE `key` LIKE ?', {
    replacements: [Date.now() - 1, `${keyPrefix}%`],
  });
}
