import { UniqueConstraintError } from 'sequelize';
import { recordAudit } from '@/lib/audit';
import { retryOnLockContention } from '@/lib/db/lock-contention';
import { db } from '@/lib/db/models';
import { revokeUserSessions } from '@/lib/db/queries/staff-sessions';
import {
  createStaffUser,
  findUserByEmail,
  findUserById,
  lockActiveManagerIds,
  toStaffRow,
} from '@/lib/db/queries/users';
import { HttpError } from '@/lib/http/errors';
import { invalidFields, type FieldError } from '@/lib/http/responses';
import { MailError } from '@/lib/mail';
import type { StaffRole } from './roles';
import { issuePasswordLink } from './password-links';

// Staff accounts as a manager changes them: invitations and changes of role, name or active flag, with
// the rules that keep the shop workable (never without an active manager; nobody locks themselves out).
// Refusals are HttpErrors for the route kit.

type Manager = { id: number; email: string; name: string };
export type StaffRow = ReturnType<typeof toStaffRow>;

const emailTaken = () => invalidFields([{ field: 'email', message: 'already has a staff account' }]);

/** Invites a new staff member: the account exists at once, the password is theirs to choose from the e-mail. */
export async function inviteStaff(
  input: { email: string; name: string; role: StaffRole },
  manager: Manager,
  ip: string,
): Promise<StaffRow> {
  if (await findUserByEmail(input.email)) throw emailTaken();
  try {
    const created = await db().transaction(async (transaction) => {
      const user = await createStaffUser(input, transaction);
      await recordAudit(
        {
          user: manager,
          action: 'user.invited',
          entityType: 'user',
          entityId: user.id,
          after: { email: user.email, name: user.name, role: user.role },
          ip,
        },
        transaction,
      );
      // Sent inside the transaction: if the e-mail cannot go, nothing is saved and the manager can retry.
      await issuePasswordLink(user, 'invite', { invitedBy: manager.name, transaction });
      return user;
    });
    return toStaffRow(created);
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw emailTaken();
    if (error instanceof MailError) {
      console.error('[lobewise] invitation e-mail failed:', error);
      throw new HttpError(
        502,
        'The invitation e-mail could not be sent, so no account was created. Try again in a moment.',
      );
    }
    throw error;
  }
}

export type StaffChange = { version: number; role?: StaffRole; active?: boolean; name?: string };

/**
 * Changes a staff member's role, name or active flag. `version` must be the one last read (else 409 with
 * the current row). A manager cannot switch off or demote themselves, and the last active manager cannot
 * be switched off or demoted (422 naming the field). Switching an account off ends its sessions.
 */
export async function updateStaffAccount(
  id: number,
  change: StaffChange,
  manager: Manager,
  ip: string,
): Promise<StaffRow> {
  // The lock order below prevents most deadlocks; MariaDB can still pick a victim (gap locks), which runs again.
  const updated = await retryOnLockContention(() =>
    db().transaction(async (transaction) => {
      // Managers first, then the row: every role or active change takes the locks in the same order,
      // so concurrent changes queue instead of deadlocking, and the count below cannot go stale.
      const managers =
        change.role !== undefined || change.active !== undefined ? await lockActiveManagerIds(transaction) : [];
      const user = await findUserById(id, transaction, true);
      if (!user) throw new HttpError(404, 'There is no staff member with that id.');
      if (user.version !== change.version) {
        throw new HttpError(
          409,
          'Someone changed this staff member since you loaded the page. Review the current details and try again.',
          { current: toStaffRow(user) },
        );
      }
      const self = user.id === manager.id;
      const problems: FieldError[] = [];
      if (self && change.active === false)
        problems.push({ field: 'active', message: 'you cannot switch off your own account' });
      if (self && change.role !== undefined && change.role !== user.role)
        problems.push({ field: 'role', message: 'you cannot change your own role' });
      const losesManager =
        user.role === 'manager' &&
        user.active &&
        ((change.role !== undefined && change.role !== 'manager') || change.active === false);
      if (losesManager && managers.filter((managerId) => managerId !== user.id).length < 1) {
        problems.push({
          field: change.active === false ? 'active' : 'role',
          message: 'the shop needs at least one active manager',
        });
      }
      if (problems.length) throw invalidFields(problems);

      const before = { role: user.role, active: user.active, name: user.name };
      if (change.role !== undefined) user.role = change.role;
      if (change.active !== undefined) user.active = change.active;
      if (change.name !== undefined) user.name = change.name;
      if (!user.changed()) return user;
      await user.save({ transaction });

      const audit = (action: string, field: 'role' | 'active' | 'name') =>
        recordAudit(
          {
            user: manager,
            action,
            entityType: 'user',
            entityId: user.id,
            before: { [field]: before[field] },
            after: { [field]: user[field] },
            ip,
          },
          transaction,
        );
      if (before.role !== user.role) await audit('user.role-changed', 'role');
      if (before.active !== user.active) {
        await audit(user.active ? 'user.reactivated' : 'user.deactivated', 'active');
        if (!user.active) await revokeUserSessions(user.id, { transaction });
      }
      if (before.name !== user.name) await audit('user.renamed', 'name');
      return user;
    }),
  );
  return toStaffRow(updated);
}
