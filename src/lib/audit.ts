import type { Transaction } from 'sequelize';
import { AuditEntry } from './db/models';

// One audit row per thing that happened. Actions are dotted, past tense, e.g. "auth.signed-in",
// "user.role-changed", "cam.updated". before/after hold the changed fields only where it helps.
export type AuditInput = {
  user?: { id: number; email: string } | null;
  /** Who did it when there is no signed-in user (e.g. the e-mail typed at a failed sign-in). */
  actor?: string;
  action: string;
  entityType?: string | null;
  entityId?: string | number | null;
  before?: unknown;
  after?: unknown;
  ip?: string | null;
};

export async function recordAudit(entry: AuditInput, transaction?: Transaction): Promise<void> {
  await AuditEntry.create(
    {
      userId: entry.user?.id ?? null,
      actor: (entry.user?.email ?? entry.actor ?? 'anonymous').slice(0, 254),
      action: entry.action.slice(0, 64),
      entityType: entry.entityType ?? null,
      entityId: entry.entityId === undefined || entry.entityId === null ? null : String(entry.entityId),
      before: entry.before ?? null,
      after: entry.after ?? null,
      ip: entry.ip?.slice(0, 64) ?? null,
    },
    { transaction },
  );
}
