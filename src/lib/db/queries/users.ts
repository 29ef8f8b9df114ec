import 'server-only';
import { QueryTypes, type Transaction } from 'sequelize';
import { User, db } from '../models';
import type { StaffRole } from '../models/user';

export type StaffListRow = {
  id: number;
  email: string;
  name: string;
  role: StaffRole;
  active: boolean;
  version: number;
  /** False while an invitation is still waiting for its first password. */
  hasPassword: boolean;
  lastSignInAt: string | null;
  createdAt: string;
};

export async function findUserByEmail(email: string, transaction?: Transaction): Promise<User | null> {
  return User.findOne({ where: { email }, transaction });
}

export async function findUserById(id: number, transaction?: Transaction, lock = false): Promise<User | null> {
  return User.findByPk(id, { transaction, lock: lock && transaction ? transaction.LOCK.UPDATE : undefined });
}

export async function listStaff(): Promise<StaffListRow[]> {
  const sequelize = db();
  const rows = await sequelize.query<{
    id: number;
    email: string;
    name: string;
    role: StaffRole;
    active: number;
    version: number;
    has_password: number;
    last_sign_in_at: Date | null;
    created_at: Date;
  }>(
    `SELECT u.id, u.email, u.name, u.role, u.active, u.version, u.password_hash IS NOT NULL AS has_password,
            (SELECT MAX(s.created_at) FROM staff_sessions s WHERE s.user_id = u.id) AS last_sign_in_at, u.created_at
       FROM users u
      ORDER BY u.active DESC, u.name ASC, u.id ASC`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((row) => ({
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    active: Boolean(row.active),
    version: row.version,
    hasPassword: Boolean(row.has_password),
    lastSignInAt: row.last_sign_in_at ? new Date(row.last_sign_in_at).toISOString() : null,
    createdAt: new Date(row.created_at).toISOString(),
  }));
}

export function toStaffRow(user: User): Omit<StaffListRow, 'lastSignInAt'> {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    active: user.active,
    version: user.version,
    hasPassword: user.passwordHash !== null,
    createdAt: user.createdAt.toISOString(),
  };
}

/**
 * Locks the active managers' rows (SELECT ... FOR UPDATE, in id order) for the rest of the transaction
 * and returns their ids. Two managers demoting each other at once then queue on these locks instead of
 * both counting two managers and both succeeding; a locking read also sees the latest committed rows.
 */
export async function lockActiveManagerIds(transaction: Transaction): Promise<number[]> {
  const rows = await User.findAll({
    attributes: ['id'],
    where: { role: 'manager', active: true },
    order: [['id', 'ASC']],
    lock: transaction.LOCK.UPDATE,
    transaction,
  });
  return rows.map((row) => row.id);
}

/** Writes a new password hash without touching the row's version (it is not an edit of the account). */
export async function setPasswordHash(userId: number, passwordHash: string, transaction?: Transaction): Promise<void> {
  await User.update({ passwordHash }, { where: { id: userId }, transaction });
}

export async function createStaffUser(
  input: { email: string; name: string; role: StaffRole },
  transaction?: Transaction,
): Promise<User> {
  return User.create({ ...input, passwordHash: null, active: true }, { transaction });
}
