import crypto from 'node:crypto';
import { Op } from 'sequelize';
import { hashPassword } from '@/lib/auth/password';
import { SignInAttempt } from '@/lib/db/models';
import { User } from '@/lib/db/models';
import { DEMO_EMAILS } from './auth';
import { connectTestDatabase } from './database';
import { clearRateLimits } from './rate-limits';

// Throwaway staff accounts for tests that sign in wrongly, get throttled or deactivated, so the
// demo users stay usable for every other test file.
export type Throwaway = { id: number; email: string; password: string };

const created: number[] = [];

export async function createThrowawayUser(
  role: 'manager' | 'counter' | 'tech',
  options: { passwordHash?: string; password?: string } = {},
): Promise<Throwaway> {
  connectTestDatabase();
  const tag = crypto.randomBytes(5).toString('hex');
  const email = `throwaway-${role}-${tag}@lobewise.test`;
  const password = options.password ?? `test-password-${tag}`;
  const user = await User.create({
    email,
    name: `Test ${role} ${tag}`,
    role,
    passwordHash: options.passwordHash ?? (await hashPassword(password)),
    active: true,
  });
  created.push(user.id);
  return { id: user.id, email, password };
}

/**
 * A documentation-range address (RFC 3849) unique to the caller. The app no longer believes a caller's
 * X-Forwarded-For (TRUSTED_PROXY_HOPS=0 in tests), so this only labels requests; the socket counts.
 */
export function testAddress(): string {
  const hex = crypto.randomBytes(6).toString('hex');
  return `2001:db8::${hex.slice(0, 4)}:${hex.slice(4, 8)}:${hex.slice(8)}`;
}

/**
 * Removes the sign-in attempts made for these e-mails and addresses, and the sign-in throttle counters
 * (rate_limits rows; every test sign-in comes from the loopback socket, so they are shared by the run).
 */
export async function clearSignInAttempts(emails: string[], ips: string[] = []): Promise<void> {
  await clearRateLimits('signin-');
  await SignInAttempt.destroy({
    where: {
      [Op.or]: [{ email: { [Op.in]: emails.length ? emails : [''] } }, { ip: { [Op.in]: ips.length ? ips : [''] } }],
    },
  });
}

/**
 * Deletes the throwaway accounts this test file made (and any extra e-mails, e.g. invited people),
 * so other test files see only the demo staff. Their sessions and tokens go with them; audit rows
 * stay, with the e-mail as actor.
 */
export async function removeThrowawayUsers(extraEmails: string[] = []): Promise<void> {
  connectTestDatabase();
  const demo = new Set(Object.values(DEMO_EMAILS));
  const emails = extraEmails.filter((email) => !demo.has(email));
  await User.destroy({
    where: {
      [Op.or]: [
        { id: { [Op.in]: created.length ? created : [0] } },
        { email: { [Op.in]: emails.length ? emails : [''] } },
      ],
      email: { [Op.notIn]: [...demo] },
    },
  });
  created.length = 0;
}
