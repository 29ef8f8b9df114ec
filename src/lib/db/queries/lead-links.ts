import 'server-only';
import type { Transaction } from 'sequelize';
import type { SessionUser } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { invalid } from '@/lib/db/write';
import { Lead } from '../models';

// An interview started from a lead: the lead is linked to the interview's customer and, if nobody had
// contacted them yet, counts as contacted. Runs inside the build's own transaction, so a refused build
// leaves the lead as it was and a missing lead refuses the build (422 naming leadId).
export async function linkLeadToCustomer(
  leadId: number,
  customerId: number,
  user: SessionUser,
  t: Transaction,
): Promise<void> {
  const lead = await Lead.findByPk(leadId, { transaction: t, lock: t.LOCK.UPDATE });
  if (!lead) throw invalid([{ field: 'leadId', message: `leadId ${leadId} names no lead` }]);
  const before = { customerId: lead.customerId ?? null, status: lead.status };
  // Quoted or closed leads keep their status: starting another interview does not undo that progress.
  const after = { customerId, status: lead.status === 'new' ? ('contacted' as const) : lead.status };
  if (before.customerId === after.customerId && before.status === after.status) return;
  lead.set(after);
  await lead.save({ transaction: t });
  await recordAudit({ user, action: 'lead.linked', entityType: 'lead', entityId: leadId, before, after }, t);
}
