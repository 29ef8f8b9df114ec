import { NextResponse } from 'next/server';
import { recordAudit } from '@/lib/audit';
import { requireRole } from '@/lib/auth/guard';
import { hashPassword, verifyPassword } from '@/lib/auth/password';
import { clientIp } from '@/lib/auth/request-info';
import { currentSession } from '@/lib/auth/session';
import { db } from '@/lib/db/models';
import { spendUserTokens } from '@/lib/db/queries/password-tokens';
import { revokeUserSessions } from '@/lib/db/queries/staff-sessions';
import { findUserById, setPasswordHash } from '@/lib/db/queries/users';
import { readJson, validationFailed } from '@/lib/http/responses';
import { changePasswordSchema } from '@/lib/schemas/auth';

export const dynamic = 'force-dynamic';

/** Changes the signed-in person's own password; their other sessions and any unused reset links end, this session stays. */
export async function POST(request: Request) {
  const user = await requireRole(request);
  if (user instanceof Response) return user;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = changePasswordSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);

  const row = await findUserById(user.id);
  if (!row?.passwordHash || !(await verifyPassword(row.passwordHash, parsed.data.currentPassword))) {
    return validationFailed([{ field: 'currentPassword', message: 'is not your current password' }]);
  }
  const newHash = await hashPassword(parsed.data.newPassword);
  const session = await currentSession();
  let endedSessions = 0;
  await db().transaction(async (transaction) => {
    await setPasswordHash(user.id, newHash, transaction);
    // A reset link e-mailed before the change must not undo it (or let whoever reads that mailbox in).
    await spendUserTokens(user.id, transaction);
    endedSessions = await revokeUserSessions(user.id, { exceptSessionId: session?.sessionId, transaction });
    await recordAudit({ user, action: 'auth.password-changed', entityType: 'user', entityId: user.id, after: { otherSessionsEnded: endedSessions }, ip: clientIp(request.headers) }, transaction);
  });
  return NextResponse.json({ message: 'Your password is changed.', otherSessionsEnded: endedSessions });
}
