import { NextResponse } from 'next/server';
import { recordAudit } from '@/lib/audit';
import { hashPassword } from '@/lib/auth/password';
import { clientIp, isCrossSite } from '@/lib/auth/request-info';
import { hashToken } from '@/lib/auth/tokens';
import { db } from '@/lib/db/models';
import { findTokenByHash, lockTokenByHash, spendUserTokens, type PasswordTokenRow } from '@/lib/db/queries/password-tokens';
import { revokeUserSessions } from '@/lib/db/queries/staff-sessions';
import { findUserById, setPasswordHash } from '@/lib/db/queries/users';
import { forgetAccountFailures } from '@/lib/throttle/sign-in-limits';
import { errorResponse, readJson, validationFailed } from '@/lib/http/responses';
import { resetPasswordSchema } from '@/lib/schemas/auth';

export const dynamic = 'force-dynamic';

class LinkRefused extends Error {}

/** Throws the reason a link cannot be used; the same rules before hashing and again under the lock. */
function assertUsable(token: PasswordTokenRow | null): asserts token is PasswordTokenRow {
  if (!token) throw new LinkRefused('This link is not valid. Ask for a new one from the sign-in page.');
  if (token.usedAt) throw new LinkRefused('This link was already used. Ask for a new one from the sign-in page.');
  if (token.expiresAt.getTime() <= Date.now()) throw new LinkRefused('This link has expired. Ask for a new one from the sign-in page.');
}

/** Sets a new password from an e-mailed link (reset or invitation); the link is spent either way it succeeds. */
export async function POST(request: Request) {
  if (isCrossSite(request)) return errorResponse(403, 'This request came from another site and was refused.');
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = resetPasswordSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);

  const tokenHash = hashToken(parsed.data.token);
  try {
    // The link first: a wrong, spent or expired link costs one indexed read, never an argon2 hash
    // (which would let anyone make the server hash passwords for free). Checked again under the lock.
    assertUsable(await findTokenByHash(tokenHash));
    const passwordHash = await hashPassword(parsed.data.password);
    const outcome = await db().transaction(async (transaction) => {
      const token = await lockTokenByHash(tokenHash, transaction);
      assertUsable(token);
      const user = await findUserById(token.userId, transaction, true);
      if (!user || !user.active) throw new LinkRefused('This account is switched off. Ask your manager.');
      await setPasswordHash(user.id, passwordHash, transaction);
      await spendUserTokens(user.id, transaction);
      await revokeUserSessions(user.id, { transaction });
      await recordAudit(
        { user: { id: user.id, email: user.email }, action: token.purpose === 'invite' ? 'auth.password-set' : 'auth.password-reset', entityType: 'user', entityId: user.id, ip: clientIp(request.headers) },
        transaction,
      );
      return { email: user.email };
    });
    await forgetAccountFailures(outcome.email);
    return NextResponse.json({ message: 'Your password is set. Sign in with it now.', email: outcome.email });
  } catch (error) {
    if (error instanceof LinkRefused) return errorResponse(400, error.message, { errors: [{ field: 'token', message: error.message }] });
    throw error;
  }
}
