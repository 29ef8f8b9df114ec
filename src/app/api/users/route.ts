import { NextResponse } from 'next/server';
import { UniqueConstraintError } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import { requireRole } from '@/lib/auth/guard';
import { issuePasswordLink } from '@/lib/auth/password-links';
import { clientIp } from '@/lib/auth/request-info';
import { db } from '@/lib/db/models';
import { createStaffUser, findUserByEmail, listStaff, toStaffRow } from '@/lib/db/queries/users';
import { errorResponse, readJson, validationFailed } from '@/lib/http/responses';
import { inviteUserSchema } from '@/lib/schemas/user';

export const dynamic = 'force-dynamic';

export async function GET(request: Request) {
  const user = await requireRole(request, 'manager');
  if (user instanceof Response) return user;
  return NextResponse.json({ users: await listStaff() });
}

class MailRefused extends Error {}

/** Invites a new staff member: the account exists at once, the password is theirs to choose from the e-mail. */
export async function POST(request: Request) {
  const manager = await requireRole(request, 'manager');
  if (manager instanceof Response) return manager;
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = inviteUserSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);

  const taken = validationFailed([{ field: 'email', message: 'already has a staff account' }]);
  if (await findUserByEmail(parsed.data.email)) return taken;
  try {
    const created = await db().transaction(async (transaction) => {
      const user = await createStaffUser(parsed.data, transaction);
      await recordAudit({ user: manager, action: 'user.invited', entityType: 'user', entityId: user.id, after: { email: user.email, name: user.name, role: user.role }, ip: clientIp(request.headers) }, transaction);
      // Sent inside the transaction: if the e-mail cannot go, nothing is saved and the manager can retry.
      try {
        await issuePasswordLink(user, 'invite', { invitedBy: manager.name, transaction });
      } catch (error) {
        console.error('[lobewise] invitation e-mail failed:', error);
        throw new MailRefused();
      }
      return user;
    });
    return NextResponse.json({ user: { ...toStaffRow(created), lastSignInAt: null } }, { status: 201 });
  } catch (error) {
    if (error instanceof UniqueConstraintError) return taken;
    if (error instanceof MailRefused) return errorResponse(502, 'The invitation e-mail could not be sent, so no account was created. Try again in a moment.');
    throw error;
  }
}
