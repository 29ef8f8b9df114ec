import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { StaffSession } from '../models';
import { User } from '../models';
import type { StaffRole } from '../models/user';

export type ActiveSession = { sessionId: number; user: { id: number; email: string; name: string; role: StaffRole } };

const TOUCH_EVERY_MS = 5 * 60 * 1000;

export async function createStaffSession(
  input: { tokenHash: string; userId: number; ip: string | null; userAgent: string | null; expiresAt: Date },
  transaction?: Transaction,
): Promise<number> {
  const row = await StaffSession.create({ ...input, revokedAt: null }, { transaction });
  return row.id;
}

/**
 * The live session for a cookie's token: not revoked, not expired, and its user still active.
 * The user row is read fresh every time, so a role change or a deactivation counts at once.
 */
export async function findActiveSession(tokenHash: string): Promise<ActiveSession | null> {
  const session = await StaffSession.findOne({
    where: { tokenHash, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
  });
  if (!session) return null;
  const user = await User.findByPk(session.userId, { attributes: ['id', 'email', 'name', 'role', 'active'] });
  if (!user || !user.active) return null;
  if (Date.now() - session.lastSeenAt.getTime() > TOUCH_EVERY_MS) {
    await StaffSession.update({ lastSeenAt: new Date() }, { where: { id: session.id } });
  }
  return { sessionId: session.id, user: { id: user.id, email: user.email, name: user.name, role: user.role } };
}

export async function revokeSession(tokenHash: string): Promise<number> {
  const [count] = await StaffSession.update({ revokedAt: new Date() }, { where: { tokenHash, revokedAt: null } });
  return count;
}

/** Ends every session of a user, optionally keeping one (the one changing its own password). */
export async function revokeUserSessions(
  userId: number,
  options: { exceptSessionId?: number; transaction?: Transaction } = {},
): Promise<number> {
  const where: Record<string | symbol, unknown> = { userId, revokedAt: null };
  if (options.exceptSessionId) where.id = { [Op.ne]: options.exceptSessionId };
  const [count] = await StaffSession.update({ revokedAt: new Date() }, { where, transaction: options.transaction });
  return count;
}
