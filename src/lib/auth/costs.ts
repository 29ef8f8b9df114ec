import { can } from './policy';
import type { SessionUser } from './roles';

// Who sees what the shop pays (costs, margins): one decision, the `costs.read` row of the permission
// table. Route handlers, pages, the quote presenter and the cam CSV export all ask here.

export function canSeeCosts(user: Pick<SessionUser, 'role'> | null | undefined): boolean {
  return can(user, 'costs.read');
}

/** The record as is for someone who may see costs; without `costCents` for everyone else. */
export function withoutCosts<T extends { costCents?: number }>(
  record: T,
  user: Pick<SessionUser, 'role'>,
): T | Omit<T, 'costCents'> {
  if (canSeeCosts(user)) return record;
  const { costCents: _hidden, ...rest } = record;
  void _hidden;
  return rest;
}
