import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { PasswordToken, type TokenPurpose } from '../models';

export async function createPasswordToken(
  input: { userId: number; tokenHash: string; purpose: TokenPurpose; expiresAt: Date },
  transaction?: Transaction,
): Promise<void> {
  await PasswordToken.create({ ...input, usedAt: null }, { transaction });
}

export async function countRecentTokens(userId: number, sinceMs: number): Promise<number> {
  return PasswordToken.count({ where: { userId, createdAt: { [Op.gte]: new Date(Date.now() - sinceMs) } } });
}

export type PasswordTokenRow = PasswordToken;

/** The token row for a hash, unlocked: a cheap first look before any expensive work. */
export async function findTokenByHash(tokenHash: string): Promise<PasswordToken | null> {
  return PasswordToken.findOne({ where: { tokenHash } });
}

/** The token row for a hash, locked for the rest of the transaction, whatever its state. */
export async function lockTokenByHash(tokenHash: string, transaction: Transaction): Promise<PasswordToken | null> {
  return PasswordToken.findOne({ where: { tokenHash }, transaction, lock: transaction.LOCK.UPDATE });
}

/** Marks every unused token of a user as used: any password change spends all outstanding links. */
export async function spendUserTokens(userId: number, transaction: Transaction): Promise<void> {
  await PasswordToken.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
}
