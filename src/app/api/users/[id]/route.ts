import { NextResponse } from 'next/server';
import { recordAudit } from '@/lib/audit';
import { requireRole } from '@/lib/auth/guard';
import { clientIp } from '@/lib/auth/request-info';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db } from '@/lib/db/models';
import { revokeUserSessions } from '@/lib/db/queries/staff-sessions';
import { findUserById, lockActiveManagerIds, toStaffRow } from '@/lib/db/queries/users';
import { errorResponse, readJson, validationFailed, type FieldError } from '@/lib/http/responses';
import { updateUserSchema, userIdParam } from '@/lib/schemas/user';

export const dynamic = 'force-dynamic';

type Refusal = { status: number; message: string; extra?: Record<string, unknown> };
class Refused extends Error {
  constructor(readonly refusal: Refusal | FieldError[]) {
    super('refused');
  }
}

/** Changes a staff member's role, name or active flag. `version` must be the one last read (else 409). */
export async function PATCH(request: Request, context: { params: Promise<{ id: string }> }) {
  const manager = await requireRole(request, 'manager');
  if (manager instanceof Response) return manager;
  const id = userIdParam.safeParse((await context.params).id);
  if (!id.success) return validationFailed([{ field: 'id', message: id.error.issues[0]?.message ?? 'not valid' }]);
  const body = await readJson(request);
  if (!body.ok) return body.response;
  const parsed = updateUserSchema.safeParse(body.value);
  if (!parsed.success) return validationFailed(parsed.error);
  const change = parsed.data;
  const ip = clientIp(request.headers);

  try {
    // The lock order below prevents most deadlocks; MariaDB can still pick a victim (gap locks), which runs again.
    const updated = await retryOnLockContention(() => db().transaction(async (transaction) => {
      // Managers first, then the row: every role or active change takes the locks in the same order,
      // so concurrent changes queue instead of deadlocking, and the count below cannot go stale.
      const managers = change.role !== undefined || change.active !== undefined ? await lockActiveManagerIds(transaction) : [];
      const user = await findUserById(id.data, transaction, true);
      if (!user) throw new Refused({ status: 404, message: 'There is no staff member with that id.' });
      if (user.version !== change.version) {
        throw new Refused({ status: 409, message: 'Someone changed this staff member since you loaded the page. Review the current details and try again.', extra: { current: toStaffRow(user) } });
      }
      const self = user.id === manager.id;
      const problems: FieldError[] = [];
      if (self && change.active === false) problems.push({ field: 'active', message: 'you cannot switch off your own account' });
      if (self && change.role !== undefined && change.role !== user.role) problems.push({ field: 'role', message: 'you cannot change your own role' });
      const losesManager = user.role === 'manager' && user.active && ((change.role !== undefined && change.role !== 'manager') || change.active === false);
      if (losesManager && managers.filter((managerId) => managerId !== user.id).length < 1) {
        problems.push({ field: change.active === false ? 'active' : 'role', message: 'the shop needs at least one active manager' });
      }
      if (problems.length) throw new Refused(problems);

      const before = { role: user.role, active: user.active, name: user.name };
      if (change.role !== undefined) user.role = change.role;
      if (change.active !== undefined) user.active = change.active;
      if (change.name !== undefined) user.name = change.name;
      if (!user.changed()) return user;
      await user.save({ transaction });

      const audit = (action: string, field: 'role' | 'active' | 'name') =>
        recordAudit({ user: manager, action, entityType: 'user', entityId: user.id, before: { [field]: before[field] }, after: { [field]: user[field] }, ip }, transaction);
      if (before.role !== user.role) await audit('user.role-changed', 'role');
      if (before.active !== user.active) {
        await audit(user.active ? 'user.reactivated' : 'user.deactivated', 'active');
        if (!user.active) await revokeUserSessions(user.id, { transaction });
      }
      if (before.name !== user.name) await audit('user.renamed', 'name');
      return user;
    }));
    return NextResponse.json({ user: toStaffRow(updated) });
  } catch (error) {
    if (error instanceof Refused) {
      const r = error.refusal;
      return Array.isArray(r) ? validationFailed(r) : errorResponse(r.status, r.message, r.extra ?? {});
    }
    throw error;
  }
}
