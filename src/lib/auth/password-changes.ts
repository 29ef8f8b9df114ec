import { recordAudit } from '@/lib/audit';
import { db } from '@/lib/db/models';
import {
  countRecentTokens,
  findTokenByHash,
  lockTokenByHash,
  spendUserTokens,
  type PasswordTokenRow,
} from '@/lib/db/queries/password-tokens';
import { revokeUserSessions } from '@/lib/db/queries/staff-sessions';
import { findUserByEmail, findUserById, setPasswordHash } from '@/lib/db/queries/users';
import { HttpError } from '@/lib/http/errors';
import { invalidFields } from '@/lib/http/responses';
import type { ChangePasswordInput, ResetPasswordInput } from '@/lib/schemas/auth';
import { forgetAccountFailures } from '@/lib/throttle/sign-in-limits';
import { hashPassword, verifyPassword } from './password';
import { issuePasswordLink } from './password-links';
import type { SessionUser } from './roles';
import { hashToken } from './tokens';

// The three ways a password changes: the signed-in person changes their own, a forgotten one gets an
// e-mailed link, and a link (reset or invitation) sets a new one. Refusals throw an HttpError.

const MAX_RESET_LINKS_PER_HOUR = 5;

/** Their other sessions and any unused reset links end; `keepSessionId` (this browser's session) stays. */
export async function changeOwnPassword(
  user: SessionUser,
  input: ChangePasswordInput,
  keepSessionId: number | undefined,
  ip: string,
): Promise<{ otherSessionsEnded: number }> {
  const row = await findUserById(user.id);
  if (!row?.passwordHash || !(await verifyPassword(row.passwordHash, input.currentPassword))) {
    throw invalidFields([{ field: 'currentPassword', message: 'is not your current password' }]);
  }
  const newHash = await hashPassword(input.newPassword);
  return db().transaction(async (transaction) => {
    await setPasswordHash(user.id, newHash, transaction);
    // A reset link e-mailed before the change must not undo it (or let whoever reads that mailbox in).
    await spendUserTokens(user.id, transaction);
    const otherSessionsEnded = await revokeUserSessions(user.id, { exceptSessionId: keepSessionId, transaction });
    await recordAudit(
      {
        user,
        action: 'auth.password-changed',
        entityType: 'user',
        entityId: user.id,
        after: { otherSessionsEnded },
        ip,
      },
      transaction,
    );
    return { otherSessionsEnded };
  });
}

/** Runs after the answer is sent: nothing here may change what, or how fast, the caller is told. */
export async function sendResetLinkIfStaff(email: string, ip: string | null): Promise<void> {
  try {
    const user = await findUserByEmail(email);
    if (!user || !user.active || (await countRecentTokens(user.id, 60 * 60 * 1000)) >= MAX_RESET_LINKS_PER_HOUR) return;
    await issuePasswordLink(user, 'reset');
    await recordAudit({
      actor: user.email,
      action: 'auth.password-reset-requested',
      entityType: 'user',
      entityId: user.id,
      ip,
    });
  } catch (error) {
    console.error('[lobewise] password reset e-mail failed:', error);
  }
}

function linkRefused(message: string): HttpError {
  return new HttpError(400, message, { errors: [{ field: 'token', message }] });
}

/** Throws the reason a link cannot be used; the same rules before hashing and again under the lock. */
function assertUsable(token: PasswordTokenRow | null): asserts token is PasswordTokenRow {
  if (!token) throw linkRefused('This link is not valid. Ask for a new one from the sign-in page.');
  if (token.usedAt) throw linkRefused('This link was already used. Ask for a new one from the sign-in page.');
  if (token.expiresAt.getTime() <= Date.now())
    throw linkRefused('This link has expired. Ask for a new one from the sign-in page.');
}

/** Sets a new password from an e-mailed link (reset or invitation); the link is spent either way it succeeds. */
export async function setPasswordFromLink(input: ResetPasswordInput, ip: string): Promise<{ email: string }> {
  const tokenHash = hashToken(input.token);
  // The link first: a wrong, spent or expired link costs one indexed read, never an argon2 hash
  // (which would let anyone make the server hash passwords for free). Checked again under the lock.
  assertUsable(await findTokenByHash(tokenHash));
  const passwordHash = await hashPassword(input.password);
  const outcome = await db().transaction(async (transaction) => {
    const token = await lockTokenByHash(tokenHash, transaction);
    assertUsable(token);
    const user = await findUserById(token.userId, transaction, true);
    if (!user || !user.active) throw linkRefused('This account is switched off. Ask your manager.');
    await setPasswordHash(user.id, passwordHash, transaction);
    await spendUserTokens(user.id, transaction);
    await revokeUserSessions(user.id, { transaction });
    await recordAudit(
      {
        user: { id: user.id, email: user.email },
        action: token.purpose === 'invite' ? 'auth.password-set' : 'auth.password-reset',
        entityType: 'user',
        entityId: user.id,
        ip,
      },
      transaction,
    );
    return { email: user.email };
  });
  await forgetAccountFailures(outcome.email);
  return outcome;
}
